package dev.contour.solve;

import java.io.PrintStream;

/**
 * Throttled progress lines for long solves: nothing during the first second, then at most one
 * line per second (equations generated, unknowns eliminated, unknowns determined exactly).
 */
public final class SolveProgress {
    private static final long SECOND = 1_000_000_000L;

    private final PrintStream out;
    private final long start = System.nanoTime();
    private long lastReport = start;
    private volatile long generated;
    private int eliminated;
    private int determined;

    private SolveProgress(PrintStream out) {
        this.out = out;
    }

    /** Progress reported on the given stream (the command line passes standard error). */
    public static SolveProgress to(PrintStream out) {
        return new SolveProgress(out);
    }

    /** No progress output at all. */
    public static SolveProgress silent() {
        return new SolveProgress(null);
    }

    void generated(long equations) {
        generated = equations;
        tick("equations generated " + equations);
    }

    void eliminated(int pivots) {
        eliminated = pivots;
        tick("equations " + generated + ", eliminated " + pivots);
    }

    void determined(int unknowns) {
        determined = unknowns;
        tick("eliminated " + eliminated + ", determined exactly " + unknowns);
    }

    private void tick(String what) {
        if (out == null) {
            return;
        }
        long now = System.nanoTime();
        if (now - start < SECOND || now - lastReport < SECOND) {
            return;
        }
        synchronized (this) {
            if (now - lastReport < SECOND) {
                return;
            }
            lastReport = now;
            out.printf("solve: %.1f s, %s%n", (now - start) / 1e9, what);
        }
    }
}
