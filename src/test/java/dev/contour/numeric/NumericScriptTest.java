package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.junit.jupiter.api.Tag;
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

    /** The box function of physics-reference section 5 with the measure written in the language. */
    private Apfloat box(int digits) {
        String out = run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show position_value(1, box, U: 0.13, V: 0.53, contour: {-1/3, -1/3}, digits: %d)
                """.formatted(digits));
        // U = z zbar = 0.13 and V = (1 - z)(1 - zbar) = 0.53 at z = 0.3 + 0.2i. position_value integrates with
        // ds/2 dt/2 (physics-reference section 2), the box function with ds dt (section 5): a factor 4.
        return printed(out, digits).multiply(new Apfloat(4));
    }

    @Test
    void boxFunctionToSixDigits() {
        // Closed form: Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363; value 5.1976430145400815451 at
        // z = 0.3 + 0.2i from physics-reference.md section 5.
        assertDigits(new Apfloat("5.1976430145400815451", 30), box(6), 6);
    }

    @Test
    @Tag("slow")
    void boxFunctionToFifteenDigits() {
        // Closed form: Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363; value 5.1976430145400815451 at
        // z = 0.3 + 0.2i from physics-reference.md section 5 (good to 16 digits, see MellinBarnesTest).
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
}
