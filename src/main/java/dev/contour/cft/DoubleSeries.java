package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.List;

/**
 * An exact truncated double series {@code sum c_ij z^i zbar^j} over all i, j >= 0 with
 * {@code i + j <= order}: the terms of total degree above the order are unknown, not zero.
 * Immutable; arithmetic truncates to the smaller order.
 */
public final class DoubleSeries {
    /** The largest order accepted (the series stores about order^2/2 coefficients). */
    public static final int MAX_ORDER = 2000;

    private final int order;
    private final Rational[][] c; // c[i][j], j <= order - i

    private DoubleSeries(int order, Rational[][] c) {
        this.order = order;
        this.c = c;
    }

    /** A mutable builder of a series of the given order, all coefficients zero. */
    public static final class Builder {
        private final int order;
        private final Rational[][] c;

        public Builder(int order) {
            if (order < 0 || order > MAX_ORDER) {
                throw new ContourException("the order of a z, zbar series must be between 0 and " + MAX_ORDER + ", got " + order);
            }
            this.order = order;
            this.c = new Rational[order + 1][];
            for (int i = 0; i <= order; i++) {
                c[i] = new Rational[order - i + 1];
                java.util.Arrays.fill(c[i], Rational.ZERO);
            }
        }

        public int order() {
            return order;
        }

        /** Adds x to the coefficient of z^i zbar^j (ignored beyond the order). */
        public Builder add(int i, int j, Rational x) {
            if (i >= 0 && j >= 0 && i + j <= order && !x.isZero()) {
                c[i][j] = c[i][j].add(x);
            }
            return this;
        }

        public Rational get(int i, int j) {
            return i >= 0 && j >= 0 && i + j <= order ? c[i][j] : Rational.ZERO;
        }

        public DoubleSeries build() {
            Rational[][] copy = new Rational[order + 1][];
            for (int i = 0; i <= order; i++) {
                copy[i] = c[i].clone();
            }
            return new DoubleSeries(order, copy);
        }
    }

    public static DoubleSeries zero(int order) {
        return new Builder(order).build();
    }

    public int order() {
        return order;
    }

    /** The coefficient of z^i zbar^j; a ContourException beyond the order (it is not known). */
    public Rational coefficient(int i, int j) {
        if (i < 0 || j < 0) {
            return Rational.ZERO;
        }
        if (i + j > order) {
            throw new ContourException("the coefficient of z^" + i + " zbar^" + j + " lies beyond the series' order " + order);
        }
        return c[i][j];
    }

    public boolean isZero() {
        for (Rational[] row : c) {
            for (Rational x : row) {
                if (!x.isZero()) {
                    return false;
                }
            }
        }
        return true;
    }

    public DoubleSeries add(DoubleSeries o) {
        return combine(o, Rational.ONE);
    }

    public DoubleSeries subtract(DoubleSeries o) {
        return combine(o, Rational.MINUS_ONE);
    }

    /** this + k * o, to the smaller order. */
    public DoubleSeries combine(DoubleSeries o, Rational k) {
        int n = Math.min(order, o.order);
        Builder b = new Builder(n);
        for (int i = 0; i <= n; i++) {
            for (int j = 0; i + j <= n; j++) {
                b.c[i][j] = c[i][j].add(o.c[i][j].multiply(k));
            }
        }
        return b.build();
    }

    public DoubleSeries scale(Rational k) {
        return zero(order).combine(this, k);
    }

    /** The product, to the smaller order. */
    public DoubleSeries multiply(DoubleSeries o) {
        int n = Math.min(order, o.order);
        Builder b = new Builder(n);
        for (int i = 0; i <= n; i++) {
            for (int j = 0; i + j <= n; j++) {
                Rational x = c[i][j];
                if (x.isZero()) {
                    continue;
                }
                for (int k = 0; i + j + k <= n; k++) {
                    for (int l = 0; i + j + k + l <= n; l++) {
                        Rational y = o.c[k][l];
                        if (!y.isZero()) {
                            b.c[i + k][j + l] = b.c[i + k][j + l].add(x.multiply(y));
                        }
                    }
                }
            }
        }
        return b.build();
    }

    /** This series times (z zbar)^k, k >= 0; the order grows by 2k (the shifted terms are known). */
    public DoubleSeries timesU(int k) {
        if (k < 0) {
            throw new ContourException("dividing a z, zbar series by U is not supported; multiply the other side instead");
        }
        Builder b = new Builder(order + 2 * k);
        for (int i = 0; i <= order; i++) {
            for (int j = 0; i + j <= order; j++) {
                b.c[i + k][j + k] = c[i][j];
            }
        }
        return b.build();
    }

