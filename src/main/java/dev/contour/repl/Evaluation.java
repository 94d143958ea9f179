package dev.contour.repl;

import dev.contour.Cancellation;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;

/**
 * Runs one REPL input on a worker thread, so that an interrupt (Ctrl-C) can end it while the
 * session goes on.
 *
 * <p>An interrupt first asks politely ({@link Thread#interrupt()}) and waits a grace period, in
 * case the computation notices; a computation still running after that is stopped by force
 * ({@link Outcome#STOPPED}: whatever the worker was changing may be half changed), or, where the
 * runtime no longer allows that, left running on its own ({@link Outcome#ABANDONED}: whatever it
 * can reach must not be used again).
 */
final class Evaluation {
    /** How a run ended. */
    enum Outcome {
        /** The task returned or threw on its own; see {@link #failure()}. */
        FINISHED,
        /** The task ended after an interrupt request, on its own. */
        INTERRUPTED,
        /** The task ignored the interrupt and was stopped by force; what it was changing is suspect. */
        STOPPED,
        /** The task ignored the interrupt and could not be stopped: it still runs, on a daemon thread. */
        ABANDONED
    }

    /** Room for deeply nested expressions; the interpreter bounds recursion itself. */
    private static final long WORKER_STACK_BYTES = 256L << 20;

    private final long graceMillis;
    private final Semaphore wake = new Semaphore(0);
    private volatile Thread worker;
    /** The stop token of the running task: every long loop below it checks it (see {@link Cancellation}). */
    private volatile Cancellation.Token token;
    private volatile boolean interruptRequested;
    private volatile boolean done;
    private volatile Throwable failure;

    Evaluation(long graceMillis) {
        this.graceMillis = graceMillis;
    }

    /** Asks the running task to stop (a signal handler calls this); does nothing when idle. */
    void interrupt() {
        Thread w = worker;
        if (w != null && !done) {
            interruptRequested = true;
            Cancellation.Token t = token;
            if (t != null) {
                t.cancel("interrupted");
            }
            w.interrupt();
            wake.release();
        }
    }

    /** What the last task threw, or null. */
    Throwable failure() {
        return failure;
    }

    /** Runs the task on a fresh worker and waits for it (or for an interrupt). Not reentrant. */
    Outcome run(Runnable task) {
        wake.drainPermits();
        interruptRequested = false;
        done = false;
        failure = null;
        Cancellation.Token stop = Cancellation.Token.manual();
        token = stop;
        Thread t = new Thread(null, () -> {
            try {
                Cancellation.run(stop, task);
            } catch (Throwable x) {
                failure = x;
            } finally {
                done = true;
                wake.release();
            }
        }, "contour-evaluation", WORKER_STACK_BYTES);
        t.setDaemon(true); // a task that could not be stopped must not keep the JVM alive
        worker = t;
        t.start();
        try {
            while (!done && !interruptRequested) {
                wake.acquireUninterruptibly();
            }
            if (done) {
                return interruptRequested ? Outcome.INTERRUPTED : Outcome.FINISHED;
            }
            if (finishes(t, graceMillis)) {
                return Outcome.INTERRUPTED;
            }
            stop(t);
            return finishes(t, 2_000) ? Outcome.STOPPED : Outcome.ABANDONED;
        } finally {
            worker = null;
            token = null;
        }
    }

    private static boolean finishes(Thread t, long millis) {
        long until = System.nanoTime() + TimeUnit.MILLISECONDS.toNanos(millis);
        while (t.isAlive()) {
            long left = until - System.nanoTime();
            if (left <= 0) {
                return false;
            }
            try {
                t.join(Math.max(1, TimeUnit.NANOSECONDS.toMillis(left)));
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return !t.isAlive();
            }
        }
        return true;
    }

    /**
     * Ends a computation that does not check for interrupts. Java 17 still honours
     * {@link Thread#stop()}; later runtimes refuse it, and the thread is then left to finish on
     * its own (it is a daemon, and its session state is discarded either way).
     */
    @SuppressWarnings({"deprecation", "removal"})
    private static void stop(Thread t) {
        try {
            t.stop();
        } catch (UnsupportedOperationException | SecurityException e) {
            // Nothing more can be done from here; the caller discards the worker's state.
        }
    }
}
