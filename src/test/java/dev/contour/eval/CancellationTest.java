package dev.contour.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.bench.WardBench;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;

/**
 * An interrupt reaches the long loops inside one statement (equation building, elimination,
 * operator application, products), not only the boundaries between statements: interrupted from
 * another thread, a run ends within a second (a hang guard, not a speed figure) and leaves no
 * helper thread working.
 */
class CancellationTest {
    /** Far longer than the bound below on any machine: a p = 384 solve (73,536 unknowns) runs for many seconds. */
    private static final String LONG_SOLVE = dev.contour.bench.AnsatzSumBench.script(384) + """
            let sol = solve supergravity_poles(ward(p)(Mred), p) for a
            """;

    /** A hang guard, not a speed figure: before the fix these runs went on for tens of seconds; the
     * bound leaves room for a machine shared with other work. */
    private static final long BOUND_MILLIS = 2_000;

    @Test
    void anInterruptStopsALongSolveInsideTheStatement() throws Exception {
        assertStopsPromptly(solveScript(), "Mred");
    }

    @Test
    void anInterruptStopsALongWardBuildInsideTheStatement() throws Exception {
        // building the full amplitude at p = 256 (33,153 sigma, tau monomials) takes many seconds
        assertStopsPromptly(WardBench.script(256) + "let found = poles(M, full_measure(p))\n", "M");
    }

    @Test
    void aPassedDeadlineStopsTheRunWithItsMessageAndLocation() {
        Interpreter session = new Interpreter(InterpreterOptions.to(quiet()));
        Cancellation.Token budget = Cancellation.current().withDeadline(System.nanoTime() + 300_000_000L,
                "planted budget of 0.3 s passed (raise it with ...)");
        ContourException e = org.junit.jupiter.api.Assertions.assertThrows(ContourException.class,
                () -> Cancellation.run(budget, () -> session.run("vars s, t, u, v\nlet big = (s + t + u + v + 1)^50\n", "budget.ctr")));
        assertEquals("planted budget of 0.3 s passed (raise it with ...)", e.getMessage());
        assertEquals(2, e.span().line(), "located at the statement that was running");
        assertInstanceOf(Cancellation.Stop.class, e);
    }

    @Test
    void withoutAStopRequestTheCheckIsSilent() {
        Cancellation.check();
        assertFalse(Cancellation.stopping());
        Cancellation.Token t = Cancellation.Token.manual();
        Cancellation.run(t, Cancellation::check);
        t.cancel("asked to stop");
        Cancellation.Stop stop = org.junit.jupiter.api.Assertions.assertThrows(Cancellation.Stop.class,
                () -> Cancellation.run(t, Cancellation::check));
        assertEquals("asked to stop", stop.getMessage());
    }

    private static String solveScript() {
        return LONG_SOLVE;
    }

    /**
     * Runs the script on another thread, waits until {@code ready} is defined (the statements
     * before the long last one are done), lets the last one run a second, then interrupts.
     */
    private static void assertStopsPromptly(String script, String ready) throws Exception {
        Interpreter session = new Interpreter(InterpreterOptions.to(quiet()));
        AtomicReference<Throwable> thrown = new AtomicReference<>();
        Thread worker = new Thread(() -> {
            try {
                session.run(script, "long.ctr");
            } catch (Throwable t) {
                thrown.set(t);
            }
        }, "cancellation-test");
        worker.start();
        long waitUntil = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (session.lookup(ready) == null && worker.isAlive() && System.nanoTime() < waitUntil) {
            Thread.sleep(20);
        }
        Thread.sleep(1_000); // well inside the long last statement, which checks for interrupts only inside its loops
        assertTrue(worker.isAlive(), "the workload should still be running: " + thrown.get());
        long asked = System.nanoTime();
        worker.interrupt();
        Thread.sleep(BOUND_MILLIS / 2);
        StackTraceElement[] where = worker.getStackTrace(); // to say which loop did not check, should one not
        worker.join(Duration.ofSeconds(60).toMillis());
        long stoppedMillis = TimeUnit.NANOSECONDS.toMillis(System.nanoTime() - asked);
        assertFalse(worker.isAlive(), "the run did not stop");
        assertTrue(stoppedMillis < BOUND_MILLIS, "the run took " + stoppedMillis + " ms to stop; half way it was at\n    "
                + String.join("\n    ", java.util.Arrays.stream(where).limit(25).map(String::valueOf).toList()));
        assertInstanceOf(ContourException.class, thrown.get());
        assertTrue(thrown.get().getMessage().endsWith("interrupted"), thrown.get().getMessage());
        assertTrue(((ContourException) thrown.get()).span().isKnown(), "the stop names the statement");
        assertEquals(0, dev.contour.Parallel.running(), "parallel helpers are still working");
    }

    private static PrintStream quiet() {
        return new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8);
    }
}
