package dev.contour;

import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.IntFunction;

/**
 * The one pool of worker threads that independent pieces of a computation share (the collected
 * coefficients of an operator application, equation building per piece, residue checks per
 * coefficient), sized to the cores unless told otherwise ({@code --threads N}, or the environment
 * variable {@code CONTOUR_THREADS}); one thread means the calling thread alone, as a sequential
 * program.
 *
 * <p>Results never depend on the number of threads: {@link #map} returns the results in index order,
 * and {@link #forEachOrdered} hands results to its consumer in index order, one at a time, so callers
 * merge in a fixed order. The calling thread works too, so one extra thread already uses two cores.
 *
 * <p>Interruption: every task runs under a token below the caller's {@link Cancellation#current()}
 * token, so an interrupt of the caller, a statement budget or a cancelled REPL input stops the
 * tasks at their next {@link Cancellation#check()}. A failing task stops the others as well. A call
 * returns or throws only after every worker it started has finished its task, so no worker keeps
 * computing for a call that has ended. Calls made from inside a task run sequentially on that
 * task's thread (no nested fan-out, no deadlock on a busy pool).
 */
public final class Parallel {
    /** The environment variable that sets the default number of threads. */
    public static final String THREADS_VARIABLE = "CONTOUR_THREADS";
    /** The largest number of threads accepted. */
    public static final int MAX_THREADS = 256;

    private static final ThreadLocal<Boolean> IN_TASK = ThreadLocal.withInitial(() -> false);
    private static final AtomicInteger NAMES = new AtomicInteger();
    private static final AtomicInteger RUNNING = new AtomicInteger();
    private static volatile int threads = defaultThreads();
    private static ThreadPoolExecutor pool;

    private Parallel() { }

    /** The number of threads parallel work uses now (the caller's included). */
    public static int threads() {
        return threads;
    }

    /**
     * Sets the number of threads (1 = sequential); later parallel calls use it. Throws a
     * {@link ContourException} naming the range when {@code n} is out of it.
     */
    public static void setThreads(int n) {
        if (n < 1 || n > MAX_THREADS) {
            throw new ContourException("the number of threads must be between 1 and " + MAX_THREADS + ", not " + n);
        }
        threads = n;
    }

    /**
     * Reads a thread count as a user writes it ({@code --threads N} or {@code CONTOUR_THREADS});
     * {@code source} names where it came from in the error.
     */
    public static int parseThreads(String text, String source) {
        int n;
        try {
            n = Integer.parseInt(text.trim());
        } catch (NumberFormatException e) {
            throw new ContourException(source + " needs a whole number of threads (1 to " + MAX_THREADS + "), not '" + text + "'");
        }
        if (n < 1 || n > MAX_THREADS) {
            throw new ContourException(source + " must be between 1 and " + MAX_THREADS + ", not " + n);
        }
        return n;
    }

    /** {@code CONTOUR_THREADS} when set and valid, else the processors the JVM may use. */
    private static int defaultThreads() {
        String env = System.getenv(THREADS_VARIABLE);
        if (env != null && !env.isBlank()) {
            try {
                return parseThreads(env, THREADS_VARIABLE);
            } catch (ContourException e) {
                // Main reports a bad value before any work starts; library users get the cores
            }
        }
        return Math.max(1, Math.min(MAX_THREADS, Runtime.getRuntime().availableProcessors()));
    }

    /** Whether the current thread is running a task of this pool (where calls run sequentially). */
    public static boolean inTask() {
        return IN_TASK.get();
    }

    /**
     * {@code task(0), ..., task(n - 1)}, computed on up to {@link #threads()} threads; the list is
     * in index order whatever the number of threads. Null results are kept.
     */
    public static <T> List<T> map(int n, IntFunction<T> task) {
        Object[] out = new Object[n];
        run(n, i -> out[i] = task.apply(i));
        @SuppressWarnings("unchecked")
        List<T> list = (List<T>) Arrays.asList(out);
        return list;
    }

    /** Receives the results of {@link #forEachOrdered} one at a time, in index order. */
    public interface OrderedConsumer<T> {
        void accept(int index, T result);
    }

