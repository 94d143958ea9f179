package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class AdS5S5Test {
    /** p = 2 with the normalisation M~ = 1/((s-2)(t-2)(utilde-2)). */
    private static Expression fullP2() {
        return AdS5S5.ward(2).apply(AdS5S5.reducedAnsatz(2, (i, j, k) -> Expression.ONE));
    }

    private static Expression coefficient(Expression m, int i, int j) {
        return Expression.of(m.coefficient(Collect.monomial(Map.of("sigma", i, "tau", j))));
    }

    @Test
    void p2CoefficientsMatchThePublishedAmplitude() {
        Expression m = fullP2();
        assertTrue(m.isCanonical());
        // arXiv:1608.06624 (p = 2 amplitude), in the form of docs/conventions.md, "AdS5×S5" sections:
        // sigma^2: -(s-4)(t-4) / (16 (s+t-6))
        assertEquals(s().subtract(c(4)).multiply(t().subtract(c(4))).negate()
                .divide(c(16).multiply(s().add(t()).subtract(c(6)))), coefficient(m, 2, 0));
        // sigma^0 tau^0: -(t-4)(s+t-4) / (16 (s-2))
        assertEquals(t().subtract(c(4)).multiply(s().add(t()).subtract(c(4))).negate()
                .divide(c(16).multiply(s().subtract(c(2)))), coefficient(m, 0, 0));
        // sigma tau: (s-4)(s t + t^2 - 8 t + 4) / (8 (t-2)(s+t-6))
        assertEquals(s().subtract(c(4)).multiply(s().multiply(t()).add(t().pow(2)).subtract(c(8).multiply(t())).add(c(4)))
                .divide(c(8).multiply(t().subtract(c(2))).multiply(s().add(t()).subtract(c(6)))), coefficient(m, 1, 1));
    }

    @Test
    void p2FlatSpaceLimit() {
        // arXiv:1608.06624: lim M(beta s, beta t)/beta = (t u + s t sigma + s u tau)^2 / (16 s t u), u = -s-t.
        Growth.Result g = Growth.of(fullP2(), AdS5S5.mellinVariables());
        assertEquals(1, g.degree().getAsInt());
        Expression u = s().add(t()).negate();
        Expression structure = t().multiply(u).add(s().multiply(t()).multiply(sigma())).add(s().multiply(u).multiply(tau()));
        Expression expected = structure.pow(2).multiply(inv(c(16).multiply(s()).multiply(t()).multiply(u)));
        assertEquals(expected, g.leading());
        assertTrue(Growth.degree(fullP2(), AdS5S5.mellinVariables()).getAsInt() <= AdS5S5.GROWTH_BOUND);
    }

    /** The explicit sum of docs/conventions.md, "AdS5×S5" sections, written out independently of the dictionary. */
    private static ShiftOperator explicitWard(Expression p) {
        Expression u = c(4).multiply(p).subtract(s()).subtract(t());
        Expression a = c(2).multiply(p).subtract(s()).multiply(c(1, 2));
        Expression b = c(2).multiply(p).subtract(t()).multiply(c(1, 2));
        Expression d = c(2).multiply(p).subtract(u).multiply(c(1, 2));
        Expression one = Expression.ONE;
        Map<int[], Expression> cmn = Map.of(
                new int[] {0, 0}, tau(),
                new int[] {0, 1}, one.subtract(sigma()).subtract(tau()),
                new int[] {1, 0}, tau().pow(2).subtract(tau()).subtract(sigma().multiply(tau())),
                new int[] {1, 1}, sigma().pow(2).subtract(sigma()).subtract(sigma().multiply(tau())),
                new int[] {0, 2}, sigma(),
                new int[] {2, 0}, sigma().multiply(tau()));
        ShiftOperator sum = ShiftOperator.zero();
        for (Map.Entry<int[], Expression> e : cmn.entrySet()) {
            int m = e.getKey()[0];
            int n = e.getKey()[1];
            Expression coeff = e.getValue().multiply(poch(a, m).pow(2)).multiply(poch(b, n).pow(2))
                    .multiply(poch(d, 2 - m - n).pow(2));
            sum = sum.add(ShiftOperator.of(Shift.of(Map.of("s", Rational.of(-2L * m), "t", Rational.of(-2L * n))), coeff));
        }
        return sum;
    }

    @Test
    void wardOperatorFromTheDictionaryEqualsTheExplicitFormula() {
        // docs/conventions.md, "AdS5×S5" sections (arXiv:1608.06624): symbolic p, then numeric weights.
        ShiftOperator symbolic = AdS5S5.ward(symbolicP());
        assertEquals(explicitWard(p()), symbolic);
        assertEquals(6, symbolic.terms().size());
        for (int p = 2; p <= 5; p++) {
            assertEquals(explicitWard(c(p)), AdS5S5.ward(p));
        }
    }

    @Property(tries = 25)
    void applyingCommutesWithGivingPAValue(@ForAll @IntRange(min = 2, max = 9) int p, @ForAll("amplitudes") Expression f) {
        ShiftOperator symbolic = AdS5S5.ward(symbolicP());
        Map<String, Rational> at = Map.of("p", Rational.of(p));
        Expression later = symbolic.apply(f).evaluatePartially(at);
        assertEquals(later, symbolic.evaluatePartially(at).apply(f.evaluatePartially(at)));
        assertEquals(later, AdS5S5.ward(p).apply(f.evaluatePartially(at)));
    }

    @Provide
    Arbitrary<Expression> amplitudes() {
        return Combinators.combine(Arbitraries.integers().between(-6, 6), Arbitraries.integers().between(-6, 6),
                Arbitraries.integers().between(0, 2), Arbitraries.integers().between(1, 4))
                .as((a, b, j, k) -> tau().pow(j).multiply(c(k).add(p()))
                        .multiply(inv(s().add(c(a)).multiply(t().add(c(b))))).add(sigma()));
    }

    @Test
    void fullAmplitudeIsCrossingSymmetricForP2AndP3() {
        // Crossing M = tau^p M(t,s;sigma/tau,1/tau) and M = M(s,u;tau,sigma) (arXiv:1608.06624; checked for
        // p = 2, 3 in docs/conventions.md, "AdS5×S5" sections); p = 3 with equal coefficients (arXiv:1710.05923).
        for (int p = 2; p <= 3; p++) {
            Expression m = AdS5S5.ward(p).apply(AdS5S5.reducedAnsatz(p, (i, j, k) -> Expression.ONE));
            Polynomial pp = pc(p);
            assertEquals(m, AdS5S5.crossing13(p).apply(m), "1<->3, p = " + p);
            assertEquals(m, AdS5S5.crossing12(pp).apply(m), "1<->2, p = " + p);
            assertEquals(m, AdS5S5.crossingCyclic(p).apply(m), "composite, p = " + p);
        }
        // a_100 = 2 keeps the j <-> k symmetry of 1<->3 but breaks the i <-> j symmetry of 1<->2: the check can fail.
        Expression broken = AdS5S5.ward(3).apply(AdS5S5.reducedAnsatz(3, (i, j, k) -> c(i == 1 ? 2 : 1)));
        assertEquals(broken, AdS5S5.crossing13(3).apply(broken));
        assertNotEquals(broken, AdS5S5.crossing12(pc(3)).apply(broken));
    }

    @Test
    void reducedAmplitudeCrossingForP3AndP4() {
        // M~ = tau^(p-2) M~(t,s;sigma/tau,1/tau) and M~ = M~(s,utilde;tau,sigma) (docs/conventions.md, "AdS5×S5" sections,
        // arXiv:1710.05923 section 3): they permute (i, j, k), so a_ijk symmetric under permutations is crossing symmetric.
        for (int p = 3; p <= 4; p++) {
            Expression symmetric = AdS5S5.reducedAnsatz(p, (i, j, k) -> c(1).divide(c(fact(i) * fact(j) * fact(k))));
            assertEquals(symmetric, AdS5S5.crossing13Reduced(p).apply(symmetric), "1<->3, p = " + p);
            assertEquals(symmetric, AdS5S5.crossing12Reduced(pc(p)).apply(symmetric), "1<->2, p = " + p);
            assertEquals(symmetric, AdS5S5.crossingCyclicReduced(p).apply(symmetric), "composite, p = " + p);
            // 1<->3 swaps j and k; 1<->2 swaps i and j: an ansatz breaking that symmetry fails.
            Expression skewed = AdS5S5.reducedAnsatz(p, (i, j, k) -> c(1 + k));
            assertNotEquals(skewed, AdS5S5.crossing13Reduced(p).apply(skewed));
            Expression skewed12 = AdS5S5.reducedAnsatz(p, (i, j, k) -> c(1 + i));
            assertNotEquals(skewed12, AdS5S5.crossing12Reduced(pc(p)).apply(skewed12));
        }
    }

    private static long fact(int n) {
        return n <= 1 ? 1 : n * fact(n - 1);
    }

    @Test
    void reducedAnsatzHasTheStatedTerms() {
        Expression a = AdS5S5.reducedAnsatz(4);
        // i + j + k = 2: six unknowns, each with its own monomial in sigma, tau and a.
        assertEquals(6, a.terms().size());
        assertTrue(a.collectedVariables().contains(AdS5S5.unknownName(0, 0, 2)));
        Expression oneTerm = Expression.of(a.coefficient(Collect.monomial(Map.of("tau", 1, AdS5S5.unknownName(0, 1, 1), 1))));
        // (s - 8 + 2 + 2)(t - 8 + 2 + 2)(utilde - 8 + 2), utilde = 12 - s - t
        Expression expected = inv(s().subtract(c(4)).multiply(t().subtract(c(4))).multiply(c(6).subtract(s()).subtract(t())));
        assertEquals(expected, oneTerm);
    }
}
