package dev.contour.eval;

/**
 * Adds built-ins from another package. Implementations are found with {@link java.util.ServiceLoader}
 * (list the class in {@code META-INF/services/dev.contour.eval.BuiltinProvider}); keep
 * {@link #register} cheap (lambdas only) so start-up stays fast.
 */
public interface BuiltinProvider {
    void register(BuiltinRegistry registry);
}
