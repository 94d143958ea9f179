package dev.contour.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.math.BigInteger;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.apfloat.Apint;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

class SpecialFunctionsTest {

    private static Apcomplex c(String re, String im) {
        return new Apcomplex(new Apfloat(re), new Apfloat(im));
    }

    /** The result claims at least {@code digits} and is within its claim of the reference. */
    private static void assertAccurate(Apcomplex reference, NumericResult r, int digits) {
        assertTrue(r.digits() >= digits, () -> "claims only " + r.digits() + " digits: " + r);
        double distance = r.log10RelativeDistance(reference);
        assertTrue(distance <= -r.digits() + 0.5,
                () -> "claims " + r.digits() + " digits but is 1e" + distance + " away from " + reference + ": " + r);
    }

    @Test
    void gammaOfOneHalfIsRootPi() {
        // NIST DLMF 5.4.6: Gamma(1/2) = sqrt(pi).
        NumericResult r = SpecialFunctions.gamma(new Apfloat("0.5"), 40);
        assertAccurate(ApfloatMath.sqrt(ApfloatMath.pi(60)), r, 40);
    }

    @Test
    void gammaOfIntegersIsFactorial() {
        // NIST DLMF 5.4.1: Gamma(n + 1) = n!.
        BigInteger factorial = BigInteger.ONE;
        for (int n = 0; n <= 30; n++) {
            if (n > 0) {
                factorial = factorial.multiply(BigInteger.valueOf(n));
            }
            NumericResult r = SpecialFunctions.gamma(new Apint(n + 1), 25);
            assertAccurate(new Apint(factorial), r, 25);
        }
    }

    @Test
    void reflectionFormulaAtAComplexPoint() {
        // NIST DLMF 5.5.3: Gamma(z) Gamma(1 - z) = pi / sin(pi z); sin from apfloat, independently of our Gamma.
        Apcomplex z = c("0.3", "0.7");
        NumericResult left = SpecialFunctions.evaluate(p -> {
            Apcomplex zz = z.precision(p);
            return ComplexFunctions.gamma(zz, p).multiply(ComplexFunctions.gamma(Apcomplex.ONE.subtract(zz), p));
        }, 30);
        Apfloat pi = ApfloatMath.pi(50);
        Apcomplex right = pi.divide(ApcomplexMath.sin(pi.multiply(z.precision(50))));
        assertAccurate(right, left, 30);
    }

    @Property(tries = 12)
    void gammaAgreesWithApfloat(@ForAll @DoubleRange(min = -30, max = 30) double re,
                                @ForAll @DoubleRange(min = -40, max = 40) double im) {
        // Cross-check of two algorithms: our shifted Stirling series against apfloat's gamma.
        Apcomplex z = new Apcomplex(new Apfloat(re, 20), new Apfloat(im, 20));
        if (Math.abs(im) < 1e-3 && re < 0.5 && Math.abs(re - Math.rint(re)) < 1e-3) {
            return; // too near a pole for a fixed-precision comparison
        }
        Apcomplex ours = ComplexFunctions.gamma(z.precision(25), 25);
        Apcomplex theirs = ApcomplexMath.gamma(z.precision(35));
        assertTrue(new NumericResult(ours, 0, Apfloat.ZERO).log10RelativeDistance(theirs) < -22,
                () -> "gamma(" + z + "): " + ours + " vs apfloat " + theirs);
    }

    @Property(tries = 25)
    void expLogAndLogGammaAgreeWithApfloat(@ForAll @DoubleRange(min = -50, max = 50) double re,
                                           @ForAll @DoubleRange(min = -60, max = 60) double im) {
        Apcomplex z = new Apcomplex(new Apfloat(re, 20), new Apfloat(im, 20));
        Apcomplex exact = z.precision(45);
        check("exp", ComplexFunctions.exp(z.precision(30), 30), ApcomplexMath.exp(exact), -27);
        if (z.isZero()) {
            assertThrows(ContourException.class, () -> ComplexFunctions.log(z, 30));
            return;
        }
        check("log", ComplexFunctions.log(z.precision(30), 30), ApcomplexMath.log(exact), -27);
        if (re > 0.5 || Math.abs(im) > 0.5) {
            // Same principal branch as apfloat's logGamma, including the imaginary part for Re z < 0.
            check("logGamma", ComplexFunctions.logGamma(z.precision(30), 30), ApcomplexMath.logGamma(exact), -26);
        }
    }

    private static void check(String what, Apcomplex ours, Apcomplex theirs, double log10Tolerance) {
        double d = new NumericResult(ours, 0, Apfloat.ZERO).log10RelativeDistance(theirs);
        assertTrue(d < log10Tolerance, () -> what + ": " + ours + " vs apfloat " + theirs + " (1e" + d + ")");
    }

    @Test
    void pochhammerIsAGammaRatio() {
        // Definition (a)_n = Gamma(a + n) / Gamma(a) (DLMF 5.2.5), checked against apfloat's Gamma.
        Apcomplex a = c("0.25", "-1.5");
        for (int n : new int[] {0, 5, -4}) {
            NumericResult r = SpecialFunctions.pochhammer(a, n, 30);
            Apcomplex aa = a.precision(40);
            Apcomplex ratio = ApcomplexMath.gamma(aa.add(new Apint(n))).divide(ApcomplexMath.gamma(aa));
            assertAccurate(ratio, r, 30);
        }
        NumericResult general = SpecialFunctions.pochhammer(a, c("0.5", "0.5"), 25);
        Apcomplex aa = a.precision(35);
        assertAccurate(ApcomplexMath.gamma(aa.add(c("0.5", "0.5").precision(35))).divide(ApcomplexMath.gamma(aa)), general, 25);
        assertThrows(ContourException.class, () -> SpecialFunctions.pochhammer(new Apint(2), -3, 20));
    }

