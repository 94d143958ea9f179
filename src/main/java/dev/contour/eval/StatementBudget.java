package dev.contour.eval;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.management.MemoryUsage;
import java.time.Duration;
import java.util.List;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;

/**
 * The time and memory one statement may use, printing included. A shared watchdog thread looks at
 * the clock and at the heap that survived the last collection every few milliseconds; when a
 * statement runs past either, it interrupts the statement's thread, so the same checks that serve
 * Ctrl-C ({@link dev.contour.Cancellation}) stop the work, and the interpreter reports which budget
 * ran out and how to raise it.
 */
final class StatementBudget implements AutoCloseable {
    /** Which budget ran out. */
    enum Reason { TIME, MEMORY }

    private static final ScheduledExecutorService WATCHDOG = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "contour-budget");
        t.setDaemon(true);
        return t;
    });
    private static final long PERIOD_MS = 20;

    private final Thread thread;
    private final long startNanos;
    private final long memoryLimitBytes;
    private final long heapAtStart;
    private volatile long deadlineNanos;
    private volatile Duration timeAllowed;
    private volatile String timeSource;
    private volatile Reason tripped;
    private volatile long heapSeen;
    private final ScheduledFuture<?> task;

    private StatementBudget(Duration time, long memoryLimitBytes) {
        this.thread = Thread.currentThread();
        this.startNanos = System.nanoTime();
        this.memoryLimitBytes = memoryLimitBytes;
        this.heapAtStart = memoryLimitBytes > 0 ? liveHeap() : 0;
        this.timeAllowed = time;
        this.timeSource = null;
        this.deadlineNanos = time.isZero() ? Long.MAX_VALUE : startNanos + time.toNanos();
        this.task = time.isZero() && memoryLimitBytes <= 0 ? null
                : WATCHDOG.scheduleAtFixedRate(this::watch, PERIOD_MS, PERIOD_MS, TimeUnit.MILLISECONDS);
    }

    /** Starts watching the current thread: {@code time} zero means no time budget, {@code memoryBytes} <= 0 none for memory. */
    static StatementBudget start(Duration time, long memoryBytes) {
        return new StatementBudget(time, memoryBytes);
    }

    /**
     * A tighter time limit from the statement itself (a derivation's {@code within N seconds}),
     * counted from now; it also covers printing the result. {@code source} names it in the message.
     */
    void narrow(Duration time, String source) {
        // A grace of a quarter (at least a second) past the clause's own time: the rewriter checks its
        // limit itself and then says which rule was firing, which is the better message when it can.
        Duration grace = time.dividedBy(4).compareTo(Duration.ofSeconds(1)) < 0 ? Duration.ofSeconds(1) : time.dividedBy(4);
        long candidate = System.nanoTime() + time.plus(grace).toNanos();
        if (candidate < deadlineNanos) {
            deadlineNanos = candidate;
            timeAllowed = time;
            timeSource = source;
        }
    }

    private void watch() {
        if (tripped != null) {
            return;
        }
        if (System.nanoTime() > deadlineNanos) {
            trip(Reason.TIME);
        } else if (memoryLimitBytes > 0) {
            long grown = liveHeap() - heapAtStart;
            heapSeen = Math.max(heapSeen, grown);
            if (grown > memoryLimitBytes) {
                trip(Reason.MEMORY);
            }
        }
    }

    private void trip(Reason reason) {
        tripped = reason;
        thread.interrupt();
    }

    /** Which budget ran out, or null. */
    Reason tripped() {
        return tripped;
    }

    /** Whether the time that ran out was the statement's own (a within clause) rather than the session's budget. */
    String timeSource() {
        return timeSource;
    }

    Duration timeAllowed() {
        return timeAllowed;
    }

    long memoryLimitBytes() {
        return memoryLimitBytes;
    }

    @Override
    public void close() {
        if (task != null) {
            task.cancel(false);
        }
        if (tripped != null) {
            Thread.interrupted(); // the flag was ours; the next statement starts clean
        }
    }

    /** Heap in use after the most recent collection of each heap pool (what survives: live data). */
    static long liveHeap() {
        long sum = 0;
        List<MemoryPoolMXBean> pools = ManagementFactory.getMemoryPoolMXBeans();
        for (MemoryPoolMXBean p : pools) {
            if (p.getType() != MemoryType.HEAP) {
                continue;
            }
            MemoryUsage after = p.isCollectionUsageThresholdSupported() || p.getCollectionUsage() != null
                    ? p.getCollectionUsage() : null;
            sum += after != null ? after.getUsed() : 0;
        }
        return sum;
    }
}
