package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/** value, complex and position_value driven through the language. */
class NumericScriptTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private String run(String script) {
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        new Interpreter(InterpreterOptions.to(out)).run(script, "test.ctr");
        return bytes.toString(StandardCharsets.UTF_8);
    }

    /** The number printed after "= " on the last line, and its claimed digits. */
    private static Apfloat printed(String output, int digits) {
        String line = output.strip().lines().reduce((a, b) -> b).orElseThrow();
        String tail = line.substring(line.lastIndexOf(" = ") + 3);
        assertTrue(tail.contains("(" + digits + " digits"), line);
        return new Apfloat(tail.substring(0, tail.indexOf(' ')), digits + 5);
    }

    private static void assertDigits(Apfloat expected, Apfloat actual, int digits) {
        Apfloat rel = ApfloatMath.abs(actual.subtract(expected).divide(expected));
        assertTrue(rel.compareTo(new Apfloat("1e-" + (digits - 1))) < 0, () -> actual + " vs " + expected);
    }

    @Test
    void gammaOfOneHalfSquaredIsPiToThirtyDigits() {
        // Gamma(1/2) = sqrt(pi): NIST DLMF 5.4.6.
        String out = run("show value(Gamma(1/2)^2, digits: 30)");
        assertDigits(ApfloatMath.pi(40), printed(out, 30), 30);
    }

    @Test
    void gammaOfOneThirdPrintsItsDigits() {
        // Compared with apfloat's own Gamma (an independent implementation) rather than a published table.
        String out = run("show value(Gamma(1/3), digits: 30)");
        Apfloat expected = org.apfloat.ApfloatMath.gamma(new Apfloat(1, 45).divide(new Apfloat(3, 45)));
        assertDigits(expected, printed(out, 30), 30);
        assertTrue(out.startsWith("value(Gamma(1/3), digits: 30) = 2.678938534707747633655692940"), out);
    }

    @Test
    void expressionsInVariablesAtAComplexPoint() {
        // z Gamma(z) = Gamma(z + 1) (DLMF 5.5.1); at z = 1 + i both sides through the language.
        String a = run("vars z\nshow value(z*Gamma(z) + poch(z, 2) - binom(z + 1, 2), digits: 20, point: {z, complex(1, 1)})");
        bytes.reset();
        String b = run("vars z\nshow value(Gamma(z + 1) + z*(z + 1) - (z + 1)*z/2, digits: 20, point: {z, complex(1, 1)})");
        assertEquals(a.substring(a.indexOf(" = ")), b.substring(b.indexOf(" = ")));
        assertTrue(a.contains(" i (20 digits)"), a);
        bytes.reset();
        // Real points go through the existing substitution: Gamma(x)*Gamma(1 - x) = pi/sin(pi x) (NIST DLMF 5.5.3), pi*sqrt(2) at x = 1/4.
        String c = run("vars x\nshow value((Gamma(x)*Gamma(1 - x)) at x = 1/4, digits: 25)");
        Apfloat pi = ApfloatMath.pi(40);
        assertDigits(pi.multiply(ApfloatMath.sqrt(new Apfloat(2, 40))), printed(c, 25), 25);
    }

    @Test
    void oneVariableIntegralIsABinomial() {
        // (1/2 pi i) int Gamma(-s) Gamma(a + s) x^s ds = Gamma(a) (1 + x)^(-a), -a < Re s < 0 (DLMF 5.13.1 family,
        // common practice); with the ds/2 normalisation and a = 1, x = 1/4 the value is (1/2)(4/5) = 2/5.
        String out = run("""
                vars s, t
                let m = mellin_measure(gamma: {-s, 1 + s}, kernel: {s, t})
                show position_value(1, m, U: 1/4, contour: {-1/2}, digits: 10)
                """);
        assertDigits(new Apfloat("0.4", 30), printed(out, 10), 10);
        assertTrue(out.contains("error <= "), out);
    }

    /** The box function of docs/conventions.md, "The box function" with the measure written in the language. */
    @Test
    void checkComparesNumbersToTheirStatedPrecision() {
        // Li2(1) = pi^2/6 (DLMF section 25.12) and Gamma(1/2) = sqrt(pi) (DLMF section 5.4); from memory.
        String out = run("""
                check value(polylog(2, 1), digits: 20) == value(Gamma(1/2)^4/6, digits: 20)
                check value(polylog(2, 1), digits: 10) == value(Gamma(1/2)^4/6 + 1/10^15, digits: 10)
                check value(Gamma(3), digits: 10) == 2
                check value(polylog(2, 1), digits: 20) == value(Gamma(1/2)^4/6 + 1/10^15, digits: 20)
                """);
        List<String> lines = out.lines().toList();
        assertEquals("check value(polylog(2, 1), digits: 20) == value(Gamma(1/2)^4/6, digits: 20)  ok", lines.get(0));
        // 10^-15 apart: equal to 10 digits, different to 20
        assertTrue(lines.get(1).endsWith("  ok"), out);
        assertTrue(lines.get(2).endsWith("  ok"), out);
        assertTrue(lines.get(3).endsWith("  FAILED (line 4)"), out);
        assertTrue(lines.get(4).contains("1.6449340668482264365 (20 digits)"), out);
    }

    /** {@code a}, {@code a + b i} or {@code a - b i} as printed. */
    private static org.apfloat.Apcomplex parseComplex(String text, int digits) {
        String t = text.strip();
        if (!t.endsWith(" i")) {
            return new Apfloat(t, digits + 5);
        }
        int sep = Math.max(t.lastIndexOf(" + "), t.lastIndexOf(" - "));
        Apfloat re = new Apfloat(t.substring(0, sep), digits + 5);
        Apfloat im = new Apfloat(t.substring(sep + 3, t.length() - 2), digits + 5);
        return new org.apfloat.Apcomplex(re, t.charAt(sep + 1) == '-' ? im.negate() : im);
    }

    private Apfloat box(int digits) {
        String out = run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, U: 0.13, V: 0.53, contour: {-1/3, -1/3}, digits: %d)
                """.formatted(digits));
        // U = z zbar = 0.13 and V = (1 - z)(1 - zbar) = 0.53 at z = 0.3 + 0.2i. position_value integrates with
        // ds/2 dt/2 (docs/conventions.md, "Mellin representation and normalisation"), the box function with ds dt (section 5): a factor 4.
        return printed(out, digits).multiply(new Apfloat(4));
    }

    @Test
    void boxFunctionToSixDigits() {
        // Closed form: Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363; value 5.1976430145400815451 at
        // z = 0.3 + 0.2i from docs/conventions.md, "The box function".
        assertDigits(new Apfloat("5.1976430145400815451", 30), box(6), 6);
    }

    @Test
    void boxFunctionToFifteenDigits() {
        // Closed form: Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363; value 5.1976430145400815451 at
        // z = 0.3 + 0.2i from docs/conventions.md, "The box function" (good to 16 digits, see MellinBarnesTest).
        assertDigits(new Apfloat("5.1976430145400815451", 30), box(15), 15);
    }

    @Test
    void aContourThroughAPoleIsALocatedError() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let m = mellin_measure(gamma: {-s, 1 + s}, kernel: {s, t})
                show position_value(1, m, U: 1/4, contour: {0}, digits: 10)
                """));
        assertTrue(e.getMessage().contains("pole"), e.getMessage());
        assertNotNull(e.span());
        assertTrue(e.getMessage().contains("test.ctr:3:6") || e.span().toString().contains("3"), e.getMessage() + " " + e.span());
    }

    @Test
    void mistakesAreLocated() {
        ContourException e = assertThrows(ContourException.class, () -> run("vars q\nshow value(Gamma(q), digits: 10)"));
        assertTrue(e.getMessage().contains("no value given for the variable q"), e.getMessage());
        assertNotNull(e.span());
        ContourException d = assertThrows(ContourException.class, () -> run("show value(Gamma(1/3))"));
        assertTrue(d.getMessage().contains("digits"), d.getMessage());
    }

    // ------------------------------------------------------------------ the generic integrand's speed

    @Test
    void theBoxScriptIsFastThroughTheGenericMeasureIntegrand() {
        // Before the measure integrand was compiled (Gamma factors remembered per grid line and diagonal) this took
        // well over a minute; the bound leaves a wide margin on a shared machine. Closed form: Usyukina and
        // Davydychev, Phys. Lett. B 298 (1993) 363; value 5.1976430145400815451 from docs/conventions.md, "The box function".
        String out = run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, U: 0.13, V: 0.53, contour: {-1/3, -1/3}, digits: 8, within: 40)
                """);
        assertDigits(new Apfloat("5.1976430145400815451", 30), printed(out, 8).multiply(new Apfloat(4)), 8);
    }

    @Test
    void mixedGammaArgumentsWithFractionalCoefficients() {
        // Barnes' first lemma (NIST DLMF 5.13.3) with s -> s/2 in one variable: int ds/2/(2 pi i) of
        // Gamma(a + s/2) Gamma(b + s/2) Gamma(c - s/2) Gamma(d - s/2) equals the lemma's right side (ds/2 = d(s/2)).
        // a = 1/3, b = 1/2, c = 1/4, d = 1: Gamma(7/12) Gamma(4/3) Gamma(3/4) Gamma(3/2) / Gamma(25/12).
        String out = run("""
                vars s, t
                let m = mellin_measure(gamma: {1/3 + s/2, 1/2 + s/2, 1/4 - s/2, 1 - s/2}, kernel: {s, t})
                show position_value(1, m, U: 1, contour: {-1/4}, digits: 12)
                """);
        bytes.reset();
        String rhs = run("show value(Gamma(7/12)*Gamma(4/3)*Gamma(3/4)*Gamma(3/2)/Gamma(25/12), digits: 12)");
        assertDigits(printed(rhs, 12), printed(out, 12), 12);
    }

    // ------------------------------------------------------------------------------- polylogarithms

    @Test
    void polylogarithmSpecialValuesThroughTheLanguage() {
        Apfloat pi = ApfloatMath.pi(40);
        Apfloat ln2 = ApfloatMath.log(new Apfloat(2, 40));
        // Li2(1/2) = pi^2/12 - (ln 2)^2/2: the reflection formula NIST DLMF 25.12.6 at z = 1/2 (equation number from memory).
        String half = run("show value(polylog(2, 1/2), digits: 20)");
        assertDigits(pi.multiply(pi).divide(new Apfloat(12)).subtract(ln2.multiply(ln2).divide(new Apfloat(2))), printed(half, 20), 20);
        bytes.reset();
        // Li2(1) = zeta(2) = pi^2/6 (NIST DLMF 25.12.3 and 25.6.1; equation numbers from memory).
        String one = run("show value(polylog(2, 1), digits: 20)");
        assertDigits(pi.multiply(pi).divide(new Apfloat(6)), printed(one, 20), 20);
        bytes.reset();
        // Li1(x) = -ln(1 - x) (NIST DLMF 25.12.2 with n = 1, from memory): Li1(1/2) = ln 2.
        String li1 = run("show value(polylog(1, 1/2), digits: 20)");
        assertDigits(ln2, printed(li1, 20), 20);
    }

    @Test
    void polylogarithmAtAComplexPointMatchesItsSeries() {
        // Li2(z) = sum_k z^k/k^2 for |z| < 1 (NIST DLMF 25.12.1, from memory), summed here independently.
        String out = run("vars z\nshow value(polylog(2, z), digits: 20, point: {z, complex(3/10, 2/5)})");
        String line = out.strip();
        String tail = line.substring(line.lastIndexOf(" = ") + 3);
        assertTrue(tail.endsWith("(20 digits)"), line);
        org.apfloat.Apcomplex printed = parseComplex(tail.substring(0, tail.indexOf(" (")), 20);
        org.apfloat.Apcomplex z = new org.apfloat.Apcomplex(new Apfloat("0.3", 50), new Apfloat("0.4", 50));
        org.apfloat.Apcomplex power = org.apfloat.Apcomplex.ONE;
        org.apfloat.Apcomplex sum = org.apfloat.Apcomplex.ZERO;
        for (int k = 1; k < 200; k++) {
            power = power.multiply(z);
            sum = sum.add(power.divide(new Apfloat((long) k * k, 50)));
        }
        Apfloat rel = org.apfloat.ApcomplexMath.abs(printed.subtract(sum)).divide(org.apfloat.ApcomplexMath.abs(sum));
        org.apfloat.Apcomplex series = sum;
        assertTrue(rel.compareTo(new Apfloat("1e-19")) < 0, () -> printed + " vs " + series);
        bytes.reset();
        // Exactness first: without value it stays a term.
        assertEquals("polylog(2, 1/2)", run("show polylog(2, 1/2)").strip());
        ContourException e = assertThrows(ContourException.class, () -> run("show value(polylog(1/2, 1/3), digits: 5)"));
        assertNotNull(e.span(), e.getMessage());
    }

    // --------------------------------------------------------------------------------- chosen contours

    @Test
    void withoutAContourASeparatingOneIsChosenAndNamed() {
        String one = run("""
                vars s, t
                let m = mellin_measure(gamma: {-s, 1 + s}, kernel: {s, t})
                show position_value(1, m, U: 1/4, digits: 10)
                """);
        // Same value as with contour: {-1/2} above: Gamma(1) (1 + 1/4)^-1 / 2 = 2/5.
        assertDigits(new Apfloat("0.4", 30), printed(one, 10), 10);
        assertTrue(one.contains("contour {-1/2} chosen"), one);
        bytes.reset();
        String box = run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, U: 0.13, V: 0.53, digits: 6)
                """);
        assertTrue(box.contains("contour {-1/3, -1/3} chosen"), box);
        // Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363; docs/conventions.md, "The box function".
        assertDigits(new Apfloat("5.1976430145400815451", 30), printed(box, 6).multiply(new Apfloat(4)), 6);
    }

    @Test
    void noSeparatingStraightContourIsALocatedError() {
        // Gamma(s) Gamma(-s): the poles at s = 0 belong to both sides; no straight line separates them.
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let m = mellin_measure(gamma: {s, -s}, kernel: {s, t})
                show position_value(1, m, U: 1/4, digits: 10)
                """));
        assertTrue(e.getMessage().contains("no straight contour separates the poles"), e.getMessage());
        assertNotNull(e.span());
        assertEquals(3, e.span().line(), e.span().toString());
    }

    // ----------------------------------------------------------------------------------- z and zbar

    @Test
    void theBoxAtZAndZbar() {
        // z = 0.3 + 0.2i: U = z zbar = 0.13, V = (1 - z)(1 - zbar) = 0.53; closed form Usyukina and Davydychev,
        // Phys. Lett. B 298 (1993) 363 (docs/conventions.md, "The box function").
        String out = run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, z: complex(3/10, 1/5), zbar: complex(3/10, -1/5), contour: {-1/3, -1/3}, digits: 6)
                """);
        assertDigits(new Apfloat("5.1976430145400815451", 30), printed(out, 6).multiply(new Apfloat(4)), 6);
        ContourException both = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, z: 1/3, zbar: 1/4, U: 1/12, digits: 6)
                """));
        assertTrue(both.getMessage().contains("either as U:, V: or as z:, zbar:"), both.getMessage());
        assertNotNull(both.span());
        assertEquals(3, both.span().line());
    }

    // -------------------------------------------------------------------------------------- within

    @Test
    void aTimeLimitFromTheScriptNamesTheDigitsReached() {
        long t0 = System.nanoTime();
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, U: 0.13, V: 0.53, contour: {-1/3, -1/3}, digits: 40, within: 3/2)
                """));
        double seconds = (System.nanoTime() - t0) / 1e9;
        assertTrue(e.getMessage().contains("40 digits not reached within the time limit of 1.5 s"), e.getMessage());
        assertTrue(e.getMessage().matches("(?s).*reached (about )?\\d+ digits.*|.*0 digits reached.*"), e.getMessage());
        assertNotNull(e.span());
        assertTrue(seconds < 20, "stopped after " + seconds + " s");
        ContourException bad = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let m = mellin_measure(gamma: {-s, 1 + s}, kernel: {s, t})
                show position_value(1, m, U: 1/4, digits: 10, within: -1)
                """));
        assertTrue(bad.getMessage().contains("within is a positive number of seconds"), bad.getMessage());
    }

    // ---------------------------------------------------------------------------------- arithmetic

    @Test
    void numbersCombineWithNumbersCarryingTheSmallerPrecision() {
        // Gamma(1/3) + 1 against apfloat's own Gamma (an independent implementation).
        Apfloat g = ApfloatMath.gamma(new Apfloat(1, 45).divide(new Apfloat(3, 45)));
        String sum = run("show value(Gamma(1/3), digits: 20) + 1");
        assertDigits(g.add(Apfloat.ONE), printed(sum, 20), 20);
        bytes.reset();
        // The smaller precision: 20 digits times 10 digits is 10 digits; Gamma(1/2)^2 = pi (NIST DLMF 5.4.6).
        String product = run("show value(Gamma(1/3), digits: 20)*value(Gamma(1/2), digits: 10)^2/2");
        Apfloat pi = ApfloatMath.pi(40);
        assertDigits(g.multiply(pi).divide(new Apfloat(2)), printed(product, 10), 10);
        bytes.reset();
        // Cancellation costs digits: Gamma(1/3) - 2.6789385 leaves the digits its error bound allows. The
        // number keeps the guard digits it computed (its bound is the computed one, about 1e-25), so that is
        // more than 20 - 7, never more than 20, and every claimed digit is right.
        String diff = run("show value(Gamma(1/3), digits: 20) - 26789385/10000000");
        String line = diff.strip();
        int claimed = Integer.parseInt(line.substring(line.lastIndexOf('(') + 1, line.lastIndexOf(" digits")));
        assertTrue(claimed >= 12 && claimed <= 20, line);
        assertDigits(g.subtract(new Apfloat("2.6789385", 45)), printed(diff, claimed), claimed);
        bytes.reset();
        // An integral scaled by a number: 2 * (2/5) from the one-variable binomial integral above.
        String twice = run("""
                vars s, t
                let m = mellin_measure(gamma: {-s, 1 + s}, kernel: {s, t})
                show 2*position_value(1, m, U: 1/4, contour: {-1/2}, digits: 10)
                """);
        assertDigits(new Apfloat("0.8", 30), printed(twice, 10), 10);
        assertTrue(twice.contains("error <= "), twice);
        bytes.reset();
        ContourException e = assertThrows(ContourException.class, () -> run("vars x\nshow value(Gamma(1/3), digits: 5)*x"));
        assertNotNull(e.span());
        ContourException p = assertThrows(ContourException.class, () -> run("show value(Gamma(1/3), digits: 5)^(1/2)"));
        assertTrue(p.getMessage().contains("integer"), p.getMessage());
    }
}
