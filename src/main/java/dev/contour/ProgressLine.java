package dev.contour;

import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

/**
 * A progress report for work that may take a while (a loop over solves, a solve, an integral), on
 * standard error or another stream, in one of two styles:
 * <ul>
 *   <li>on a terminal, one line redrawn in place with a carriage return at most four times a
 *       second, shown once the work has run a second, and erased at the end;</li>
 *   <li>anywhere else (a log file, a pipe), plain lines, the first after five seconds, then at
 *       most one every ten seconds, so a log holds a few readable lines and no carriage returns.</li>
 * </ul>
 * Reports that are open at the same time on the same stream (a {@code for} loop around a solve)
 * share the line: it shows them outermost first, separated by {@code " | "}. A report falls silent
 * as soon as the work it reports on is asked to stop (see {@link Cancellation}), so no progress
 * lands after an interrupt has been acknowledged.
 *
 * <p>Use: {@code ProgressLine p = ProgressLine.standardError(); try { ... p.update(() -> text) ... }
 * finally { p.close(); }}. {@link #update} is cheap when nothing is due (a clock read), builds the
 * text only when it draws, and may be called from several threads.
 */
public final class ProgressLine implements AutoCloseable {
    /** How a report is drawn. */
    public enum Style {
        /** Redrawn in place, erased at the end. */
        TERMINAL(1_000_000_000L, 250_000_000L),
        /** Plain lines at a low rate. */
        LINES(5_000_000_000L, 10_000_000_000L);

        final long showAfterNanos;
        final long intervalNanos;

        Style(long showAfterNanos, long intervalNanos) {
            this.showAfterNanos = showAfterNanos;
            this.intervalNanos = intervalNanos;
        }
    }

    /** Every open report (all streams), in the order opened; guarded by itself. */
    private static final List<ProgressLine> OPEN = new ArrayList<>();
    /** Per stream: when it last drew and how wide the drawn line is (terminal style). */
    private static final List<StreamState> STREAMS = new ArrayList<>();

    private static final class StreamState {
        final PrintStream out;
        long lastDraw;
        int drawnWidth;

        StreamState(PrintStream out) {
            this.out = out;
        }
    }

    private final PrintStream out;
    private final Style style;
    private final long showAfter;
    private final long interval;
    private final long start = System.nanoTime();
    private final Cancellation.Token stop = Cancellation.current();
    private volatile Supplier<String> text;
    /** Before this time nothing can be due, so updates skip the lock (loops call often). */
    private volatile long quietUntil;
    private volatile boolean open;
    private boolean closed;

    /**
     * A report on {@code out} (null: no output at all) in the given style, with the style's delays
     * unless others are given (tests).
     */
    public ProgressLine(PrintStream out, Style style, long showAfterNanos, long intervalNanos) {
        this.out = out;
        this.style = style;
        this.showAfter = showAfterNanos;
        this.interval = intervalNanos;
    }

    public ProgressLine(PrintStream out, Style style) {
        this(out, style, style.showAfterNanos, style.intervalNanos);
    }

    /** A report on standard error, drawn in place when standard error is a terminal, else as plain lines. */
    public static ProgressLine standardError() {
        return on(System.err);
    }

    /**
     * A report on {@code out} (null: silent): in place when it is standard error and that is a
     * terminal, as plain lines otherwise.
     */
    public static ProgressLine on(PrintStream out) {
        return new ProgressLine(out, styleFor(out));
    }

    /** In place for standard error on a terminal, plain lines for anything else. */
    public static Style styleFor(PrintStream out) {
        return out == System.err && standardErrorIsTerminal() ? Style.TERMINAL : Style.LINES;
    }

    /** No output at all. */
    public static ProgressLine silent() {
        return new ProgressLine(null, Style.LINES);
    }

    /** Nanoseconds since this report was made. */
    public long elapsedNanos() {
        return System.nanoTime() - start;
    }

    /**
     * Whether standard error is a terminal. Java tells only whether the console (standard input
     * and output) is; on Linux the file behind descriptor 2 says it exactly (a pseudo-terminal or
     * a tty device), elsewhere the console is the best guess (common practice).
     */
    public static boolean standardErrorIsTerminal() {
        try {
            Path fd = Path.of("/proc/self/fd/2");
            if (Files.isSymbolicLink(fd)) {
                String target = Files.readSymbolicLink(fd).toString();
                return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty");
            }
        } catch (Exception e) {
            // not Linux, or /proc unreadable: fall back below
        }
        return System.console() != null;
    }

    /** Sets what this report says now and draws the shared line if it is due; {@code now} is built only then. */
    public void update(Supplier<String> now) {
        if (out == null) {
            return;
        }
        long t = System.nanoTime();
        if (open && t - quietUntil < 0) {
            text = now;
            return;
        }
        synchronized (OPEN) {
            if (closed) {
                return;
            }
            text = now;
            if (!open) {
                OPEN.add(this); // from now on other reports on the stream show this one's text too
                open = true;
            }
            if (t - start < showAfter) {
                quietUntil = start + showAfter;
                return;
            }
            StreamState s = state(out);
            if (s.lastDraw != 0 && t - s.lastDraw < interval) {
                quietUntil = s.lastDraw + interval;
                return;
            }
            quietUntil = t + interval;
            if (stop.stopping()) {
                return; // the work is being stopped: say nothing more
            }
            s.lastDraw = t;
            draw(s);
        }
    }

    /** Ends this report; on a terminal the line is erased when this was the last report on it, else redrawn without it. */
    @Override
    public void close() {
        if (out == null) {
            return;
        }
        synchronized (OPEN) {
            if (closed) {
                return;
            }
            closed = true;
            if (!open) {
                return;
            }
            OPEN.remove(this);
            StreamState s = state(out);
            if (style == Style.TERMINAL && s.drawnWidth > 0) {
                boolean others = OPEN.stream().anyMatch(p -> p.out == out);
                if (others && !stop.stopping()) {
                    draw(s);
                } else {
                    out.print("\r" + " ".repeat(s.drawnWidth) + "\r");
                    out.flush();
                    s.drawnWidth = 0;
                }
            }
            if (OPEN.stream().noneMatch(p -> p.out == out)) {
                STREAMS.remove(s);
            }
        }
    }

    private void draw(StreamState s) {
        StringBuilder line = new StringBuilder();
        for (ProgressLine p : OPEN) {
            if (p.out != out || p.text == null) {
                continue;
            }
            String part = p.text.get();
            if (line.length() > 0) {
                line.append(" | ");
            }
            line.append(part);
        }
        String shown = line.toString();
        if (style == Style.TERMINAL) {
            out.print("\r" + shown + " ".repeat(Math.max(0, s.drawnWidth - shown.length())));
            s.drawnWidth = Math.max(s.drawnWidth, shown.length());
        } else {
            out.println(shown);
        }
        out.flush();
    }

    private static StreamState state(PrintStream out) {
        for (StreamState s : STREAMS) {
            if (s.out == out) {
                return s;
            }
        }
        StreamState s = new StreamState(out);
        STREAMS.add(s);
        return s;
    }
}
