package dev.contour.print;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import dev.contour.eval.ExprValue;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.TermValue;
import dev.contour.eval.Value;
import dev.contour.algebra.Expression;
import java.io.OutputStream;
import java.io.PrintStream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.statistics.Statistics;

/**
 * Printing a value in plain text and parsing the text again gives back the same value, for random
 * expressions in inner variables, collected variables and unknowns, expanded or factored, and for
 * symbolic terms with Gamma functions.
 */
class PrintParseRoundTripProperties {
    private static final String DEFINITIONS = "vars s, t\nvars x, y collected\nunknown a[i] with i <= 2\n";

    private static Interpreter session() {
        Interpreter i = new Interpreter(InterpreterOptions.to(new PrintStream(OutputStream.nullOutputStream())));
        i.run(DEFINITIONS, "roundtrip.ctr");
        return i;
    }

    @Provide
    Arbitrary<String> expressions() {
        return expression(3);
    }

    private Arbitrary<String> expression(int depth) {
        Arbitrary<String> leaf = Arbitraries.oneOf(
                Arbitraries.of("s", "t", "x", "y", "a[0]", "a[2]", "s - 2", "t + 3*s", "2*s - t + 1"),
                Arbitraries.integers().between(-6, 6).map(String::valueOf),
                Combinators.combine(Arbitraries.integers().between(-9, 9), Arbitraries.integers().between(1, 7))
                        .as((p, q) -> p + "/" + q));
        if (depth == 0) {
            return leaf;
        }
        Arbitrary<String> smaller = Arbitraries.lazy(() -> expression(depth - 1));
        return Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(2, leaf),
                net.jqwik.api.Tuple.of(4, Combinators.combine(smaller, Arbitraries.of("+", "-", "*"), smaller)
                        .as((a, op, b) -> "(" + a + ") " + op + " (" + b + ")")),
                net.jqwik.api.Tuple.of(2, Combinators.combine(smaller, Arbitraries.of("s - 1", "t + s", "2*t + 5", "s", "x", "y^2"))
                        .as((a, b) -> "(" + a + ") / (" + b + ")")),
                net.jqwik.api.Tuple.of(1, Combinators.combine(smaller, Arbitraries.integers().between(-2, 3))
                        .as((a, e) -> "(" + a + ")^" + e)));
    }

    @Property(tries = 300)
    void plainTextParsesBackToTheSameExpression(@ForAll("expressions") String text) {
        Interpreter i = session();
        Value v;
        try {
            v = i.evaluate(text, "gen.ctr");
        } catch (ContourException e) {
            Statistics.collect("rejected (division by a sum in collected variables, or by zero)");
            return;
        }
        Statistics.collect("evaluated");
        Expression e = ((ExprValue) v).value();
        for (boolean factored : new boolean[] {false, true}) {
            String printed = PlainPrinter.expression(e, factored);
            Value back = i.evaluate(printed, "printed.ctr");
            assertEquals(v, back, "printed" + (factored ? " factored" : "") + " as: " + printed);
        }
    }

    @Property(tries = 100)
    void symbolicTermsParseBackToTheSameTerm(@ForAll("expressions") String a, @ForAll("expressions") String b) {
        Interpreter i = session();
        String text = "Gamma(s/2 + (" + a + "))^2 * Gamma(1/3 - t)/Gamma(s/2) + (" + b + ")*Gamma(x + 1/2)";
        Value v;
        try {
            v = i.evaluate(text, "gen.ctr");
        } catch (ContourException e) {
            return;
        }
        String printed = v instanceof TermValue t ? PlainPrinter.term(t.value(), false)
                : PlainPrinter.expression(((ExprValue) v).value(), false);
        Value back = i.evaluate(printed, "printed.ctr");
        Value difference = i.evaluate("(" + text + ") - (" + printed + ")", "difference.ctr");
        assertTrue(difference instanceof ExprValue d && d.value().isZero(), "printed as: " + printed + "; difference " + difference);
        assertEquals(v.getClass(), back.getClass());
    }
}
