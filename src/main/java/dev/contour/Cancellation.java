package dev.contour;

import java.util.function.Supplier;

/**
 * The one place a long loop asks whether it should stop: {@link #check()} throws {@link Stop}
 * when the thread was interrupted (Ctrl-C in the REPL, a caller giving up), when the token in
 * force was cancelled, or when a deadline set for the current work has passed.
 *
 * <p>Every loop that can run for more than a moment (equation building, elimination, exact
 * propagation, numerical integration, rewriting, collecting operator applications, GCDs, big
 * products, interpreter loops) calls {@link #check()} once per step of a size that takes well under
 * a millisecond, so a stop request ends the work within a fraction of a second. A check costs a
 * thread-local read, an interrupt-flag read and, when a deadline is set, a clock read.
 *
 * <p>Work handed to other threads ({@link Parallel}) captures {@link #current()} on the calling
 * thread and calls {@link Token#check()} on it, since a pool thread sees neither the caller's
 * interrupt nor its thread-local token. A stop is sticky on the token: once one check has failed,
 * every later check of the same token fails too, even if the thread's interrupt flag is cleared,
 * so helpers on other threads end as well.
 */
public final class Cancellation {
    private static final ThreadLocal<Token> CURRENT = new ThreadLocal<>();

    private Cancellation() { }

    /**
     * A stop request: raised by a check when its work must end. It is a {@link ContourException},
     * so the interpreter locates it at the statement that was running, and it stays a {@code Stop}
     * when located.
     */
    public static final class Stop extends ContourException {
        public Stop(String message, Span span) {
            super(message, span);
        }

        @Override
        public Stop at(Span where) {
            if (span() != null && span().isKnown()) {
                return this;
            }
            Stop located = new Stop(getMessage(), where);
            located.setStackTrace(getStackTrace());
            return located;
        }
    }

    /**
     * Whether the work owning this token should stop: cancelled by hand, its owner thread
     * interrupted, its deadline passed, or its parent stopping.
     */
    public static final class Token {
        private final Token parent;
        private final Thread owner;
        private final long deadline;
        private final String deadlineMessage;
        private volatile String stopped;

        private Token(Token parent, Thread owner, long deadline, String deadlineMessage) {
            this.parent = parent;
            this.owner = owner;
            this.deadline = deadline;
            this.deadlineMessage = deadlineMessage;
        }

        /** A token with no deadline that stops when {@link #cancel} is called. */
        public static Token manual() {
            return new Token(null, null, Long.MAX_VALUE, null);
        }

        /**
         * A token under this one that also stops at {@code deadlineNanos} ({@link System#nanoTime()}
         * scale), with {@code message} as the error (it should name the limit and how to raise it).
         */
        public Token withDeadline(long deadlineNanos, String message) {
            return new Token(this, owner, deadlineNanos, message);
        }

        /** Asks every check of this token (and of tokens under it) to fail with {@code reason}. */
        public void cancel(String reason) {
            if (stopped == null) {
                stopped = reason;
            }
        }

        /** Whether a check would fail now (without throwing). */
        public boolean stopping() {
            return reason() != null;
        }

        private String reason() {
            String r = stopped;
            if (r != null) {
                return r;
            }
            if (owner != null && owner.isInterrupted()) {
                stopped = "interrupted";
                return stopped;
            }
            if (deadline != Long.MAX_VALUE && System.nanoTime() - deadline > 0) {
                stopped = deadlineMessage;
                return stopped;
            }
            if (parent != null) {
                r = parent.reason();
                if (r != null) {
                    stopped = r;
                }
            }
            return r;
        }

        /** Throws {@link Stop} (without a location) if this work should stop. */
        public void check() {
            String r = reason();
            if (r != null) {
                throw new Stop(r, null);
            }
        }
    }

    /**
     * Throws {@link Stop} if the current thread was interrupted or the token in force says stop.
     * Cheap enough for any loop whose steps take a microsecond or more. Under a token, an interrupt
     * is moved onto the token (the thread's flag is cleared, as an {@link InterruptedException}
     * would clear it); with no token the flag is left for the caller to see.
     */
    public static void check() {
        Token t = CURRENT.get();
        if (t == null) {
            if (Thread.currentThread().isInterrupted()) {
                throw new Stop("interrupted", null);
            }
            return;
        }
        if (Thread.interrupted()) {
            // the request is taken over by the token (sticky, and seen by helper threads), so a later
            // run on this thread, under a new token, starts afresh as it did before
            t.cancel("interrupted");
        }
        t.check();
    }

    /** Whether {@link #check()} would throw now (without throwing or clearing anything). */
    public static boolean stopping() {
        Token t = CURRENT.get();
        return Thread.currentThread().isInterrupted() || t != null && t.stopping();
    }

    /**
     * The token in force on this thread, to carry into work on other threads; when none is
     * installed, a token that stops when this thread is interrupted.
     */
    public static Token current() {
        Token t = CURRENT.get();
        return t != null ? t : new Token(null, Thread.currentThread(), Long.MAX_VALUE, null);
    }

    /**
     * Runs {@code work} with {@code token} in force on this thread (it also stops when this thread
     * is interrupted), restoring the previous token afterwards.
     */
    public static <T> T under(Token token, Supplier<T> work) {
        Token previous = CURRENT.get();
        Token installed = token.owner == Thread.currentThread() ? token : new Token(token, Thread.currentThread(), Long.MAX_VALUE, null);
        CURRENT.set(installed);
        try {
            return work.get();
        } finally {
            if (previous == null) {
                CURRENT.remove();
            } else {
                CURRENT.set(previous);
            }
        }
    }

    /** {@link #under(Token, Supplier)} for work without a result. */
    public static void run(Token token, Runnable work) {
        under(token, () -> {
            work.run();
            return null;
        });
    }
}