    @Test
    void dilogarithmSpecialValues() {
        Apfloat pi = ApfloatMath.pi(60);
        Apfloat ln2 = ApfloatMath.log(new Apfloat(2, 60));
        // NIST DLMF 25.12.6, the reflection formula, at z = 1/2 (equation number from memory):
        // Li2(1/2) = pi^2/12 - (ln 2)^2 / 2.
        Apfloat half = pi.multiply(pi).divide(new Apint(12)).subtract(ln2.multiply(ln2).divide(new Apint(2)));
        assertAccurate(half, SpecialFunctions.dilog(new Apfloat("0.5"), 30), 30);
        // Li2(1) = zeta(2) = pi^2/6 (NIST DLMF 25.12(i) and 25.6.1).
        assertAccurate(pi.multiply(pi).divide(new Apint(6)), SpecialFunctions.dilog(Apcomplex.ONE, 30), 30);
        // Li2(-1) = -pi^2/12 (NIST DLMF 25.12(i); from memory).
        assertAccurate(pi.multiply(pi).divide(new Apint(-12)), SpecialFunctions.dilog(new Apint(-1), 30), 30);
    }

    @Test
    void dilogarithmMatchesItsSeriesInsideTheDisc() {
        // Li2(z) = sum z^k / k^2 (DLMF 25.12.1, from memory), summed here independently of apfloat's polylog.
        Apcomplex z = c("0.3", "0.35");
        Apcomplex zz = z.precision(50);
        Apcomplex power = Apcomplex.ONE;
        Apcomplex sum = Apcomplex.ZERO;
        for (int k = 1; k < 400; k++) {
            power = power.multiply(zz);
            sum = sum.add(power.divide(new Apint((long) k * k)));
        }
        assertAccurate(sum, SpecialFunctions.dilog(z, 30), 30);
    }

    @Test
    void dilogarithmInversionFormulaOutsideTheDisc() {
        // Li2(z) + Li2(1/z) = -pi^2/6 - ln^2(-z)/2 for z not in (0, 1] (DLMF 25.12.4, from memory);
        // it checks the continuation and branch of |z| > 1 against |z| < 1.
        Apcomplex z = c("2", "1");
        NumericResult lhs = SpecialFunctions.evaluate(p -> {
            Apcomplex zz = z.precision(p);
            return ComplexFunctions.polylog(2, zz, p).add(ComplexFunctions.polylog(2, Apcomplex.ONE.divide(zz), p));
        }, 25);
        Apfloat pi = ApfloatMath.pi(45);
        Apcomplex l = ApcomplexMath.log(z.precision(45).negate());
        Apcomplex rhs = pi.multiply(pi).divide(new Apint(-6)).subtract(l.multiply(l).divide(new Apint(2)));
        assertAccurate(rhs, lhs, 25);
    }

    @Test
    @Tag("slow") // apfloat's polylog takes seconds per value
    void ourDilogarithmAgreesWithApfloatsPolylog() {
        // Cross-check of two algorithms: our Bernoulli-series dilogarithm against apfloat's general polylog.
        for (Apcomplex z : new Apcomplex[] {c("0.9", "0.4"), c("-1.5", "-2")}) {
            Apcomplex theirs = ApcomplexMath.polylog(new Apint(2), z.precision(30));
            assertAccurate(theirs, SpecialFunctions.dilog(z, 22), 22);
        }
    }

    @Test
    void polylogarithmOfOrderOne() {
        // Li_1(z) = -ln(1 - z) (DLMF 25.12.10 with s = 1; from memory), against apfloat's logarithm.
        Apcomplex z = c("0.25", "0.5");
        Apcomplex expected = ApcomplexMath.log(Apcomplex.ONE.subtract(z.precision(40))).negate();
        assertAccurate(expected, SpecialFunctions.polylog(1, z, 20), 20);
    }

    @Test
    void polesAndSingularitiesAreContourErrors() {
        ContourException e = assertThrows(ContourException.class, () -> SpecialFunctions.gamma(new Apint(-3), 20));
        assertTrue(e.getMessage().contains("pole"), e.getMessage());
        assertThrows(ContourException.class, () -> SpecialFunctions.gamma(Apcomplex.ZERO, 20));
        assertThrows(ContourException.class, () -> SpecialFunctions.log(Apcomplex.ZERO, 20));
        assertThrows(ContourException.class, () -> SpecialFunctions.polylog(1, Apcomplex.ONE, 20));
        assertThrows(ContourException.class, () -> ComplexFunctions.gamma(new Apint(3)));
    }

    @Test
    void nearAPoleTheDigitsAreStillHonest() {
        // Gamma(-2 + 1e-12): ill-conditioned (the argument's distance to the pole), yet exact as input.
        Apcomplex z = new Apfloat("-1.999999999999");
        NumericResult r = SpecialFunctions.gamma(z, 20);
        Apcomplex reference = ApcomplexMath.gamma(z.precision(60));
        assertAccurate(reference, r, 20);
        assertEquals(20, Math.min(20, r.digits()));
    }
}
