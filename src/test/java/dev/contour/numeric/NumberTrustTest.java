package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Numbers say what they know: contours that respect the amplitude's poles, printed digits within
 * the printed error, and check between numbers within their combined stated errors.
 */
class NumberTrustTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private RunResult run(String script) {
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        return new Interpreter(InterpreterOptions.to(out)).run(script, "test.ctr");
    }

    private String output() {
        return bytes.toString(StandardCharsets.UTF_8);
    }

    /** The printed number after ") = " (the end of the shown call) on the last line. */
    static Apfloat printedValue(String output) {
        String line = output.strip().lines().reduce((a, b) -> b).orElseThrow();
        String tail = line.substring(line.indexOf(") = ") + 4);
        return new Apfloat(tail.substring(0, tail.indexOf(' ')), 60);
    }

    /** The printed error bound ("error <= 2.1e-15") on the last line. */
    static Apfloat printedError(String output) {
        String line = output.strip().lines().reduce((a, b) -> b).orElseThrow();
        int at = line.indexOf("error <= ");
        assertTrue(at >= 0, line);
        String e = line.substring(at + 9).split("[,)]")[0];
        return new Apfloat(e, 10);
    }

    // ------------------------------------------------------------------- item 3: digits earned

    @Test
    void theBoxFunctionsPrintedDigitsAreWithinThePrintedError() {
        // Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363: at z = 7/10 + 2i/5 the closed form is
        // 4.1060377860386880679... (evaluated with apfloat's own dilogarithm in the property test
        // NumberTrustProperties; the digits here are from that closed form).
        run("""
                vars s, t
                let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show 4*position_value(1, box, z: complex(7/10, 2/5), zbar: complex(7/10, -2/5), digits: 15)
                """);
        Apfloat reference = new Apfloat("4.1060377860386880679", 60);
        Apfloat printed = printedValue(output());
        Apfloat error = printedError(output());
        assertTrue(ApfloatMath.abs(printed.subtract(reference)).compareTo(error) <= 0, output());
        assertTrue(output().contains("(15 digits") || output().contains("(14 digits"), output());
    }

    @Test
    void printedDigitsAreRoundedNotCut() {
        // Gamma(1/3) = 2.678938534707747633655692940974677644128... (apfloat's Gamma, an independent implementation):
        // to 12 digits that is 2.67893853471, not the cut 2.67893853470.
        run("show value(Gamma(1/3), digits: 12)");
        assertTrue(output().contains("= 2.67893853471 (12 digits)"), output());
        bytes.reset();
        // 4 * 2.678938534707747633... = 10.715754138830990...: fifteen digits end in a printed zero.
        run("show 4*value(Gamma(1/3), digits: 15)");
        assertTrue(output().contains("= 10.7157541388310 (15 digits)"), output());
    }

    // ------------------------------------------------------------ item 4: check within the error

    @Test
    void numbersOfDifferentPrecisionsAgreeWithinTheirErrors() {
        RunResult r = run("""
                check value(Gamma(1/3), digits: 30) == value(Gamma(1/3), digits: 15)
                check value(Gamma(1/3), digits: 15) == value(Gamma(1/3), digits: 30)
                check value(Gamma(1/3), digits: 30) == 2.678938534707747633655692940974677644128
                check value(Gamma(1/3), digits: 30) == 2.67893853470774763365569294097
                check 2.6789385347077476 == value(Gamma(1/3), digits: 16)
                """);
        assertEquals(5, r.checksPassed(), output());
        assertEquals(0, r.checksFailed(), output());
    }

    @Test
    void numbersDifferingBeyondTheirErrorsDoNotAgree() {
        RunResult r = run("""
                check value(Gamma(1/3), digits: 30) == value(Gamma(1/3), digits: 15) + 1/10^13
                check value(Gamma(1/3), digits: 30) == 2.67893853470774763365569294098
                check value(Gamma(1/3), digits: 15) == 2.678938534707757
                check value(Gamma(1/3), digits: 15) == value(Gamma(1/4), digits: 15)
                """);
        assertEquals(0, r.checksPassed(), output());
        assertEquals(4, r.checksFailed(), output());
    }

    // ------------------------------------------------------------------ item 2: contour choice

    @Test
    void theChosenContourKeepsTheAmplitudesPoleWithTheMeasures() {
        // int ds/2 /(2 pi i) U^(s/2) Gamma(3 - s/2)/(s - 2) with the pole s = 2 on the side of Gamma's poles
        // (right): closing to the right, -U/2 + U (1 - e^-U (1 + U))/2 (residues, common practice).
        // Choosing from the measure alone put the contour at Re s = 5, which leaves out -U/2.
        run("""
                vars s, t
                let m = mellin_measure(gamma: {3 - s/2}, kernel: {s/2, t})
                show position_value(1/(s - 2), m, U: 1/4, digits: 10)
                """);
        Apfloat u = new Apfloat("0.25", 40);
        Apfloat expected = u.negate().divide(new Apfloat(2)).add(u.multiply(Apfloat.ONE
                .subtract(ApfloatMath.exp(u.negate()).multiply(Apfloat.ONE.add(u)))).divide(new Apfloat(2)));
        Apfloat printed = printedValue(output());
        assertTrue(ApfloatMath.abs(printed.subtract(expected)).compareTo(new Apfloat("1e-10")) < 0, output() + " vs " + expected);
        assertTrue(output().contains("contour {1} chosen; amplitude poles: s = 2 right of Re s = 1"), output());
    }

    @Test
    void anExplicitContourSaysWhereThePolesLie() {
        run("""
                vars s, t
                let m = mellin_measure(gamma: {3 - s/2}, kernel: {s/2, t})
                show position_value(1/(s - 2), m, U: 1/4, contour: {5}, digits: 6)
                """);
        assertTrue(output().contains("amplitude poles: s = 2 left of Re s = 5"), output());
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let m = mellin_measure(gamma: {3 - s/2}, kernel: {s/2, t})
                show position_value(1/(s - 2), m, U: 1/4, contour: {2}, digits: 6)
                """));
        assertTrue(e.getMessage().contains("passes through the amplitude's pole at s = 2"), e.getMessage());
        assertEquals(3, e.span().line());
    }

    @Test
    void aPoleWithoutARuleIsRefusedByName() {
        ContourException both = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let b = mellin_measure(gamma: {-s, 1 + s}, kernel: {s, t})
                show position_value(1/(s - 1/2), b, U: 1/4, digits: 6)
                """));
        assertTrue(both.getMessage().contains("the amplitude's pole at s = 1/2 lies along Gamma(-s) and Gamma(s + 1)"), both.getMessage());
        assertEquals(3, both.span().line());
        ContourException none = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let m = mellin_measure(gamma: {{-s, 2}, {-t, 2}}, kernel: {s, t})
                show position_value(1/(s - t - 1/2), m, U: 1/4, V: 1/2, digits: 6)
                """));
        assertTrue(none.getMessage().contains("lies along no Gamma factor of the measure"), none.getMessage());
    }

    @Test
    @Tag("slow")
    void theReducedP3TermGetsAContourLeftOfItsPoles() {
        // The reduced p = 3 term of the issue: its poles s = 2, t = 4, utilde = 4 lie with the measure's
        // (Gamma((6 - s)/2)^2 ... at s, t, utilde >= 6), so the contour passes left of all three.
        run("""
                use "ads5s5.ctr"
                show position_value(1/((s - 2)*(t - 4)*(utilde - 4)), reduced_measure(3), U: 1/4, V: 1/2, digits: 4)
                """);
        assertTrue(output().contains("contour {4/3, 10/3} chosen"), output());
        assertTrue(output().contains("s = 2 right of Re s = 4/3"), output());
        assertTrue(output().contains("utilde = 4 right of Re utilde = 10/3"), output());
    }
}
