package dev.contour.solve;

import java.io.PrintStream;

/**
 * Throttled progress lines for long solves: nothing during the first second, then at most one
 * line per second (which condition is being turned into equations and how many of its pieces are
 * done; then the distinct equations and the unknowns determined exactly).
 */
public final class SolveProgress {
    private static final long SECOND = 1_000_000_000L;

    private final PrintStream out;
    private final long start = System.nanoTime();
    private long lastReport = start;
    private volatile long generated;

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

    private int constraint = 1;
    private int constraints = 1;

    void constraint(int k, int of) {
        constraint = k;
        constraints = of;
    }

    void pieces(long done, long of) {
        tick("building equations" + (constraints > 1 ? " for condition " + constraint + " of " + constraints : "")
                + ": " + (100 * done / Math.max(1, of)) + "% of " + of + " pieces");
    }

    void generated(long equations) {
        generated = equations;
        tick(equations + " distinct equations");
    }

    void determined(int unknowns) {
        tick(generated + " distinct equations, " + unknowns + " unknowns determined");
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
