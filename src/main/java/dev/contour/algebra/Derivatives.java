package dev.contour.algebra;

import java.util.HashMap;
import java.util.Map;

/**
 * Derivatives of expressions: {@code d/dx} and the Euler operator {@code x d/dx}, in an inner
 * variable (differentiating the rational-function coefficients) or a collected one (lowering the
 * exponents of the power products).
 */
public final class Derivatives {
    private Derivatives() { }

    /** {@code d e / d x}, exact; x may be inner or collected (an absent name gives zero). */
    public static Expression derivative(Expression e, String x) {
        Map<Monomial, RationalFunction> out = new HashMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            Monomial m = t.getKey();
            RationalFunction c = t.getValue();
            int k = m.exponent(x);
            if (k != 0) {
                // x^k -> k x^(k-1); the coefficient cannot mention a collected x
                Monomial lowered = m.multiply(Monomial.of(x, -1));
                out.merge(lowered, c.multiply(Rational.of(k)), RationalFunction::add);
            } else if (c.variables().contains(x)) {
                out.merge(m, c.derivative(x), RationalFunction::add);
            }
        }
        return Expression.of(out);
    }

    /** {@code x d e / d x}: for a collected x each power product x^k is multiplied by k. */
    public static Expression euler(Expression e, String x) {
        boolean collected = e.collectedVariables().contains(x);
        if (!collected) {
            return Expression.variable(x).multiply(derivative(e, x));
        }
        Map<Monomial, RationalFunction> out = new HashMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            int k = t.getKey().exponent(x);
            if (k != 0) {
                out.merge(t.getKey(), t.getValue().multiply(Rational.of(k)), RationalFunction::add);
            }
        }
        return Expression.of(out);
    }
}
