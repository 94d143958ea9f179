package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.TreeMap;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/**
 * The modular propagation against the exact one (two algorithms on the same systems): every
 * accepted modular result must be, entry by entry, the exact path's result, with the same free
 * unknowns. The systems are lattice recurrences with planted dependent rows, the shape of a
 * widened ansatz (many parameters, few independent residual equations).
 */
class ModularPropagationTest {

    /**
     * A random lattice system: unknowns on an n x n grid, rows x(i,j) combined with neighbours,
     * plus random combinations of rows (dependent, so the residual system has low rank) and, when
     * inhomogeneous, a planted solution for the right sides.
     */
    private static List<IntegerRow> lattice(long seed, int n, int extra, int coefficientBits, boolean homogeneous) {
        Random rnd = new Random(seed);
        int columns = n * n;
        Rational[] planted = new Rational[columns];
        for (int c = 0; c < columns; c++) {
            planted[c] = homogeneous ? Rational.ZERO : Rational.of(rnd.nextInt(9) - 4, 1 + rnd.nextInt(4));
        }
        List<TreeMap<Integer, Rational>> base = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (rnd.nextInt(3) == 0) {
                    continue; // leave room for parameters
                }
                TreeMap<Integer, Rational> row = new TreeMap<>();
                row.put(i * n + j, coefficient(rnd, coefficientBits));
                if (i + 1 < n) {
                    row.merge((i + 1) * n + j, coefficient(rnd, coefficientBits), Rational::add);
                }
                if (j + 1 < n) {
                    row.merge(i * n + j + 1, coefficient(rnd, coefficientBits), Rational::add);
                }
                if (i + 1 < n && j + 1 < n && rnd.nextBoolean()) {
                    row.merge((i + 1) * n + j + 1, coefficient(rnd, coefficientBits), Rational::add);
                }
                base.add(row);
            }
        }
        List<TreeMap<Integer, Rational>> all = new ArrayList<>(base);
        for (int e = 0; e < extra && !base.isEmpty(); e++) {
            TreeMap<Integer, Rational> sum = new TreeMap<>();
            for (int t = 0; t < 3; t++) {
                Rational f = Rational.of(rnd.nextInt(7) - 3);
                base.get(rnd.nextInt(base.size())).forEach((c, v) -> sum.merge(c, v.multiply(f), Rational::add));
            }
            all.add(sum);
        }
        // a few sparse rows coupling far-apart unknowns (they end up among the residual equations)
        for (int e = 0; e < extra / 2; e++) {
            TreeMap<Integer, Rational> row = new TreeMap<>();
            row.put(rnd.nextInt(columns), coefficient(rnd, coefficientBits));
            row.merge(rnd.nextInt(columns), coefficient(rnd, coefficientBits), Rational::add);
            all.add(row);
        }
        List<IntegerRow> rows = new ArrayList<>();
        for (TreeMap<Integer, Rational> row : all) {
            row.values().removeIf(Rational::isZero);
            if (row.isEmpty()) {
                continue;
            }
            Rational b = Rational.ZERO;
            for (var e : row.entrySet()) {
                b = b.add(e.getValue().multiply(planted[e.getKey()]));
            }
            IntegerRow r = IntegerRow.of(row.keySet().stream().mapToInt(Integer::intValue).toArray(),
                    row.values().toArray(new Rational[0]), b, 0);
            if (r != null) {
                rows.add(r);
            }
        }
        return rows;
    }

    private static Rational coefficient(Random rnd, int bits) {
        BigInteger v = new BigInteger(bits, rnd).add(BigInteger.ONE);
        return Rational.of(rnd.nextBoolean() ? v : v.negate());
    }

    private static void assertSame(ExactPropagation.Outcome expected, ExactPropagation.Outcome actual) {
        assertEquals(expected.consistent(), actual.consistent());
        if (!expected.consistent()) {
            return;
        }
        assertArrayEquals(expected.free(), actual.free(), "free unknowns");
        assertEquals(expected.values().length, actual.values().length);
        for (int c = 0; c < expected.values().length; c++) {
            assertArrayEquals(expected.values()[c], actual.values()[c], "unknown " + c);
        }
    }

    @Property(tries = 150)
    void acceptedModularResultsAreTheExactOnes(@ForAll long seed, @ForAll @IntRange(min = 2, max = 9) int n,
                                               @ForAll @IntRange(min = 0, max = 30) int extra,
                                               @ForAll @IntRange(min = 1, max = 40) int bits,
                                               @ForAll boolean homogeneous) {
        List<IntegerRow> rows = lattice(seed, n, extra, bits, homogeneous);
        int columns = n * n;
        ExactPropagation.Plan plan = ExactPropagation.plan(rows, columns, SolveProgress.silent());
        ExactPropagation.Outcome exact = ExactPropagation.exact(rows, columns, plan);
        assertTrue(exact.consistent(), "a planted solution exists");
        ExactPropagation.Outcome modular = ModularPropagation.solve(rows, columns, plan);
        if (modular != null) {
            assertSame(exact, modular);
        }
        assertSame(exact, ExactPropagation.solve(rows, columns, SolveProgress.silent()));
    }

    @Test
    void theModularPathIsTakenOnLatticeSystemsAndAgrees() {
        int taken = 0;
        for (long seed = 1; seed <= 40; seed++) {
            List<IntegerRow> rows = lattice(seed, 6, 20, 1, seed % 2 == 0);
            ExactPropagation.Plan plan = ExactPropagation.plan(rows, 36, SolveProgress.silent());
            if (plan.allUsed()) {
                continue;
            }
            ExactPropagation.Outcome modular = ModularPropagation.solve(rows, 36, plan);
            if (modular != null) {
                taken++;
                assertSame(ExactPropagation.exact(rows, 36, plan), modular);
            }
        }
        assertTrue(taken >= 30, "the modular path should succeed on most systems, took " + taken + " of 40");
    }

    @Test
    void largeValuesNeedSeveralPrimesAndStillAgree() {
        // coefficients of 60 bits: values far beyond one prime's reconstruction bound
        List<IntegerRow> rows = lattice(7, 6, 12, 60, false);
        ExactPropagation.Plan plan = ExactPropagation.plan(rows, 36, SolveProgress.silent());
        assertFalse(plan.allUsed());
        ExactPropagation.Outcome exact = ExactPropagation.exact(rows, 36, plan);
        ExactPropagation.Outcome modular = ModularPropagation.solve(rows, 36, plan);
        if (modular != null) {
            assertSame(exact, modular);
        }
        assertSame(exact, ExactPropagation.solve(rows, 36, SolveProgress.silent()));
    }

    @Test
    void aPrimeDividingAPivotIsSkipped() {
        // x0 - x1 = 0, q x1 - x2 = 1 with q the largest prime below 2^31 (the first prime tried),
        // x2 + x3 = 0, x0 - x3 = 0 and a dependent row; solution x0 = x1 = x3 = 1/(q + 1), x2 = -x0.
        long q = 2147483647L;
        assertTrue(BigInteger.valueOf(q).isProbablePrime(60));
        List<IntegerRow> rows = new ArrayList<>();
        rows.add(IntegerRow.of(new int[] {0, 1}, new Rational[] {Rational.ONE, Rational.MINUS_ONE}, Rational.ZERO, 0));
        rows.add(IntegerRow.of(new int[] {1, 2}, new Rational[] {Rational.of(q), Rational.MINUS_ONE}, Rational.ONE, 0));
        rows.add(IntegerRow.of(new int[] {2, 3}, new Rational[] {Rational.ONE, Rational.ONE}, Rational.ZERO, 0));
        rows.add(IntegerRow.of(new int[] {0, 3}, new Rational[] {Rational.ONE, Rational.MINUS_ONE}, Rational.ZERO, 0));
        // the sum of the first three rows: x0 + (q - 1) x1 + x3 = 1
        rows.add(IntegerRow.of(new int[] {0, 1, 3}, new Rational[] {Rational.ONE, Rational.of(q - 1), Rational.ONE}, Rational.ONE, 0));
        rows.removeIf(r -> r == null);
        ExactPropagation.Plan plan = ExactPropagation.plan(rows, 4, SolveProgress.silent());
        ExactPropagation.Outcome exact = ExactPropagation.exact(rows, 4, plan);
        ExactPropagation.Outcome modular = ModularPropagation.solve(rows, 4, plan);
        if (!plan.allUsed()) {
            assertNotNull(modular, "the other primes carry it");
            assertSame(exact, modular);
        }
        assertSame(exact, ExactPropagation.solve(rows, 4, SolveProgress.silent()));
    }
}
