package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
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
    /** The p = 3 all-ones reduced ansatz and its full amplitude, through the rule library. */
    private static final String P3_ALL_ONES = """
                use "ads5s5.ctr"
                let p = 3
                let Mred = (sum i, j, k with i + j + k = p - 2 :
                    sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i))) at (utilde = 4*p - 4 - s - t)
                let M = ward(p)(Mred)
                """;

    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private RunResult run(String script, OutputFormat format) {
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        return new Interpreter(InterpreterOptions.to(out).withFormat(format)).run(script, "test.ctr");
    }

    /** The equal-weight reduced ansatz Mred with unknowns a[i,j,k] at weight p (docs/conventions.md, "AdS5×S5" sections). */
    private static String ansatz(int p) {
        return dev.contour.bench.AnsatzSumBench.script(p);
    }

    private String output() {
        return bytes.toString(StandardCharsets.UTF_8);
    }

    @Test
    void theAdS5S5ProblemInADozenLines() {
        // arXiv:1608.06624 / arXiv:1710.05923: at p = 3 equal a_ijk give a crossing-symmetric amplitude with
        // simple poles at s, t, u = 2, 4, polynomial residues and linear growth (docs/conventions.md, "AdS5×S5" sections).
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
        // and the solution is crossing symmetric with linear growth (docs/conventions.md, "AdS5×S5" sections).
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
        // docs/conventions.md, "AdS5×S5" sections: the coefficients of R-hat are products of squared Pochhammer
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
        // docs/conventions.md, "AdS5×S5" sections: the dictionary handles p as a variable; giving p a value afterwards agrees.
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
    @Test
    void eulerOperatorsAreWrittenInScriptsAndTranslatedByTheDictionary() {
        // docs/conventions.md, "The dictionary": on the kernel U^(s/2) V^(t/2-p), U d/dU acts as s/2 and V d/dV as t/2 - p;
        // [U d/dU, U] = U (common practice), and the dictionary turns composition into composition.
        String script = """
                use "ads5s5.ctr"
                let m = full_measure(2)
                let mr = reduced_measure(2)
                check euler(U)*U == U*euler(U) + U
                check euler(V)*V^2 == V^2*euler(V) + 2*V^2
                check euler(U)*euler(V) == euler(V)*euler(U)
                check euler(U)*V == V*euler(U)
                check mellin(euler(U), from: m, to: m) == s/2
                check mellin(euler(V), from: m, to: m) == t/2 - 2
                check mellin(euler(U)*U, from: m, to: m) == mellin(euler(U), from: m, to: m) * mellin(U, from: m, to: m)
                check mellin(sigma*U*euler(V) + tau*V^2*euler(U)^2, from: mr, to: m)
                      == sigma*mellin(U, from: mr, to: m)*mellin(euler(V), from: mr, to: mr)
                         + tau*mellin(V^2, from: mr, to: m)*mellin(euler(U), from: mr, to: mr)^2
                check mellin(U*euler(U) + 0*euler(V), from: m, to: m) == mellin(U, from: m, to: m)*(s/2)
                show mellin(sigma*U*euler(V) + tau*V^2*euler(U)^2, from: mr, to: m)
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(9, r.checksPassed(), output());
        assertEquals(0, r.checksFailed(), output());
        // the same operator built in Java (PositionOperator) and translated there prints the same
        Polynomial two = Polynomial.constant(2);
        PositionOperator x = PositionOperator.of(new PositionOperator.Word(1, 0, 0, 1), Expression.collectedVariable("sigma"))
                .add(PositionOperator.of(new PositionOperator.Word(0, 2, 2, 0), Expression.collectedVariable("tau")));
        String java = OperatorPrinter.plain(MellinDictionary.translate(x, AdS5S5.reducedMeasure(two), AdS5S5.fullMeasure(two)), false);
        assertTrue(output().contains("= " + java + "\n"), java + "\n" + output());
    }

    @Test
    void positionOperatorsPrintInThreeFormsAndReadBack() {
        bytes.reset();
        run("""
                vars s, t
                vars sigma, tau, U, V collected
                show (sigma*U + tau*V)*euler(U)^2*euler(V) - euler(U)*U
                show (sigma*U + tau*V)*euler(U)^2*euler(V) - euler(U)*U as latex
                show sigma*euler(V) as json
                """, OutputFormat.PLAIN);
        String[] lines = output().split("\n");
        String plain = lines[0].substring(lines[0].indexOf(" = ") + 3);
        assertEquals("-U - U*euler(U) + (V*tau + U*sigma)*euler(U)^2*euler(V)", plain, output());
        assertTrue(output().contains("\\left(U\\,\\partial_{U}\\right)^{2}\\left(V\\,\\partial_{V}\\right)"), output());
        assertTrue(output().contains("{\"kind\":\"position operator\",\"cross\":[\"U\",\"V\"],\"terms\":[{\"euler\":{\"U\":0,\"V\":1},"),
                output());
        bytes.reset();
        RunResult r = run("vars sigma, tau, U, V collected\ncheck " + plain
                + " == (sigma*U + tau*V)*euler(U)^2*euler(V) - euler(U)*U\n", OutputFormat.PLAIN);
        assertEquals(1, r.checksPassed(), plain + "\n" + output());
    }

    @Test
    void eulerMistakesAreLocated() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars sigma, U, V, W collected
                show euler(W)
                """, OutputFormat.PLAIN));
        assertTrue(e.getMessage().contains("not a cross ratio") && e.span().line() == 2, e.getMessage());
        ContourException mixed = assertThrows(ContourException.class, () -> run("""
                vars X, Y, U, V collected
                show euler(X, cross: {X, Y}) + euler(U)
                """, OutputFormat.PLAIN));
        assertTrue(mixed.getMessage().contains("different cross ratios") && mixed.span().line() == 2, mixed.getMessage());
    }

    @Test
    void theCyclicCrossingComposesTheTwoSwapsInTheLanguage() {
        // arXiv:1608.06624 (docs/conventions.md, "AdS5×S5" sections): the p = 2 and p = 3 amplitudes are crossing symmetric, so
        // the composite of 1<->2 and 1<->3 fixes them; the composite is a 3-cycle, so its cube is the identity.
        String script = P3_ALL_ONES + """
                check cross_cyclic(p)(M) == M
                check cross_cyclic_reduced(p)(Mred) == Mred
                let M2 = ward(2)(1/((s - 2)*(t - 2)*(2 - s - t)))
                let C = cross_cyclic(2)
                check C(C(C(M2))) == M2
                check (C^3)(M2) == M2
                let X = sigma*s^2/(t - 2) + tau^2*t + sigma*tau
                check C(C(C(X))) == X
                check C(X) == X
                check C(C(X)) == X
                show cross_cyclic(3)
                show cross_cyclic_reduced(3)
                """;
        RunResult r = run(script, OutputFormat.PLAIN);
        assertEquals(5, r.checksPassed(), output());
        assertEquals(2, r.checksFailed(), output()); // a generic X is not fixed by one or two steps of the 3-cycle
        assertTrue(output().contains("cross_cyclic(3) = " + new CrossingValue(AdS5S5.crossingCyclic(3)).render(OutputFormat.PLAIN)),
                output());
        assertTrue(output().contains("cross_cyclic_reduced(3) = "
                + new CrossingValue(AdS5S5.crossingCyclicReduced(3)).render(OutputFormat.PLAIN)), output());
    }

    @Test
    void partialFractionsTakesTheDocumentedByArgument() {
        RunResult r = run("""
                vars s, t
                vars sigma, tau collected
                show partial_fractions(1/(s*(s - 2)) + sigma/s + tau*s^2/(s - 2), s, by: {sigma, tau})
                show partial_fractions(sigma/s + sigma/(s + t), s, by: {sigma})
                """, OutputFormat.PLAIN);
        assertEquals(0, r.checksFailed());
        assertTrue(output().contains("    1:  0  +  (-1/2)/(s)  +  (1/2)/(s - 2)"), output());
        assertTrue(output().contains("    sigma:  0  +  (1)/(s)"), output());
        assertTrue(output().contains("    tau:  s + 2  +  (4)/(s - 2)"), output());
        assertTrue(output().contains("    sigma:  0  +  (1)/(s)  +  (1)/(s + t)")
                || output().contains("    sigma:  0  +  (1)/(s + t)  +  (1)/(s)"), output());
    }

    @Test
    void coefficientOfOneIsThePartFreeOfTheCollectedVariables() {
        RunResult r = run("""
                vars s, t
                vars sigma, tau collected
                let E = 1/s + sigma/t + tau^2*s - sigma*tau
                show coefficient(E, 1)
                check coefficient(E, 1) == 1/s
                check coefficient(s/t, 1) == s/t
                check coefficient(sigma, 1) == 0
                check coefficient(E, sigma) == 1/t - tau
                """, OutputFormat.PLAIN);
        assertEquals(4, r.checksPassed(), output());
        assertTrue(output().startsWith("coefficient(E, 1) = 1/s\n"), output());
    }

    @Test
    void latexFormsCompile() {
        // every value kind's LaTeX: balanced braces and no unescaped _ # % & outside math (report lines are % comments)
        run("""
                use "ads5s5.ctr"
                def f(x) = x + 1
                show full_measure(2) as latex
                show reduced_measure(p) as latex
                show cross_cyclic(2) as latex
                show ward(2) as latex
                show euler(U)*U as latex
                show f as latex
                show coefficient as latex
                show "a_b #1 50% x&y {z}" as latex
                show {full_measure(2), 1} as latex
                """.replace("reduced_measure(p)", "reduced_measure(3)"), OutputFormat.PLAIN);
        String out = output();
        assertTrue(out.contains("\\Gamma\\left(-\\frac{1}{2}\\,s + 2\\right)^{2}"), out);
        assertTrue(out.contains("U^{\\frac{1}{2}\\,s} V^{\\frac{1}{2}\\,t - 2},\\quad u = -s - t + 8"), out);
        for (String line : out.split("\n")) {
            if (line.startsWith("%")) {
                continue; // a LaTeX comment: the statement shown
            }
            assertBalancedAndEscaped(line);
        }
    }

    private static void assertBalancedAndEscaped(String line) {
        int depth = 0;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            boolean escaped = i > 0 && line.charAt(i - 1) == '\\' && (i < 2 || line.charAt(i - 2) != '\\');
            if (escaped) {
                continue;
            }
            if (c == '{') {
                depth++;
            } else if (c == '}') {
                depth--;
                assertTrue(depth >= 0, "unbalanced braces in " + line);
            } else if (c == '#' || c == '%' || c == '&') {
                fail("unescaped " + c + " in " + line);
            } else if (c == '_' && insideText(line, i)) {
                fail("unescaped _ in text mode in " + line);
            }
        }
        assertEquals(0, depth, "unbalanced braces in " + line);
    }

    /** True when position i lies inside the argument of a \text{...}. */
    private static boolean insideText(String line, int i) {
        int open = line.lastIndexOf("\\text{", i);
        if (open < 0) {
            return false;
        }
        int depth = 0;
        for (int k = open + 5; k < i; k++) {
            char c = line.charAt(k);
            if (c == '\\') {
                k++;
            } else if (c == '{') {
                depth++;
            } else if (c == '}') {
                depth--;
                if (depth == 0) {
                    return false;
                }
            }
        }
        return true;
    }
}
