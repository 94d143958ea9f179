package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class RationalFunctionTest {
    private static final Polynomial S = Polynomial.variable("s");
    private static final Polynomial T = Polynomial.variable("t");

    @Provide
    Arbitrary<RationalFunction> fns() {
        return Gen.rationalFunctions();
    }

    @Provide
    Arbitrary<Map<String, Rational>> points() {
        return Gen.points();
    }

    private static void canonical(RationalFunction... fs) {
        for (RationalFunction f : fs) {
            assertTrue(f.isCanonical(), () -> "not canonical: " + f);
            // the (possibly cached) expanded denominator is the product of the listed factors
            Polynomial d = Polynomial.ONE;
            for (LinearFactors.Factor x : f.denominatorFactors()) {
                d = d.multiply(x.base().pow(x.multiplicity()));
            }
            assertEquals(d, f.denominator());
        }
    }

    @Property(tries = 120)
    void fieldLawsAndCanonicalResults(@ForAll("fns") RationalFunction a, @ForAll("fns") RationalFunction b,
            @ForAll("fns") RationalFunction c) {
        canonical(a, b, c, a.add(b), a.multiply(b), a.subtract(b), a.negate());
        assertEquals(a.add(b), b.add(a));
        assertEquals(a.add(b).add(c), a.add(b.add(c)));
        assertEquals(a.multiply(b).multiply(c), a.multiply(b.multiply(c)));
        assertEquals(a.multiply(b.add(c)), a.multiply(b).add(a.multiply(c)));
        assertEquals(RationalFunction.ZERO, a.subtract(a));
        if (!b.isZero()) {
            RationalFunction q = a.divide(b);
            canonical(q, b.inverse());
            assertEquals(a, q.multiply(b));
            assertEquals(RationalFunction.ONE, b.multiply(b.inverse()));
        }
    }

    @Property(tries = 120)
    void twoConstructionsOfOneValueAreIdentical(@ForAll("fns") RationalFunction a, @ForAll("fns") RationalFunction b) {
        // Expanded num/den through the splitting factory versus the factored arithmetic.
        RationalFunction sum = a.add(b);
        RationalFunction rebuilt = RationalFunction.of(
                a.numerator().multiply(b.denominator()).add(b.numerator().multiply(a.denominator())),
                a.denominator().multiply(b.denominator()));
        assertEquals(sum, rebuilt);
        assertEquals(sum.hashCode(), rebuilt.hashCode());
        assertEquals(sum.toString(), rebuilt.toString());
        RationalFunction again = RationalFunction.of(sum.numerator().multiply(Rational.of(-3, 7)),
                sum.denominator().multiply(Rational.of(-3, 7)));
        assertEquals(sum, again);
    }

    @Property(tries = 120)
    void evaluationIsAHomomorphism(@ForAll("fns") RationalFunction a, @ForAll("fns") RationalFunction b,
            @ForAll("points") Map<String, Rational> x) {
        Rational va;
        Rational vb;
        try {
            va = a.evaluate(x);
            vb = b.evaluate(x);
        } catch (ContourException pole) {
            return;
        }
        assertEquals(va.add(vb), a.add(b).evaluate(x));
        assertEquals(va.multiply(vb), a.multiply(b).evaluate(x));
        assertEquals(va.pow(2), a.pow(2).evaluate(x));
        if (!vb.isZero()) {
            assertEquals(va.divide(vb), a.divide(b).evaluate(x));
        }
        assertEquals(va, a.evaluatePartially(Map.of("s", x.get("s"))).evaluate(x));
    }

    @Property(tries = 120)
    void linearSubstitutionAgreesWithPointwiseValues(@ForAll("fns") RationalFunction a, @ForAll("points") Map<String, Rational> x) {
        // s -> s - 2, t -> 4p - s - t with p = 3 (invertible) and s -> t (degenerate)
        Map<String, Polynomial> shift = Map.of("s", S.subtract(Polynomial.constant(2)),
                "t", Polynomial.constant(12).subtract(S).subtract(T));
        Map<String, Polynomial> collapse = Map.of("s", T);
        for (Map<String, Polynomial> m : List.of(shift, collapse)) {
            RationalFunction image;
            try {
                image = a.substituteLinear(m);
            } catch (ContourException vanished) {
                continue;
            }
            canonical(image);
            Map<String, RationalFunction> general = new HashMap<>();
            m.forEach((k, v) -> general.put(k, RationalFunction.of(v)));
            assertEquals(image, a.substitute(general));
            Map<String, Rational> moved = new HashMap<>(x);
            m.forEach((k, v) -> moved.put(k, v.evaluate(x)));
            try {
                assertEquals(a.evaluate(moved), image.evaluate(x));
            } catch (ContourException pole) {
                // the point landed on a pole
            }
        }
    }

    /** Long sums take the cached-expansion path; the result must not depend on the order of addition. */
    @Property(tries = 30)
    void longSumsAgreeInAnyOrder(@ForAll("fns") RationalFunction a, @ForAll("fns") RationalFunction b,
            @ForAll("fns") RationalFunction c, @ForAll("fns") RationalFunction d) {
        List<RationalFunction> xs = List.of(a, b, c, d, a.negate(), b.multiply(Rational.of(3)), c.multiply(d));
        RationalFunction forward = RationalFunction.ZERO;
        for (RationalFunction x : xs) {
            forward = forward.add(x);
            canonical(forward);
        }
        RationalFunction backward = RationalFunction.ZERO;
        for (int i = xs.size() - 1; i >= 0; i--) {
            backward = xs.get(i).add(backward);
            canonical(backward);
        }
        assertEquals(forward, backward);
        assertEquals(forward, RationalFunction.sum(xs));
    }

    @Property(tries = 80)
    void derivativeObeysTheProductRule(@ForAll("fns") RationalFunction a, @ForAll("fns") RationalFunction b) {
        RationalFunction lhs = a.multiply(b).derivative("s");
        RationalFunction rhs = a.derivative("s").multiply(b).add(a.multiply(b.derivative("s")));
        canonical(lhs);
        assertEquals(lhs, rhs);
    }

    @Test
    void canonicalFormAsDocumented() {
        // (2s - 4)/((6 - 3s)(t + 1)^2) = -2/(3 (t + 1)^2)
        RationalFunction f = RationalFunction.of(S.multiply(Rational.of(2)).subtract(Polynomial.constant(4)),
                Polynomial.constant(6).subtract(S.multiply(Rational.of(3))).multiply(T.add(Polynomial.ONE).pow(2)));
        assertEquals(Polynomial.constant(Rational.of(-2, 3)), f.numerator());
        assertEquals(List.of(new LinearFactors.Factor(T.add(Polynomial.ONE), 2)), f.denominatorFactors());
        assertEquals("(-2/3)/((t + 1)^2)", f.toString());
        RationalFunction g = RationalFunction.of(Polynomial.ONE, S.pow(2).add(T.pow(2)).multiply(S));
        assertEquals(2, g.denominatorFactors().size());
        assertEquals(S, g.denominatorFactors().get(0).base());
        assertTrue(RationalFunction.constant(5).isConstant());
        assertEquals(Rational.of(5), RationalFunction.constant(5).constantValue());
        assertEquals(RationalFunction.ONE, RationalFunction.variable("s").divide(RationalFunction.variable("s")));
        assertEquals(RationalFunction.of(S.subtract(T)).inverse().pow(-2), RationalFunction.of(S.subtract(T).pow(2)));
    }

    @Test
    void errorsNameTheOperation() {
        ContourException e = assertThrows(ContourException.class, () -> RationalFunction.of(S, Polynomial.ZERO));
        assertTrue(e.getMessage().contains("division by zero"), e.getMessage());
        assertThrows(ContourException.class, () -> RationalFunction.ZERO.inverse());
        assertThrows(ContourException.class, () -> RationalFunction.ONE.divide(RationalFunction.ZERO));
        assertThrows(ContourException.class, () -> RationalFunction.ZERO.pow(-2));
        RationalFunction f = RationalFunction.of(Polynomial.ONE, S.subtract(Polynomial.constant(2)));
        e = assertThrows(ContourException.class, () -> f.evaluate(Map.of("s", Rational.of(2))));
        assertTrue(e.getMessage().contains("s - 2"), e.getMessage());
        e = assertThrows(ContourException.class, () -> f.substituteLinear(Map.of("s", Polynomial.constant(2))));
        assertTrue(e.getMessage().contains("vanishes"), e.getMessage());
        assertThrows(ContourException.class, () -> f.substituteLinear(Map.of("s", S.pow(2))));
    }
}
