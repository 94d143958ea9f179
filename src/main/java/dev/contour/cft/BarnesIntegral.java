package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.List;

/**
 * The exact expansion around V = 1 of a one-variable Mellin-Barnes integral of Barnes form,
 * {@code int dx/(2 pi i) P(x)/prod (x - r_i) Gamma(a1 + x) Gamma(a2 + x) Gamma(c1 - x) Gamma(c2 - x) V^(lambda x + mu)}
 * on the straight contour Re x = x0.
 *
 * <p>Method: {@code V^y = sum_n (-y)_n / n! (1 - V)^n} turns the n-th coefficient into an integral
 * of a polynomial times the Gamma product. Every pole factor 1/(x - r) is first absorbed into a
 * Gamma function on its own side of the contour whose poles it continues (r to the right of the
 * contour: {@code Gamma(c - x)/(x - r) = -Gamma(r - x) (r + 1 - x)_(c - r - 1)} with c - r a positive
 * integer; to the left: {@code Gamma(a + x)/(x - r) = Gamma(-r + x) (-r + 1 + x)_(a + r - 1)}), so the
 * contour keeps separating the two families of poles. The polynomial is then written in the basis
 * {@code (a1 + x)_k}, each term raising a1 by k, and Barnes' first lemma (E. W. Barnes, Proc. London
 * Math. Soc. (2) 6 (1908) 141) gives
 * {@code int Gamma(a+x) Gamma(b+x) Gamma(c-x) Gamma(d-x) = Gamma(a+c) Gamma(a+d) Gamma(b+c) Gamma(b+d) / Gamma(a+b+c+d)}.
 * Where a step is not exact (a pole off the Gamma lattices, Gamma values that are not rational,
 * a contour that does not separate) it refuses with a ContourException.
 */
final class BarnesIntegral {
    private BarnesIntegral() { }

    /** A pole factor 1/(x - root)^multiplicity of the rational part. */
    record PoleFactor(Rational root, int multiplicity) { }

    /**
     * The coefficients of (1 - V)^n, n = 0..order, of the integral.
     *
     * @param lefts   the a_i of the factors Gamma(a_i + x) (with repetition)
     * @param rights  the c_i of the factors Gamma(c_i - x) (with repetition)
     * @param numerator the polynomial P(x)
     * @param poles   the pole factors of the rational part
     * @param x0      the real part of the contour
     * @param lambda  the kernel exponent is lambda x + mu
     */
    static List<Rational> expand(List<Rational> lefts, List<Rational> rights, UnivariatePolynomial numerator,
                                 List<PoleFactor> poles, Rational x0, Rational lambda, Rational mu, int order) {
        return expand(lefts, rights, numerator, poles, x0, null, lambda, mu, order);
    }

