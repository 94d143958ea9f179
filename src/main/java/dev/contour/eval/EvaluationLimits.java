package dev.contour.eval;

import java.time.Duration;

/**
 * Bounds that keep every script finite and fast to reject: largest exponent, largest index set,
 * most loop iterations, deepest user-function recursion, an optional wall-clock budget for a whole
 * run, and the budget of each statement: its time, the memory it may add to the heap, and the
 * largest exact number (in bits) it may build.
 *
 * @param statementTime     time one top-level statement may take, printing included (zero: no limit);
 *                          the command line's {@code --time-budget SECONDS}
 * @param statementMemoryMiB heap one statement may add, in MiB (zero or less: no limit); the command
 *                          line's {@code --memory-budget MIB}. A power is refused before it expands
 *                          when its estimated size is past a quarter of this.
 * @param maxNumberBits     the largest numerator or denominator an exact number may reach, in bits
 */
public record EvaluationLimits(int maxExponent, long maxSetSize, long maxLoopIterations, int maxCallDepth,
                               Duration timeLimit, Duration statementTime, long statementMemoryMiB,
                               long maxNumberBits) {
    /** Default time budget of one statement. */
    public static final Duration DEFAULT_STATEMENT_TIME = Duration.ofMinutes(5);
    /** Default largest exact number: about 315,000 decimal digits. */
    public static final long DEFAULT_NUMBER_BITS = 1L << 20;

    /** Generous limits for real derivations (a p = 128 ansatz has about 8000 terms). */
    public static final EvaluationLimits DEFAULT =
            new EvaluationLimits(1_000, 2_000_000, 1_000_000, 200, Duration.ZERO);

    public EvaluationLimits {
        timeLimit = timeLimit == null ? Duration.ZERO : timeLimit;
        statementTime = statementTime == null ? Duration.ZERO : statementTime;
    }

    /** The older five limits, with the default statement budget. */
    public EvaluationLimits(int maxExponent, long maxSetSize, long maxLoopIterations, int maxCallDepth, Duration timeLimit) {
        this(maxExponent, maxSetSize, maxLoopIterations, maxCallDepth, timeLimit, DEFAULT_STATEMENT_TIME,
                defaultMemoryMiB(), DEFAULT_NUMBER_BITS);
    }

    /** Default memory budget of one statement: three quarters of the Java heap. */
    public static long defaultMemoryMiB() {
        return Runtime.getRuntime().maxMemory() / (1024 * 1024) * 3 / 4;
    }

    /** The same limits with another statement budget. */
    public EvaluationLimits withStatementBudget(Duration time, long memoryMiB) {
        return new EvaluationLimits(maxExponent, maxSetSize, maxLoopIterations, maxCallDepth, timeLimit, time, memoryMiB,
                maxNumberBits);
    }

    /**
     * These limits with one budget option of the command line applied ({@code --time-budget SECONDS},
     * {@code --memory-budget MIB}, {@code --max-digits DIGITS}); the message of the exception says
     * what is wrong with the value.
     */
    public EvaluationLimits withOption(String option, String value) {
        long n;
        try {
            n = Long.parseLong(value);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(option + " needs a whole number, not '" + value + "'");
        }
        if (n < 0) {
            throw new IllegalArgumentException(option + " cannot be negative (0 means no limit)");
        }
        return switch (option) {
            case "--time-budget" -> withStatementBudget(Duration.ofSeconds(Math.min(n, 10_000_000L)), statementMemoryMiB);
            case "--memory-budget" -> withStatementBudget(statementTime, n);
            case "--max-digits" -> {
                if (n < 1) {
                    throw new IllegalArgumentException("--max-digits needs at least 1");
                }
                yield new EvaluationLimits(maxExponent, maxSetSize, maxLoopIterations, maxCallDepth, timeLimit, statementTime,
                        statementMemoryMiB, (long) Math.ceil(Math.min(n, 1_000_000_000L) / Math.log10(2)));
            }
            default -> throw new IllegalArgumentException("unknown budget option " + option);
        };
    }

    /** Whether a wall-clock budget applies (zero means none). */
    public boolean timed() {
        return !timeLimit.isZero();
    }

    /** The most bytes one expansion may be estimated to need before it is refused (zero: no limit). */
    public long maxExpansionBytes() {
        return statementMemoryMiB <= 0 ? 0 : statementMemoryMiB * 1024 * 1024 / 4;
    }
}
