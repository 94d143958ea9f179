package dev.contour.term;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

class TermsTest {
    private static final Expression S = Expression.variable("s");

    private static Term gamma(Expression x) {
        return new Term.Apply(Terms.GAMMA, List.of(Terms.of(x)));
    }

    private static Expression shifted(int n) {
        return S.add(Expression.constant(n));
    }

    private static Expression leaf(Term t) {
        return assertInstanceOf(Term.Leaf.class, t, "rational: " + t).value();
    }

    @Test
    void constructorsNeverSimplify() {
        Term t = new Term.Product(List.of(gamma(shifted(3)), new Term.Power(gamma(S), -1)));
        assertInstanceOf(Term.Product.class, t);
        assertEquals(2, ((Term.Product) t).factors().size());
        Term one = new Term.Sum(List.of(Terms.of(Expression.ONE), Terms.of(Expression.ZERO)));
        assertEquals(2, ((Term.Sum) one).terms().size());
    }

    @Property(tries = 40)
    void gammaRatiosWithIntegerShiftsArePochhammerProducts(@ForAll @IntRange(min = -6, max = 6) int n) {
        // Gamma(s + n)/Gamma(s) = (s)_n, for negative n too (common practice: Gamma(x + 1) = x Gamma(x))
        Term ratio = new Term.Product(List.of(gamma(shifted(n)), new Term.Power(gamma(S), -1)));
        Expression expected = Expression.ONE;
        for (int k = 0; k < n; k++) {
            expected = expected.multiply(shifted(k));
        }
        for (int k = 1; k <= -n; k++) {
            expected = expected.divide(shifted(-k));
        }
        assertEquals(expected, leaf(Terms.normalize(ratio)));
        assertEquals(expected, Terms.pochhammer(S, n));
    }

    @Test
    void differenceOfEqualGammaFormsIsZero() {
        // Gamma(s + 1) - s*Gamma(s) = 0 once both are written over Gamma(s)
        Term t = new Term.Sum(List.of(gamma(shifted(1)),
                new Term.Product(List.of(Terms.of(S.negate()), gamma(S)))));
        assertTrue(leaf(Terms.normalize(t)).isZero());
    }

    @Test
    void nonIntegerShiftsStayInert() {
        Term t = Terms.normalize(new Term.Product(List.of(gamma(S), gamma(S.add(Expression.constant(Rational.of(1, 2)))))));
        assertInstanceOf(Term.Product.class, t);
    }

    @Test
    void exactValuesAtIntegers() {
        assertEquals(Expression.constant(720), leaf(Terms.normalize(gamma(Expression.constant(7)))));
        assertEquals(Expression.constant(Rational.of(new BigInteger("2432902008176640000"))),
                leaf(Terms.normalize(new Term.Apply(Terms.FACTORIAL, List.of(Terms.of(Expression.constant(20)))))));
        assertEquals(Expression.constant(252),
                leaf(Terms.normalize(new Term.Apply(Terms.BINOM, List.of(Terms.of(Expression.constant(10)), Terms.of(Expression.constant(5)))))));
        // binom(-2, 3) = (-2)(-3)(-4)/3! = -4 (the falling-factorial definition, common practice)
        assertEquals(Expression.constant(-4),
                leaf(Terms.normalize(new Term.Apply(Terms.BINOM, List.of(Terms.of(Expression.constant(-2)), Terms.of(Expression.constant(3)))))));
        assertThrows(ContourException.class, () -> Terms.normalize(gamma(Expression.constant(0))));
        assertThrows(ContourException.class,
                () -> Terms.normalize(new Term.Apply(Terms.FACTORIAL, List.of(Terms.of(Expression.constant(-1))))));
    }

    @Test
    void symbolicFactorialAndBinomialBecomeGammaForms() {
        // x! / Gamma(x) = x
        Term t = new Term.Product(List.of(new Term.Apply(Terms.FACTORIAL, List.of(Terms.of(S))), new Term.Power(gamma(S), -1)));
        assertEquals(S, leaf(Terms.normalize(t)));
        // binom(s, 2) = s(s - 1)/2
        Term b = new Term.Apply(Terms.BINOM, List.of(Terms.of(S), Terms.of(Expression.constant(2))));
        assertEquals(S.multiply(shifted(-1)).divide(Expression.constant(2)), leaf(Terms.normalize(b)));
    }

    @Test
    void substitutionRenormalises() {
        Term t = Terms.normalize(new Term.Product(List.of(gamma(S), gamma(S))));
        Term at = Terms.substitute(t, java.util.Map.of("s", Expression.constant(4)));
        assertEquals(Expression.constant(36), leaf(at));
    }
}
