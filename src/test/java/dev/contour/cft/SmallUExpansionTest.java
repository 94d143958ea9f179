package dev.contour.cft;

import dev.contour.algebra.Rational;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.*;

/** small_u and zseries through the language, against closed forms and position_value. */
class SmallUExpansionTest {
    /** The z, zbar terms of a series printed as JSON. */
    private static Map<List<Integer>, Rational> terms(String json) {
        Map<List<Integer>, Rational> out = new HashMap<>();
        Matcher m = Pattern.compile("\\{\"z\":(\\d+),\"zbar\":(\\d+),\"c\":\"([-0-9/]+)\"}").matcher(json);
        while (m.find()) {
            out.put(List.of(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2))), Rational.parse(m.group(3)));
        }
        return out;
    }

    @Test
    void boxFunctionLogCoefficientMatchesItsClosedForm() {
        // Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363 (physics reference section 5):
        // int ds dt/(2 pi i)^2 U^s V^t Gamma(-s)^2 Gamma(-t)^2 Gamma(1+s+t)^2
        //   = [2 Li2(z) - 2 Li2(zbar) + log(z zbar) log((1-z)/(1-zbar))]/(z - zbar),
        // so the coefficient of log U is log((1-z)/(1-zbar))/(z - zbar) = -sum_(n>=1) (1/n) sum_(i+j=n-1) z^i zbar^j.
        // position_value's normalisation has ds/2 dt/2: the integral is 4 times ours.
        int order = 12;
        String out = CftScripts.run("""
                vars s, t
                let m = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                let E = small_u(1, m, contour: {-1/3, -1/3}, through: 6, order: 12)
                show 4*0
                show zseries(E, log: 1, order: 12) as json
                """);
        Map<List<Integer>, Rational> got = terms(out);
        for (int n = 1; n <= order + 1; n++) {
            for (int i = 0; i <= n - 1; i++) {
                Rational expected = Rational.of(-1, n).divide(Rational.of(4));
                assertEquals(expected, got.getOrDefault(List.of(i, n - 1 - i), Rational.ZERO), "z^" + i + " zbar^" + (n - 1 - i));
            }
        }
        assertEquals(order * (order + 1) / 2 + order + 1, got.size());
    }

    @Test
    void boxFunctionLowerLogPowersAreReportedAsNotComputed() {
        String out = CftScripts.run("""
                vars s, t
                let m = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show small_u(1, m, contour: {-1/3, -1/3}, through: 1, order: 2)
                """);
        assertTrue(out.contains("U^0 log(U)  |  -1/4 - 1/8*w - 1/12*w^2 + O(w^3)"), out);
        assertTrue(out.contains("U^0  |  not computed: a pole of order 2 at s = 0"), out);
    }

    /** The coefficients of (1 - V)^n of the U^power log U term, from the JSON form of small_u. */
    private static List<Rational> series(String json, String power) {
        Matcher m = Pattern.compile("\\{\"U\":\"" + power + "\",\"log\":1,\"one_minus_V\":\\[([^]]*)]").matcher(json);
        assertTrue(m.find(), json);
        List<Rational> out = new ArrayList<>();
        for (String x : m.group(1).split(",")) {
            out.add(Rational.parse(x.replace("\"", "")));
        }
        return out;
    }

    private static Apfloat sum(List<Rational> w, Rational oneMinusV, long digits) {
        Rational acc = Rational.ZERO;
        Rational p = Rational.ONE;
        for (Rational c : w) {
            acc = acc.add(c.multiply(p));
            p = p.multiply(oneMinusV);
        }
        return new Apfloat(acc.numerator(), digits).divide(new Apfloat(acc.denominator(), digits));
    }

    @Test
    void logCoefficientAgreesWithPositionValue() {
        compareWithPositionValue(List.of("9/10"));
    }

    @Test
    @org.junit.jupiter.api.Tag("slow")
    void logCoefficientsAgreeWithPositionValueAtSeveralV() {
        compareWithPositionValue(List.of("11/10", "4/5", "3/4"));
    }

    private static void compareWithPositionValue(List<String> points) {
        // The U^(2+m) log U coefficient of the <2222> reduced integral is, by closing the s-contour on
        // the right (Gamma((4-s)/2)^2 = 4/(m!^2 e^2) (1 + O(e)) at s = 4 + 2m + e, U^(s/2) = U^(2+m)(1 + e/2 log U + ...),
        // minus the residue, the 1/2 of ds/2), -1/m!^2 times the one-variable integral
        // int dt/2/(2 pi i) V^(t/2 - 2) Gamma((4-t)/2)^2 Gamma((4+2m+t)/2)^2 Mred(4+2m, t), which position_value evaluates
        // numerically (apfloat, on Re t = 4/3). Our value: the exact (1 - V) series, summed to w^90.
        int m = 0;
        String json = CftScripts.run("""
                use "ads5s5.ctr"
                let Mred = 1/((s - 2)*(t - 2)*(utilde - 2)) at utilde = 4 - s - t
                show small_u(Mred, reduced_measure(2), contour: {4/3, 4/3}, through: 2, order: 90) as json
                """);
        List<Rational> w = series(json, "2");
        for (String v : points) {
            String out = CftScripts.run("""
                    vars s, t
                    let mt = mellin_measure(gamma: {{(4 - t)/2, 2}, {(4 + 2*M + t)/2, 2}}, kernel: {t/2 - 2, s/2})
                    show position_value(-1/(M!)^2 / ((4 + 2*M - 2)*(t - 2)*(2 - 4 - 2*M - t)), mt, U: VV, contour: {4/3}, digits: 15)
                    """.replace("VV", v).replace("M", String.valueOf(m)));
            String line = out.lines().filter(l -> l.startsWith("position_value")).findFirst().orElseThrow();
            java.util.regex.Matcher number = java.util.regex.Pattern.compile(" = (-?[0-9.]+(?:e-?[0-9]+)?) \\(").matcher(line);
            assertTrue(number.find(), "no value in: " + line);
            Apfloat numeric = new Apfloat(number.group(1), 20);
            Apfloat exact = sum(w, Rational.ONE.subtract(Rational.parse(v)), 40);
            Apfloat rel = ApfloatMath.abs(exact.subtract(numeric).divide(exact));
            assertTrue(rel.compareTo(new Apfloat("1e-14")) < 0, "V = " + v + ": exact " + exact + " numeric " + numeric);
        }
    }

    @Test
    void polesThatMoveWithTRightOfTheContourAreRefused() {
        String out;
        try {
            out = CftScripts.run("""
                    vars s, t
                    let m = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                    show small_u(1/(s + t - 1), m, contour: {-1/3, -1/3}, through: 2, order: 2)
                    """);
            fail("expected a refusal, got " + out);
        } catch (dev.contour.ContourException e) {
            assertTrue(e.getMessage().contains("moves with t and lies right of Re s = -1/3"), e.getMessage());
            assertNotNull(e.span());
            assertEquals(3, e.span().line());
        }
    }

    @Test
    void amplitudePolesOffTheGammaLatticeAreRefused() {
        try {
            CftScripts.run("""
                    vars s, t
                    let m = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                    show small_u(1/(t - 1/2), m, contour: {-1/3, -1/3}, through: 1, order: 2)
                    """);
            fail("expected a refusal");
        } catch (dev.contour.ContourException e) {
            assertTrue(e.getMessage().contains("not of Barnes form"), e.getMessage());
        }
    }
}
