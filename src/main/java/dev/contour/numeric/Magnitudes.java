package dev.contour.numeric;

import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;

/** Base-10 magnitudes of apfloat numbers as doubles, free of double overflow and underflow. */
final class Magnitudes {
    private Magnitudes() { }

    /** log10 |z|, or negative infinity for zero; exact in the exponent, double-accurate in the mantissa. */
    static double log10Abs(Apcomplex z) {
        if (z.isZero()) {
            return Double.NEGATIVE_INFINITY;
        }
        long scale = z.scale();
        Apcomplex m = ApcomplexMath.scale(z, -scale);
        return Math.log10(Math.hypot(m.real().doubleValue(), m.imag().doubleValue())) + scale;
    }

    /** 10^e to a few digits, for error estimates (zero for negative infinity). */
    static Apfloat pow10(double e) {
        if (e == Double.NEGATIVE_INFINITY) {
            return Apfloat.ZERO;
        }
        double floor = Math.floor(e);
        return ApfloatMath.scale(new Apfloat(Math.pow(10, e - floor), 3), (long) floor);
    }

    /**
     * 10^e rounded up to three digits (zero for negative infinity): an error bound written down must
     * not come out smaller than the one computed.
     */
    static Apfloat pow10Up(double e) {
        if (e == Double.NEGATIVE_INFINITY) {
            return Apfloat.ZERO;
        }
        double floor = Math.floor(e);
        double mantissa = Math.pow(10, e - floor) * (1 + 1e-9);
        java.math.BigDecimal m = new java.math.BigDecimal(mantissa).round(new java.math.MathContext(3, java.math.RoundingMode.CEILING));
        return ApfloatMath.scale(new Apfloat(m, 3), (long) floor);
    }

    /** log10(10^x + 10^y), either of them possibly negative infinity. */
    static double log10Sum(double x, double y) {
        if (x == Double.NEGATIVE_INFINITY) {
            return y;
        }
        if (y == Double.NEGATIVE_INFINITY) {
            return x;
        }
        double m = Math.max(x, y);
        return m + Math.log10(Math.pow(10, x - m) + Math.pow(10, y - m)) + 1e-12;
    }

    /** An error bound to two significant digits, rounded up, such as {@code 3.1e-18} (0 for zero). */
    static String errorText(Apfloat error) {
        if (error.signum() == 0) {
            return "0";
        }
        long scale = error.scale();
        double mantissa = ApfloatMath.scale(ApfloatMath.abs(error), 1 - scale).doubleValue(); // in [1, 10)
        java.math.BigDecimal m = new java.math.BigDecimal(mantissa).round(new java.math.MathContext(2, java.math.RoundingMode.CEILING));
        if (m.compareTo(java.math.BigDecimal.TEN) >= 0) {
            m = java.math.BigDecimal.ONE;
            scale++;
        }
        return String.format("%.1fe%s%02d", m.doubleValue(), scale - 1 < 0 ? "-" : "+", Math.abs(scale - 1));
    }

    /** A plain-text rendering to at most {@code digits} significant digits: {@code a}, or {@code a + b i}. */
    static String format(Apcomplex z, int digits) {
        Apcomplex r = z.precision(Math.min(digits, z.precision()));
        if (r.imag().signum() == 0) {
            return r.real().toString(true);
        }
        String re = r.real().signum() == 0 ? "0" : r.real().toString(true);
        String sign = r.imag().signum() < 0 ? " - " : " + ";
        return re + sign + ApfloatMath.abs(r.imag()).toString(true) + " i";
    }
}
