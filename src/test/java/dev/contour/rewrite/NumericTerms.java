package dev.contour.rewrite;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.term.Term;
import java.math.BigInteger;
import java.util.Map;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;

/**
 * Evaluates terms at complex points with apfloat, independently of the rules: Gamma is
 * {@link ApcomplexMath#gamma}; poch(x, n) is the product x (x + 1) ... (x + n - 1) for an integer
 * n >= 0 and Gamma(x + n)/Gamma(x) otherwise (DLMF 5.2.4 and 5.2.5, recalled from memory);
 * factorial(n) = Gamma(n + 1) (DLMF 5.4.1); binom(x, k) for an integer k is the falling product over
 * k! (0 for k < 0), and Gamma(x + 1)/(Gamma(k + 1) Gamma(x - k + 1)) otherwise (common practice).
 */
final class NumericTerms {
    private final Map<String, Apcomplex> point;
    private final long precision;
    /** Calls already evaluated: the steps of one derivation share most of them. */
    private final Map<Term, Apcomplex> calls = new java.util.HashMap<>();

    NumericTerms(Map<String, Apcomplex> point, long precision) {
        this.point = point;
        this.precision = precision;
    }

    Apcomplex value(Term t) {
        if (t instanceof Term.Leaf l) {
            return value(l.value());
        }
        if (t instanceof Term.Sum s) {
            Apcomplex acc = zero();
            for (Term x : s.terms()) {
                acc = acc.add(value(x));
            }
            return acc;
        }
        if (t instanceof Term.Product p) {
            Apcomplex acc = one();
            for (Term x : p.factors()) {
                acc = acc.multiply(value(x));
            }
            return acc;
        }
        if (t instanceof Term.Power w) {
            return power(value(w.base()), w.exponent());
        }
        Apcomplex known = calls.get(t);
        if (known == null) {
            known = call((Term.Apply) t);
            calls.put(t, known);
        }
        return known;
    }

    private Apcomplex call(Term.Apply a) {
        Apcomplex x = value(a.arguments().get(0));
        switch (a.function()) {
            case "Gamma":
                return ApcomplexMath.gamma(x);
            case "factorial":
                return ApcomplexMath.gamma(x.add(one()));
            case "poch": {
                Integer n = integer(a.arguments().get(1));
                if (n != null && n >= 0) {
                    Apcomplex acc = one();
                    for (int k = 0; k < n; k++) {
                        acc = acc.multiply(x.add(number(k)));
                    }
                    return acc;
                }
                Apcomplex length = value(a.arguments().get(1));
                return ApcomplexMath.gamma(x.add(length)).divide(ApcomplexMath.gamma(x));
            }
            case "binom": {
                Integer k = integer(a.arguments().get(1));
                if (k != null) {
                    if (k < 0) {
                        return zero();
                    }
                    Apcomplex acc = one();
                    for (int j = 0; j < k; j++) {
                        acc = acc.multiply(x.subtract(number(j))).divide(number(j + 1));
                    }
                    return acc;
                }
                Apcomplex kk = value(a.arguments().get(1));
                return ApcomplexMath.gamma(x.add(one())).divide(ApcomplexMath.gamma(kk.add(one()))
                        .multiply(ApcomplexMath.gamma(x.subtract(kk).add(one()))));
            }
            default:
                throw new IllegalArgumentException("no numeric value for " + a.function());
        }
    }

    private static Integer integer(Term t) {
        if (t instanceof Term.Leaf l && l.value().isConstant() && l.value().constantValue().isInteger()) {
            return l.value().constantValue().intValueExact();
        }
        return null;
    }

    private Apcomplex value(Expression e) {
        Apcomplex acc = zero();
        for (Map.Entry<Monomial, RationalFunction> m : e.terms().entrySet()) {
            Apcomplex term = value(m.getValue().numerator()).divide(value(m.getValue().denominator()));
            for (Map.Entry<String, Integer> v : m.getKey().exponents().entrySet()) {
                term = term.multiply(power(variable(v.getKey()), v.getValue()));
            }
            acc = acc.add(term);
        }
        return acc;
    }

    private Apcomplex value(Polynomial p) {
        Apcomplex acc = zero();
        for (Polynomial.Term t : p.terms()) {
            Apcomplex term = rational(t.coefficient());
            for (Map.Entry<String, Integer> v : t.exponents().entrySet()) {
                term = term.multiply(power(variable(v.getKey()), v.getValue()));
            }
            acc = acc.add(term);
        }
        return acc;
    }

    private Apcomplex variable(String name) {
        Apcomplex v = point.get(name);
        if (v == null) {
            throw new IllegalArgumentException("no value for " + name);
        }
        return v;
    }

    private Apcomplex power(Apcomplex base, int e) {
        Apcomplex acc = one();
        for (int i = 0; i < Math.abs(e); i++) {
            acc = acc.multiply(base);
        }
        return e >= 0 ? acc : one().divide(acc);
    }

    Apcomplex rational(Rational r) {
        return new Apfloat(r.numerator(), precision).divide(new Apfloat(r.denominator(), precision));
    }

    private Apcomplex number(long n) {
        return new Apfloat(BigInteger.valueOf(n), precision);
    }

    private Apcomplex zero() {
        return new Apfloat(0, precision);
    }

    private Apcomplex one() {
        return new Apfloat(1, precision);
    }

    /** Whether a and b agree to {@code digits} significant digits (or are both that close to 0). */
    static boolean agree(Apcomplex a, Apcomplex b, int digits) {
        Apfloat diff = ApcomplexMath.abs(a.subtract(b));
        Apfloat scale = ApcomplexMath.abs(a).add(ApcomplexMath.abs(b)).add(new Apfloat("1e-10", a.precision()));
        return diff.compareTo(scale.multiply(new Apfloat("1e-" + digits, a.precision()))) <= 0;
    }
}
