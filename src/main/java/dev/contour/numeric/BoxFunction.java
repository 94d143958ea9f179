package dev.contour.numeric;

import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;
import org.apfloat.Apint;

/**
 * The one-loop box function of the cross ratios U = z zbar, V = (1-z)(1-zbar), both as the
 * two-variable Mellin-Barnes integral of U^s V^t Gamma(-s)^2 Gamma(-t)^2 Gamma(1+s+t)^2 on
 * Re s = Re t = -1/3 and in closed form through dilogarithms (closed form: Usyukina and Davydychev,
 * Phys. Lett. B 298 (1993) 363). The numerics' reference workload: two independent routes to one number.
 */
public final class BoxFunction {
    private BoxFunction() { }

    /** The contour Re s = Re t = -1/3, to the working precision of {@code digits}. */
    public static Apfloat contour(int digits) {
        long wp = MellinBarnes.workingPrecision(digits);
        return new Apfloat(-1, wp + 5).divide(new Apint(3));
    }

    /** U^s V^t Gamma(-s)^2 Gamma(-t)^2 Gamma(1+s+t)^2 for the point z (z and zbar its conjugate). */
    public static Integrand2 integrand(Apcomplex z, int digits) {
        long wp = MellinBarnes.workingPrecision(digits) + 5;
        Apcomplex zz = z.precision(wp);
        Apcomplex u = zz.multiply(zz.conj());
        Apcomplex one = Apcomplex.ONE;
        Apcomplex v = one.subtract(zz).multiply(one.subtract(zz.conj()));
        // The factors of s alone and of t alone are remembered per grid line: three products a point.
        Object tagS = new Object();
        Object tagT = new Object();
        return (s, t) -> {
            Apcomplex a = ComplexFunctions.remember(tagS, s, x -> square(ComplexFunctions.gamma(x.negate()))
                    .multiply(ComplexFunctions.power(u, x)));
            Apcomplex b = ComplexFunctions.remember(tagT, t, x -> square(ComplexFunctions.gamma(x.negate()))
                    .multiply(ComplexFunctions.power(v, x)));
            return a.multiply(b).multiply(square(ComplexFunctions.gamma(one.add(s).add(t))));
        };
    }

    private static Apcomplex square(Apcomplex x) {
        return x.multiply(x);
    }

    static NumericResult viaMellinBarnes(Apcomplex z, int digits, IntegrationLimits limits) {
        Apfloat c = contour(digits);
        return MellinBarnes.integrate2(integrand(z, digits), c, c, digits, limits);
    }

    /** [2 Li2(z) - 2 Li2(zbar) + ln(z zbar) ln((1-z)/(1-zbar))] / (z - zbar), for Im z != 0. */
    public static NumericResult closedForm(Apcomplex z, int digits) {
        return SpecialFunctions.evaluate(p -> {
            Apcomplex zz = z.precision(p);
            Apcomplex zb = zz.conj();
            Apcomplex one = Apcomplex.ONE;
            Apcomplex two = new Apint(2);
            Apcomplex dilogs = two.multiply(ComplexFunctions.polylog(2, zz, p).subtract(ComplexFunctions.polylog(2, zb, p)));
            Apcomplex logs = ComplexFunctions.log(zz.multiply(zb), p)
                    .multiply(ComplexFunctions.log(one.subtract(zz).divide(one.subtract(zb)), p));
            return dilogs.add(logs).divide(zz.subtract(zb));
        }, digits);
    }
}
