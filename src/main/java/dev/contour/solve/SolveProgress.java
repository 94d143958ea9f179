package dev.contour.solve;

import dev.contour.ProgressLine;
import java.io.PrintStream;

/**
 * Progress of a long solve (which condition is being turned into equations and how many of its
 * pieces are done; then the distinct equations and the unknowns determined exactly), reported
 * through a {@link ProgressLine}: in place on a terminal, as occasional plain lines elsewhere, and
 * silent once the solve is asked to stop.
 */
public final class SolveProgress implements AutoCloseable {
    private final ProgressLine line;
    private volatile String what = "starting";
    private volatile long generated;
    private volatile int constraint = 1;
    private volatile int constraints = 1;

    private SolveProgress(ProgressLine line) {
        this.line = line;
    }

    /** Progress reported on the given stream (the command line passes standard error). */
    public static SolveProgress to(PrintStream out) {
        return new SolveProgress(ProgressLine.on(out));
    }

    /** No progress output at all. */
    public static SolveProgress silent() {
        return new SolveProgress(ProgressLine.silent());
    }

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

    private void tick(String now) {
        what = now;
        line.update(() -> String.format("solve: %.1f s, %s", line.elapsedNanos() / 1e9, what));
    }

    /** Ends the report (erasing the line on a terminal). */
    @Override
    public void close() {
        line.close();
    }
}
