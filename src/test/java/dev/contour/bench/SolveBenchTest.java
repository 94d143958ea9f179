package dev.contour.bench;


import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** Workload "solve" (figures printed, never asserted): mvn -Pbench test. */
@Tag("bench")
class SolveBenchTest {
    @Test
    void solveWorkload() {
        SolveBench.runSolve(System.out, 2, 8, 32, 64, 128, 256, 512);
    }
}
