package dev.contour.solve;

import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;

/**
 * The vanishing conditions of a factored term in one variable, computed with dense truncated power
 * series: the same keys and the same values as the general expansion in {@link TermConditions}.
 *
 * <p>Why: in one variable every Laurent coefficient is a number, so the general path's sums of
 * factored partial products (one object per way of distributing the order among the factors, their
 * count growing like a binomial coefficient in the order) collapse to a product of short series of
 * rationals. For f = c * prod (v + a_j)^e_j * P(v), the coefficient of h^q at the pole v = -a_i
 * (h = v + a_i) is c times the coefficient of h^(q - e_i) in prod_(j != i) ((a_j - a_i) + h)^e_j *
 * P(-a_i + h); at infinity (v = 1/h) the coefficient of h^q, q >= -deg, is c times the coefficient of
 * h^(q + deg) in prod (1 + a_j h)^e_j * (P with its coefficients reversed).
 */
final class UnivariateConditions {
    private UnivariateConditions() { }

    /**
     * Hands the term's vanishing conditions to the sink (principal parts at each pole, then the
     * polynomial part's coefficients), or returns false when the term is not in the expected shape
     * (a form that is not monic), leaving it to the general path.
     */
    static boolean vanish(String variable, FactoredTerm t, Object key, TermConditions.Sink sink) {
        int k = t.size();
        Rational[] a = new Rational[k];
        for (int i = 0; i < k; i++) {
            LinearForm f = t.forms[i];
            if (f.size() != 1 || !f.coefficient(0).isOne()) {
                return false;
            }
            a[i] = f.constant;
        }
        Rational[] p = dense(t.cofactor, variable);
        if (p == null) {
            return false;
        }
        for (int i = 0; i < k; i++) {
            int e = t.exps[i];
            if (e >= 0) {
                continue;
            }
            int n = -e;
            Rational[] series = taylorShift(p, a[i].negate(), n);
            for (int j = 0; j < k; j++) {
                if (j != i) {
                    series = times(series, binomialSeries(a[j].subtract(a[i]), Rational.ONE, t.exps[j], n), n);
                }
            }
            for (int q = e; q <= -1; q++) {
                Rational v = series[q - e];
                if (!v.isZero()) {
                    sink.add(new TermConditions.Step(key, "line", t.forms[i], q), t.coefficient.multiply(v));
                }
            }
        }
        int deg = t.degree();
        if (deg >= 0) {
            int n = deg + 1;
            Rational[] series = new Rational[n];
            int d = p.length - 1;
            for (int r = 0; r < n; r++) {
                series[r] = r <= d ? p[d - r] : Rational.ZERO;
            }
            for (int j = 0; j < k; j++) {
                series = times(series, binomialSeries(Rational.ONE, a[j], t.exps[j], n), n);
            }
            for (int q = -deg; q <= 0; q++) {
                Rational v = series[q + deg];
                if (!v.isZero()) {
                    sink.add(new TermConditions.Step(key, "ray", null, q), t.coefficient.multiply(v));
                }
            }
        }
        return true;
    }

    /** The cofactor's coefficients (index = power; {1} for none), or null if it has another variable. */
    private static Rational[] dense(Polynomial cofactor, String variable) {
        if (cofactor == null) {
            return new Rational[] {Rational.ONE};
        }
        for (String v : cofactor.variables()) {
            if (!v.equals(variable)) {
                return null;
            }
        }
        int d = cofactor.degree(variable);
        Rational[] out = new Rational[d + 1];
        java.util.Arrays.fill(out, Rational.ZERO);
        for (Polynomial.Term term : cofactor.terms()) {
            Integer e = term.exponents().get(variable);
            out[e == null ? 0 : e] = term.coefficient();
        }
        return out;
    }

    /** The first n coefficients in h of P(x0 + h) (repeated synthetic division). */
    static Rational[] taylorShift(Rational[] p, Rational x0, int n) {
        Rational[] c = p.clone();
        int d = c.length - 1;
        Rational[] out = new Rational[n];
        for (int j = 0; j < n; j++) {
            if (j > d) {
                out[j] = Rational.ZERO;
                continue;
            }
            // after this pass c[j] is the j-th Taylor coefficient
            if (!x0.isZero()) {
                for (int m = d - 1; m >= j; m--) {
                    c[m] = c[m].add(x0.multiply(c[m + 1]));
                }
            }
            out[j] = c[j];
        }
        return out;
    }

    /** The first n coefficients in h of (c + b h)^e, c non-zero (binomial series; e may be negative). */
    static Rational[] binomialSeries(Rational c, Rational b, int e, int n) {
        Rational[] out = new Rational[n];
        java.util.Arrays.fill(out, Rational.ZERO);
        if (n == 0) {
            return out;
        }
        out[0] = c.pow(e);
        if (b.isZero()) {
            return out;
        }
        Rational ratio = b.divide(c);
        Rational binom = Rational.ONE;
        Rational power = out[0];
        for (int r = 1; r < n; r++) {
            binom = binom.multiply(Rational.of(e - r + 1, r));
            if (binom.isZero()) {
                break;
            }
            power = power.multiply(ratio);
            out[r] = binom.multiply(power);
        }
        return out;
    }

    /** The product of two series, truncated to n coefficients. */
    static Rational[] times(Rational[] x, Rational[] y, int n) {
        Rational[] out = new Rational[n];
        java.util.Arrays.fill(out, Rational.ZERO);
        for (int i = 0; i < n && i < x.length; i++) {
            if (x[i].isZero()) {
                continue;
            }
            for (int j = 0; i + j < n && j < y.length; j++) {
                if (!y[j].isZero()) {
                    out[i + j] = out[i + j].add(x[i].multiply(y[j]));
                }
            }
        }
        return out;
    }
}
