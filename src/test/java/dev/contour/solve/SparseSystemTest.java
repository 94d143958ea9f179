package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.Span;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

class SparseSystemTest {

    private static List<String> names(int n) {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add("x" + i);
        }
        return out;
    }

    @Property(tries = 200)
    void recoversPlantedSolutions(@ForAll long seed, @ForAll @IntRange(min = 1, max = 40) int n,
                                  @ForAll @IntRange(min = 0, max = 80) int m) {
        Random rnd = new Random(seed);
        Rational[] planted = new Rational[n];
        for (int i = 0; i < n; i++) {
            planted[i] = Rational.of(rnd.nextInt(21) - 10, 1 + rnd.nextInt(5));
        }
        SparseSystem sys = new SparseSystem(names(n));
        int tag = sys.constraint(new Span("t.ctr", 1, 1, 1), "random");
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        for (int r = 0; r < m; r++) {
            Map<Integer, Rational> row = new HashMap<>();
            int len = 1 + rnd.nextInt(Math.min(4, n));
            for (int e = 0; e < len; e++) {
                row.put(rnd.nextInt(n), Rational.of(rnd.nextInt(9) - 4, 1 + rnd.nextInt(3)));
            }
            Rational b = Rational.ZERO;
            for (var e : row.entrySet()) {
                b = b.add(e.getValue().multiply(planted[e.getKey()]));
            }
            sys.addEquation(tag, row, b);
            rows.add(row);
            rhs.add(b);
        }
        Solution sol = sys.solve();
        int rank = DenseRank.of(rows, n);
        if (rank == n) {
            Solution.Unique u = assertInstanceOf(Solution.Unique.class, sol);
            for (int i = 0; i < n; i++) {
                assertEquals(planted[i], u.values().get(i));
            }
        } else {
            Solution.Family f = assertInstanceOf(Solution.Family.class, sol);
            assertEquals(n - rank, f.dimension());
            // The planted point lies in the family: read off the free unknowns, rebuild the rest.
            for (int i = 0; i < n; i++) {
                List<Rational> a = f.affine().get(i);
                Rational v = a.get(0);
                for (int k = 0; k < f.dimension(); k++) {
                    v = v.add(a.get(k + 1).multiply(planted[f.unknowns().indexOf(f.free().get(k))]));
                }
                assertEquals(planted[i], v, "unknown x" + i);
            }
        }
    }

    @Property(tries = 100)
    void plantedContradictionsAreFoundAndTheReportedSetIsMinimal(@ForAll long seed,
            @ForAll @IntRange(min = 1, max = 12) int n, @ForAll @IntRange(min = 1, max = 12) int m) {
        Random rnd = new Random(seed);
        Rational[] planted = new Rational[n];
        for (int i = 0; i < n; i++) {
            planted[i] = Rational.of(rnd.nextInt(11) - 5);
        }
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        for (int r = 0; r < m; r++) {
            Map<Integer, Rational> row = new HashMap<>();
            for (int e = 0; e < 1 + rnd.nextInt(Math.min(3, n)); e++) {
                row.merge(rnd.nextInt(n), Rational.of(rnd.nextInt(7) - 3), Rational::add);
            }
            row.values().removeIf(Rational::isZero);
            if (row.isEmpty()) {
                row.put(0, Rational.ONE);
            }
            Rational b = Rational.ZERO;
            for (var e : row.entrySet()) {
                b = b.add(e.getValue().multiply(planted[e.getKey()]));
            }
            rows.add(row);
            rhs.add(b);
        }
        // the planted contradiction: twice row 0 plus row m-1, with the right side off by one
        Map<Integer, Rational> bad = new HashMap<>();
        rows.get(0).forEach((c, v) -> bad.merge(c, v.multiply(Rational.of(2)), Rational::add));
        rows.get(m - 1).forEach((c, v) -> bad.merge(c, v, Rational::add));
        rows.add(bad);
        rhs.add(rhs.get(0).multiply(Rational.of(2)).add(rhs.get(m - 1)).add(Rational.ONE));
        Solution.Inconsistent inc = assertInstanceOf(Solution.Inconsistent.class, system(rows, rhs, null, n).solve());
        java.util.Set<Integer> lines = new java.util.HashSet<>(inc.conflicting().stream().map(Span::line).toList());
        assertTrue(lines.contains(m + 1), "the planted row is in every conflict here: " + lines);
        assertInstanceOf(Solution.Inconsistent.class, system(rows, rhs, lines, n).solve());
        for (int drop : lines) {
            java.util.Set<Integer> fewer = new java.util.HashSet<>(lines);
            fewer.remove(drop);
            assertTrue(!(system(rows, rhs, fewer, n).solve() instanceof Solution.Inconsistent), "not minimal: " + lines);
        }
    }

    /** One constraint per row (line r + 1), keeping only the rows whose line is in keep (all if null). */
    private static SparseSystem system(List<Map<Integer, Rational>> rows, List<Rational> rhs, java.util.Set<Integer> keep, int n) {
        SparseSystem sys = new SparseSystem(names(n));
        for (int r = 0; r < rows.size(); r++) {
            int tag = sys.constraint(new Span("p.ctr", r + 1, 1, 1), "row " + (r + 1));
            if (keep == null || keep.contains(r + 1)) {
                sys.addEquation(tag, rows.get(r), rhs.get(r));
            }
        }
        return sys;
    }

    @Test
    void overConstrainedToyNamesTheConflictingLines() {
        // x + y = 1 (line 1), x - y = 0 (line 2), z = 5 (line 3), x = 2 (line 4): lines 1, 2, 4 conflict.
        SparseSystem sys = new SparseSystem(List.of("x", "y", "z"));
        int l1 = sys.constraint(new Span("toy.ctr", 1, 1, 1), "x + y = 1");
        int l2 = sys.constraint(new Span("toy.ctr", 2, 1, 1), "x - y = 0");
        int l3 = sys.constraint(new Span("toy.ctr", 3, 1, 1), "z = 5");
        int l4 = sys.constraint(new Span("toy.ctr", 4, 1, 1), "x = 2");
        sys.addEquation(l1, Map.of(0, Rational.ONE, 1, Rational.ONE), Rational.ONE);
        sys.addEquation(l2, Map.of(0, Rational.ONE, 1, Rational.MINUS_ONE), Rational.ZERO);
        sys.addEquation(l3, Map.of(2, Rational.ONE), Rational.of(5));
        sys.addEquation(l4, Map.of(0, Rational.ONE), Rational.of(2));
        Solution.Inconsistent bad = assertInstanceOf(Solution.Inconsistent.class, sys.solve());
        assertEquals(List.of(1, 2, 4), bad.conflicting().stream().map(Span::line).toList());
    }

    @Test
    void underConstrainedToyNamesItsFreeUnknowns() {
        // a + b + c = 3 and a - c = 0: one free unknown; the family contains (1, 1, 1) and (0, 3, 0).
        SparseSystem sys = new SparseSystem(List.of("a[0]", "a[1]", "a[2]"));
        int t = sys.constraint(Span.NONE, "toy");
        sys.addEquation(t, Map.of(0, Rational.ONE, 1, Rational.ONE, 2, Rational.ONE), Rational.of(3));
        sys.addEquation(t, Map.of(0, Rational.ONE, 2, Rational.MINUS_ONE), Rational.ZERO);
        Solution.Family fam = assertInstanceOf(Solution.Family.class, sys.solve());
        assertEquals(1, fam.dimension());
        assertTrue(List.of("a[0]", "a[1]", "a[2]").containsAll(fam.free()));
        Solution.Unique one = assertInstanceOf(Solution.Unique.class,
                fam.normalized("a[0]", Rational.ONE, Span.NONE));
        assertEquals(List.of(Rational.ONE, Rational.ONE, Rational.ONE), one.values());
        Solution.Unique other = assertInstanceOf(Solution.Unique.class,
                fam.normalized("a[1]", Rational.of(3), Span.NONE));
        assertEquals(List.of(Rational.ZERO, Rational.of(3), Rational.ZERO), other.values());
    }
}
