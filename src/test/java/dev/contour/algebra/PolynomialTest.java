package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class PolynomialTest {
    @Provide
    Arbitrary<Polynomial> polys() {
        return Gen.polynomials(6, 3);
    }

    @Provide
    Arbitrary<Map<String, Rational>> points() {
        return Gen.points();
    }

    @Property(tries = 200)
    void ringLaws(@ForAll("polys") Polynomial a, @ForAll("polys") Polynomial b, @ForAll("polys") Polynomial c) {
        assertEquals(a.add(b), b.add(a));
        assertEquals(a.add(b).add(c), a.add(b.add(c)));
        assertEquals(a.multiply(b), b.multiply(a));
        assertEquals(a.multiply(b).multiply(c), a.multiply(b.multiply(c)));
        assertEquals(a.multiply(b.add(c)), a.multiply(b).add(a.multiply(c)));
        assertEquals(Polynomial.ZERO, a.subtract(a));
        assertEquals(a, a.multiply(Polynomial.ONE));
        assertEquals(a.multiply(b).hashCode(), b.multiply(a).hashCode());
    }

    @Property(tries = 200)
    void evaluationIsAHomomorphism(@ForAll("polys") Polynomial a, @ForAll("polys") Polynomial b,
            @ForAll("points") Map<String, Rational> x) {
        assertEquals(a.evaluate(x).add(b.evaluate(x)), a.add(b).evaluate(x));
        assertEquals(a.evaluate(x).multiply(b.evaluate(x)), a.multiply(b).evaluate(x));
        assertEquals(a.evaluate(x).pow(3), a.pow(3).evaluate(x));
        Polynomial shifted = a.substitute(Map.of("s", Polynomial.variable("t").add(Polynomial.constant(2))));
        assertEquals(a.evaluate(Map.of("s", x.get("t").add(Rational.of(2)), "t", x.get("t"), "u", x.get("u"))),
                shifted.evaluate(x));
        assertEquals(a.evaluate(x), a.evaluatePartially(Map.of("s", x.get("s"))).evaluate(x));
    }

    @Property(tries = 200)
    void exactDivisionUndoesMultiplication(@ForAll("polys") Polynomial a, @ForAll("polys") Polynomial b) {
        if (b.isZero()) {
            return;
        }
        assertEquals(a, a.multiply(b).divideExact(b));
        Polynomial off = a.multiply(b).add(Polynomial.variable("s").pow(7));
        if (b.totalDegree() > 0) {
            assertTrue(off.tryDivide(b).isEmpty() || off.tryDivide(b).get().multiply(b).equals(off));
        }
    }

    @Property(tries = 100)
    void orderDoesNotDependOnConstructionOrder(@ForAll("polys") Polynomial a, @ForAll long seed) {
        List<Polynomial> parts = new ArrayList<>();
        for (Polynomial.Term t : a.terms()) {
            parts.add(Polynomial.monomial(t.coefficient(), t.exponents()));
        }
        Collections.shuffle(parts, new Random(seed));
        Polynomial rebuilt = parts.stream().reduce(Polynomial.ZERO, Polynomial::add);
        assertEquals(a, rebuilt);
        assertEquals(a.toString(), rebuilt.toString());
        assertEquals(a.hashCode(), rebuilt.hashCode());
    }

    @Property(tries = 100)
    void contentAndPrimitivePart(@ForAll("polys") Polynomial a) {
        if (a.isZero()) {
            return;
        }
        Polynomial pp = a.primitivePart();
        assertEquals(a, pp.multiply(a.content()));
        assertTrue(pp.leadingCoefficient().signum() > 0);
        for (Polynomial.Term t : pp.terms()) {
            assertTrue(t.coefficient().isInteger());
        }
        assertEquals(Rational.ONE, pp.content());
    }

    @Test
    void structureAndPrinting() {
        Polynomial s = Polynomial.variable("s");
        Polynomial t = Polynomial.variable("t");
        Polynomial p = s.pow(2).multiply(t).multiply(Rational.of(3)).subtract(Polynomial.constant(Rational.of(1, 2)));
        assertEquals("3*s^2*t - 1/2", p.toString());
        assertEquals(2, p.degree("s"));
        assertEquals(0, p.degree("x"));
        assertEquals(3, p.totalDegree());
        assertEquals(List.of("s", "t"), new ArrayList<>(p.variables()));
        assertEquals(Rational.of(3), p.leadingCoefficient());
        assertEquals(t.multiply(Rational.of(3)), p.coefficient("s", 2));
        assertEquals(Polynomial.constant(Rational.of(-1, 2)), p.coefficient("s", 0));
        assertEquals(s.pow(2).multiply(Rational.of(3)), p.coefficients(List.of("t")).get(List.of(1)));
        assertEquals(s.multiply(t).multiply(Rational.of(6)), p.derivative("s"));
        // graded: t^3 (degree 3) leads s^2 (degree 2); on equal degree the earlier name wins
        assertEquals("t^3 + s^2", t.pow(3).add(s.pow(2)).toString());
        assertEquals("s*t + t^2", t.pow(2).add(s.multiply(t)).toString());
        assertTrue(Polynomial.ONE.isOne());
        assertFalse(p.isConstant());
        assertEquals(Rational.of(5), Polynomial.constant(5).constantValue());
    }

    @Test
    void errors() {
        Polynomial s = Polynomial.variable("s");
        assertThrows(ContourException.class, () -> s.divideExact(Polynomial.ZERO));
        ContourException e = assertThrows(ContourException.class, () -> s.divideExact(Polynomial.variable("t")));
        assertTrue(e.getMessage().contains("not exact"), e.getMessage());
        assertThrows(ContourException.class, () -> s.evaluate(Map.of()));
        assertThrows(ContourException.class, () -> s.constantValue());
        assertThrows(ContourException.class, () -> s.pow(-1));
        assertThrows(ContourException.class, () -> Polynomial.monomial(Rational.ONE, Map.of("s", -1)));
    }
}
