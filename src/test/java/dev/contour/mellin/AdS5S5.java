package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.RationalFunction;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;

import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * TEST SCOPE ONLY: an independent hand construction of the equal-weight AdS5 x S5 problem, kept to
 * cross-check the library file backgrounds/ads5s5.ctr (which is what users, benchmarks and the REPL
 * reach). The problem for equal weights p (arXiv:1608.06624; docs/conventions.md, "AdS5×S5" sections): the two Mellin measures,
 * the factor R of the superconformal Ward identity, the operator taking the reduced amplitude to the
 * full one, the crossing maps, the reduced ansatz and the allowed poles.
 *
 * <p>The weight is a polynomial: a number, or the inner variable p for symbolic work. The operator
 * {@link #ward} is not written out by hand: it is the dictionary image of multiplication by R,
 * from the reduced measure to the full one.
 */
public final class AdS5S5 {
    public static final String S = "s";
    public static final String T = "t";
    public static final String U = "u";
    /** The eliminated variable of the reduced measure, {@code utilde = u - 4}. */
    public static final String UTILDE = "utilde";
    public static final String SIGMA = "sigma";
    public static final String TAU = "tau";
    /** Names of the position-space cross ratios in {@link #rFactor()}. */
    public static final String CROSS_U = "U";
    public static final String CROSS_V = "V";
    /** Supergravity: {@code M(beta s, beta t) = O(beta)}. */
    public static final int GROWTH_BOUND = 1;

    private AdS5S5() { }

    /** Mellin variables, s first. */
    public static List<String> mellinVariables() {
        return List.of(S, T);
    }

    /** {@code Gamma((2p-s)/2)^2 Gamma((2p-t)/2)^2 Gamma((2p-u)/2)^2}, {@code s + t + u = 4p}, kernel {@code U^(s/2) V^(t/2-p)}. */
    public static MellinMeasure fullMeasure(Polynomial p) {
        return measure(p, U, p.multiply(Rational.of(4)));
    }

    /** As {@link #fullMeasure} with u replaced by {@code utilde = u - 4}, {@code s + t + utilde = 4p - 4}. */
    public static MellinMeasure reducedMeasure(Polynomial p) {
        return measure(p, UTILDE, p.multiply(Rational.of(4)).subtract(Polynomial.constant(4)));
    }

    private static MellinMeasure measure(Polynomial p, String third, Polynomial sum) {
        Polynomial twoP = p.multiply(Rational.of(2));
        Rational half = Rational.of(1, 2);
        List<GammaPower> factors = List.of(
                new GammaPower(twoP.subtract(Polynomial.variable(S)).multiply(half), 2),
                new GammaPower(twoP.subtract(Polynomial.variable(T)).multiply(half), 2),
                new GammaPower(twoP.subtract(Polynomial.variable(third)).multiply(half), 2));
        return new MellinMeasure(S, T, third, sum, factors, half, Polynomial.ZERO, half, p.negate());
    }

    /** {@code R = tau + (1-sigma-tau) V + (tau^2-tau-sigma tau) U + (sigma^2-sigma-sigma tau) UV + sigma V^2 + sigma tau U^2}. */
    public static Expression rFactor() {
        Expression s = Expression.collectedVariable(SIGMA);
        Expression t = Expression.collectedVariable(TAU);
        Expression u = Expression.collectedVariable(CROSS_U);
        Expression v = Expression.collectedVariable(CROSS_V);
        Expression one = Expression.ONE;
        return t
                .add(one.subtract(s).subtract(t).multiply(v))
                .add(t.pow(2).subtract(t).subtract(s.multiply(t)).multiply(u))
                .add(s.pow(2).subtract(s).subtract(s.multiply(t)).multiply(u).multiply(v))
                .add(s.multiply(v.pow(2)))
                .add(s.multiply(t).multiply(u.pow(2)));
    }

    /** The operator taking the reduced amplitude to the full one, {@code M = ward(p) M~}, through the dictionary. */
    public static ShiftOperator ward(Polynomial p) {
        return MellinDictionary.translate(rFactor(), CROSS_U, CROSS_V, reducedMeasure(p), fullMeasure(p));
    }

    public static ShiftOperator ward(int p) {
        return ward(Polynomial.constant(p));
    }

    /** Swap 1 and 3: {@code M -> tau^p M(t, s; sigma/tau, 1/tau)}. */
    public static CrossingMap crossing13(int p) {
        return swap13(p);
    }

    /** Swap 1 and 2: {@code M -> M(s, u; tau, sigma)}, {@code u = 4p - s - t}. */
    public static CrossingMap crossing12(Polynomial p) {
        return swap12(p.multiply(Rational.of(4)));
    }

    /** Swap 1 and 3 for the reduced amplitude: {@code M~ -> tau^(p-2) M~(t, s; sigma/tau, 1/tau)}. */
    public static CrossingMap crossing13Reduced(int p) {
        return swap13(p - 2);
    }

    /** Swap 1 and 2 for the reduced amplitude: {@code M~ -> M~(s, utilde; tau, sigma)}, {@code utilde = 4p - 4 - s - t}. */
    public static CrossingMap crossing12Reduced(Polynomial p) {
        return swap12(p.multiply(Rational.of(4)).subtract(Polynomial.constant(4)));
    }

    /** The composite: first swap 1 and 2, then swap 1 and 3 (a cyclic permutation, of order 3). */
    public static CrossingMap crossingCyclic(int p) {
        return crossing13(p).compose(crossing12(Polynomial.constant(p)));
    }

    /** The composite for the reduced amplitude. */
    public static CrossingMap crossingCyclicReduced(int p) {
        return crossing13Reduced(p).compose(crossing12Reduced(Polynomial.constant(p)));
    }

    private static CrossingMap swap13(int tauPower) {
        Expression sigma = Expression.collectedVariable(SIGMA);
        Expression tau = Expression.collectedVariable(TAU);
        return CrossingMap.of(Map.of(S, Polynomial.variable(T), T, Polynomial.variable(S)),
                Map.of(SIGMA, sigma.divide(tau), TAU, Expression.ONE.divide(tau)), tau.pow(tauPower));
    }

    private static CrossingMap swap12(Polynomial sum) {
        Polynomial third = sum.subtract(Polynomial.variable(S)).subtract(Polynomial.variable(T));
        return CrossingMap.of(Map.of(T, third),
                Map.of(SIGMA, Expression.collectedVariable(TAU), TAU, Expression.collectedVariable(SIGMA)), Expression.ONE);
    }

    /** Chooses the coefficient a_ijk of the reduced ansatz. */
    @FunctionalInterface
    public interface Coefficients {
        Expression of(int i, int j, int k);
    }

    /** The name of the unknown a_ijk used by {@link #reducedAnsatz(int)}: {@code a[i,j,k]}. */
    public static String unknownName(int i, int j, int k) {
        return "a[" + i + "," + j + "," + k + "]";
    }

    /** The reduced ansatz with unknown (collected) coefficients {@code a[i,j,k]}. */
    public static Expression reducedAnsatz(int p) {
        return reducedAnsatz(p, (i, j, k) -> Expression.collectedVariable(unknownName(i, j, k)));
    }

    /**
     * {@code M~ = sum_(i+j+k = p-2) a_ijk sigma^i tau^j / ((s-2p+2+2k)(t-2p+2+2j)(utilde-2p+2+2i))},
     * {@code utilde = 4p - 4 - s - t}.
     */
    public static Expression reducedAnsatz(int p, Coefficients a) {
        if (p < 2) {
            throw new ContourException("the reduced ansatz needs weight p >= 2, got " + p);
        }
        Polynomial s = Polynomial.variable(S);
        Polynomial t = Polynomial.variable(T);
        Polynomial ut = Polynomial.constant(4L * p - 4).subtract(s).subtract(t);
        Map<Monomial, RationalFunction> acc = new HashMap<>();
        for (int i = 0; i <= p - 2; i++) {
            for (int j = 0; i + j <= p - 2; j++) {
                int k = p - 2 - i - j;
                // One linear factor at a time: the denominator is born factored, never expanded.
                RationalFunction c = inverse(s.add(Polynomial.constant(2 - 2L * p + 2L * k)))
                        .multiply(inverse(t.add(Polynomial.constant(2 - 2L * p + 2L * j))))
                        .multiply(inverse(ut.add(Polynomial.constant(2 - 2L * p + 2L * i))));
                Expression term = Expression.of(Map.of(Collect.monomial(Map.of(SIGMA, i, TAU, j)), c));
                ShiftOperator.accumulate(acc, a.of(i, j, k), term);
            }
        }
        return Expression.of(acc);
    }

    private static RationalFunction inverse(Polynomial linear) {
        return RationalFunction.of(Polynomial.ONE, linear);
    }

    /** Simple poles at {@code s, t, u = 2, 4, ..., 2p-2} only: the poles of the full amplitude. */
    public static AllowedPoles allowedPoles(int p) {
        Set<Polynomial> at = new LinkedHashSet<>();
        for (int c = 2; c <= 2 * p - 2; c += 2) {
            at.add(Polynomial.constant(c));
        }
        return new AllowedPoles(Map.of(S, at, T, at, U, at), 1);
    }

    /** The forms s, t, u = 4p - s - t of the full amplitude. */
    public static List<NamedForm> poleForms(Polynomial p) {
        return fullMeasure(p).poleForms();
    }

    /** The forms s, t, utilde = 4p - 4 - s - t of the reduced amplitude. */
    public static List<NamedForm> reducedPoleForms(Polynomial p) {
        return reducedMeasure(p).poleForms();
    }
}