    /**
     * Computes {@code task(i)} for i below n on up to {@link #threads()} threads and hands each
     * result to {@code consumer} in index order, never two at once (so the consumer needs no
     * locking and its merged state does not depend on the number of threads). A result is dropped
     * as soon as it has been consumed, so results are not all held at once.
     */
    public static <T> void forEachOrdered(int n, IntFunction<T> task, OrderedConsumer<? super T> consumer) {
        Object[] done = new Object[n];
        boolean[] ready = new boolean[n];
        int[] next = {0};
        Object lock = new Object();
        run(n, i -> {
            T r = task.apply(i);
            synchronized (lock) {
                done[i] = r;
                ready[i] = true;
                // whoever completes the next index in line hands over every result ready after it
                while (next[0] < n && ready[next[0]]) {
                    int k = next[0];
                    @SuppressWarnings("unchecked")
                    T value = (T) done[k];
                    done[k] = null;
                    consumer.accept(k, value);
                    next[0]++;
                }
            }
        });
    }

    private interface IndexTask {
        void run(int index);
    }

    private static void run(int n, IndexTask task) {
        int t = Math.min(threads, n);
        if (t <= 1 || IN_TASK.get()) {
            for (int i = 0; i < n; i++) {
                Cancellation.check();
                task.run(i);
            }
            return;
        }
        Cancellation.check();
        Cancellation.Token caller = Cancellation.current();
        // a token of our own below the caller's: a failing task cancels it without stopping the caller's work
        Cancellation.Token mine = caller.withDeadline(Long.MAX_VALUE, null);
        AtomicInteger nextIndex = new AtomicInteger();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable loop = () -> Cancellation.run(mine, () -> {
            boolean was = IN_TASK.get();
            IN_TASK.set(true);
            RUNNING.incrementAndGet();
            try {
                for (int i = nextIndex.getAndIncrement(); i < n; i = nextIndex.getAndIncrement()) {
                    if (failure.get() != null) {
                        return;
                    }
                    Cancellation.check();
                    task.run(i);
                }
            } catch (Throwable e) {
                if (failure.compareAndSet(null, e)) {
                    mine.cancel("stopped: another part of the same computation failed");
                }
            } finally {
                RUNNING.decrementAndGet();
                IN_TASK.set(was);
            }
        });
        int helpers = t - 1;
        CountDownLatch finished = new CountDownLatch(helpers);
        ExecutorService workers = pool(helpers);
        for (int h = 0; h < helpers; h++) {
            Runnable r = () -> {
                try {
                    loop.run();
                } finally {
                    finished.countDown();
                }
            };
            workers.execute(r);
        }
        loop.run();
        boolean interrupted = false;
        while (true) {
            try {
                finished.await();
                break;
            } catch (InterruptedException e) {
                // the caller is asked to stop: stop the helpers too, then wait for them to end
                interrupted = true;
                mine.cancel("interrupted");
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
        Throwable e = failure.get();
        if (e == null) {
            return;
        }
        if (e instanceof Cancellation.Stop && caller.stopping()) {
            caller.check(); // the caller's own stop reason (interrupt, deadline) rather than ours
        }
        if (e instanceof RuntimeException re) {
            throw re;
        }
        if (e instanceof Error err) {
            throw err;
        }
        throw new IllegalStateException(e);
    }

    /** The shared pool, grown to at least {@code helpers} threads; its threads are daemons. */
    private static synchronized ExecutorService pool(int helpers) {
        if (pool == null) {
            pool = new ThreadPoolExecutor(helpers, helpers, 30, TimeUnit.SECONDS, new LinkedBlockingQueue<>(), r -> {
                Thread th = new Thread(r, "contour-worker-" + NAMES.incrementAndGet());
                th.setDaemon(true);
                return th;
            });
            pool.allowCoreThreadTimeOut(true);
        } else if (pool.getMaximumPoolSize() < helpers) {
            pool.setMaximumPoolSize(helpers);
            pool.setCorePoolSize(helpers);
        }
        return pool;
    }

    /**
     * How many threads are inside a parallel call's work right now (the callers' own share
     * included); zero once every call has returned, which tests use to see that no worker is left
     * computing after an interrupt.
     */
    public static int running() {
        return RUNNING.get();
    }
}
