package dev.contour.bench;


import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** Runs the "ward" workload and prints its table; figures are printed, never asserted. */
@Tag("bench")
class WardBenchTest {
    @Test
    void ward() {
        WardBench.runWard(System.out, 2, 4, 8, 16, 32, 64, 128);
    }
}
