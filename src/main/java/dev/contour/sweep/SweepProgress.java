package dev.contour.sweep;

import java.io.PrintStream;

/**
 * The sweep's progress: tuples done, failed, running, and the estimated time left. On a terminal
 * one line rewritten in place (carriage return) at most four times a second; elsewhere (a log
 * file, a batch job) a plain line every thirty seconds, so logs stay short.
 */
final class SweepProgress {
    private final PrintStream err;
    private final boolean terminal;
    private final int total;
    private final long start = System.nanoTime();
    private final long intervalNanos;
    private long lastPrint;
    private int done;
    private int failed;
    private int running;
    private boolean lineOpen;

    SweepProgress(PrintStream err, boolean terminal, int total) {
        this.err = err;
        this.terminal = terminal;
        this.total = total;
        this.intervalNanos = terminal ? 250_000_000L : 30_000_000_000L;
        this.lastPrint = start;
    }

    synchronized void started() {
        running++;
        maybePrint();
    }

    synchronized void finished(boolean ok) {
        running--;
        done++;
        if (!ok) {
            failed++;
        }
        maybePrint();
    }

    /** Ends the progress display with a final plain line. */
    synchronized void close() {
        if (lineOpen) {
            err.print("\r" + " ".repeat(79) + "\r");
        }
        err.println("sweep: " + line() + String.format(" in %.1f s", (System.nanoTime() - start) / 1e9));
        err.flush();
    }

    private void maybePrint() {
        long now = System.nanoTime();
        if (now - lastPrint < intervalNanos) {
            return;
        }
        lastPrint = now;
        if (terminal) {
            String text = "sweep: " + line() + eta(now);
            err.print("\r" + text + " ".repeat(Math.max(0, 79 - text.length())));
            lineOpen = true;
        } else {
            err.println("sweep: " + line() + eta(now));
        }
        err.flush();
    }

    private String line() {
        return done + "/" + total + " done, " + failed + " failed, " + running + " running";
    }

    private String eta(long now) {
        if (done == 0) {
            return "";
        }
        double perTuple = (now - start) / 1e9 / done;
        long seconds = Math.round(perTuple * (total - done));
        return String.format(", about %d:%02d:%02d left", seconds / 3600, seconds / 60 % 60, seconds % 60);
    }
}
