package dev.contour.print;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.algebra.Expression;
import dev.contour.algebra.RationalFunction;
import dev.contour.eval.ExprValue;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * Printing through a measure's forms and pulling out the common factor change only the text: the
 * printed form, read back by the interpreter with u bound to total - s - t, equals the value
 * (checked by the exact core), and common times bracket is the expression.
 */
class FormViewProperties {
    private static final String HEAD = """
            vars s, t, u
            vars sigma, tau collected
            let m = mellin_measure(gamma: {{(6 - s)/2, 2}, {(6 - t)/2, 2}, {(6 - u)/2, 2}}, kernel: {s/2, t/2 - 3}, eliminate: u, total: 10)
            """;

    private static final class Session {
        final ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        final Interpreter in = new Interpreter(InterpreterOptions.to(new PrintStream(buffer, true, StandardCharsets.UTF_8)));

        String run(String script) {
            buffer.reset();
            in.run(script, "test.ctr");
            return buffer.toString(StandardCharsets.UTF_8);
        }
    }

    /** A product of linear factors over a product of linear factors, times a polynomial in sigma, tau: written with u. */
    @Provide
    Arbitrary<String> amplitudes() {
        Arbitrary<String> factor = Arbitraries.of("s", "t", "u", "s - 2", "t - 4", "u - 2", "u + 1", "s + 1", "t - 1", "2*s - 3",
                "s - t", "u - 6", "s + t - 3");
        Arbitrary<List<String>> top = factor.list().ofMinSize(0).ofMaxSize(3);
        Arbitrary<List<String>> bottom = factor.list().ofMinSize(1).ofMaxSize(3);
        Arbitrary<String> bracket = Arbitraries.of("1", "1 + sigma + tau", "sigma - 2*tau", "3*sigma^2 + tau", "sigma*tau - 1",
                "(s - 1)*sigma + t*tau");
        Arbitrary<Integer> scalar = Arbitraries.integers().between(-6, 6).filter(k -> k != 0);
        return net.jqwik.api.Combinators.combine(top, bottom, bracket, scalar, Arbitraries.integers().between(1, 5))
                .as((n, d, b, k, q) -> "(" + k + "/" + q + ")*" + product(n) + "*(" + b + ")/(" + product(d) + ")");
    }

    private static String product(List<String> fs) {
        List<String> out = new ArrayList<>();
        fs.forEach(f -> out.add("(" + f + ")"));
        return out.isEmpty() ? "1" : String.join("*", out);
    }

    @Property(tries = 60)
    void theFormsViewReadsBackToTheSameValue(@ForAll("amplitudes") String amplitude) {
        for (String option : List.of("in m", "factored whole in m", "factored whole")) {
            Session session = new Session();
            String shown = session.run(HEAD + "let E = " + amplitude + " at (u = 10 - s - t)\nshow E " + option + "\n");
            assertTrue(shown.startsWith("E = "), shown);
            String printed = shown.substring("E = ".length()).strip();
            if (option.contains(" in ")) {
                assertTrue(!printed.contains("s + t") && !printed.contains("-s - t"), "u factors are written through u: " + printed);
            }
            Session back = new Session();
            String verdict = back.run("vars s, t\nvars sigma, tau collected\nlet u = 10 - s - t\nlet E = " + amplitude
                    + "\ncheck " + printed + " == E\n");
            assertTrue(verdict.endsWith("  ok\n"), option + ": " + printed + "\n" + verdict);
        }
    }

    @Property(tries = 60)
    void commonTimesBracketIsTheExpressionAndTheBracketIsPolynomial(@ForAll("amplitudes") String amplitude) {
        Session session = new Session();
        session.run(HEAD + "let E = " + amplitude + " at (u = 10 - s - t)\n");
        Expression e = ((ExprValue) session.in.lookup("E")).value();
        RationalFunction common = FormView.common(e);
        Expression inner = FormView.inner(e);
        assertEquals(e, inner.multiply(common));
        inner.terms().values().forEach(c -> assertTrue(c.isPolynomial(), "bracket coefficient " + c));
    }

    @Test
    void aUPoleIsWrittenAsPhysicistsWriteIt() {
        Session session = new Session();
        String out = session.run(HEAD + """
                let A = 1/((s - 2)*(t - 4)*(u - 2)) at (u = 10 - s - t)
                show A
                show A in m
                let F = 5*(1 + sigma + tau)/(s*t*(s + t))
                show F factored whole in {u, -s - t}
                show F factored whole in {u, -s - t} as latex
                """);
        assertEquals("""
                A = -1/((s - 2)*(t - 4)*(s + t - 8))
                A = 1/((s - 2)*(t - 4)*(u - 2))
                F = -5/(s*t*u)*(1 + tau + sigma)
                % F
                -\\frac{5}{s\\,t\\,u}\\,\\left(1 + \\tau + \\sigma\\right)
                """, out);
    }
}
