package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

class EvaluationTest {
    @Test
    void aTaskThatEndsReportsWhatItThrew() {
        Evaluation e = new Evaluation(100);
        assertEquals(Evaluation.Outcome.FINISHED, e.run(() -> { }));
        assertNull(e.failure());
        assertEquals(Evaluation.Outcome.FINISHED, e.run(() -> {
            throw new IllegalStateException("planted");
        }));
        assertInstanceOf(IllegalStateException.class, e.failure());
    }

    @Test
    void aTaskThatHeedsInterruptsEndsOnItsOwn() throws Exception {
        Evaluation e = new Evaluation(5_000);
        CountDownLatch started = new CountDownLatch(1);
        Thread signal = interruptAfter(started, e);
        Evaluation.Outcome outcome = e.run(() -> {
            started.countDown();
            while (!Thread.currentThread().isInterrupted()) {
                Thread.onSpinWait();
            }
            throw new IllegalStateException("noticed");
        });
        signal.join();
        assertEquals(Evaluation.Outcome.INTERRUPTED, outcome);
        assertInstanceOf(IllegalStateException.class, e.failure());
    }

    @Test
    void aTaskThatIgnoresInterruptsIsStopped() throws Exception {
        Evaluation e = new Evaluation(50);
        CountDownLatch started = new CountDownLatch(1);
        AtomicLong spins = new AtomicLong();
        Thread signal = interruptAfter(started, e);
        Evaluation.Outcome outcome = e.run(() -> {
            started.countDown();
            while (true) {
                spins.incrementAndGet(); // never looks at its interrupt flag
                Thread.interrupted();
            }
        });
        signal.join();
        assertEquals(Evaluation.Outcome.STOPPED, outcome, "Java 17 still allows stopping a thread");
        long after = spins.get();
        Thread.sleep(100);
        assertEquals(after, spins.get(), "the stopped task no longer runs");
        assertEquals(Evaluation.Outcome.FINISHED, e.run(() -> { }), "the next run is unaffected");
    }

    @Test
    void anInterruptWhenIdleDoesNothing() {
        Evaluation e = new Evaluation(50);
        e.interrupt();
        assertEquals(Evaluation.Outcome.FINISHED, e.run(() -> { }));
    }

    private static Thread interruptAfter(CountDownLatch started, Evaluation e) {
        Thread t = new Thread(() -> {
            try {
                started.await();
            } catch (InterruptedException x) {
                return;
            }
            e.interrupt();
        });
        t.start();
        return t;
    }
}
