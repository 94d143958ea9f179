package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.RunResult;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.*;

/** The mellin built-ins and rules/ads5s5.ctr driven through the language. */
class MellinScriptTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private RunResult run(String script, OutputFormat format) {
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        return new Interpreter(InterpreterOptions.to(out).withFormat(format)).run(script, "test.ctr");
    }

    /** The equal-weight reduced ansatz Mred with unknowns a[i,j,k] at weight p (physics-reference section 4). */
    private static String ansatz(int p) {
        return dev.contour.eval.AnsatzSumBench.script(p);
    }

    private String output() {
        return bytes.toString(StandardCharsets.UTF_8);
    }

    @Test
    void theAdS5S5ProblemInADozenLines() {
        // arXiv:1608.06624 / arXiv:1710.05923: at p = 3 equal a_ijk give a crossing-symmetric amplitude with
        // simple poles at s, t, u = 2, 4, polynomial residues and linear growth (physics-reference section 4).
        String script = """
                use "ads5s5.ctr"
                let p = 3
                let Mred = (sum i, j, k with i + j + k = p - 2 :
                    sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i))) at (utilde = 4*p - 4 - s - t)
                let M = ward(p)(Mred)
                check cross13_reduced(p)(Mred) == Mred
                check cross12_reduced(p)(Mred) == Mred
                check cross13(p)(M) == M
                check cross12(p)(M) == M
                check stray_poles(M, p) == 0
                check bad_residues(M, p) == 0
                check growth(M, full_measure(p)) == growth_bound
                show poles(M, full_measure(p))
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(7, r.checksPassed(), output());
        assertEquals(0, r.checksFailed(), output());
        assertTrue(output().contains("s = 2") && output().contains("u = 4"), output());
    }

    @Test
    void theP4AnsatzIsSolvedThroughTheLanguage() {
        // arXiv:1608.06624 and arXiv:1710.05923: polynomial residues fix the reduced ansatz up to one constant,
        // and the solution is crossing symmetric with linear growth (physics-reference section 4).
        String script = ansatz(4) + """
                let sol = solve supergravity_poles(ward(p)(Mred), p) for a
                let Mred1 = Mred with sol normalized a[0, 0, 2] = 1
                let M = ward(p)(Mred1)
                check cross13_reduced(p)(Mred1) == Mred1
                check cross12_reduced(p)(Mred1) == Mred1
                check cross13(p)(M) == M
                check bad_residues(M, p) == 0
                check stray_poles(M, p) == 0
                check growth(M, full_measure(p)) == growth_bound
                show free_unknowns(sol)
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(6, r.checksPassed(), output());
        assertEquals(0, r.checksFailed(), output());
    }

    @Test
    void aSweepOverTheWeightDeclaresEachWeightsUnknowns() {
        // Unique up to normalisation for every p (arXiv:1608.06624, arXiv:1710.05923); the values
        // a[1,1,p-4] = ((p-2)!/(p-4)!)^2 are the closed form a[i,j,k] = ((p-2)!/(i! j! k!))^2 that
        // SupergravityAnsatzTest checks against an independent elimination (not a published value).
        String script = """
                use "ads5s5.ctr"
                for p in 4..7 {
                    unknown a[i, j, k] with i + j + k = p - 2
                    let Mred = (sum i, j, k with i + j + k = p - 2 :
                        a[i, j, k] * sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i))) at (utilde = 4*p - 4 - s - t)
                    let sol = solve supergravity_poles(ward(p)(Mred), p) for a
                    show free_unknowns(sol)
                    check a[1, 1, p - 4] with sol normalized a[0, 0, p - 2] = 1 == ((p - 2)!/(p - 4)!)^2
                }
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(4, r.checksPassed(), output());
        assertTrue(output().contains("[p = 7] free_unknowns(sol) = {a[0,0,5]}"), output());
    }

    @Test
    void anOperatorAppliedToAnAnsatzIsTheSameValueCollectedOrNot() {
        // common practice: E(F(f)) = (E*F)(f); the solver reads ward(p)(Mred) uncollected, and its
        // solution must be the one found from the collected expression (ward(p)(Mred) + 0 forces that)
        String script = ansatz(5) + """
                let E = shift(s: -2) + s*shift(t: 2)
                check E(ward(p)(Mred)) == (E*ward(p))(Mred)
                let one = solve supergravity_poles(ward(p)(Mred), p) for a
                let two = solve supergravity_poles(ward(p)(Mred) + 0, p) for a
                check (Mred with one normalized a[0,0,3] = 1) == (Mred with two normalized a[0,0,3] = 1)
                check (ward(p)(Mred) with one normalized a[0,0,3] = 1) == ward(p)(Mred with one normalized a[0,0,3] = 1)
                check stray_poles(ward(p)(Mred with one normalized a[0,0,3] = 1), p) == 0
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(4, r.checksPassed(), output());
        assertEquals(0, r.checksFailed(), output());
    }

    @Test
    void aBrokenAnsatzFailsTheResidueCheckNamingAPolePair() {
        String script = """
                use "ads5s5.ctr"
                let Mred = (2*sigma/((s - 4)*(t - 2)*(utilde - 2)) + tau/((s - 4)*(t - 4)*(utilde - 4))
                    + 1/((s - 2)*(t - 4)*(utilde - 4))) at (utilde = 8 - s - t)
                show bad_residues(ward(3)(Mred), 3)
                check bad_residues(ward(3)(Mred), 3) == 0
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(1, r.checksFailed(), output());
        assertTrue(output().matches("(?s).*[stu] = \\d+ and [stu] = \\d+ \\(coefficient of .*"), output());
    }

    @Test
    void operatorArithmeticInTheLanguage() {
        String script = """
                vars s, t
                let E = shift(s: -2, t: 2)
                check (E*E)(s*t) == (s - 4)*(t + 4)
                check (E + 1)(s) == 2*s - 2
                check (s*E)(t) == s*(t + 2)
                check (E*s)(t) == (s - 2)*(t + 2)
                check E^2 == E*E
                check shift({s, t}, {2, -2}) * E == 1
                check (E - E) == 0
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(7, r.checksPassed(), output());
    }

    @Test
    void shiftsNameAnyDeclaredVariable() {
        RunResult r = run("""
                vars x, y
                check shift(x: 1, y: -2)(x*y) == (x + 1)*(y - 2)
                check shift(x: 1/2) * shift(x: -1/2) == 1
                """, OutputFormat.PLAIN);
        assertEquals(2, r.checksPassed(), output());
        ContourException e = assertThrows(ContourException.class, () -> run("vars x\nshow shift(xx: 1)\n", OutputFormat.PLAIN));
        assertEquals("shift: 'xx' is not a declared variable (declare it with 'vars xx')", e.getMessage());
        assertEquals(2, e.span().line());
    }

    @Test
    void wardOperatorPrintsAndReadsBack() {
        assertTrue(printsAndReadsBack("show ward(2)").contains("*shift(s: -4)"));
        // physics-reference section 4: the coefficients of R-hat are products of squared Pochhammer
        // factors, which 'factored' shows as such
        String factored = printsAndReadsBack("show ward(2) factored");
        assertTrue(factored.contains("((s - 4)^2*(s - 6)^2*sigma*tau/16)*shift(s: -4)"), factored);
    }

    /** Shows ward(2) with the given statement, checks that the printed text reads back as ward(2), returns it. */
    private String printsAndReadsBack(String show) {
        bytes.reset();
        run("use \"ads5s5.ctr\"\n" + show + "\n", OutputFormat.PLAIN);
        String printed = output().trim();
        String text = printed.substring(printed.indexOf('=') + 1).trim();
        bytes.reset();
        RunResult r = run("use \"ads5s5.ctr\"\nlet E = " + text + "\ncheck E == ward(2)\n", OutputFormat.PLAIN);
        assertEquals(1, r.checksPassed(), text + "\n" + output());
        return text;
    }

    @Test
    void latexAndJsonForms() {
        run("""
                vars s, t
                show shift(s: -2) * s as latex
                show shift(s: -2) * s as json
                """, OutputFormat.PLAIN);
        assertTrue(output().contains("\\mathrm{E}_{s}^{-2}"), output());
        assertTrue(output().contains("\"kind\":\"shift operator\"") && output().contains("\"shift\":{\"s\":\"-2\"}"), output());
    }

    @Test
    void symbolicWeightThroughTheLanguage() {
        // physics-reference section 4: the dictionary handles p as a variable; giving p a value afterwards agrees.
        String script = """
                use "ads5s5.ctr"
                vars p
                let W = ward(p)
                check (W at (p = 4)) == ward(4)
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(1, r.checksPassed(), output());
    }

    @Test
    void mistakesAreLocatedContourErrors() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t
                let m = mellin_measure(gamma: {(1 - s)/2}, kernel: {s, t})
                let E = mellin(1, from: m, to: m)
                let F = mellin(1, from: m, to: 3)
                """, OutputFormat.PLAIN));
        assertTrue(e.span() != null && e.span().line() == 4, e.getMessage());
        ContourException half = assertThrows(ContourException.class, () -> run("""
                vars s, t
                vars U, V collected
                let m = mellin_measure(gamma: {-s/2}, kernel: {s, t})
                let E = mellin(U, from: m, to: m)
                """, OutputFormat.PLAIN));
        assertTrue(half.getMessage().contains("not an integer") && half.span().line() == 4, half.getMessage());
    }
}
