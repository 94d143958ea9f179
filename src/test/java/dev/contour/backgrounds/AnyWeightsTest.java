package dev.contour.backgrounds;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import static org.junit.jupiter.api.Assertions.*;

/**
 * backgrounds/ads5s5.ctr at any weights, driven through the language as a user drives it.
 * Conventions and check values: arXiv:1710.05923 (general weights; as restated and re-derived in
 * the project's physics notes, section 4b); equal weights: arXiv:1608.06624.
 */
class AnyWeightsTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    /** Runs a script after {@code use "ads5s5.ctr"}; every check must pass. */
    String passes(String script) {
        bytes.reset();
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        RunResult r = new Interpreter(InterpreterOptions.to(out)).run("use \"ads5s5.ctr\"\n" + script, "test.ctr");
        String text = bytes.toString(StandardCharsets.UTF_8);
        assertTrue(r.ok() && r.checksPassed() > 0, text);
        return text;
    }

    /** The general ansatz of the given width for weights w, solved: Mred, M, sol and F (its one function). */
    static String solved(String w, int width) {
        return "let w = " + w + "\n"
                + "unknown c[i, j, x in -" + width + ".." + width + ", y in -" + width + ".." + width
                + ", z in -" + width + ".." + width + "] with i + j <= r_degree(w) - 2\n"
                + "let Mred = general_ansatz(w, c, " + width + ")\n"
                + "let M = ward_of(w)(Mred)\n"
                + "let sol = solve residues_allowed_of(M, w), poles_allowed_of(M, w) for c\n"
                + "let F = item(function_basis(Mred, sol), 1)\n";
    }

    @Test
    void checkValuesOf2233And2323() {
        // arXiv:1710.05923 conventions; check values re-derived exactly for docs/backgrounds/ads5s5.md (a_000 = 1).
        passes("""
                let w = {2, 2, 3, 3}
                check r_degree(w) == 2
                check closed_form(w) == 1/((s - 2)*(t - 3)*(10 - 4 - s - t - 3))
                let M = ward_of(w)(closed_form(w))
                check coefficient(M, 1) == -(t - 5)*(s + t - 5)/(16*(s - 2))
                check coefficient(M, sigma^2) == -(s - 6)*(t - 5)/(16*(s + t - 7))
                let M2 = ward_of({2, 3, 2, 3})(closed_form({2, 3, 2, 3}))
                check coefficient(M2, 1) at (s = 1/3, t = 1/7) == 629/1568
                """);
    }

    @ParameterizedTest
    // both cases of arXiv:1710.05923: p1 + p4 <= p2 + p3 ({6,6,5,3}, {3,3,3,3}, {2,2,3,3} reordered)
    // and p1 + p4 > p2 + p3 ({7,5,4,4}, {4,3,3,2}); {6,6,5,3} and {7,5,4,4} have all three kappa non-zero
    @ValueSource(strings = {"{2, 2, 3, 3}", "{3, 2, 3, 2}", "{3, 3, 3, 3}", "{4, 3, 3, 2}", "{6, 6, 5, 3}", "{7, 5, 4, 4}",
            "{4, 4, 4, 4}", "{5, 3, 4, 4}"})
    void theGeneralAnsatzGivesOneFunctionTheClosedForm(String w) {
        // a_ijk = 1/(i! j! k! (i+kappa_u/2)! (j+kappa_t/2)! (k+kappa_s/2)!), arXiv:1710.05923
        String out = passes(solved(w, 1) + """
                show family(Mred, sol)
                check function_count(Mred, sol) == 1
                let C = closed_form(w)
                check F * coefficient(C, 1) == C * coefficient(F, 1)
                let MF = ward_of(w)(F)
                check stray_poles_of(MF, w) == 0
                check bad_residues_of(MF, w) == 0
                check growth(MF, full_measure_of(w)) == 1
                # flat space: the ten-dimensional structure times the reduced leading term (arXiv:1608.06624, 1710.05923)
                check leading(MF, full_measure_of(w)) == (t*(-s - t) + s*t*sigma + s*(-s - t)*tau)^2/16 * leading(F, reduced_measure_of(w))
                """);
        assertTrue(out.contains("a one-dimensional family of functions"), out);
    }

    @Test
    void contactTermsAreRemovedByTheGrowthBound() {
        // supergravity growth O(beta) (arXiv:1608.06624, arXiv:1710.05923): a contact term in the reduced
        // amplitude grows like beta^4 or faster in M, so the growth bound removes it and one function is left
        passes(solved("{4, 3, 3, 2}", 1).replace("let Mred = general_ansatz(w, c, 1)",
                "unknown e[i, j, m, n] with i + j <= r_degree(w) - 2, m + n <= 1\n"
                + "let Mred = general_ansatz(w, c, 1) + contact_terms(w, e, 1)")
                .replace("poles_allowed_of(M, w) for c", "poles_allowed_of(M, w), growth_at_most(M, 1, s, t) for c, e") + """
                check function_count(Mred, sol) == 1
                check e with sol == {0, 0, 0}
                check F * coefficient(closed_form(w), 1) == closed_form(w) * coefficient(F, 1)
                """);
    }

    @Test
    void theExampleOfTheBackgroundDocRuns() {
        // docs/backgrounds/ads5s5.md: a made-up ordering, solved from the general ansatz
        String out = passes("""
                let w = {5, 4, 4, 3}
                unknown c[i, j, x in -1..1, y in -1..1, z in -1..1] with i + j <= r_degree(w) - 2
                let Mred = general_ansatz(w, c, 1)
                let M = ward_of(w)(Mred)
                let sol = solve residues_allowed_of(M, w), poles_allowed_of(M, w) for c
                show family(Mred, sol)
                let F = item(function_basis(Mred, sol), 1)
                check F * coefficient(closed_form(w), 1) == closed_form(w) * coefficient(F, 1)
                """);
        assertTrue(out.contains("a one-dimensional family of functions;"), out);
    }

    @Test
    void equalWeightsAreTheSpecialCase() {
        // arXiv:1608.06624: for equal weights a_ijk is proportional to ((p-2)!/(i! j! k!))^2; the general
        // definitions at {p, p, p, p} agree with the equal-weight ones of the same file
        passes("""
                for p in 2..8 {
                    let w = {p, p, p, p}
                    unknown a[i, j, k] with i + j + k = p - 2
                    let Mred = standard_ansatz(w, a)
                    check Mred == (sum i, j, k with i + j + k = p - 2 :
                        a[i, j, k] * sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i)))
                        at (utilde = 4*p - 4 - s - t)
                    check ward_of(w)(Mred) == ward(p)(Mred)
                    check relabel_reduced(w, {3, 2, 1, 4})(Mred) == cross13_reduced(p)(Mred)
                    check relabel_reduced(w, {2, 1, 3, 4})(Mred) == cross12_reduced(p)(Mred)
                    let C = closed_form(w)
                    check relabel(w, {3, 2, 1, 4})(ward_of(w)(C)) == cross13(p)(ward(p)(C))
                    check relabel(w, {2, 1, 3, 4})(ward_of(w)(C)) == cross12(p)(ward(p)(C))
                    let sol = solve supergravity_poles(ward(p)(Mred), p) for a
                    check Mred with sol normalized a[0, 0, p - 2] = 1 == C * ((p - 2)!)^2
                }
                """);
    }

    /** The 24 relabellings as lists, and the weights each gives. */
    private static List<int[]> permutations() {
        List<int[]> out = new ArrayList<>();
        for (int a = 1; a <= 4; a++) for (int b = 1; b <= 4; b++) for (int c = 1; c <= 4; c++) for (int d = 1; d <= 4; d++) {
            if (a != b && a != c && a != d && b != c && b != d && c != d) {
                out.add(new int[] {a, b, c, d});
            }
        }
        return out;
    }

    private static String list(int[] x) {
        return "{" + x[0] + ", " + x[1] + ", " + x[2] + ", " + x[3] + "}";
    }

    @ParameterizedTest
    @ValueSource(strings = {"2,2,3,3", "3,3,3,3", "4,3,3,2", "3,2,3,2"})
    void crossingSelfMapsAreSymmetriesAndOtherMapsRelateSolvedAmplitudes(String weights) {
        int[] w = java.util.Arrays.stream(weights.split(",")).mapToInt(Integer::parseInt).toArray();
        StringBuilder script = new StringBuilder(solved(list(w), 1));
        script.append("let MF = ward_of(w)(F)\n");
        int self = 0;
        for (int[] perm : permutations()) {
            int[] to = {w[perm[0] - 1], w[perm[1] - 1], w[perm[2] - 1], w[perm[3] - 1]};
            if (java.util.Arrays.equals(to, w)) {
                // a symmetry of the solved amplitude, reduced and full (arXiv:1710.05923)
                script.append("check relabel_reduced(w, ").append(list(perm)).append(")(F) == F\n");
                script.append("check relabel(w, ").append(list(perm)).append(")(MF) == MF\n");
                self++;
            } else {
                // the image of the solved amplitude is the amplitude solved for the other ordering
                String tag = "o" + perm[0] + perm[1] + perm[2] + perm[3];
                script.append(solved(list(to), 1).replace("let w = ", "let w_" + tag + " = ")
                        .replace("(w)", "(w_" + tag + ")").replace("(w,", "(w_" + tag + ",").replace("(M, w)", "(M_" + tag + ", w_" + tag + ")")
                        .replace("c[", "c_" + tag + "[").replace(", c, ", ", c_" + tag + ", ").replace("for c\n", "for c_" + tag + "\n")
                        .replace("let Mred", "let Mred_" + tag).replace("(Mred)", "(Mred_" + tag + ")").replace("(Mred,", "(Mred_" + tag + ",")
                        .replace("let M ", "let M_" + tag + " ").replace("let sol", "let sol_" + tag).replace(", sol)", ", sol_" + tag + ")")
                        .replace("let F", "let F_" + tag));
                script.append("let G_").append(tag).append(" = relabel_reduced(w, ").append(list(perm)).append(")(F)\n");
                script.append("check G_").append(tag).append(" * coefficient(F_").append(tag).append(", 1) == F_").append(tag)
                        .append(" * coefficient(G_").append(tag).append(", 1)\n");
                break; // one other ordering per case keeps the test short; the sweep checks all 24 on the closed form
            }
        }
        assertTrue(self >= 1);
        passes(script.toString());
    }

    @Test
    void aPerturbedAmplitudeFailsNamingTheCoefficient() {
        bytes.reset();
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        RunResult r = new Interpreter(InterpreterOptions.to(out)).run("use \"ads5s5.ctr\"\n" + """
                let w = {3, 3, 3, 3}
                let C = closed_form(w) + sigma/(s - 4)
                check relabel_reduced(w, {2, 1, 3, 4})(C) == C
                """, "test.ctr");
        String text = bytes.toString(StandardCharsets.UTF_8);
        assertEquals(1, r.checksFailed(), text);
        assertTrue(text.contains("first difference, in the coefficient of"), text);
    }

    /** Runs a script expected to fail with a located error; returns it. */
    private static ContourException fails(String script) {
        return assertThrows(ContourException.class, () -> new Interpreter(InterpreterOptions.to(
                new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8))).run("use \"ads5s5.ctr\"\n" + script, "test.ctr"));
    }

    @Test
    void badWeightsAreLocatedErrorsAtTheCallersCall() {
        ContourException odd = fails("show 1\nshow r_degree({2, 2, 2, 3})\n");
        assertEquals("test.ctr", odd.span().file());
        assertEquals(3, odd.span().line());
        assertTrue(odd.getMessage().contains("the weights {2, 2, 2, 3} have an odd sum 9"), odd.getMessage());
        ContourException small = fails("show full_measure_of({1, 3, 2, 2})\n");
        assertEquals(2, small.span().line());
        assertTrue(small.getMessage().contains("must each be at least 2"), small.getMessage());
        ContourException low = fails("unknown a[i] with i <= 1\nshow standard_ansatz({2, 2, 2, 4}, a)\n");
        assertEquals(3, low.span().line());
        assertTrue(low.getMessage().contains("the weights {2, 2, 2, 4} have degree L = 1 < 2"), low.getMessage());
        ContourException frac = fails("show ward_of({5/2, 5/2, 3, 3})\n");
        assertEquals(2, frac.span().line());
        assertTrue(frac.getMessage().contains("must be integers"), frac.getMessage());
        ContourException perm = fails("show relabel({3, 3, 3, 3}, {1, 1, 2, 3})\n");
        assertEquals(2, perm.span().line());
        assertTrue(perm.getMessage().contains("{1, 1, 2, 3} is not an ordering"), perm.getMessage());
    }
}
