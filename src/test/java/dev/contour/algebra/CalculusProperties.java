package dev.contour.algebra;

import dev.contour.ContourException;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/** Derivatives and the remainder modulo a monic polynomial ({@link Derivatives}, {@link MonicRemainder}). */
class CalculusProperties {
    /** Expressions in the collected x, y (Laurent, exponents -2..3) with rational-function coefficients in s, t, u. */
    @Provide
    Arbitrary<Expression> expressions() {
        Arbitrary<Map.Entry<Monomial, RationalFunction>> term = Combinators.combine(Arbitraries.integers().between(-2, 3),
                Arbitraries.integers().between(0, 2), Gen.rationalFunctions())
                .as((a, b, f) -> Map.entry(Monomial.of(Map.of("x", a, "y", b)), f));
        return term.list().ofMinSize(1).ofMaxSize(3).map(ts -> {
            Map<Monomial, RationalFunction> m = new HashMap<>();
            ts.forEach(e -> m.merge(e.getKey(), e.getValue(), RationalFunction::add));
            return Expression.of(m);
        });
    }

    @Property(tries = 60)
    void derivativesObeyTheProductRule(@ForAll("expressions") Expression f, @ForAll("expressions") Expression g) {
        // (f g)' = f' g + f g' (common practice), in an inner and in a collected variable.
        for (String v : List.of("s", "x")) {
            Expression lhs = Derivatives.derivative(f.multiply(g), v);
            Expression rhs = Derivatives.derivative(f, v).multiply(g).add(f.multiply(Derivatives.derivative(g, v)));
            assertTrue(lhs.isCanonical());
            assertEquals(rhs, lhs, "d/d" + v);
        }
    }

    @Property(tries = 60)
    void eulerDerivativeIsXTimesTheDerivative(@ForAll("expressions") Expression f) {
        for (String v : List.of("t", "x", "y")) {
            Expression x = v.equals("t") ? Expression.variable(v) : Expression.collectedVariable(v);
            assertEquals(x.multiply(Derivatives.derivative(f, v)), Derivatives.euler(f, v), v);
        }
    }

    @Test
    void derivativeOfAPowerAndOfAQuotient() {
        // d/ds (s^3) = 3 s^2; d/ds 1/(s - 2) = -1/(s - 2)^2 (common practice)
        Expression s = Expression.variable("s");
        assertEquals(Expression.constant(3).multiply(s.pow(2)), Derivatives.derivative(s.pow(3), "s"));
        Expression inv = Expression.ONE.divide(s.subtract(Expression.constant(2)));
        assertEquals(inv.pow(2).negate(), Derivatives.derivative(inv, "s"));
        Expression x = Expression.collectedVariable("x");
        assertEquals(Expression.constant(-2).multiply(x.pow(-3)), Derivatives.derivative(x.pow(-2), "x"));
    }

    /** Polynomials in the collected chi, U, V with small integer coefficients, chi-degree up to 7. */
    @Provide
    Arbitrary<Expression> polynomialsInChi() {
        Arbitrary<Expression> term = Combinators.combine(Arbitraries.integers().between(-9, 9), Arbitraries.integers().between(0, 7),
                Arbitraries.integers().between(0, 2), Arbitraries.integers().between(0, 2))
                .as((c, a, b, d) -> Expression.constant(c).multiply(Expression.of(Map.of(Monomial.of(Map.of("chi", a, "U", b, "V", d)),
                        RationalFunction.ONE))));
        return term.list().ofMinSize(1).ofMaxSize(8).map(ts -> ts.stream().reduce(Expression.ZERO, Expression::add));
    }

