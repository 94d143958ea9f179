package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import org.junit.jupiter.api.Test;

/** Benchmark settings from the environment: lists and numbers, defaults, and errors that name the variable. */
class BenchEnvTest {
    @Test
    void listsAndNumbersAreReadOrDefaulted() {
        assertArrayEquals(new int[] {256, 512}, BenchEnv.numbers("CONTOUR_SOLVE_P", " 256, 512 ", 2, 8));
        assertArrayEquals(new int[] {2, 8}, BenchEnv.numbers("CONTOUR_SOLVE_P", null, 2, 8));
        assertArrayEquals(new int[] {2, 8}, BenchEnv.numbers("CONTOUR_SOLVE_P", "  ", 2, 8));
        assertEquals(600, BenchEnv.number("CONTOUR_ADS7_BUDGET", "600", 0, Long.MAX_VALUE, 1800));
        assertEquals(1800, BenchEnv.number("CONTOUR_ADS7_BUDGET", null, 0, Long.MAX_VALUE, 1800));
        assertEquals(0, BenchEnv.number("CONTOUR_ADS7_BUDGET", "0", 0, Long.MAX_VALUE, 1800));
    }

    @Test
    void aBadValueNamesTheVariableAndWhatItTakes() {
        ContourException list = assertThrows(ContourException.class, () -> BenchEnv.numbers("CONTOUR_ADS7_K", "4,x", 2));
        assertTrue(list.getMessage().contains("CONTOUR_ADS7_K must list whole numbers") && list.getMessage().contains("'4,x'"),
                list.getMessage());
        assertThrows(ContourException.class, () -> BenchEnv.numbers("CONTOUR_WARD_P", "-4", 2));
        ContourException low = assertThrows(ContourException.class, () -> BenchEnv.number("CONTOUR_SWEEP_BENCH_ROUNDS", "0", 1, 100, 2));
        assertTrue(low.getMessage().contains("from 1 to 100, not '0'"), low.getMessage());
        assertThrows(ContourException.class, () -> BenchEnv.number("CONTOUR_SWEEP_BUDGET", "ten", 0, Long.MAX_VALUE, 7200));
        // a count past its bound is refused, not cast into a negative int
        ContourException high = assertThrows(ContourException.class,
                () -> BenchEnv.number("CONTOUR_SWEEP_BENCH_TOP", "10000000000", 2, 100, 10));
        assertTrue(high.getMessage().contains("from 2 to 100"), high.getMessage());
    }
}
