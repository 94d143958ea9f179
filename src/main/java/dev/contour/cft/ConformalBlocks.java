package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.List;

/**
 * Scalar four-point conformal blocks with equal external dimensions, as exact series in z, zbar,
 * from the closed forms of Dolan and Osborn (hep-th/0011040):
 * <ul>
 *   <li>d = 4: {@code G = z zbar/(z - zbar) [k_(Delta+l)(z) k_(Delta-l-2)(zbar) - (z <-> zbar)]};</li>
 *   <li>d = 2: {@code G = [k_(Delta+l)(z) k_(Delta-l)(zbar) + (z <-> zbar)] / (1 + delta_(l,0))};</li>
 * </ul>
 * and d = 6 from the Casimir recursion ({@link CasimirBlocks}, checked against the d = 4 closed form),
 * with {@code k_b(x) = x^(b/2) 2F1(b/2, b/2; b; x)}. Normalisation: G is z^((Delta+l)/2) zbar^((Delta-l)/2)
 * (1 + ...) for zbar << z << 1 (no 2^l factors). The twist Delta - l must be an even integer >= 0
 * so that the series has integer powers.
 */
public final class ConformalBlocks {
    private ConformalBlocks() { }

    /**
     * (Delta - l)/2 for a block whose expansion has integer powers of z, zbar; refuses a negative
     * spin or a twist that is not an even integer >= 0. Shared with {@link CasimirBlocks}.
     */
    static int halfTwist(Rational delta, int spin) {
        if (spin < 0) {
            throw new ContourException("the spin must be a non-negative integer, got " + spin);
        }
        Rational twist = delta.subtract(Rational.of(spin));
        Rational half = twist.divide(Rational.of(2));
        if (!half.isInteger() || half.signum() < 0) {
            throw new ContourException("the twist Delta - l = " + twist + " must be an even integer >= 0 (integer powers of z, zbar)");
        }
        return half.intValueExact();
    }

    /** The block G_(Delta, l) in dimension d to total degree {@code order} in z, zbar. */
    public static DoubleSeries block(int d, Rational delta, int spin, int order) {
        int h = halfTwist(delta, spin);
        Rational twist = Rational.of(2 * h);
        DoubleSeries.Builder b = new DoubleSeries.Builder(order);
        int inner = order - 2 * h;
        if (inner < 0) {
            return b.build();
        }
        switch (d) {
            case 4 -> {
                if (twist.compareTo(Rational.of(2)) < 0) {
                    throw new ContourException("in d = 4 the twist must be at least 2 (the unitarity bound), got " + twist);
                }
                // Numerator N = z^(l+1) A(z) B(zbar) - zbar^(l+1) A(zbar) B(z) to degree inner + 1; G = (z zbar)^h N/(z - zbar).
                List<Rational> a = hypergeometric(delta.add(Rational.of(spin)), inner + 1);
                List<Rational> bb = hypergeometric(twist.subtract(Rational.of(2)), inner + 1);
                int n = inner + 1;
                Rational[][] num = new Rational[n + 1][];
                for (int i = 0; i <= n; i++) {
                    num[i] = new Rational[n - i + 1];
                    for (int j = 0; i + j <= n; j++) {
                        Rational x = i >= spin + 1 ? a.get(i - spin - 1).multiply(bb.get(j)) : Rational.ZERO;
                        Rational y = j >= spin + 1 ? a.get(j - spin - 1).multiply(bb.get(i)) : Rational.ZERO;
                        num[i][j] = x.subtract(y);
                    }
                }
                // N = (z - zbar) Q: N_(i+1, j) = Q_(i, j) - Q_(i+1, j-1).
                Rational[][] q = new Rational[inner + 1][];
                for (int i = 0; i <= inner; i++) {
                    q[i] = new Rational[inner - i + 1];
                }
                for (int deg = 0; deg <= inner; deg++) {
                    for (int j = 0; j <= deg; j++) {
                        int i = deg - j;
                        Rational v = num[i + 1][j];
                        if (j > 0) {
                            v = v.add(q[i + 1][j - 1]);
                        }
                        q[i][j] = v;
                    }
                }
                for (int i = 0; i <= inner; i++) {
                    for (int j = 0; i + j <= inner; j++) {
                        b.add(i + h, j + h, q[i][j]);
                    }
                }
            }
            case 2 -> {
                List<Rational> a = hypergeometric(delta.add(Rational.of(spin)), inner);
                List<Rational> bb = hypergeometric(twist, inner);
                Rational norm = spin == 0 ? Rational.of(1, 2) : Rational.ONE;
                for (int i = 0; i <= inner; i++) {
                    for (int j = 0; i + j <= inner; j++) {
                        Rational x = i >= spin ? a.get(i - spin).multiply(bb.get(j)) : Rational.ZERO;
                        Rational y = j >= spin ? a.get(j - spin).multiply(bb.get(i)) : Rational.ZERO;
                        b.add(i + h, j + h, x.add(y).multiply(norm));
                    }
                }
            }
            case 6 -> {
                return CasimirBlocks.block(6, delta, spin, order);
            }
            default -> throw new ContourException("blocks are available in d = 2, 4 and 6, not d = " + d);
        }
        return b.build();
    }

    /** The coefficients of 2F1(b/2, b/2; b; x) to x^n; b = 0 gives 1. */
    static List<Rational> hypergeometric(Rational beta, int n) {
        List<Rational> out = new ArrayList<>();
        if (beta.isZero()) {
            out.add(Rational.ONE);
            for (int k = 1; k <= n; k++) {
                out.add(Rational.ZERO);
            }
            return out;
        }
        if (beta.isInteger() && beta.signum() < 0) {
            throw new ContourException("2F1(b/2, b/2; b; x) is not defined at b = " + beta);
        }
        Rational half = beta.divide(Rational.of(2));
        Rational x = Rational.ONE;
        for (int k = 0; k <= n; k++) {
            out.add(x);
            Rational hk = half.add(Rational.of(k));
            x = x.multiply(hk).multiply(hk).divide(beta.add(Rational.of(k)).multiply(Rational.of(k + 1)));
        }
        return out;
    }
}
