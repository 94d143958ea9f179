package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.List;

/**
 * Small general built-ins that library files use to validate their input and to pick items:
 * numbers (abs, min, max), tests that give 1 or 0 (is_integer, at_least, equal), lists (item,
 * index_of, length) and {@code require}, whose error is reported at the caller's call.
 */
final class UtilityBuiltins {
    private UtilityBuiltins() { }

    static void register(BuiltinRegistry r) {
        r.register(Builtin.of("abs", 1, "abs(x): the absolute value of a number",
                (a, span) -> number(rational(a, 0, "abs").abs())));
        r.register(new Builtin("min", 1, Integer.MAX_VALUE, java.util.Set.of(), false,
                "min(a, b, ...): the smallest of the numbers", (a, span) -> extreme(a, -1)));
        r.register(new Builtin("max", 1, Integer.MAX_VALUE, java.util.Set.of(), false,
                "max(a, b, ...): the largest of the numbers", (a, span) -> extreme(a, 1)));
        r.register(Builtin.of("is_integer", 1, "is_integer(x): 1 when the number x is an integer, else 0",
                (a, span) -> truth(rational(a, 0, "is_integer").isInteger())));
        r.register(Builtin.of("at_least", 2, "at_least(a, b): 1 when the number a is at least b, else 0",
                (a, span) -> truth(rational(a, 0, "at_least").compareTo(rational(a, 1, "at_least")) >= 0)));
        r.register(Builtin.of("equal", 2, "equal(a, b): 1 when the two numbers are equal, else 0",
                (a, span) -> truth(rational(a, 0, "equal").equals(rational(a, 1, "equal")))));
        r.register(Builtin.of("length", 1, "length(list): the number of items of a list",
                (a, span) -> Values.of(list(a, 0, "length").size())));
        r.register(Builtin.of("item", 2, "item(list, n): the n-th item of a list, counting from 1",
                UtilityBuiltins::item));
        r.register(Builtin.of("index_of", 2, "index_of(list, x): the place of the number x in a list of numbers, counting from 1",
                UtilityBuiltins::indexOf));
        r.register(new Builtin("require", 2, Integer.MAX_VALUE, java.util.Set.of(), false,
                "require(test, \"message {}\", values...): 1 when test is 1; when it is 0 an error with the message"
                        + " (each {} replaced by the next value), reported at the caller's call",
                UtilityBuiltins::require));
    }

    private static Rational rational(Arguments a, int i, String name) {
        return Values.rational(a.get(i), a.spanOf(i), name + "'s argument");
    }

    private static ExprValue number(Rational r) {
        return new ExprValue(Values.constant(r));
    }

    private static ExprValue truth(boolean b) {
        return Values.of(b ? 1 : 0);
    }

    private static Value extreme(Arguments a, int sign) {
        Rational best = null;
        for (int i = 0; i < a.positional().size(); i++) {
            Rational r = rational(a, i, sign < 0 ? "min" : "max");
            if (best == null || r.compareTo(best) * sign > 0) {
                best = r;
            }
        }
        return number(best);
    }

    private static List<Value> list(Arguments a, int i, String name) {
        if (!(a.get(i) instanceof ListValue l)) {
            throw new ContourException(name + " needs a list, not " + Values.describe(a.get(i)), a.spanOf(i));
        }
        return l.items();
    }

    private static Value item(Arguments a, Span span) {
        List<Value> items = list(a, 0, "item");
        int n = Values.integer(a.get(1), a.spanOf(1), "the item's place");
        if (n < 1 || n > items.size()) {
            throw new ContourException("item " + n + " of a list of " + items.size() + " (places count from 1)", a.spanOf(1));
        }
        return items.get(n - 1);
    }

    private static Value indexOf(Arguments a, Span span) {
        List<Value> items = list(a, 0, "index_of");
        Rational x = rational(a, 1, "index_of");
        for (int i = 0; i < items.size(); i++) {
            if (items.get(i) instanceof ExprValue e && e.value().isConstant() && e.value().constantValue().equals(x)) {
                return Values.of(i + 1);
            }
        }
        throw new ContourException(x + " is not in the list " + Display.plain(a.get(0), false), a.spanOf(1));
    }

    private static Value require(Arguments a, Span span) {
        Rational test = rational(a, 0, "require");
        if (!(a.get(1) instanceof StringValue message)) {
            throw new ContourException("require: the second argument must be a message in quotes", a.spanOf(1));
        }
        if (test.equals(Rational.ONE)) {
            return Values.of(1);
        }
        if (!test.isZero()) {
            throw new ContourException("require: the test must be 1 or 0, not " + test, a.spanOf(0));
        }
        List<String> shown = new ArrayList<>();
        for (int i = 2; i < a.positional().size(); i++) {
            shown.add(Display.plain(a.get(i), false));
        }
        StringBuilder b = new StringBuilder();
        String text = message.value();
        int next = 0;
        for (int i = 0; i < text.length(); i++) {
            if (text.startsWith("{}", i) && next < shown.size()) {
                b.append(shown.get(next++));
                i++;
            } else {
                b.append(text.charAt(i));
            }
        }
        throw new CallerError(b.toString(), span);
    }
}
