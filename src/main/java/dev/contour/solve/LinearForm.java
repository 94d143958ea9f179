package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.algebra.Hashing;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * An affine form c + sum a_i v_i over a fixed, positional list of variables (immutable).
 *
 * <p>Why positional: the residue and growth analyses touch millions of such forms (each factor of
 * each term of each piece), and array arithmetic over two or three variables is far cheaper than
 * named polynomials. Names are attached only at the boundary ({@link #of}, {@link #toPolynomial}).
 */
final class LinearForm {
    final Rational constant;
    private final Rational[] coef;
    private int hash;
    /** {constant, coefficients...} as longs when all are integers of moderate size; computed on demand. */
    private long[] integral;
    private boolean integralKnown;

    LinearForm(Rational constant, Rational[] coef) {
        this.constant = constant;
        this.coef = coef;
    }

    /** c + a v_0 + b v_1 with small integer coefficients (the integer view is known up front). */
    static LinearForm ofIntegers(long c, long a, long b) {
        LinearForm f = new LinearForm(Rational.of(c), new Rational[] {Rational.of(a), Rational.of(b)});
        if (Math.abs(c) < (1L << 31) && Math.abs(a) < (1L << 31) && Math.abs(b) < (1L << 31)) {
            f.integral = new long[] {c, a, b};
        }
        f.integralKnown = true;
        return f;
    }

    static LinearForm constant(Rational c, int n) {
        Rational[] z = new Rational[n];
        Arrays.fill(z, Rational.ZERO);
        return new LinearForm(c, z);
    }

    static LinearForm variable(int i, int n) {
        LinearForm f = constant(Rational.ZERO, n);
        f.coef[i] = Rational.ONE;
        return f;
    }

    /** The form of a polynomial of total degree at most one over the given variables. */
    static LinearForm of(Polynomial p, List<String> vars) {
        if (p.totalDegree() > 1) {
            throw new ContourException("not a linear form: " + p);
        }
        Rational c = Rational.ZERO;
        Rational[] a = new Rational[vars.size()];
        Arrays.fill(a, Rational.ZERO);
        for (Polynomial.Term t : p.terms()) {
            if (t.exponents().isEmpty()) {
                c = t.coefficient();
            } else {
                String v = t.exponents().keySet().iterator().next();
                int i = vars.indexOf(v);
                if (i < 0) {
                    throw new ContourException("variable " + v + " is not among " + vars);
                }
                a[i] = t.coefficient();
            }
        }
        return new LinearForm(c, a);
    }

    Polynomial toPolynomial(List<String> vars) {
        Polynomial p = Polynomial.constant(constant);
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].isZero()) {
                p = p.add(Polynomial.variable(vars.get(i)).multiply(coef[i]));
            }
        }
        return p;
    }

    /** {constant, a_0, a_1, ...} as longs if every entry is an integer below 2^31 in size, else null. */
    long[] integral() {
        if (!integralKnown) {
            long[] v = new long[coef.length + 1];
            boolean ok = true;
            for (int i = 0; i <= coef.length && ok; i++) {
                Rational r = i == 0 ? constant : coef[i - 1];
                ok = r.isInteger() && r.numerator().bitLength() < 31;
                v[i] = ok ? r.numerator().longValue() : 0;
            }
            integral = ok ? v : null;
            integralKnown = true;
        }
        return integral;
    }

    int size() {
        return coef.length;
    }

    Rational coefficient(int i) {
        return coef[i];
    }

    boolean isConstant() {
        for (Rational a : coef) {
            if (!a.isZero()) {
                return false;
            }
        }
        return true;
    }

    boolean isZero() {
        return constant.isZero() && isConstant();
    }

    /** Index of the first variable with a non-zero coefficient, or -1. */
    int pivot() {
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].isZero()) {
                return i;
            }
        }
        return -1;
    }

    Rational evaluate(Rational[] point) {
        Rational v = constant;
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].isZero()) {
                v = v.add(coef[i].multiply(point[i]));
            }
        }
        return v;
    }

    LinearForm add(LinearForm o) {
        Rational[] a = new Rational[coef.length];
        for (int i = 0; i < a.length; i++) {
            a[i] = coef[i].add(o.coef[i]);
        }
        return new LinearForm(constant.add(o.constant), a);
    }

    LinearForm scale(Rational f) {
        Rational[] a = new Rational[coef.length];
        for (int i = 0; i < a.length; i++) {
            a[i] = coef[i].multiply(f);
        }
        return new LinearForm(constant.multiply(f), a);
    }

    /** The same line scaled so that its first variable coefficient is 1 (a canonical key for the line). */
    LinearForm monic() {
        int p = pivot();
        if (p < 0) {
            throw new ContourException("a constant has no line");
        }
        return coef[p].isOne() ? this : scale(coef[p].inverse());
    }

    /** The form of v + amounts (a shift of the variables): the same slopes, a moved constant. */
    LinearForm translate(Rational[] amounts) {
        Rational c = constant;
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].isZero() && !amounts[i].isZero()) {
                c = c.add(coef[i].multiply(amounts[i]));
            }
        }
        return c.equals(constant) ? this : new LinearForm(c, coef);
    }

    /** sum_i coef_i * images[i] + constant, the images being forms over another space. */
    LinearForm compose(LinearForm[] images, int newSize) {
        LinearForm out = constant(constant, newSize);
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].isZero()) {
                out = out.add(images[i].scale(coef[i]));
            }
        }
        return out;
    }

    /** The coefficients of the variables selected by mask, summed against images; the rest ignored. */
    LinearForm composePart(LinearForm[] images, boolean[] mask, boolean withConstant, int newSize) {
        LinearForm out = constant(withConstant ? constant : Rational.ZERO, newSize);
        for (int i = 0; i < coef.length; i++) {
            if (mask[i] && !coef[i].isZero()) {
                out = out.add(images[i].scale(coef[i]));
            }
        }
        return out;
    }

    boolean involvesAny(boolean[] mask) {
        for (int i = 0; i < coef.length; i++) {
            if (mask[i] && !coef[i].isZero()) {
                return true;
            }
        }
        return false;
    }

    /** If this form is lambda * (other - c) for some lambda, c, returns c; otherwise null. */
    Rational levelOf(LinearForm other) {
        long[] x = integral();
        long[] y = other.integral();
        if (x != null && y != null) {
            return levelOfIntegers(x, y);
        }
        int p = other.pivot();
        if (p < 0 || coef[p].isZero()) {
            return null;
        }
        Rational lambda = coef[p].divide(other.coef[p]);
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].equals(other.coef[i].multiply(lambda))) {
                return null;
            }
        }
        // this = lambda * other - lambda * c  =>  c = (lambda * other.constant - constant) / lambda
        return other.constant.subtract(constant.divide(lambda));
    }

    /** levelOf for integer forms: this = lambda (other - c) with word arithmetic (entries below 2^31). */
    private static Rational levelOfIntegers(long[] x, long[] y) {
        int p = -1;
        for (int i = 1; i < y.length; i++) {
            if (y[i] != 0) {
                p = i;
                break;
            }
        }
        if (p < 0 || x[p] == 0) {
            return null;
        }
        // lambda = x[p] / y[p]; need x[i] * y[p] == y[i] * x[p] for every variable
        for (int i = 1; i < y.length; i++) {
            if (x[i] * y[p] != y[i] * x[p]) {
                return null;
            }
        }
        // c = y0 - x0 / lambda = (y0 x[p] - x0 y[p]) / x[p]
        return Rational.of(y[0] * x[p] - x[0] * y[p], x[p]);
    }

    static Map<String, Rational> pointMap(List<String> vars, Rational[] point) {
        Map<String, Rational> m = new HashMap<>();
        for (int i = 0; i < vars.size(); i++) {
            m.put(vars.get(i), point[i]);
        }
        return m;
    }

    @Override
    public boolean equals(Object o) {
        return o == this || o instanceof LinearForm f && hashCode() == f.hashCode() && constant.equals(f.constant)
                && Arrays.equals(coef, f.coef);
    }

    @Override
    public int hashCode() {
        int h = hash;
        if (h == 0) {
            h = Hashing.mix(constant.hashCode());
            for (Rational a : coef) {
                h = Hashing.combine(h, a.hashCode());
            }
            hash = h == 0 ? 1 : h;
        }
        return h;
    }

    @Override
    public String toString() {
        StringBuilder b = new StringBuilder(constant.toString());
        for (int i = 0; i < coef.length; i++) {
            if (!coef[i].isZero()) {
                b.append(" + ").append(coef[i]).append("*v").append(i);
            }
        }
        return b.toString();
    }
}
