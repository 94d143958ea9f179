package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.List;

/**
 * The eigenvalues of a square matrix of rationals when they are all rational: the characteristic
 * polynomial by the Faddeev-LeVerrier recursion (exact, no division except by k), split into linear
 * factors over Q. A factor without rational roots is reported, never approximated.
 */
public final class RationalEigenvalues {
    private RationalEigenvalues() { }

    /** The largest size accepted, so that a mistaken argument fails with a message. */
    public static final int MAX_SIZE = 60;

    /** The coefficients c_0 .. c_n of det(x I - A) = sum c_k x^k (c_n = 1). */
    public static List<Rational> characteristic(List<List<Rational>> a) {
        int n = a.size();
        if (n == 0 || n > MAX_SIZE) {
            throw new ContourException("the matrix must have between 1 and " + MAX_SIZE + " rows, not " + n);
        }
        for (List<Rational> row : a) {
            if (row.size() != n) {
                throw new ContourException("the matrix must be square: " + n + " rows, but a row has " + row.size() + " entries");
            }
        }
        Rational[] c = new Rational[n + 1];
        c[n] = Rational.ONE;
        Rational[][] m = new Rational[n][n];
        for (Rational[] row : m) {
            java.util.Arrays.fill(row, Rational.ZERO);
        }
        for (int k = 1; k <= n; k++) {
            // M_k = A M_(k-1) + c_(n-k+1) I;  c_(n-k) = -tr(A M_k)/k.
            Rational[][] next = multiply(a, m);
            for (int i = 0; i < n; i++) {
                next[i][i] = next[i][i].add(c[n - k + 1]);
            }
            m = next;
            Rational[][] am = multiply(a, m);
            Rational trace = Rational.ZERO;
            for (int i = 0; i < n; i++) {
                trace = trace.add(am[i][i]);
            }
            c[n - k] = trace.negate().divide(Rational.of(k));
        }
        return List.of(c);
    }

    /** The eigenvalues with multiplicity, in increasing order; an error naming a factor with no rational root. */
    public static List<Rational> of(List<List<Rational>> a) {
        List<Rational> c = characteristic(a);
        Polynomial x = Polynomial.variable("x");
        Polynomial p = Polynomial.ZERO;
        for (int k = 0; k < c.size(); k++) {
            p = p.add(x.pow(k).multiply(c.get(k)));
        }
        LinearFactors.Split split = LinearFactors.split(p);
        if (!split.cofactor().isConstant()) {
            throw new ContourException("the characteristic polynomial " + p + " has the factor " + split.cofactor()
                    + " with no rational root: not every eigenvalue is rational");
        }
        List<Rational> out = new ArrayList<>();
        for (LinearFactors.Factor f : split.factors()) {
            Rational lead = f.base().coefficient("x", 1).constantValue();
            Polynomial rest = f.base().coefficient("x", 0);
            Rational root = (rest.isZero() ? Rational.ZERO : rest.constantValue()).negate().divide(lead);
            for (int i = 0; i < f.multiplicity(); i++) {
                out.add(root);
            }
        }
        out.sort(Rational::compareTo);
        return out;
    }

    private static Rational[][] multiply(List<List<Rational>> a, Rational[][] b) {
        int n = b.length;
        Rational[][] out = new Rational[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                Rational sum = Rational.ZERO;
                for (int k = 0; k < n; k++) {
                    sum = sum.add(a.get(i).get(k).multiply(b[k][j]));
                }
                out[i][j] = sum;
            }
        }
        return out;
    }
}
