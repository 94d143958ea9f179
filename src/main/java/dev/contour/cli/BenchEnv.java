package dev.contour.cli;

import dev.contour.ContourException;

/**
 * Benchmark settings read from the environment (CONTOUR_SOLVE_P="256,512", CONTOUR_ADS7_BUDGET=600):
 * a value that is not what the variable takes is a usage error naming the variable, not a stack trace.
 */
public final class BenchEnv {
    private BenchEnv() { }

    /** A comma-separated list of whole numbers, or the defaults when the variable is unset. */
    public static int[] numbers(String variable, int... defaults) {
        return numbers(variable, System.getenv(variable), defaults);
    }

    static int[] numbers(String variable, String env, int... defaults) {
        if (env == null || env.isBlank()) {
            return defaults;
        }
        try {
            int[] out = java.util.Arrays.stream(env.split(",")).map(String::trim).mapToInt(Integer::parseInt).toArray();
            for (int v : out) {
                if (v < 0) {
                    throw new NumberFormatException();
                }
            }
            return out;
        } catch (NumberFormatException e) {
            throw new ContourException(variable + " must list whole numbers separated by commas, not '" + env + "'");
        }
    }

    /** One whole number at least {@code min}, or the default when the variable is unset. */
    public static long number(String variable, long min, long fallback) {
        return number(variable, System.getenv(variable), min, Long.MAX_VALUE, fallback);
    }

    /** A count between {@code min} and {@code max}, or the default when the variable is unset. */
    public static int count(String variable, int min, int max, int fallback) {
        return (int) number(variable, System.getenv(variable), min, max, fallback);
    }

    static long number(String variable, String env, long min, long max, long fallback) {
        if (env == null || env.isBlank()) {
            return fallback;
        }
        try {
            long v = Long.parseLong(env.trim());
            if (v >= min && v <= max) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new ContourException(variable + " must be a whole number " + (max == Long.MAX_VALUE ? "of at least " + min
                : "from " + min + " to " + max) + ", not '" + env + "'");
    }
}
