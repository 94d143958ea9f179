package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class ExpressionTest {
    private static final Expression SIGMA = Expression.collectedVariable("sigma");
    private static final Expression TAU = Expression.collectedVariable("tau");
    private static final Expression S = Expression.variable("s");

    @Provide
    Arbitrary<Expression> exprs() {
        Arbitrary<Expression> term = Combinators.combine(Gen.rationalFunctions(), Arbitraries.integers().between(-1, 2),
                Arbitraries.integers().between(0, 2))
                .as((c, i, j) -> Expression.of(Map.of(Monomial.of(Map.of("sigma", i, "tau", j)), c)));
        return term.list().ofMaxSize(3).map(ts -> ts.stream().reduce(Expression.ZERO, Expression::add));
    }

    @Property(tries = 60)
    void ringLaws(@ForAll("exprs") Expression a, @ForAll("exprs") Expression b, @ForAll("exprs") Expression c) {
        for (Expression e : List.of(a, b, a.add(b), a.multiply(b), a.subtract(b))) {
            assertTrue(e.isCanonical(), () -> "not canonical: " + e);
        }
        assertEquals(a.add(b), b.add(a));
        assertEquals(a.multiply(b), b.multiply(a));
        assertEquals(a.multiply(b.add(c)), a.multiply(b).add(a.multiply(c)));
        assertEquals(Expression.ZERO, a.subtract(a));
        assertEquals(a, a.multiply(SIGMA).divide(SIGMA));
    }

    @Property(tries = 60)
    void substitutionAndEvaluationCommute(@ForAll("exprs") Expression a) {
        Map<String, Rational> at = Map.of("s", Rational.of(1, 7), "t", Rational.of(-3, 11), "u", Rational.of(5, 13),
                "sigma", Rational.of(2, 3), "tau", Rational.of(-5, 2));
        Map<String, Rational> moved = new java.util.HashMap<>(at);
        moved.put("s", at.get("t").add(Rational.ONE));
        try {
            Expression shifted = a.substituteLinear(Map.of("s", Polynomial.variable("t").add(Polynomial.constant(1))));
            assertTrue(shifted.isCanonical());
            assertEquals(a.evaluatePartially(moved), shifted.evaluatePartially(at));
        } catch (ContourException pole) {
            // the substitution or the point hit a pole
        }
    }

    @Test
    void collectedAndInnerNames() {
        Expression a = S.multiply(SIGMA).add(Expression.constant(3));
        assertEquals(List.of("sigma"), List.copyOf(a.collectedVariables()));
        assertEquals(List.of("s"), List.copyOf(a.innerVariables()));
        assertEquals(RationalFunction.variable("s"), a.coefficient(Monomial.of("sigma", 1)));
        // an inner "sigma" meeting a collected one is expanded as a polynomial in it
        Expression inner = Expression.variable("sigma").multiply(S).add(S);
        Expression sum = a.add(inner);
        assertTrue(sum.isCanonical());
        assertEquals(RationalFunction.variable("s").multiply(RationalFunction.constant(2)), sum.coefficient(Monomial.of("sigma", 1)));
        ContourException e = assertThrows(ContourException.class,
                () -> a.add(Expression.of(RationalFunction.variable("sigma").inverse())));
        assertTrue(e.getMessage().contains("denominator"), e.getMessage());
        // Laurent division by a monomial, and refusal of a sum
        Expression q = a.divide(SIGMA.pow(2).multiply(TAU));
        assertEquals(Monomial.of(Map.of("sigma", -1, "tau", -1)), q.terms().lastKey());
        assertThrows(ContourException.class, () -> a.divide(SIGMA.add(TAU)));
        assertThrows(ContourException.class, () -> a.divide(Expression.ZERO));
        assertThrows(ContourException.class, () -> a.asRationalFunction());
        assertEquals(RationalFunction.variable("s").inverse(), Expression.ONE.divide(S).asRationalFunction());
        assertEquals(Rational.of(3), Expression.constant(3).constantValue());
        // substitution of a collected variable
        Expression sub = a.substitute(Map.of("sigma", TAU.add(Expression.ONE), "s", Expression.constant(2)));
        assertEquals(Expression.constant(2).multiply(TAU).add(Expression.constant(5)), sub);
        assertEquals(SIGMA.multiply(SIGMA).multiply(SIGMA), SIGMA.pow(3));
        assertEquals(SIGMA.pow(-2), Expression.ONE.divide(SIGMA.pow(2)));
    }

    @Test
    void monomialOrder() {
        Monomial one = Monomial.ONE;
        Monomial s = Monomial.of("sigma", 1);
        Monomial t = Monomial.of("tau", 1);
        Monomial st = s.multiply(t);
        assertTrue(one.compareTo(s) < 0);
        assertTrue(t.compareTo(s) < 0);
        assertTrue(s.compareTo(st) < 0);
        assertTrue(s.inverse().compareTo(one) < 0);
        assertEquals(one, s.multiply(s.inverse()));
        assertEquals("sigma^2*tau^-1", s.pow(2).multiply(t.inverse()).toString());
        assertEquals(Monomial.of(Map.of("tau", 1, "sigma", 2)), Monomial.of(Map.of("sigma", 2, "tau", 1)));
        assertEquals(3, Monomial.of(Map.of("tau", 1, "sigma", 2)).totalDegree());
    }
}
