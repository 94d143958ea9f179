package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** Prints timings of the interpreter's workloads ({@code mvn -Pbench test}); figures are never asserted. */
@Tag("bench")
class InterpreterBenchTest {
    @Test
    void timeTheInterpreterWorkloads() {
        Map<String, BenchRegistry.Workload> all = BenchRegistry.standard().all();
        for (String name : new String[] {"parse", "ansatz-sum-p16", "ansatz-sum-p64", "ansatz-sum-p128"}) {
            BenchRegistry.Workload w = all.get(name);
            assertTrue(w != null, name + " is registered");
            w.body().run(); // warm-up
            long t0 = System.nanoTime();
            w.body().run();
            System.out.printf("bench %-16s %10.1f ms%n", name, (System.nanoTime() - t0) / 1e6);
        }
    }
}
