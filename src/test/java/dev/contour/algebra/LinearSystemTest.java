package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

class LinearSystemTest {
    private static Map<Integer, Rational> row(long... c) {
        Map<Integer, Rational> m = new HashMap<>();
        for (int i = 0; i < c.length; i++) {
            m.put(i, Rational.of(c[i]));
        }
        return m;
    }

    @Test
    void uniqueFamilyInconsistent() {
        LinearSystem a = new LinearSystem(2);
        a.addRow(row(1, 1), Rational.of(3), "r1");
        a.addRow(row(1, -1), Rational.of(1), "r2");
        assertEquals(new LinearSystem.Unique(List.of(Rational.of(2), Rational.ONE)), a.solve());

        LinearSystem b = new LinearSystem(3);
        b.addRow(row(1, 2, 3), Rational.of(6), "only");
        LinearSystem.Family f = assertInstanceOf(LinearSystem.Family.class, b.solve());
        assertEquals(1, f.rank());
        assertEquals(List.of(1, 2), f.freeColumns());
        assertEquals(List.of(Rational.of(6), Rational.ZERO, Rational.ZERO), f.particular());
        assertEquals(List.of(Rational.of(-2), Rational.ONE, Rational.ZERO), f.nullBasis().get(0));

        LinearSystem c = new LinearSystem(3);
        c.addRow(row(1, 0, 1), Rational.of(1), "a");
        c.addRow(row(0, 1, 0), Rational.of(5), "unrelated");
        c.addRow(row(0, 0, 1), Rational.of(2), "b");
        c.addRow(row(1, 0, 0), Rational.of(0), "c");
        LinearSystem.Inconsistent bad = assertInstanceOf(LinearSystem.Inconsistent.class, c.solve());
        assertEquals(List.of("a", "b", "c"), bad.conflictingTags());
        assertThrows(ContourException.class, () -> c.addRow(row(0, 0, 0, 1), Rational.ONE, "x"));
    }

