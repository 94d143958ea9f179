package dev.contour.numeric;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.util.Map;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apint;
import org.junit.jupiter.api.Test;

class PointEvaluationTest {
    private static final Polynomial S = Polynomial.variable("s");
    private static final Polynomial T = Polynomial.variable("t");

    private static Apcomplex c(String re, String im) {
        return new Apcomplex(new Apfloat(re), new Apfloat(im));
    }

    private static void assertAccurate(Apcomplex reference, NumericResult r, int digits) {
        assertTrue(r.digits() >= digits, () -> "claims only " + r.digits() + " digits: " + r);
        double distance = r.log10RelativeDistance(reference);
        assertTrue(distance <= -r.digits() + 0.5, () -> "1e" + distance + " from " + reference + ": " + r);
    }

    @Property(tries = 20)
    void expandedProductEqualsTheProductOfItsFactors(@ForAll @IntRange(min = -9, max = 9) int a,
                                                     @ForAll @IntRange(min = 1, max = 9) int b,
                                                     @ForAll @IntRange(min = 0, max = 6) int n) {
        // Planted: (b s - a)^n (t + 1/b) expanded by the algebra, evaluated term by term, against the
        // factors evaluated directly.
        Polynomial linear = S.multiply(Rational.of(b)).subtract(Polynomial.constant(a));
        Polynomial p = linear.pow(n).multiply(T.add(Polynomial.constant(Rational.of(1, b))));
        Apcomplex s = c("0.37", "-1.25");
        Apcomplex t = c("-2.5", "0.125");
        Apcomplex direct = ApcomplexMath.pow(s.precision(60).multiply(new Apint(b)).subtract(new Apint(a)), n)
                .multiply(t.precision(60).add(new Apfloat(1, 60).divide(new Apint(b))));
        if (direct.isZero()) {
            return;
        }
        assertAccurate(direct, PointEvaluation.polynomial(p, Map.of("s", s, "t", t), 30), 30);
    }

    @Test
    void cancellationIsCaughtAndOvercome() {
        // (s - 1)^12 expanded has terms near 10^3 but the value 1e-36 at s = 1.001.
        Polynomial p = S.subtract(Polynomial.ONE).pow(12);
        NumericResult r = PointEvaluation.polynomial(p, Map.of("s", new Apfloat("1.001")), 20);
        assertAccurate(new Apfloat("1e-36"), r, 20);
    }

    @Test
    void rationalFunctionsAndTheirPoles() {
        // (s^2 - 4) / ((s - 2)(t + 1)) is (s + 2)/(t + 1) in canonical form: s = 2 is not a pole.
        RationalFunction f = RationalFunction.of(S.pow(2).subtract(Polynomial.constant(4)),
                S.subtract(Polynomial.constant(2)).multiply(T.add(Polynomial.ONE)));
        NumericResult r = PointEvaluation.rationalFunction(f, Map.of("s", new Apint(2), "t", c("0.5", "1")), 25);
        Apcomplex expected = new Apfloat(4, 40).divide(c("1.5", "1").precision(40));
        assertAccurate(expected, r, 25);
        ContourException e = assertThrows(ContourException.class,
                () -> PointEvaluation.rationalFunction(f, Map.of("s", Apcomplex.ONE, "t", new Apint(-1)), 20));
        assertTrue(e.getMessage().contains("pole"), e.getMessage());
        assertThrows(ContourException.class, () -> PointEvaluation.rationalFunction(f, Map.of("s", Apcomplex.ONE), 20));
    }
}
