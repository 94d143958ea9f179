package dev.contour;

/**
 * The one way long loops notice that their work should stop: the thread's interrupt flag, set by
 * the REPL's Ctrl-C or by a statement's budget watchdog. Checking costs a field read, so loops call
 * {@link #check()} once per outer iteration; the interpreter turns the error into the reason (an
 * interrupt, or which budget ran out).
 */
public final class Interrupts {
    private Interrupts() { }

    /** Thrown where a loop noticed the request to stop; the interpreter gives it a location and a reason. */
    public static final class Stopped extends ContourException {
        public Stopped() {
            super("interrupted");
        }
    }

    /** Throws {@link Stopped} (and clears the flag) when this thread has been asked to stop. */
    public static void check() {
        if (Thread.currentThread().isInterrupted()) {
            Thread.interrupted();
            throw new Stopped();
        }
    }
}
