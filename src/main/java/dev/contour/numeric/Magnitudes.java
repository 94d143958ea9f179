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
