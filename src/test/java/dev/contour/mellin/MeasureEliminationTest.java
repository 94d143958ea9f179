package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Every built-in that takes a measure reads its amplitude as a function of s and t alone: the
 * measure's eliminated variable (u = total - s - t) is substituted, never taken for a constant.
 */
class MeasureEliminationTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private RunResult run(String script) {
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        return new Interpreter(InterpreterOptions.to(out)).run(script, "test.ctr");
    }

    private String output() {
        return bytes.toString(StandardCharsets.UTF_8);
    }

    private static final String M = """
            use "ads5s5.ctr"
            let M = 1/((s - 2)*(t - 2)*(u - 2))
            """;

    @Test
    void growthCountsTheEliminatedVariable() {
        // M(b s, b t) = 1/((bs - 2)(bt - 2)(4 - bs - bt - 2)) falls like b^-3 (u = 8 - s - t at p = 2).
        RunResult r = run(M + "check growth(M, full_measure(2)) == -3\n"
                + "check growth(M at (u = 8 - s - t), full_measure(2)) == -3\n");
        assertTrue(r.ok() && r.checksPassed() > 0, output());
    }

    @Test
    void leadingIsAFunctionOfSAndTAlone() {
        RunResult r = run(M + "check leading(M, full_measure(2)) == -1/(s*t*(s + t))\n");
        assertTrue(r.ok() && r.checksPassed() > 0, output());
    }

    @Test
    void polesListTheEliminatedChannel() {
        RunResult r = run(M + "show poles(M, full_measure(2))\n"
                + "show poles_outside(M, full_measure(2), s in {2}, t in {2})\n"
                + "show residue_check(M, full_measure(2))\n");
        assertTrue(r.ok(), output());
        String out = output();
        assertTrue(out.contains("poles (3):"), out);
        assertTrue(out.contains("u = 2"), out);
        assertTrue(out.contains("poles outside the allowed set (1):\n    u = 2 in the coefficient of 1"), out);
        assertTrue(out.contains("and u = 2"), out);
    }

    @Test
    void aMellinOperatorWritesItsArgumentInSAndT() {
        // Forgetting 'at (utilde = 4 - s - t)' before ward(2) must not change the answer: linear growth
        // of the p = 2 supergravity amplitude (arXiv:1608.06624).
        RunResult r = run("""
                use "ads5s5.ctr"
                let Mred = 1/((s - 2)*(t - 2)*(utilde - 2))
                let A = ward(2)(Mred)
                let B = ward(2)(Mred at (utilde = 4 - s - t))
                check A == B
                check growth(A, full_measure(2)) == 1
                check (ward(2) + 0)(Mred) == B
                """);
        assertTrue(r.ok() && r.checksPassed() > 0, output());
    }

    @Test
    void aConditionWithTotalRefusesAnExpressionInAllThreeVariables() {
        // residues_polynomial with total: reads u as total - s - t; an expression that still has u would
        // have its residues taken with u held fixed.
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t, u
                unknown c[i] with i <= 0
                let M = c[0]/((s - 2)*(t - 2)*(u - 2))
                let sol = solve residues_polynomial(M, s in {2}, t in {2}, u in {2}, total: 8) for c
                """));
        assertEquals(4, e.span().line(), e.getMessage());
        assertTrue(e.getMessage().contains("residues_polynomial: the expression mentions s, t, u although total:"), e.getMessage());
    }
}
