package dev.contour.numeric;

import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;
import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * A numeric value together with the number of correct significant digits it claims and the
 * absolute error bound behind that claim.
 *
 * <p>The value is kept as computed, with its guard digits: it is not rounded to the claim, so that
 * arithmetic done with it downstream loses nothing to intermediate rounding, and
 * {@code errorEstimate} bounds {@code |value - true value|}. The claim of {@code digits} digits means
 * that the error bound is at most half a unit in the last claimed place, so the value rounded to
 * those digits ({@link #shown()}) is within one unit of the last printed digit; {@link #shown()}
 * states its own error, the bound plus what the rounding moved. When the value is zero the claim
 * is about the absolute error only and {@code digits} is 0.
 */
public record NumericResult(Apcomplex value, int digits, Apfloat errorEstimate) {

    public NumericResult {
        if (value == null || errorEstimate == null) {
            throw new IllegalArgumentException("value and error estimate are required");
        }
        if (digits < 0) {
            throw new IllegalArgumentException("digits must be non-negative");
        }
    }

    private static final double LOG10_HALF = Math.log10(0.5);

    /**
     * The result for {@code value} with absolute error at most {@code 10^log10Error}: the claimed
     * digits are those the error leaves intact ({@link #digitsAllowed}), never more than {@code maxDigits}.
     */
    static NumericResult of(Apcomplex value, double log10Error, int maxDigits) {
        // A real or imaginary part below the error is zero as far as the claim goes; dropping it
        // moves the value by its size, which the bound then includes.
        if (!value.imag().isZero() && Magnitudes.log10Abs(value.imag()) < log10Error) {
            log10Error = Magnitudes.log10Sum(log10Error, Magnitudes.log10Abs(value.imag()));
            value = value.real();
        } else if (!value.real().isZero() && Magnitudes.log10Abs(value.real()) < log10Error) {
            log10Error = Magnitudes.log10Sum(log10Error, Magnitudes.log10Abs(value.real()));
            value = new Apcomplex(Apfloat.ZERO, value.imag());
        }
        int digits = value.isZero() ? 0 : Math.max(0, Math.min(maxDigits, digitsAllowed(value, log10Error)));
        return new NumericResult(value, digits, Magnitudes.pow10Up(log10Error));
    }

    /**
     * The most significant digits an absolute error of {@code 10^log10Error} leaves intact: the largest
     * n with error at most half a unit in the n-th place (at the scale of the larger part), so the value
     * rounded to n digits is within one unit of its last digit. Can be negative.
     */
    static int digitsAllowed(Apcomplex value, double log10Error) {
        if (value.isZero()) {
            return 0;
        }
        if (log10Error == Double.NEGATIVE_INFINITY) {
            return Integer.MAX_VALUE;
        }
        double n = Math.floor(value.scale() + LOG10_HALF - log10Error);
        return n > Integer.MAX_VALUE ? Integer.MAX_VALUE : n < -1_000_000 ? -1_000_000 : (int) n;
    }

    /** The same number claiming at most {@code maxDigits} digits. */
    NumericResult capped(int maxDigits) {
        return digits <= maxDigits ? this : new NumericResult(value, Math.max(0, maxDigits), errorEstimate);
    }

    /**
     * The value as printed: both parts rounded (half to even) at the last claimed place of the larger
     * part, with the error bound increased by exactly what the rounding moved. With no digit claimed
     * the value is returned unchanged.
     */
    public NumericResult shown() {
        if (digits == 0 || value.isZero()) {
            return this;
        }
        long place = value.scale() - digits; // the last claimed place is 10^place
        BigDecimal re = decimal(value.real());
        BigDecimal im = decimal(value.imag());
        BigDecimal rr = re.setScale((int) -place, RoundingMode.HALF_EVEN);
        BigDecimal ri = im.setScale((int) -place, RoundingMode.HALF_EVEN);
        BigDecimal moved = re.subtract(rr).abs().add(im.subtract(ri).abs());
        double log10Moved = moved.signum() == 0 ? Double.NEGATIVE_INFINITY : log10(moved);
        Apfloat error = Magnitudes.pow10Up(Magnitudes.log10Sum(Magnitudes.log10Abs(errorEstimate), log10Moved));
        return new NumericResult(new Apcomplex(apfloat(rr), apfloat(ri)), digits, error);
    }

    /**
     * The printed digits: {@code a} or {@code a + b i}, rounded as {@link #shown()} and keeping trailing
     * zeros, so a claim of n digits shows n digits (of the larger part).
     */
    public String shownText() {
        if (digits == 0 || value.isZero()) {
            return Magnitudes.format(value, 1);
        }
        long place = value.scale() - digits;
        BigDecimal re = decimal(value.real()).setScale((int) -place, RoundingMode.HALF_EVEN);
        BigDecimal im = decimal(value.imag()).setScale((int) -place, RoundingMode.HALF_EVEN);
        String r = plain(re);
        if (im.signum() == 0) {
            return r;
        }
        return (re.signum() == 0 ? "0" : r) + (im.signum() < 0 ? " - " : " + ") + plain(im.abs()) + " i";
    }

    private static String plain(BigDecimal x) {
        return x.signum() == 0 ? "0" : x.toPlainString();
    }

    private static BigDecimal decimal(Apfloat x) {
        return x.signum() == 0 ? BigDecimal.ZERO : new BigDecimal(x.toString(true));
    }

    private static Apfloat apfloat(BigDecimal x) {
        return x.signum() == 0 ? Apfloat.ZERO : new Apfloat(x.stripTrailingZeros(), Math.max(1, x.precision()));
    }

    /** log10 of a positive decimal, exact in the exponent. */
    private static double log10(BigDecimal x) {
        BigDecimal u = new BigDecimal(x.unscaledValue());
        int shift = Math.max(0, u.precision() - 17);
        double mantissa = u.movePointLeft(shift).doubleValue();
        return Math.log10(mantissa) + shift - x.scale();
    }

    /** The real part (the imaginary part is discarded; use {@link #value()} for both). */
    public Apfloat real() {
        return value.real();
    }

    /** The relative difference to {@code reference}, as a base-10 logarithm (for tests and reports). */
    public double log10RelativeDistance(Apcomplex reference) {
        long p = Math.max(value.precision(), reference.precision());
        Apcomplex diff = value.precision(p).subtract(reference.precision(p));
        if (diff.isZero()) {
            return Double.NEGATIVE_INFINITY;
        }
        return Magnitudes.log10Abs(diff) - Magnitudes.log10Abs(reference);
    }

    /** The value printed to its claimed digits, with the error estimate (both as {@link #shown()}). */
    @Override
    public String toString() {
        NumericResult r = shown();
        return Magnitudes.format(r.value, Math.max(digits, 1)) + "  (" + digits + " digits, error <= "
                + Magnitudes.errorText(r.errorEstimate) + ")";
    }
}