    /** The non-zero terms as {i, j, coefficient}, by total degree, then by the power of z, highest first. */
    public List<Entry> terms() {
        List<Entry> out = new ArrayList<>();
        for (int d = 0; d <= order; d++) {
            for (int i = d; i >= 0; i--) {
                Rational x = c[i][d - i];
                if (!x.isZero()) {
                    out.add(new Entry(i, d - i, x));
                }
            }
        }
        return out;
    }

    /** One term {@code coefficient * z^i * zbar^j}. */
    public record Entry(int i, int j, Rational coefficient) { }

    @Override
    public boolean equals(Object o) {
        if (!(o instanceof DoubleSeries d) || d.order != order) {
            return false;
        }
        for (int i = 0; i <= order; i++) {
            if (!java.util.Arrays.equals(c[i], d.c[i])) {
                return false;
            }
        }
        return true;
    }

    @Override
    public int hashCode() {
        int h = order;
        for (Rational[] row : c) {
            h = 31 * h + java.util.Arrays.hashCode(row);
        }
        return h;
    }

    @Override
    public String toString() {
        return "DoubleSeries(order " + order + ", " + terms() + ")";
    }

    // ------------------------------------------------------------------ builders from U, V

    /** (1 - z)^b (1 - zbar)^b = V^b for any integer b, to the order. */
    public static DoubleSeries powerOfV(int b, int order) {
        List<Rational> one = oneMinusPower(b, order);
        Builder r = new Builder(order);
        for (int i = 0; i <= order; i++) {
            for (int j = 0; i + j <= order; j++) {
                r.c[i][j] = one.get(i).multiply(one.get(j));
            }
        }
        return r.build();
    }

    /** The coefficients of (1 - x)^b = sum (-b)_n/n! x^n, n = 0..order. */
    static List<Rational> oneMinusPower(int b, int order) {
        List<Rational> out = new ArrayList<>();
        Rational x = Rational.ONE;
        for (int n = 0; n <= order; n++) {
            out.add(x);
            x = x.multiply(Rational.of(n - b)).divide(Rational.of(n + 1));
        }
        return out;
    }

    /** U^a sum_n w[n] (1 - V)^n with 1 - V = z + zbar - z zbar, to the order; a >= 0. */
    public static DoubleSeries fromOneMinusV(int a, List<Rational> w, int order) {
        if (a < 0) {
            throw new ContourException("U^" + a + " has no series in z, zbar (negative power of U)");
        }
        Builder r = new Builder(order);
        int inner = order - 2 * a;
        if (inner < 0) {
            return r.build();
        }
        if (w.size() <= inner) {
            throw new ContourException("the (1 - V) series of the U^" + a + " coefficient has " + (w.size() - 1)
                    + " as its order but total degree " + order + " in z, zbar needs order " + inner + "; raise order:");
        }
        // p = (1 - V)^n as a series of order `inner`, built step by step.
        Rational[][] p = new Rational[inner + 1][];
        for (int i = 0; i <= inner; i++) {
            p[i] = new Rational[inner - i + 1];
            java.util.Arrays.fill(p[i], Rational.ZERO);
        }
        p[0][0] = Rational.ONE;
        for (int n = 0; n <= inner && n < w.size(); n++) {
            Rational wn = w.get(n);
            if (!wn.isZero()) {
                for (int i = 0; i <= inner; i++) {
                    for (int j = 0; i + j <= inner; j++) {
                        if (!p[i][j].isZero()) {
                            r.c[i + a][j + a] = r.c[i + a][j + a].add(wn.multiply(p[i][j]));
                        }
                    }
                }
            }
            // p <- p * (z + zbar - z zbar); terms of degree < n + 1 vanish.
            Rational[][] q = new Rational[inner + 1][];
            for (int i = 0; i <= inner; i++) {
                q[i] = new Rational[inner - i + 1];
                java.util.Arrays.fill(q[i], Rational.ZERO);
            }
            for (int i = 0; i <= inner; i++) {
                for (int j = 0; i + j <= inner; j++) {
                    Rational x = p[i][j];
                    if (x.isZero()) {
                        continue;
                    }
                    if (i + j + 1 <= inner) {
                        q[i + 1][j] = q[i + 1][j].add(x);
                        q[i][j + 1] = q[i][j + 1].add(x);
                    }
                    if (i + j + 2 <= inner) {
                        q[i + 1][j + 1] = q[i + 1][j + 1].subtract(x);
                    }
                }
            }
            p = q;
        }
        return r.build();
    }
}
