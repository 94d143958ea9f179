package dev.contour.numeric;

import java.io.PrintStream;
import java.time.Duration;

/**
 * Budgets for one numerical integration: integrand evaluations, wall time, how far along the
 * contour the integrand may stay non-negligible, and where progress goes.
 *
 * @param maxEvaluations integrand evaluations allowed over all refinement levels
 * @param timeLimit      wall time allowed
 * @param maxImaginary   the largest |Im s| the integration walks to before it declares that the
 *                       integrand does not decay on the contour
 * @param progress       where the progress line goes while an integral takes more than a second,
 *                       or {@code null} for none
 */
public record IntegrationLimits(long maxEvaluations, Duration timeLimit, double maxImaginary, PrintStream progress) {

    public IntegrationLimits {
        if (maxEvaluations <= 0 || timeLimit == null || timeLimit.isNegative() || timeLimit.isZero() || !(maxImaginary > 0)) {
            throw new IllegalArgumentException("limits must be positive");
        }
    }

    /** Fifty million evaluations, ten minutes, |Im s| up to 400, progress on standard error. */
    public static IntegrationLimits defaults() {
        return new IntegrationLimits(50_000_000L, Duration.ofMinutes(10), 400, System.err);
    }

    public IntegrationLimits withMaxEvaluations(long n) {
        return new IntegrationLimits(n, timeLimit, maxImaginary, progress);
    }

    public IntegrationLimits withTimeLimit(Duration d) {
        return new IntegrationLimits(maxEvaluations, d, maxImaginary, progress);
    }

    public IntegrationLimits withMaxImaginary(double y) {
        return new IntegrationLimits(maxEvaluations, timeLimit, y, progress);
    }

    public IntegrationLimits withProgress(PrintStream out) {
        return new IntegrationLimits(maxEvaluations, timeLimit, maxImaginary, out);
    }
}
