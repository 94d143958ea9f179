package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.math.BigInteger;

/** Gamma functions at rational points where the value is a rational number (positive integers). */
final class ExactGamma {
    private ExactGamma() { }

    /** The largest argument evaluated, so that a runaway integral cannot build a huge factorial. */
    static final int LIMIT = 100_000;

    /** Gamma(x) for a positive integer x; a ContourException naming {@code where} otherwise. */
    static Rational of(Rational x, String where) {
        if (!x.isInteger() || x.signum() <= 0) {
            throw new ContourException(where + ": Gamma(" + x + ") is not a rational number (exact coefficients need"
                    + " Gamma functions at positive integers; half-integer or other weights are not supported yet)");
        }
        if (x.compareTo(Rational.of(LIMIT)) > 0) {
            throw new ContourException(where + ": Gamma(" + x + ") exceeds the limit of arguments up to " + LIMIT);
        }
        return factorial(x.intValueExact() - 1);
    }

    static Rational factorial(int n) {
        BigInteger f = BigInteger.ONE;
        for (int i = 2; i <= n; i++) {
            f = f.multiply(BigInteger.valueOf(i));
        }
        return Rational.of(f);
    }

    /** The Pochhammer symbol (x)_n for n >= 0. */
    static Rational pochhammer(Rational x, int n) {
        Rational p = Rational.ONE;
        for (int i = 0; i < n; i++) {
            p = p.multiply(x.add(Rational.of(i)));
        }
        return p;
    }
}
