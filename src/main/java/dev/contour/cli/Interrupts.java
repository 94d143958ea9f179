package dev.contour.cli;

import java.io.PrintStream;
import java.util.concurrent.atomic.AtomicInteger;
import org.jline.utils.Signals;

/**
 * Ctrl-C during {@code contour run} or {@code check}: the first one interrupts the running
 * statement, which stops at its next cancellation check with a located message (so the output so
 * far stands and a report is still written whole, ending where the run stopped); a second one
 * ends the process at once, for a computation that does not reach a check soon enough.
 *
 * <p>Installed for the run only and restored on close, so an in-process caller keeps its own
 * handling. Where the platform does not let us handle the signal, the default (end at once) stays.
 */
final class Interrupts implements AutoCloseable {
    private final Object previous;
    private final AtomicInteger count = new AtomicInteger();

    private Interrupts(Thread runner, PrintStream err) {
        this.previous = Signals.register("INT", () -> {
            if (count.incrementAndGet() == 1) {
                runner.interrupt();
            } else {
                err.println();
                err.println("contour: second interrupt: stopping at once");
                err.flush();
                Runtime.getRuntime().halt(Main.INTERRUPTED);
            }
        });
    }

    static Interrupts install(Thread runner, PrintStream err) {
        return new Interrupts(runner, err);
    }

    /** Whether an interrupt arrived while installed. */
    boolean received() {
        return count.get() > 0;
    }

    @Override
    public void close() {
        if (previous != null) {
            Signals.unregister("INT", previous);
        }
    }
}
