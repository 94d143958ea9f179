package dev.contour.numeric;

import java.io.PrintStream;

/**
 * A one-line progress report on a terminal stream, shown only once a computation has run for a
 * second, redrawn in place with a carriage return at most four times a second, and erased at the end.
 */
final class Progress {
    private static final long SHOW_AFTER_NANOS = 1_000_000_000L;
    private static final long REDRAW_NANOS = 250_000_000L;

    private final PrintStream out;
    private final long showAfter;
    private final long redraw;
    private final long start = System.nanoTime();
    private long lastDraw;
    private int drawnWidth;

    Progress(PrintStream out) {
        this(out, SHOW_AFTER_NANOS, REDRAW_NANOS);
    }

    Progress(PrintStream out, long showAfterNanos, long redrawNanos) {
        this.out = out;
        this.showAfter = showAfterNanos;
        this.redraw = redrawNanos;
    }

    long elapsedNanos() {
        return System.nanoTime() - start;
    }

    /** Redraws the line if it is due; {@code text} is built only then. */
    void update(java.util.function.Supplier<String> text) {
        if (out == null) {
            return;
        }
        long now = System.nanoTime();
        if (now - start < showAfter || (lastDraw != 0 && now - lastDraw < redraw)) {
            return;
        }
        lastDraw = now;
        String line = text.get();
        out.print("\r" + line + " ".repeat(Math.max(0, drawnWidth - line.length())));
        out.flush();
        drawnWidth = Math.max(drawnWidth, line.length());
    }

    /** Erases the line if one was drawn. */
    void finish() {
        if (out != null && drawnWidth > 0) {
            out.print("\r" + " ".repeat(drawnWidth) + "\r");
            out.flush();
            drawnWidth = 0;
        }
    }
}
