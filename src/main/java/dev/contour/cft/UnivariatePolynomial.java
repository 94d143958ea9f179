package dev.contour.cft;

import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/** A dense polynomial in one variable over Q, lowest power first, no trailing zeros. */
record UnivariatePolynomial(List<Rational> coefficients) {
    static final UnivariatePolynomial ONE = constant(Rational.ONE);

    UnivariatePolynomial {
        List<Rational> c = new ArrayList<>(coefficients);
        while (!c.isEmpty() && c.get(c.size() - 1).isZero()) {
            c.remove(c.size() - 1);
        }
        coefficients = Collections.unmodifiableList(c);
    }

    static UnivariatePolynomial constant(Rational c) {
        return new UnivariatePolynomial(List.of(c));
    }

    /** The linear polynomial {@code a + b x}. */
    static UnivariatePolynomial linear(Rational a, Rational b) {
        return new UnivariatePolynomial(List.of(a, b));
    }

    int degree() {
        return coefficients.size() - 1;
    }

    boolean isZero() {
        return coefficients.isEmpty();
    }

    Rational coefficient(int k) {
        return k < coefficients.size() ? coefficients.get(k) : Rational.ZERO;
    }

    UnivariatePolynomial multiply(UnivariatePolynomial o) {
        if (isZero() || o.isZero()) {
            return new UnivariatePolynomial(List.of());
        }
        Rational[] r = new Rational[coefficients.size() + o.coefficients.size() - 1];
        java.util.Arrays.fill(r, Rational.ZERO);
        for (int i = 0; i < coefficients.size(); i++) {
            if (coefficients.get(i).isZero()) {
                continue;
            }
            for (int j = 0; j < o.coefficients.size(); j++) {
                r[i + j] = r[i + j].add(coefficients.get(i).multiply(o.coefficients.get(j)));
            }
        }
        return new UnivariatePolynomial(List.of(r));
    }

    UnivariatePolynomial scale(Rational c) {
        List<Rational> r = new ArrayList<>();
        coefficients.forEach(x -> r.add(x.multiply(c)));
        return new UnivariatePolynomial(r);
    }

    Rational evaluate(Rational x) {
        Rational v = Rational.ZERO;
        for (int i = coefficients.size() - 1; i >= 0; i--) {
            v = v.multiply(x).add(coefficients.get(i));
        }
        return v;
    }

    /** The rising product {@code (a + x)(a + 1 + x)...(a + n - 1 + x)} (sign = 1) or {@code (a - x)...(a + n - 1 - x)} (sign = -1). */
    static UnivariatePolynomial rising(Rational a, int sign, int n) {
        UnivariatePolynomial p = ONE;
        for (int i = 0; i < n; i++) {
            p = p.multiply(linear(a.add(Rational.of(i)), Rational.of(sign)));
        }
        return p;
    }

    /**
     * The coefficients c_k of this polynomial in the basis {@code (a + x)_k}: repeated synthetic
     * division by {@code a + x}, {@code a + 1 + x}, ... (Newton's form at the nodes -a, -a-1, ...).
     */
    List<Rational> inPochhammerBasis(Rational a) {
        List<Rational> out = new ArrayList<>();
        Rational[] q = coefficients.toArray(new Rational[0]);
        int len = q.length;
        for (int k = 0; len > 0; k++) {
            Rational root = a.add(Rational.of(k)).negate();
            // Divide q (degree len - 1) by (x - root): Horner from the top.
            Rational[] quotient = new Rational[Math.max(len - 1, 0)];
            Rational carry = Rational.ZERO;
            for (int i = len - 1; i >= 0; i--) {
                Rational v = q[i].add(carry.multiply(root));
                if (i == 0) {
                    out.add(v);
                } else {
                    quotient[i - 1] = v;
                }
                carry = v;
            }
            q = quotient;
            len = quotient.length;
        }
        return out;
    }
}
