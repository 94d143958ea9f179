package dev.contour.numeric;

import org.apfloat.Apcomplex;

/**
 * A two-variable Mellin-Barnes integrand f(s, t), evaluated at points of the working precision.
 *
 * <p>Build it from {@link ComplexFunctions}; inside an integration their values are memoised, so a
 * factor that depends only on s, only on t or only on s + t costs one evaluation per grid line
 * rather than one per grid point.
 */
@FunctionalInterface
public interface Integrand2 {
    Apcomplex at(Apcomplex s, Apcomplex t);
}
