package dev.contour;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * A stop request reaches every worker of a parallel call, and the call ends only after every task
 * it started has ended: an interrupt of the caller, a passed deadline and a failing task each end
 * the call with no task left running. The tasks below would spin for ever without a stop.
 */
class ParallelInterruptTest {
    private int before;

    @BeforeEach
    void fourThreads() {
        before = Parallel.threads();
        Parallel.setThreads(4);
    }

    @AfterEach
    void restore() {
        Parallel.setThreads(before);
    }

    /** A task that only a stop request ends; it counts the tasks inside it. */
    private static Integer spin(AtomicInteger inside, CountDownLatch started) {
        inside.incrementAndGet();
        started.countDown();
        try {
            while (true) {
                Cancellation.check();
                Thread.onSpinWait();
            }
        } finally {
            inside.decrementAndGet();
        }
    }

    @Test
    void anInterruptOfTheCallerStopsEveryWorker() throws Exception {
        AtomicInteger inside = new AtomicInteger();
        CountDownLatch started = new CountDownLatch(4);
        AtomicReference<Throwable> thrown = new AtomicReference<>();
        AtomicInteger leftAtReturn = new AtomicInteger(-1);
        Thread caller = new Thread(() -> {
            try {
                Parallel.map(64, i -> spin(inside, started));
            } catch (Throwable t) {
                thrown.set(t);
            }
            leftAtReturn.set(inside.get());
        });
        caller.start();
        assertTrue(started.await(30, TimeUnit.SECONDS), "four tasks should run at once on four threads");
        caller.interrupt();
        caller.join(TimeUnit.SECONDS.toMillis(30));
        assertFalse(caller.isAlive(), "the call did not end");
        assertInstanceOf(Cancellation.Stop.class, thrown.get());
        assertEquals("interrupted", thrown.get().getMessage());
        assertEquals(0, leftAtReturn.get(), "tasks still running when the call returned");
        assertEquals(0, Parallel.running(), "pool workers still inside the call's work");
    }

    @Test
    void aPassedDeadlineStopsEveryWorkerWithItsMessage() {
        AtomicInteger inside = new AtomicInteger();
        CountDownLatch started = new CountDownLatch(1);
        Cancellation.Token budget = Cancellation.current().withDeadline(System.nanoTime() + 200_000_000L,
                "planted budget of 0.2 s passed");
        Cancellation.Stop stop = assertThrows(Cancellation.Stop.class,
                () -> Cancellation.run(budget, () -> Parallel.map(16, i -> spin(inside, started))));
        assertEquals("planted budget of 0.2 s passed", stop.getMessage());
        assertEquals(0, inside.get(), "tasks still running when the call returned");
        assertEquals(0, Parallel.running());
    }

    @Test
    void aFailingTaskStopsTheOthersAndItsErrorIsReported() {
        AtomicInteger inside = new AtomicInteger();
        CountDownLatch started = new CountDownLatch(3);
        ContourException e = assertThrows(ContourException.class, () -> Parallel.forEachOrdered(32, i -> {
            if (i == 3) {
                try {
                    started.await(30, TimeUnit.SECONDS); // the others are spinning by now
                } catch (InterruptedException x) {
                    Thread.currentThread().interrupt();
                }
                throw new ContourException("planted failure in task 3");
            }
            return spin(inside, started);
        }, (i, r) -> { }));
        assertEquals("planted failure in task 3", e.getMessage());
        assertFalse(e instanceof Cancellation.Stop);
        assertEquals(0, inside.get(), "tasks still running when the call returned");
        assertEquals(0, Parallel.running());
        // the caller's own work goes on: its token was not stopped by the failure
        Cancellation.check();
    }

    @Test
    void nestedCallsRunOnTheTaskThread() {
        var out = Parallel.map(8, i -> Parallel.inTask() ? Parallel.map(3, j -> 10 * i + j) : null);
        for (int i = 0; i < 8; i++) {
            assertEquals(java.util.List.of(10 * i, 10 * i + 1, 10 * i + 2), out.get(i));
        }
    }

    @Test
    void threadCountsOutsideTheRangeAreRefused() {
        assertThrows(ContourException.class, () -> Parallel.setThreads(0));
        assertThrows(ContourException.class, () -> Parallel.setThreads(Parallel.MAX_THREADS + 1));
        assertEquals(3, Parallel.parseThreads(" 3 ", "--threads"));
        assertEquals("CONTOUR_THREADS needs a whole number of threads (1 to 256), not 'x'",
                assertThrows(ContourException.class, () -> Parallel.parseThreads("x", "CONTOUR_THREADS")).getMessage());
    }
}
