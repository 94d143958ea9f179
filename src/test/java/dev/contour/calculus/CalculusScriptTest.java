package dev.contour.calculus;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.*;

/** derivative, euler_derivative, remainder, degree and coefficient(..., of:) through the language. */
class CalculusScriptTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private RunResult run(String script) {
        bytes.reset();
        return new Interpreter(InterpreterOptions.to(new PrintStream(bytes, true, StandardCharsets.UTF_8))).run(script, "test.ctr");
    }

    @Test
    void theChainRuleOfTheCrossRatiosComesOutOfThePrimitives() {
        // U = chi chi', V = (1 - chi)(1 - chi'): chi dU/dchi = U and chi dV/dchi = -chi/(1 - chi) V
        // (physics-reference section 6; arXiv:1712.02800), and alpha d/dalpha of tau = (alpha - 1)(alpha' - 1)
        // at alpha = 1/chi is (alpha' - 1)/chi.
        RunResult r = run("""
                vars w, wp
                vars alpha, alphap, chi collected
                check euler_derivative(w*wp, w)/(w*wp) == 1
                check euler_derivative((1 - w)*(1 - wp), w)/((1 - w)*(1 - wp)) == -w/(1 - w)
                check euler_derivative((alpha - 1)*(alphap - 1), alpha) at alpha = 1/chi == (alphap - 1)/chi
                check derivative(alpha^3*w^2/(w - 1), w) == alpha^3*w*(w - 2)/(w - 1)^2
                check derivative(alpha^-2*w, alpha) == -2*alpha^-3*w
                """);
        assertEquals(5, r.checksPassed(), bytes.toString(StandardCharsets.UTF_8));
        assertTrue(r.ok());
    }

    @Test
    void remainderDegreeAndChosenCoefficients() {
        // x^3 modulo (x - 1)(x - y): the remainder takes the values 1 and y^3 at the roots (common practice).
        RunResult r = run("""
                vars x, y, z collected
                let rem = remainder(x^3, x^2 - (1 + y)*x + y, x)
                check rem at x = 1 == 1
                check rem at x = y == y^3
                check degree(x^2*y + z^5, {x, y}) == 3
                check coefficient(x*y + y + 3 + z, 1, of: {x}) == 3 + y + z
                check coefficient(x*y + x*z + y, x, of: {x, y}) == z
                """);
        assertEquals(5, r.checksPassed(), bytes.toString(StandardCharsets.UTF_8));
    }

    @Test
    void mistakesAreLocated() {
        ContourException inner = assertThrows(ContourException.class, () -> run("""
                vars s
                let r = remainder(s^3, s^2 - 1, s)
                """));
        assertTrue(inner.getMessage().contains("collected") && inner.span().line() == 2 && inner.span().column() == 33,
                inner.getMessage() + " " + inner.span());
        ContourException notMonic = assertThrows(ContourException.class, () -> run("""
                vars x collected
                let r = remainder(x^3, 2*x^2 - 1, x)
                """));
        assertTrue(notMonic.getMessage().contains("monic") && notMonic.span().column() == 24,
                notMonic.getMessage() + " " + notMonic.span());
        ContourException notVariable = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let d = derivative(s*t, s + t)
                """));
        assertTrue(notVariable.getMessage().contains("must be a variable") && notVariable.span().line() == 2,
                notVariable.getMessage());
        ContourException notNumber = assertThrows(ContourException.class, () -> run("""
                vars s
                let e = require_number(s, "epsilon")
                """));
        assertTrue(notNumber.getMessage().contains("epsilon must be a rational number") && notNumber.span().line() == 2,
                notNumber.getMessage());
    }
}