    /**
     * As above, but with {@code side} non-null every pole factor is placed on that side (true: right)
     * whatever its position, and the contour is any curve separating the two families of poles (no
     * straight line needs to exist); x0 is then not used. Barnes' lemma holds for such a curve, and a
     * pinch of the two families shows up as a Gamma value at a non-positive integer, refused.
     */
    static List<Rational> expand(List<Rational> lefts, List<Rational> rights, UnivariatePolynomial numerator,
                                 List<PoleFactor> poles, Rational x0, Boolean side, Rational lambda, Rational mu, int order) {
        List<Rational> a = new ArrayList<>(lefts);
        List<Rational> c = new ArrayList<>(rights);
        UnivariatePolynomial p = numerator;
        Rational scale = Rational.ONE;
        for (PoleFactor f : poles) {
            for (int k = 0; k < f.multiplicity(); k++) {
                Rational r = f.root();
                int cmp = side != null ? (side ? 1 : -1) : r.compareTo(x0);
                if (cmp == 0) {
                    throw new ContourException("the amplitude has a pole at x = " + r + " on the contour Re x = " + x0);
                }
                boolean done = false;
                if (cmp > 0) {
                    for (int i = 0; i < c.size() && !done; i++) {
                        Rational j = c.get(i).subtract(r);
                        if (j.isInteger() && j.signum() > 0) {
                            // Gamma(c - x)/(x - r) = -Gamma(r - x) (r + 1 - x)_(j - 1)
                            p = p.multiply(UnivariatePolynomial.rising(r.add(Rational.ONE), -1, j.intValueExact() - 1));
                            scale = scale.negate();
                            c.set(i, r);
                            done = true;
                        }
                    }
                } else {
                    for (int i = 0; i < a.size() && !done; i++) {
                        Rational j = a.get(i).add(r);
                        if (j.isInteger() && j.signum() > 0) {
                            // Gamma(a + x)/(x - r) = Gamma(-r + x) (-r + 1 + x)_(j - 1)
                            p = p.multiply(UnivariatePolynomial.rising(r.negate().add(Rational.ONE), 1, j.intValueExact() - 1));
                            a.set(i, r.negate());
                            done = true;
                        }
                    }
                }
                if (!done) {
                    throw new ContourException("the pole of the amplitude at x = " + r + " (" + (cmp > 0 ? "right" : "left")
                            + (side != null ? " by its channel)" : " of the contour)")
                            + " does not continue the poles of a Gamma function on that side; the integral is not"
                            + " of Barnes form and has no exact expansion here");
                }
            }
        }
        if (a.size() != 2 || c.size() != 2) {
            throw new ContourException("the remaining integral has " + a.size() + " Gamma(a + x) and " + c.size()
                    + " Gamma(c - x) factors; exact values need exactly two of each (Barnes' first lemma)");
        }
        for (Rational ai : side != null ? List.<Rational>of() : a) {
            if (ai.add(x0).signum() <= 0) {
                throw new ContourException("the contour Re x = " + x0 + " does not keep the poles of Gamma(" + ai + " + x) on its left");
            }
        }
        for (Rational ci : side != null ? List.<Rational>of() : c) {
            if (ci.subtract(x0).signum() <= 0) {
                throw new ContourException("the contour Re x = " + x0 + " does not keep the poles of Gamma(" + ci + " - x) on its right");
            }
        }
        int maxDegree = p.degree() + order;
        // B_k = Barnes(a1 + k, a2, c1, c2), built by its ratio in k.
        Rational a1 = a.get(0);
        Rational a2 = a.get(1);
        Rational c1 = c.get(0);
        Rational c2 = c.get(1);
        String where = "Barnes' lemma";
        Rational b = ExactGamma.of(a1.add(c1), where).multiply(ExactGamma.of(a1.add(c2), where))
                .multiply(ExactGamma.of(a2.add(c1), where)).multiply(ExactGamma.of(a2.add(c2), where))
                .divide(ExactGamma.of(a1.add(a2).add(c1).add(c2), where));
        List<Rational> barnes = new ArrayList<>();
        for (int k = 0; k <= maxDegree; k++) {
            barnes.add(b);
            Rational ak = a1.add(Rational.of(k));
            b = b.multiply(ak.add(c1)).multiply(ak.add(c2)).divide(ak.add(a2).add(c1).add(c2));
        }
        List<Rational> out = new ArrayList<>();
        // (-lambda x - mu)_n / n!, built step by step.
        UnivariatePolynomial kernel = UnivariatePolynomial.ONE;
        for (int n = 0; n <= order; n++) {
            if (n > 0) {
                kernel = kernel.multiply(UnivariatePolynomial.linear(mu.negate().add(Rational.of(n - 1)), lambda.negate()))
                        .scale(Rational.of(1, n));
            }
            List<Rational> basis = p.multiply(kernel).inPochhammerBasis(a1);
            Rational sum = Rational.ZERO;
            for (int k = 0; k < basis.size(); k++) {
                sum = sum.add(basis.get(k).multiply(barnes.get(k)));
            }
            out.add(sum.multiply(scale));
        }
        return out;
    }
}
