package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.util.List;

/**
 * Conformal blocks in any dimension d (equal external dimensions) as exact series in z, zbar, from
 * the quadratic Casimir equation of Dolan and Osborn (hep-th/0309180):
 * {@code [D_z + D_zbar + (d - 2) z zbar/(z - zbar) ((1 - z) d_z - (1 - zbar) d_zbar)] G = C/2 G},
 * {@code D_x = x^2 (1 - x) d_x^2 - x^2 d_x}, {@code C = Delta (Delta - d) + l (l + d - 2)}.
 *
 * <p>Multiplied by z - zbar the equation links, at each total degree, neighbouring coefficients on
 * the anti-diagonal to the lower degrees. The slice zbar^(tau/2) is the collinear block
 * z^(tau/2 + l) 2F1((Delta+l)/2, (Delta+l)/2; Delta + l; z) (the normalisation of {@link ConformalBlocks});
 * from it the recursion walks each anti-diagonal towards higher powers of zbar up to the diagonal, and
 * the symmetry in z, zbar gives the rest. A vanishing pivot (another block of the same Casimir value
 * starts at that monomial, as at conserved currents) is refused rather than resolved from later equations. In d = 2 and d = 4 the result equals the closed forms (tested).
 */
public final class CasimirBlocks {
    private CasimirBlocks() { }

    public static DoubleSeries block(int d, Rational delta, int spin, int order) {
        if (d < 1) {
            throw new ContourException("the dimension must be a positive integer, got " + d);
        }
        int h = ConformalBlocks.halfTwist(delta, spin);
        DoubleSeries.Builder b = new DoubleSeries.Builder(order);
        if (2 * h + spin > order) {
            return b.build();
        }
        Rational dd = Rational.of(d);
        Rational halfC = delta.multiply(delta.subtract(dd)).add(Rational.of((long) spin * (spin + d - 2))).divide(Rational.of(2));
        List<Rational> collinear = ConformalBlocks.hypergeometric(delta.add(Rational.of(spin)), order);
        for (int i = h + spin; i + h <= order; i++) {
            b.add(i, h, collinear.get(i - h - spin));
        }
        Rational dm2 = Rational.of(d - 2);
        // E_(a,b) = A_(a-1,b) - A_(a,b-1) + (d-2) B_(a,b) = 0 with
        // A_(i,j) = e(i,j) c_(i,j) - (i-1)^2 c_(i-1,j) - (j-1)^2 c_(i,j-1), e(i,j) = i(i-1) + j(j-1) - C/2,
        // B_(a,b) = a c_(a,b-1) - b c_(a-1,b) + (b-a) c_(a-1,b-1).
        for (int n = 2 * h; n <= order; n++) {
            for (int j = h + 1; j <= n - h; j++) {
                int i = n - j;
                if (j > i) {
                    b.add(i, j, b.get(j, i)); // the block is symmetric in z, zbar
                    continue;
                }
                // Equation E_(a,b) with a - 1 = i, b = j: unknown c_(i,j); c_(i+1,j-1) is known (previous step).
                int a = i + 1;
                int bb = j;
                Rational pivot = e(i, j, halfC).subtract(dm2.multiply(Rational.of(bb)));
                if (pivot.isZero()) {
                    throw new ContourException("the Casimir recursion is singular at z^" + i + " zbar^" + j + " for Delta = " + delta
                            + ", l = " + spin + " in d = " + d);
                }
                // Everything in E_(a,b) except pivot * c_(i,j).
                Rational rest = Rational.ZERO;
                // A_(a-1,b) without its e term: -(a-2)^2 c_(a-2,b) - (b-1)^2 c_(a-1,b-1).
                rest = rest.subtract(sq(a - 2).multiply(b.get(a - 2, bb))).subtract(sq(bb - 1).multiply(b.get(a - 1, bb - 1)));
                // -A_(a,b-1).
                rest = rest.subtract(e(a, bb - 1, halfC).multiply(b.get(a, bb - 1))
                        .subtract(sq(a - 1).multiply(b.get(a - 1, bb - 1))).subtract(sq(bb - 2).multiply(b.get(a, bb - 2))));
                // (d-2) B_(a,b) without -b c_(a-1,b).
                rest = rest.add(dm2.multiply(Rational.of(a).multiply(b.get(a, bb - 1)).add(Rational.of(bb - a).multiply(b.get(a - 1, bb - 1)))));
                b.add(i, j, rest.negate().divide(pivot));
            }
        }
        return b.build();
    }

    private static Rational e(int i, int j, Rational halfC) {
        return Rational.of((long) i * (i - 1) + (long) j * (j - 1)).subtract(halfC);
    }

    private static Rational sq(int x) {
        return Rational.of((long) x * x);
    }
}
