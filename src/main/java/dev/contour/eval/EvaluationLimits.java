package dev.contour.eval;

import java.time.Duration;

/**
 * Bounds that keep every script finite and fast to reject: largest exponent, largest index set,
 * most loop iterations, deepest user-function recursion, and an optional wall-clock budget.
 */
public record EvaluationLimits(int maxExponent, long maxSetSize, long maxLoopIterations, int maxCallDepth,
                               Duration timeLimit) {
    /** Generous limits for real derivations (a p = 128 ansatz has about 8000 terms). */
    public static final EvaluationLimits DEFAULT =
            new EvaluationLimits(1_000, 2_000_000, 1_000_000, 200, Duration.ZERO);

    /** Whether a wall-clock budget applies (zero means none). */
    public boolean timed() {
        return !timeLimit.isZero();
    }
}
