package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.TreeMap;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * Exact propagation leaves a dense system in its parameters; eliminating only the rows independent
 * modulo a prime, then checking every row exactly (and eliminating all of them when one fails),
 * gives exactly what exact Gauss-Jordan on all rows gave: the same consistency, the same free
 * unknowns and the same affine values (the reduced row echelon form with lowest-column pivots is
 * unique).
 */
class ParameterSystemProperties {

    @Property(tries = 150)
    void modularParameterSolveEqualsExactElimination(@ForAll long seed, @ForAll @IntRange(min = 2, max = 30) int n,
                                                     @ForAll @IntRange(min = 1, max = 60) int m) {
        Random rnd = new Random(seed);
        Rational[] planted = new Rational[n];
        for (int i = 0; i < n; i++) {
            planted[i] = Rational.of(rnd.nextInt(21) - 10, 1 + rnd.nextInt(5));
        }
        boolean consistent = rnd.nextInt(4) > 0;
        List<IntegerRow> rows = new ArrayList<>();
        for (int r = 0; r < m; r++) {
            // rows of three or more entries leave parameters, and their residuals mix them
            TreeMap<Integer, Rational> row = new TreeMap<>();
            int len = 2 + rnd.nextInt(Math.min(5, n - 1));
            for (int e = 0; e < len; e++) {
                row.merge(rnd.nextInt(n), Rational.of(rnd.nextInt(19) - 9, 1 + rnd.nextInt(4)), Rational::add);
            }
            row.values().removeIf(Rational::isZero);
            if (row.isEmpty()) {
                continue;
            }
            Rational b = Rational.ZERO;
            for (var e : row.entrySet()) {
                b = b.add(e.getValue().multiply(planted[e.getKey()]));
            }
            if (!consistent && r == m - 1) {
                b = b.add(Rational.ONE);
            }
            IntegerRow ir = IntegerRow.of(row.keySet().stream().mapToInt(Integer::intValue).toArray(),
                    row.values().toArray(new Rational[0]), b, 0);
            if (ir != null) {
                rows.add(ir);
            }
        }
        ExactPropagation.Outcome exact = ExactPropagation.solve(rows, n, SolveProgress.silent(), 0);
        // the working prime, and small ones that lose rank or meet denominators (the exact check then falls back)
        for (long prime : new long[] {ExactPropagation.PARAMETER_PRIME, 2, 3, 5, 7}) {
            ExactPropagation.Outcome chosen = ExactPropagation.solve(rows, n, SolveProgress.silent(), prime);
            assertEquals(exact.consistent(), chosen.consistent(), "prime " + prime);
            if (exact.consistent()) {
                assertArrayEquals(exact.free(), chosen.free(), "prime " + prime);
                for (int c = 0; c < n; c++) {
                    assertArrayEquals(exact.values()[c], chosen.values()[c], "unknown " + c + ", prime " + prime);
                }
            }
        }
    }
}
