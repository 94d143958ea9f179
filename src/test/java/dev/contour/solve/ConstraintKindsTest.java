package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Each constraint kind on small ansatze whose solution space is known by construction. */
class ConstraintKindsTest {
    private static final Expression S = Expression.variable("s");
    private static final Expression T = Expression.variable("t");
    private static final List<String> C = List.of("c[0]", "c[1]", "c[2]");

    private static Expression c(int i) {
        return Expression.collectedVariable("c[" + i + "]");
    }

    private static Expression k(long n) {
        return Expression.constant(n);
    }

    private static Solution solve(Expression e, Constraint.Condition cond) {
        return new LinearConstraintBuilder(C).add(Constraint.on(e, C, cond, new Span("k.ctr", 1, 1, 1), "toy"))
                .solve(SolveProgress.silent());
    }

    /** The values of the family at the given free values (free unknowns in the family's order). */
    private static List<Rational> at(Solution sol, long... free) {
        Solution.Family f = assertInstanceOf(Solution.Family.class, sol);
        assertEquals(free.length, f.dimension());
        return f.affine().stream().map(row -> {
            Rational v = row.get(0);
            for (int i = 0; i < free.length; i++) {
                v = v.add(row.get(i + 1).multiply(Rational.of(free[i])));
            }
            return v;
        }).toList();
    }

    @Test
    void vanishingOfABivariatePartialFractionIdentity() {
        // 1/((s-1)(t-2)) - 1/((s-1)(t-3)) + 1/((s-1)(t-2)(t-3)) = 0: the kernel is spanned by (1, -1, 1).
        Expression a = k(1).divide(S.subtract(k(1)).multiply(T.subtract(k(2))));
        Expression b = k(1).divide(S.subtract(k(1)).multiply(T.subtract(k(3))));
        Expression d = a.divide(T.subtract(k(3)));
        Solution sol = solve(c(0).multiply(a).add(c(1).multiply(b)).add(c(2).multiply(d)), new Constraint.Vanishes());
        Solution.Family f = assertInstanceOf(Solution.Family.class, sol);
        int free = C.indexOf(f.free().get(0));
        List<Rational> v = at(sol, 1);
        assertEquals(Rational.ONE, v.get(free));
        assertEquals(v.get(0).negate(), v.get(1));
        assertEquals(v.get(0), v.get(2));
    }

    @Test
    void polynomialWithACofactorThatHasNoLinearFactor() {
        // (s^2 + 1)/(s - 1) = s + 1 + 2/(s - 1): c0 (s^2+1)/(s-1) + 2 c1/(s-1) + c2 (s+1) is polynomial in s iff c0 + c1 = 0,
        // and vanishes iff moreover c2 = -c0.
        Expression e = c(0).multiply(S.pow(2).add(k(1)).divide(S.subtract(k(1))))
                .add(c(1).multiply(k(2).divide(S.subtract(k(1))))).add(c(2).multiply(S.add(k(1))));
        Solution poly = solve(e, new Constraint.PolynomialIn(List.of("s")));
        assertEquals(2, assertInstanceOf(Solution.Family.class, poly).dimension());
        Solution zero = solve(e, new Constraint.Vanishes());
        Solution.Unique u = assertInstanceOf(Solution.Unique.class, zero.normalized("c[0]", Rational.ONE, Span.NONE));
        assertEquals(List.of(Rational.ONE, Rational.MINUS_ONE, Rational.MINUS_ONE), u.values());
    }

    @Test
    void growthBoundRemovesTheFasterTerms() {
        // c0 s^2/(t + 1) + c1 s t + c2 (s + t): growth at most 1 in (s, t) forces c1 = 0 but allows c0 (degree 1).
        Expression e = c(0).multiply(S.pow(2).divide(T.add(k(1)))).add(c(1).multiply(S.multiply(T)))
                .add(c(2).multiply(S.add(T)));
        Solution sol = solve(e, new Constraint.GrowthAtMost(List.of("s", "t"), 1));
        Solution.Family f = assertInstanceOf(Solution.Family.class, sol);
        assertEquals(Set.of("c[0]", "c[2]"), Set.copyOf(f.free()));
        assertEquals(Rational.ZERO, at(sol, 5, 7).get(1));
        Solution flat = solve(e, new Constraint.GrowthAtMost(List.of("s", "t"), 0));
        assertEquals(List.of(Rational.ZERO, Rational.ZERO, Rational.ZERO),
                assertInstanceOf(Solution.Unique.class, flat).values());
    }

    @Test
    void polesOutsideTheAllowedSetCancel() {
        // c0/(s-1) + c1/(s-3) + c2 (2s)/((s-1)(s-3)) = (c0 - c2)/(s-1) + (c1 + 3 c2)/(s-3) after partial fractions:
        // only s = 3 allowed forces c0 = c2.
        Expression e = c(0).divide(S.subtract(k(1))).add(c(1).divide(S.subtract(k(3))))
                .add(c(2).multiply(k(2).multiply(S)).divide(S.subtract(k(1)).multiply(S.subtract(k(3)))));
        Constraint.Poles poles = new Constraint.Poles("s", Polynomial.variable("s"), Set.of(Rational.of(3)));
        Solution sol = solve(e, new Constraint.PolesOnlyAt(poles));
        assertEquals(2, assertInstanceOf(Solution.Family.class, sol).dimension());
        Solution.Unique u = assertInstanceOf(Solution.Unique.class,
                sol.normalized("c[0]", Rational.ONE, Span.NONE).normalized("c[1]", Rational.ZERO, Span.NONE));
        assertEquals(Rational.ONE, u.value("c[2]"));
    }

    @Test
    void residuesAtAllowedPolesMustBePolynomial() {
        // Res_{s=2} of c0/((s-2)(t-1)) + c1/((s-2)(t+s-3)) is (c0 + c1)/(t-1): polynomial iff c1 = -c0.
        // c2/(s-5) has its pole outside the listed set and is not constrained by this condition.
        Expression e = c(0).divide(S.subtract(k(2)).multiply(T.subtract(k(1))))
                .add(c(1).divide(S.subtract(k(2)).multiply(T.add(S).subtract(k(3)))))
                .add(c(2).divide(S.subtract(k(5))));
        Constraint.Poles poles = new Constraint.Poles("s", Polynomial.variable("s"), Set.of(Rational.of(2)));
        Solution sol = solve(e, new Constraint.ResiduesPolynomial(List.of(poles), true));
        List<Rational> v = at(sol, 1, 1);
        assertEquals(v.get(0).negate(), v.get(1));
    }

    @Test
    void crossingSymmetry() {
        // c0 s + c1 t + c2 s t symmetric under s <-> t iff c0 = c1.
        Expression e = c(0).multiply(S).add(c(1).multiply(T)).add(c(2).multiply(S).multiply(T));
        Constraint cross = Constraint.crossing(e, x -> x.substitute(Map.of("s", T, "t", S)), C, Span.NONE, "s <-> t");
        Solution sol = new LinearConstraintBuilder(C).add(cross).solve(SolveProgress.silent());
        List<Rational> v = at(sol, 3, 4);
        assertEquals(v.get(0), v.get(1));
    }

    @Test
    void nonLinearUnknownsAreAUserError() {
        Expression e = c(0).multiply(c(1));
        assertThrows(ContourException.class, () -> solve(e, new Constraint.Vanishes()));
    }
}