    @Property(tries = 100)
    void remainderModuloTheQuadraticAgreesAtBothRootsNumerically(@ForAll("polynomialsInChi") Expression p,
            @ForAll("points") double[] uv) {
        // chi and chi' are the roots of x^2 - (1 + U - V) x + U (physics-reference section 6, from U = chi chi',
        // V = (1 - chi)(1 - chi')): p and its remainder take the same value at both roots.
        Expression chi = Expression.collectedVariable("chi");
        Expression quadratic = chi.pow(2).subtract(Expression.ONE.add(Expression.collectedVariable("U"))
                .subtract(Expression.collectedVariable("V")).multiply(chi)).add(Expression.collectedVariable("U"));
        Expression r = MonicRemainder.of(p, quadratic, "chi");
        assertTrue(r.isCanonical());
        for (Monomial m : r.terms().keySet()) {
            assertTrue(m.exponent("chi") >= 0 && m.exponent("chi") <= 1, r.toString());
        }
        double b = 1 + uv[0] - uv[1];
        double disc = Math.sqrt(b * b - 4 * uv[0]);
        for (double root : new double[] {(b + disc) / 2, (b - disc) / 2}) {
            double lhs = evaluate(p, root, uv[0], uv[1]);
            double rhs = evaluate(r, root, uv[0], uv[1]);
            assertEquals(lhs, rhs, 1e-9 * (1 + Math.abs(lhs) + magnitude(p, root, uv[0], uv[1])), p + " at chi = " + root);
        }
    }

    @Provide
    Arbitrary<double[]> points() {
        // U, V in (0, 1) with real, distinct roots: the Euclidean region z, zbar real (common practice)
        return Combinators.combine(Arbitraries.integers().between(1, 99), Arbitraries.integers().between(1, 99))
                .as((u, v) -> new double[] {u / 100.0, v / 100.0})
                .filter(x -> Math.pow(1 + x[0] - x[1], 2) - 4 * x[0] > 1e-3);
    }

    private static double evaluate(Expression e, double chi, double u, double v) {
        double sum = 0;
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            sum += term(t.getKey(), t.getValue(), chi, u, v);
        }
        return sum;
    }

    /** The sum of the terms' absolute values: the scale of the rounding error. */
    private static double magnitude(Expression e, double chi, double u, double v) {
        double sum = 0;
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            sum += Math.abs(term(t.getKey(), t.getValue(), chi, u, v));
        }
        return sum;
    }

    private static double term(Monomial m, RationalFunction c, double chi, double u, double v) {
        Rational k = c.constantValue();
        return k.doubleValue() * Math.pow(chi, m.exponent("chi"))
                * Math.pow(u, m.exponent("U")) * Math.pow(v, m.exponent("V"));
    }

    @Property(tries = 60)
    void remainderIsExactAtRationalRoots(@ForAll("polynomialsInChi") Expression p, @ForAll("roots") Rational[] roots) {
        // (chi - r1)(chi - r2): both sides agree exactly at r1 and r2 (the remainder theorem, common practice).
        Expression chi = Expression.collectedVariable("chi");
        Expression q = chi.subtract(Expression.constant(roots[0])).multiply(chi.subtract(Expression.constant(roots[1])));
        Expression r = MonicRemainder.of(p, q, "chi");
        for (Rational root : roots) {
            Map<String, Expression> at = Map.of("chi", Expression.constant(root));
            assertEquals(p.substitute(at), r.substitute(at));
        }
    }

    @Provide
    Arbitrary<Rational[]> roots() {
        return Combinators.combine(Gen.rationals(), Gen.rationals()).as((a, b) -> new Rational[] {a, b});
    }

    @Test
    void remainderRefusesNegativePowersAndModuliThatAreNotMonic() {
        Expression chi = Expression.collectedVariable("chi");
        Expression q = chi.pow(2).subtract(Expression.ONE);
        ContourException negative = assertThrows(ContourException.class, () -> MonicRemainder.of(chi.pow(-1), q, "chi"));
        assertTrue(negative.getMessage().contains("negative power chi^-1"), negative.getMessage());
        ContourException monic = assertThrows(ContourException.class,
                () -> MonicRemainder.of(chi, Expression.constant(2).multiply(q), "chi"));
        assertTrue(monic.getMessage().contains("monic"), monic.getMessage());
    }
}
