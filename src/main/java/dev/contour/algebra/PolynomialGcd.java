package dev.contour.algebra;

import dev.contour.Cancellation;
import java.util.Arrays;

/**
 * Greatest common divisors of multivariate polynomials over Q.
 *
 * <p>The result is normalised as in {@link Polynomial#primitivePart()}: integer coefficients with gcd
 * 1 and a positive leading coefficient (so it is unique). Algorithm: contents with respect to a main
 * variable by recursion on the number of variables, then a Brown-style modular gcd
 * ({@link ModularGcd}: dense evaluation/interpolation modulo word-size primes, Chinese remaindering,
 * exact trial division), with the primitive remainder sequence over Z[other variables] as fallback
 * when the interpolation grid would be too large. The result is exact for every input.
 */
public final class PolynomialGcd {
    private PolynomialGcd() { }

    /** The gcd, primitive with positive leading coefficient; gcd(0, 0) = 0; correct for every input. */
    public static Polynomial gcd(Polynomial a, Polynomial b) {
        if (a.isZero()) {
            return b.primitivePart();
        }
        if (b.isZero()) {
            return a.primitivePart();
        }
        if (a.isConstant() || b.isConstant()) {
            return Polynomial.ONE;
        }
        a = a.primitivePart();
        b = b.primitivePart();
        if (a.equals(b)) {
            return a;
        }
        return recursive(a, b).primitivePart();
    }

    /** gcd up to a constant factor, for non-zero a and b. */
    static Polynomial recursive(Polynomial a, Polynomial b) {
        if (a.isConstant() || b.isConstant()) {
            return Polynomial.ONE;
        }
        // A variable present in one input only divides out through the other's content.
        for (String v : a.vars) {
            if (b.indexOf(v) < 0) {
                return recursive(contentIn(a, v), b);
            }
        }
        for (String v : b.vars) {
            if (a.indexOf(v) < 0) {
                return recursive(a, contentIn(b, v));
            }
        }
        // Main variable: the one of highest common degree, so the interpolation grid is smallest.
        String x = a.vars[0];
        int best = -1;
        for (String v : a.vars) {
            int d = Math.min(a.degree(v), b.degree(v));
            if (d > best) {
                best = d;
                x = v;
            }
        }
        Polynomial ca = contentIn(a, x);
        Polynomial cb = contentIn(b, x);
        Polynomial c = recursive(ca, cb);
        Polynomial pa = a.divideOrNull(ca).primitivePart();
        Polynomial pb = b.divideOrNull(cb).primitivePart();
        Polynomial[] ka = pa.coefficientsIn(x);
        Polynomial[] kb = pb.coefficientsIn(x);
        Polynomial la = ka[ka.length - 1];
        Polynomial lb = kb[kb.length - 1];
        Rational integerGcd = Rational.of(la.content().numerator().gcd(lb.content().numerator()));
        Polynomial gamma = gcd(la, lb).multiply(integerGcd);
        Polynomial g = ModularGcd.gcd(pa, pb, x, gamma);
        if (g == null) {
            g = remainderSequence(ka, kb, x);
        }
        return c.multiply(g);
    }

    /** Primitive remainder sequence in x over Z[other variables] (inputs primitive in x). */
    static Polynomial remainderSequence(Polynomial[] p, Polynomial[] q, String x) {
        if (p.length < q.length) {
            Polynomial[] t = p;
            p = q;
            q = t;
        }
        while (true) {
            Cancellation.check();
            Polynomial[] r = pseudoRemainder(p, q);
            if (r.length == 0) {
                break;
            }
            if (r.length == 1) {
                return Polynomial.ONE;
            }
            p = q;
            q = primitiveIn(r);
        }
        return Polynomial.fromCoefficientsIn(x, primitiveIn(q));
    }

    /** The gcd of the coefficients of p with respect to x (a polynomial free of x). */
    static Polynomial contentIn(Polynomial p, String x) {
        Polynomial[] c = p.coefficientsIn(x);
        return contentOf(c);
    }

    private static Polynomial contentOf(Polynomial[] c) {
        Polynomial[] sorted = Arrays.stream(c).filter(q -> !q.isZero()).sorted((u, v) -> Integer.compare(u.termCount(), v.termCount()))
                .toArray(Polynomial[]::new);
        Polynomial g = sorted[0].primitivePart();
        for (int i = 1; i < sorted.length && !g.isConstant(); i++) {
            if (sorted[i].divideOrNull(g) == null) {
                g = recursive(g, sorted[i]).primitivePart();
            }
        }
        return g.isConstant() ? Polynomial.ONE : g;
    }

    /** Coefficient array divided by its content (and integer content), leading index = degree. */
    private static Polynomial[] primitiveIn(Polynomial[] r) {
        Polynomial g = contentOf(r);
        Polynomial[] out = new Polynomial[r.length];
        for (int i = 0; i < r.length; i++) {
            out[i] = g.isOne() ? r[i] : r[i].divideOrNull(g);
        }
        // Over Q the overall rational content is a unit: scale to integer coefficients with gcd 1.
        java.math.BigInteger num = java.math.BigInteger.ZERO;
        java.math.BigInteger den = java.math.BigInteger.ONE;
        for (Polynomial o : out) {
            if (!o.isZero()) {
                Rational ct = o.content().abs();
                num = num.gcd(ct.numerator());
                den = den.divide(den.gcd(ct.denominator())).multiply(ct.denominator());
            }
        }
        Rational scale = Rational.of(den, num);
        if (!scale.isOne()) {
            for (int i = 0; i < out.length; i++) {
                out[i] = out[i].multiply(scale);
            }
        }
        return out;
    }

    /** lc(q)^k * p mod q as coefficient arrays in the main variable (trimmed; empty when zero). */
    static Polynomial[] pseudoRemainder(Polynomial[] p, Polynomial[] q) {
        Polynomial[] r = p.clone();
        int dq = q.length - 1;
        Polynomial lq = q[dq];
        int dr = r.length - 1;
        while (dr >= dq) {
            Polynomial lr = r[dr];
            int shift = dr - dq;
            for (int k = 0; k < dr; k++) {
                Polynomial v = r[k].multiply(lq);
                if (k >= shift) {
                    v = v.subtract(lr.multiply(q[k - shift]));
                }
                r[k] = v;
            }
            r[dr] = Polynomial.ZERO;
            dr--;
            while (dr >= 0 && r[dr].isZero()) {
                dr--;
            }
        }
        return Arrays.copyOf(r, dr + 1);
    }
}
