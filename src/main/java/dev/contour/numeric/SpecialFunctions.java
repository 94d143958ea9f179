package dev.contour.numeric;

import dev.contour.ContourException;
import org.apfloat.Apcomplex;

/**
 * Special functions to a requested number of correct digits, each returned as a
 * {@link NumericResult} that states the digits it claims.
 *
 * <p>Every value is computed at two working precisions (digits + 5 and digits + 15); the digits on
 * which they agree are the claim, and the more precise value is returned. When ill-conditioning
 * (an argument near a pole, cancellation) eats the guard digits, the precisions are raised and the
 * evaluation repeated, up to three times. Arguments are taken as exact decimal numbers.
 */
public final class SpecialFunctions {
    private SpecialFunctions() { }

    private static final int LOW_GUARD = 5;
    private static final int HIGH_GUARD = 15;
    private static final int RETRIES = 3;

    /** The Gamma function; its poles are a ContourException. */
    public static NumericResult gamma(Apcomplex z, int digits) {
        return evaluate(p -> ComplexFunctions.gamma(z.precision(p), p), digits);
    }

    /** The principal branch of log Gamma. */
    public static NumericResult logGamma(Apcomplex z, int digits) {
        return evaluate(p -> ComplexFunctions.logGamma(z.precision(p), p), digits);
    }

    /** The Pochhammer symbol (a)_n for integer n (negative n allowed). */
    public static NumericResult pochhammer(Apcomplex a, long n, int digits) {
        return evaluate(p -> ComplexFunctions.pochhammer(a.precision(p), n, p), digits);
    }

    /** The Pochhammer symbol (a)_x = Gamma(a + x)/Gamma(a). */
    public static NumericResult pochhammer(Apcomplex a, Apcomplex x, int digits) {
        return evaluate(p -> ComplexFunctions.pochhammer(a.precision(p), x.precision(p)), digits);
    }

    /** The polylogarithm Li_n(z) (principal branch, cut along [1, infinity)). */
    public static NumericResult polylog(int n, Apcomplex z, int digits) {
        return evaluate(p -> ComplexFunctions.polylog(n, z.precision(p), p), digits);
    }

    /** The dilogarithm Li_2(z). */
    public static NumericResult dilog(Apcomplex z, int digits) {
        return polylog(2, z, digits);
    }

    /** e^z. */
    public static NumericResult exp(Apcomplex z, int digits) {
        return evaluate(p -> ComplexFunctions.exp(z.precision(p), p), digits);
    }

    /** The principal logarithm. */
    public static NumericResult log(Apcomplex z, int digits) {
        return evaluate(p -> ComplexFunctions.log(z.precision(p), p), digits);
    }

    /** base^exponent on the principal branch. */
    public static NumericResult power(Apcomplex base, Apcomplex exponent, int digits) {
        return evaluate(p -> ComplexFunctions.power(base.precision(p), exponent.precision(p), p), digits);
    }

    /**
     * Any expression to {@code digits} correct digits: {@code expression} is evaluated at two
     * precisions and the digits on which the results agree are claimed.
     */
    public static NumericResult evaluate(AtPrecision expression, int digits) {
        if (digits < 1 || digits > 10_000) {
            throw new ContourException("digits must be between 1 and 10000, got " + digits);
        }
        int extra = 0;
        int reached = 0;
        for (int attempt = 0; attempt <= RETRIES; attempt++) {
            long low = digits + LOW_GUARD + extra;
            Apcomplex coarse = expression.at(low);
            Apcomplex fine = expression.at(digits + HIGH_GUARD + extra);
            Apcomplex diff = fine.subtract(coarse.precision(fine.precision()));
            double error = diff.isZero() ? Magnitudes.log10Abs(fine) - low : Magnitudes.log10Abs(diff);
            if (fine.isZero()) {
                return new NumericResult(fine, 0, Magnitudes.pow10(error));
            }
            reached = NumericResult.digitsAllowed(fine, error);
            if (reached >= digits) {
                return NumericResult.of(fine, error, digits + LOW_GUARD);
            }
            extra += (digits - reached) + 10;
        }
        throw new ContourException("could not reach " + digits + " digits (reached " + Math.max(reached, 0)
                + " with " + (digits + HIGH_GUARD + extra) + " working digits): the expression is too ill-conditioned here");
    }
}
