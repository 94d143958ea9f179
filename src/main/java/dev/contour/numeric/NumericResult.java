package dev.contour.numeric;

import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;

/**
 * A numeric value together with the number of correct significant digits it claims and the
 * absolute error estimate behind that claim.
 *
 * <p>The value carries exactly {@code digits} significant digits (apfloat precision), so arithmetic
 * done with it downstream keeps the claim; a real or imaginary part smaller than the error estimate
 * is reported as zero. When the value is zero the claim is about the absolute error only and
 * {@code digits} is 0.
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

    /**
     * The result for {@code value} with absolute error at most {@code error}: the claimed digits are
     * those the error leaves intact, never more than {@code maxDigits}.
     */
    static NumericResult of(Apcomplex value, double log10Error, int maxDigits) {
        // A real or imaginary part below the error is zero as far as the claim goes.
        if (!value.imag().isZero() && Magnitudes.log10Abs(value.imag()) < log10Error) {
            value = value.real();
        } else if (!value.real().isZero() && Magnitudes.log10Abs(value.real()) < log10Error) {
            value = new Apcomplex(Apfloat.ZERO, value.imag());
        }
        double log10Value = Magnitudes.log10Abs(value);
        int digits = value.isZero() ? 0
                : (int) Math.max(0, Math.min(maxDigits, Math.floor(log10Value - log10Error)));
        Apcomplex rounded = digits > 0 ? value.precision(digits) : value;
        return new NumericResult(rounded, digits, Magnitudes.pow10(log10Error));
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

    /** The value printed to its claimed digits, with the error estimate. */
    @Override
    public String toString() {
        return Magnitudes.format(value, Math.max(digits, 1)) + "  (" + digits + " digits, error <= "
                + String.format("%.1e", ApcomplexMath.abs(errorEstimate).doubleValue()) + ")";
    }
}
