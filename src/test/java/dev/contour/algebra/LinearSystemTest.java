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
}
