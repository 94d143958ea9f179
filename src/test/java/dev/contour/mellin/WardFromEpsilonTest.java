package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.RunResult;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The Ward identity derived from epsilon by backgrounds/ward_from_eps.ctr, and the AdS7xS4 library
 * backgrounds/ads7s4.ctr, driven through the language. Route: arXiv:1712.02800 (Mellin-space Ward
 * identities of maximally supersymmetric backgrounds); conventions: arXiv:1710.05923.
 */
class WardFromEpsilonTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();

    private RunResult run(String script) {
        bytes.reset();
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        return new Interpreter(InterpreterOptions.to(out).withFormat(OutputFormat.PLAIN)).run(script, "test.ctr");
    }

    private String output() {
        return bytes.toString(StandardCharsets.UTF_8);
    }

    private static final String ADS5_ANSATZ = """
            use "ads5s5.ctr"
            use "ward_from_eps.ctr"
            for p in 2..6 {
                unknown a[i, j, k] with i + j + k = p - 2
                let Mred = (sum i, j, k with i + j + k = p - 2 :
                    a[i, j, k]*sigma^i*tau^j/((s - 2*p + 2 + 2*k)*(t - 2*p + 2 + 2*j)*(utilde - 2*p + 2 + 2*i)))
                    at (utilde = 4*p - 4 - s - t)
                let M = ward(p)(Mred)
            """;

    @Test
    void epsilonOneEquationsHoldForTheAdS5S5Amplitudes() {
        // arXiv:1712.02800 (the Ward identity with epsilon = 1) and arXiv:1710.05923 (G = G_free + R H in
        // Mellin space, the amplitudes built with ward(p)): the derived equations vanish identically, both for
        // the amplitudes fixed by the pole conditions and for R applied to an arbitrary reduced ansatz
        // (R vanishes at alpha = 1/chi and (chi d/dchi - alpha d/dalpha) R does too there).
        RunResult r = run(ADS5_ANSATZ + """
                    check ward_equations(M, p, 1, full_measure(p)) == 0
                    let sol = solve supergravity_poles(M, p) for a
                    check ward_equations(M with sol, p, 1, full_measure(p)) == 0
                }
                """);
        assertEquals(10, r.checksPassed(), output());
        assertTrue(r.ok(), output());
    }

    @Test
    void aPerturbedAmplitudeBreaksNamedEquations() {
        // physics-reference section 6 (route checked there for epsilon = 1): adding 1/(s - 2) to one
        // coefficient of the p = 2 amplitude of arXiv:1608.06624 breaks two of the six equations
        // (adding it to the sigma^0 tau^0 coefficient here).
        RunResult r = run("""
                use "ads5s5.ctr"
                use "ward_from_eps.ctr"
                let p = 2
                let M = ward(p)(1/((s - 2)*(t - 2)*(utilde - 2)) at utilde = 4*p - 4 - s - t)
                check ward_equations(M, p, 1, full_measure(p)) == 0
                let W = ward_equations(M + 1/(s - 2), p, 1, full_measure(p))
                show W collected alphap, chi
                check W == 0
                """);
        assertEquals(1, r.checksPassed(), output());
        assertEquals(1, r.checksFailed(), output());
        // the failure names the equation: the coefficient of a power product of alphap and chi (here the
        // chi^0 alphap^0 one, printed as the coefficient of 1)
        assertTrue(output().contains("FAILED (line 8)") && output().contains("first difference, in the coefficient of 1:"),
                output());
        Matcher rows = Pattern.compile("W, collected in alphap, chi \\((\\d+) terms?\\)").matcher(output());
        assertTrue(rows.find(), output());
        assertEquals(2, Integer.parseInt(rows.group(1)), output());
    }

    @Test
    void ads7KTwoIsUniqueAndMatchesTheGivenCoefficients() {
        // arXiv:1712.02800 (epsilon = 2 Ward identity) with the ansatz of physics-reference section 6:
        // 126 unknowns, one amplitude left. Given check values (physics-reference section 6; compare
        // arXiv:1712.02788, from memory): sigma^0 tau^0 coefficient proportional to
        // (5s-28)(t-8)(s+t-8)/((s-6)(s-4)), sigma^2 coefficient to (s-8)(t-8)(5s+5t-52)/((s+t-12)(s+t-10)),
        // with one common constant; flat-space limit proportional to (tu + st sigma + su tau)^2/(stu).
        RunResult r = run("""
                use "ads7s4.ctr"
                let k = 2
                unknown x[a, b, c in 1..3, q in 2..2*k - 1, d in 0..2] with a + b <= k
                unknown y[a, b, i, j] with a + b <= k, i + j <= 1
                let M = ads7_ansatz(k, x, y)
                let sol = solve ads7_cross13(k)(M) == M, ads7_cross12(k)(M) == M, ads7_ward_holds(M, k) for x, y
                show free_unknowns(sol)
                let A = M with sol
                let c0 = coefficient(A, 1, of: {sigma, tau})*(s - 6)*(s - 4)/((5*s - 28)*(t - 8)*(s + t - 8))
                let c2 = coefficient(A, sigma^2, of: {sigma, tau})*(s + t - 12)*(s + t - 10)/((s - 8)*(t - 8)*(5*s + 5*t - 52))
                check c0 == c2
                check derivative(c0, s) == 0
                check derivative(c0, t) == 0
                check leading(A, ads7_measure(k))*s*t*(-s - t) == c0*(-5/1)*(t*(-s - t) + s*t*sigma + s*(-s - t)*tau)^2
                check ads7_ward(A, k) == 0
                check ads7_stray_poles(A, k) == 0
                check ads7_bad_residues(A, k) == 0
                check ads7_growth_excess(A, k) == 0
                """);
        assertTrue(r.ok(), output());
        assertEquals(8, r.checksPassed(), output());
        assertEquals(1, freeUnknowns(output()), output());
    }

    /** The number of names in the printed list of free unknowns. */
    private static int freeUnknowns(String out) {
        Matcher m = Pattern.compile("free_unknowns\\(sol\\) = \\{([^}]*)}").matcher(out);
        assertTrue(m.find(), out);
        return m.group(1).isBlank() ? 0 : m.group(1).split(", ").length;
    }

    private String ads7Solve(int k) {
        return """
                use "ads7s4.ctr"
                let k = %d
                unknown x[a, b, c in 1..3, q in 2..2*k - 1, d in 0..2] with a + b <= k
                unknown y[a, b, i, j] with a + b <= k, i + j <= 1
                let M = ads7_ansatz(k, x, y)
                let sol = solve ads7_cross13(k)(M) == M, ads7_cross12(k)(M) == M, ads7_ward_holds(M, k) for x, y
                show free_unknowns(sol)
                let A = M with sol
                check ads7_cross13(k)(A) == A
                check ads7_cross12(k)(A) == A
                check ads7_ward(A, k) == 0
                check ads7_stray_poles(A, k) == 0
                check ads7_bad_residues(A, k) == 0
                check ads7_growth_excess(A, k) == 0
                show coefficient(A, 1, of: {sigma, tau}) factored
                show coefficient(A, 1, of: {sigma, tau}) as latex
                """.formatted(k);
    }

    @Test
    @Tag("slow")
    void ads7KThreeAndFourAreExactCrossingSymmetricWithAllowedPolesAndLinearGrowth() {
        // arXiv:1712.02800 (epsilon = 2); physics-reference section 6: one amplitude for larger k too.
        for (int k = 3; k <= 4; k++) {
            RunResult r = run(ads7Solve(k));
            assertTrue(r.ok(), output());
            assertEquals(6, r.checksPassed(), output());
            assertEquals(1, freeUnknowns(output()), "k = " + k + ": " + output());
            assertTrue(output().contains("\\frac{"), output());
        }
    }

    @Test
    void ads4TruncatedAmplitudeSatisfiesTheEquationsToItsOrder() {
        // arXiv:1712.02800: with epsilon = 1/2 (AdS4xS7) the poles do not truncate; physics-reference section 6:
        // keep the first N poles and impose the equations order by order. Here k = 2 (Delta = 1), poles at
        // s, t, u = 1, 3, ..., 2N - 1 (twist 1). Crossing and the equations' residues at the first N poles fix
        // the pole part up to one constant (contact terms are not seen by residues); it satisfies the equations
        // to order N but not at the next pole, where the missing poles enter; and the residues at s = 1, 3
        // agree between N = 2 and N = 3 (order by order, the truncation does not move the lower poles).
        RunResult r = run("""
                use "ads4s7.ctr"
                let k = 2
                for N in 2..3 {
                    unknown x[a, b, c in 1..3, q in 0..N - 1, d in 0..2] with a + b <= k
                    unknown y[a, b, i, j] with a + b <= k, i + j <= 1
                    let M = ads4_ansatz(k, 1, N, 2, x, y)
                    let sol = solve ads4_cross13(k)(M) == M, ads4_cross12(k)(M) == M,
                                    vanishes(sum n in 0..N - 1 : ads4_ward_at_order(M, k, 1, n)) for x, y
                    show free_unknowns(sol)
                    let A = M with sol
                    check ads4_stray_poles(A, k, 1, N) == 0
                    check ads4_ward_at_order(A, k, 1, N - 1) == 0
                    let r1 = residue(coefficient(A, 1, of: {sigma, tau}), s, 1)
                    let r3 = residue(coefficient(A, 1, of: {sigma, tau}), s, 3)
                    check r3/r1 == (t + 1)/(10*(t - 1))
                    show ads4_ward_at_order(A, k, 1, N)
                }
                """);
        assertEquals(6, r.checksPassed(), output());
        assertTrue(r.ok(), output());
        // one pole unknown and four contact unknowns stay free at each N
        Matcher m = Pattern.compile("free_unknowns\\(sol\\) = \\{([^}]*)}").matcher(output());
        int found = 0;
        while (m.find()) {
            String[] names = m.group(1).split(", ");
            assertEquals(5, names.length, output());
            assertEquals(1, java.util.Arrays.stream(names).filter(x -> x.startsWith("x[")).count(), output());
            found++;
        }
        assertEquals(2, found, output());
        assertTrue(output().contains("[N = 2] ads4_ward_at_order(A, k, 1, N) = ")
                && !output().contains("ads4_ward_at_order(A, k, 1, N) = 0\n"), output());
    }

    @Test
    void epsilonThatIsNotANumberIsALocatedError() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                use "ads5s5.ctr"
                use "ward_from_eps.ctr"
                let W = ward_equations(sigma/(s - 2), 2, s, full_measure(2))
                """));
        assertTrue(e.getMessage().contains("epsilon must be a rational number") && e.getMessage().contains("not s"),
                e.getMessage());
        assertTrue(e.span().isKnown() && e.span().file().endsWith("ward_from_eps.ctr"), e.span().toString());
    }

    @Test
    void weightsWithNoRSymmetryPolynomialAreALocatedError() {
        // Delta = 3 with epsilon = 2: the degree Delta/epsilon = 3/2 is not a whole number.
        ContourException e = assertThrows(ContourException.class, () -> run("""
                use "ads7s4.ctr"
                let W = ward_equations(sigma/(s - 2), 3, 2, ads7_measure(2))
                """));
        assertTrue(e.getMessage().contains("the R-symmetry degree weight/epsilon must be an integer >= 0, not 3/2"),
                e.getMessage());
        assertTrue(e.span().isKnown(), e.getMessage());
    }

    @Test
    void negativePowersOfTheRSymmetryVariablesAreALocatedError() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                use "ads7s4.ctr"
                let W = ads7_ward(sigma + 1/tau, 2)
                """));
        assertTrue(e.getMessage().contains("the amplitude must be a polynomial in sigma, tau, but it has the power tau^-1"),
                e.getMessage());
        assertTrue(e.span().isKnown(), e.getMessage());
    }

    @Test
    void anIdentityThatIsNotPolynomialIsALocatedError() {
        // sigma^3 with Delta = 4, epsilon = 2 (degree 2): chi^L does not clear the denominator chi^3.
        ContourException e = assertThrows(ContourException.class, () -> run("""
                use "ads7s4.ctr"
                let W = ads7_ward(sigma^3/(s - 4), 2)
                """));
        assertTrue(e.getMessage().contains("negative power chi^-1") && e.getMessage().contains("not a polynomial in chi"),
                e.getMessage());
        assertTrue(e.span().isKnown(), e.getMessage());
    }
}