    /** A planted solution x* is recovered, and every family member solves the system. */
    @Property(tries = 60)
    void plantedSolution(@ForAll @IntRange(min = 1, max = 9) int n, @ForAll @IntRange(min = 1, max = 12) int m, @ForAll long seed) {
        Random rnd = new Random(seed);
        List<Rational> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(Rational.of(rnd.nextInt(21) - 10, 1 + rnd.nextInt(4)));
        }
        LinearSystem sys = new LinearSystem(n);
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        for (int r = 0; r < m; r++) {
            Map<Integer, Rational> c = new HashMap<>();
            Rational b = Rational.ZERO;
            for (int i = 0; i < n; i++) {
                if (rnd.nextInt(3) == 0) {
                    Rational v = Rational.of(rnd.nextInt(7) - 3);
                    c.put(i, v);
                    b = b.add(v.multiply(x.get(i)));
                }
            }
            rows.add(c);
            rhs.add(b);
            sys.addRow(c, b, r);
        }
        LinearSystem.Solution s = sys.solve();
        if (s instanceof LinearSystem.Unique u) {
            assertEquals(x, u.values());
        } else {
            LinearSystem.Family f = assertInstanceOf(LinearSystem.Family.class, s);
            assertEquals(n - f.rank(), f.freeColumns().size());
            List<Rational> y = new ArrayList<>(f.particular());
            for (int k = 0; k < f.nullBasis().size(); k++) {
                Rational w = Rational.of(k + 2);
                for (int i = 0; i < n; i++) {
                    y.set(i, y.get(i).add(w.multiply(f.nullBasis().get(k).get(i))));
                }
            }
            for (int r = 0; r < m; r++) {
                Rational lhs = Rational.ZERO;
                for (Map.Entry<Integer, Rational> e : rows.get(r).entrySet()) {
                    lhs = lhs.add(e.getValue().multiply(y.get(e.getKey())));
                }
                assertEquals(rhs.get(r), lhs);
            }
        }
        assertTrue(s instanceof LinearSystem.Unique || s instanceof LinearSystem.Family);
    }

    /** Random small system, possibly rank-deficient (combined rows), inconsistent (perturbed rhs), with big entries. */
    private static LinearSystem randomSystem(Random rnd, int n, int m, boolean big, boolean perturb) {
        LinearSystem sys = new LinearSystem(n);
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        for (int r = 0; r < m; r++) {
            Map<Integer, Rational> c = new HashMap<>();
            Rational b;
            if (r >= 2 && rnd.nextInt(3) == 0) {
                // a combination of two earlier rows: rank deficiency
                Rational u = Rational.of(rnd.nextInt(5) - 2, 1 + rnd.nextInt(3));
                Rational w = Rational.of(rnd.nextInt(5) - 2, 1 + rnd.nextInt(3));
                int i1 = rnd.nextInt(r);
                int i2 = rnd.nextInt(r);
                for (int i = 0; i < n; i++) {
                    Rational v = rows.get(i1).getOrDefault(i, Rational.ZERO).multiply(u)
                            .add(rows.get(i2).getOrDefault(i, Rational.ZERO).multiply(w));
                    if (!v.isZero()) {
                        c.put(i, v);
                    }
                }
                b = rhs.get(i1).multiply(u).add(rhs.get(i2).multiply(w));
                if (perturb && rnd.nextInt(2) == 0) {
                    b = b.add(Rational.ONE);
                }
            } else {
                for (int i = 0; i < n; i++) {
                    if (rnd.nextInt(2) == 0) {
                        c.put(i, coefficient(rnd, big));
                    }
                }
                b = coefficient(rnd, big);
            }
            rows.add(c);
            rhs.add(b);
            sys.addRow(c, b, "row" + r);
        }
        return sys;
    }

    private static Rational coefficient(Random rnd, boolean big) {
        if (!big) {
            return Rational.of(rnd.nextInt(7) - 3, 1 + rnd.nextInt(3));
        }
        java.math.BigInteger num = new java.math.BigInteger(1 + rnd.nextInt(120), rnd);
        java.math.BigInteger den = new java.math.BigInteger(1 + rnd.nextInt(120), rnd).add(java.math.BigInteger.ONE);
        return Rational.of(rnd.nextBoolean() ? num : num.negate(), den);
    }

    /** The multi-modular solve() gives exactly the reference Gauss-Jordan result (same records). */
    @Property(tries = 150)
    void modularAgreesWithExact(@ForAll @IntRange(min = 0, max = 8) int n, @ForAll @IntRange(min = 0, max = 10) int m,
            @ForAll boolean big, @ForAll boolean perturb, @ForAll long seed) {
        LinearSystem sys = randomSystem(new Random(seed), n, m, big, perturb);
        assertEquals(sys.solveExact(), sys.solve());
    }

    @Test
    void modularAgreesWithExactOnHandPickedCases() {
        // Dependent columns first: the free column is the later one, as in the RREF.
        LinearSystem a = new LinearSystem(3);
        a.addRow(row(2, 4, 1), Rational.of(3), "a");
        a.addRow(row(1, 2, 0), Rational.of(1), "b");
        assertEquals(a.solveExact(), a.solve());
        LinearSystem.Family f = assertInstanceOf(LinearSystem.Family.class, a.solve());
        assertEquals(List.of(1), f.freeColumns());
        // A coefficient divisible by the first primes tried does not matter (rows are scaled to integers).
        LinearSystem b = new LinearSystem(2);
        b.addRow(Map.of(0, Rational.of(268435399L * 268435367L), 1, Rational.ONE), Rational.ONE, "x");
        b.addRow(Map.of(0, Rational.ONE, 1, Rational.of(1, 268435399L)), Rational.ZERO, "y");
        assertEquals(b.solveExact(), b.solve());
    }

    private static Rational dot(Map<Integer, Rational> row, List<Rational> x) {
        Rational s = Rational.ZERO;
        for (Map.Entry<Integer, Rational> e : row.entrySet()) {
            s = s.add(e.getValue().multiply(x.get(e.getKey())));
        }
        return s;
    }

    /** v scaled by the lcm of its denominators, as integers, the lcm last (exact; no gcd per rational addition). */
    private static java.math.BigInteger[] integerVector(List<Rational> v) {
        java.math.BigInteger l = java.math.BigInteger.ONE;
        for (Rational q : v) {
            java.math.BigInteger d = q.denominator();
            if (l.mod(d).signum() != 0) {
                l = l.divide(l.gcd(d)).multiply(d);
            }
        }
        java.math.BigInteger[] w = new java.math.BigInteger[v.size() + 1];
        for (int i = 0; i < v.size(); i++) {
            w[i] = v.get(i).numerator().multiply(l.divide(v.get(i).denominator()));
        }
        w[v.size()] = l;
        return w;
    }

    /** Whether row . v = rhs exactly, for v given by {@link #integerVector} (all scaled to integers). */
    private static boolean holds(Map<Integer, Rational> row, Rational rhs, java.math.BigInteger[] w) {
        java.math.BigInteger l = w[w.length - 1];
        java.math.BigInteger rl = rhs.denominator();
        for (Rational a : row.values()) {
            rl = rl.divide(rl.gcd(a.denominator())).multiply(a.denominator());
        }
        java.math.BigInteger s = rhs.numerator().multiply(rl.divide(rhs.denominator())).multiply(l).negate();
        for (Map.Entry<Integer, Rational> e : row.entrySet()) {
            Rational a = e.getValue();
            s = s.add(a.numerator().multiply(rl.divide(a.denominator())).multiply(w[e.getKey()]));
        }
        return s.signum() == 0;
    }

    /** Checks A particular = b, A v = 0, identity on the free columns and the RREF support; returns the family. */
    private static LinearSystem.Family checkFamily(LinearSystem.Solution s, List<Map<Integer, Rational>> rows, List<Rational> rhs, int n) {
        LinearSystem.Family f = assertInstanceOf(LinearSystem.Family.class, s);
        assertEquals(n - f.rank(), f.freeColumns().size());
        java.util.Set<Integer> free = new java.util.HashSet<>(f.freeColumns());
        for (int c : f.freeColumns()) {
            assertEquals(Rational.ZERO, f.particular().get(c));
        }
        java.math.BigInteger[] p = integerVector(f.particular());
        for (int r = 0; r < rows.size(); r++) {
            assertTrue(holds(rows.get(r), rhs.get(r), p), "particular fails row " + r);
        }
        for (int k = 0; k < f.nullBasis().size(); k++) {
            List<Rational> v = f.nullBasis().get(k);
            int fc = f.freeColumns().get(k);
            for (int c = 0; c < n; c++) {
                if (free.contains(c)) {
                    assertEquals(c == fc ? Rational.ONE : Rational.ZERO, v.get(c));
                } else if (c > fc) {
                    assertEquals(Rational.ZERO, v.get(c), "RREF: a pivot above the free column is not involved");
                }
            }
            java.math.BigInteger[] w = integerVector(v);
            for (Map<Integer, Rational> row : rows) {
                assertTrue(holds(row, Rational.ZERO, w), "null vector " + k);
            }
        }
        return f;
    }

    @Test
    @Timeout(600) // a guard against a hang, not a speed check
    void randomSparse600By500() {
        int n = 600;
        Random rnd = new Random(20240601L);
        List<Rational> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(Rational.of(rnd.nextInt(19) - 9, 1 + rnd.nextInt(3)));
        }
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        LinearSystem sys = new LinearSystem(n);
        for (int r = 0; r < 500; r++) {
            Map<Integer, Rational> c = new HashMap<>();
            while (c.size() < 6) {
                int v = rnd.nextInt(19) - 9;
                if (v != 0) {
                    c.put(rnd.nextInt(n), rnd.nextInt(8) == 0 ? Rational.of(v, 2) : Rational.of(v));
                }
            }
            rows.add(c);
            rhs.add(dot(c, x));
            sys.addRow(c, rhs.get(r), r);
        }
        LinearSystem.Family f = checkFamily(sys.solve(), rows, rhs, n);
        // 500 random rows of 6 entries in 600 columns (fixed seed) are independent.
        assertEquals(500, f.rank());
        // The planted solution is in the family: x = particular + sum over free c of x_c * v_c,
        // checked exactly on every 25th column.
        for (int i = 0; i < n; i += 25) {
            Rational yi = f.particular().get(i);
            for (int k = 0; k < f.nullBasis().size(); k++) {
                Rational vk = f.nullBasis().get(k).get(i);
                if (!vk.isZero()) {
                    yi = yi.add(x.get(f.freeColumns().get(k)).multiply(vk));
                }
            }
            assertEquals(x.get(i), yi, "column " + i);
        }
    }

    @Test
    @Timeout(600) // a guard against a hang, not a speed check
    void lattice2000() {
        // A 40 x 50 lattice: each equation ties a site to its right and upper neighbours (banded, width 50).
        int w = 50;
        int h = 40;
        int n = w * h;
        Random rnd = new Random(7L);
        List<Rational> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(Rational.of(rnd.nextInt(11) - 5));
        }
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        LinearSystem sys = new LinearSystem(n);
        for (int i = 0; i < h; i++) {
            for (int j = 0; j < w; j++) {
                if ((i * w + j) % 37 == 5) {
                    continue; // a few sites without an equation: a rank-deficient system
                }
                Map<Integer, Rational> c = new HashMap<>();
                int site = i * w + j;
                c.put(site, Rational.of(1 + rnd.nextInt(2)));
                if (j + 1 < w) {
                    c.put(site + 1, Rational.of(-1));
                }
                if (i + 1 < h) {
                    c.put(site + w, Rational.of(rnd.nextInt(3) - 1));
                }
                rows.add(c);
                rhs.add(dot(c, x));
                sys.addRow(c, rhs.get(rhs.size() - 1), site);
            }
        }
        LinearSystem.Family f = checkFamily(sys.solve(), rows, rhs, n);
        assertEquals(rows.size(), f.rank());
    }
}
