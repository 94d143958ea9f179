package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Plain, LaTeX and JSON forms of shift operators, with coefficients rendered by the expression
 * printers of dev.contour.print.
 *
 * <p>Plain text uses the language's own constructor, so a printed operator reads back as the same
 * value: {@code (s - 2)*shift(s: -2, t: 2) + sigma}. LaTeX writes the shift of v by a as
 * {@code \mathrm{E}_{v}^{a}}.
 */
public final class OperatorPrinter {
    private OperatorPrinter() { }

    public static String plain(ShiftOperator op, boolean factored) {
        if (op.isZero()) {
            return "0";
        }
        List<String> parts = new ArrayList<>();
        for (Map.Entry<Shift, Expression> e : op.terms().entrySet()) {
            String c = PlainPrinter.expression(e.getValue(), factored);
            if (e.getKey().isNone()) {
                parts.add(e.getValue().terms().size() > 1 ? "(" + c + ")" : c);
            } else {
                String sh = "shift(" + plainShift(e.getKey()) + ")";
                parts.add(e.getValue().equals(Expression.ONE) ? sh : "(" + c + ")*" + sh);
            }
        }
        return String.join(" + ", parts);
    }

    public static String latex(ShiftOperator op, boolean factored) {
        if (op.isZero()) {
            return "0";
        }
        List<String> parts = new ArrayList<>();
        for (Map.Entry<Shift, Expression> e : op.terms().entrySet()) {
            StringBuilder sh = new StringBuilder();
            e.getKey().amounts().forEach((v, a) -> sh.append("\\mathrm{E}_{").append(LatexPrinter.name(v)).append("}^{")
                    .append(LatexPrinter.rational(a)).append("}"));
            String c = LatexPrinter.expression(e.getValue(), factored);
            if (sh.length() == 0) {
                parts.add(c);
            } else {
                parts.add(e.getValue().equals(Expression.ONE) ? sh.toString() : "\\left(" + c + "\\right)" + sh);
            }
        }
        return String.join(" + ", parts);
    }

    public static String json(ShiftOperator op) {
        List<String> terms = new ArrayList<>();
        for (Map.Entry<Shift, Expression> e : op.terms().entrySet()) {
            List<String> amounts = new ArrayList<>();
            e.getKey().amounts().forEach((v, a) -> amounts.add(JsonPrinter.string(v) + ":" + JsonPrinter.string(a.toString())));
            terms.add("{\"shift\":{" + String.join(",", amounts) + "},\"coefficient\":" + JsonPrinter.expression(e.getValue()) + "}");
        }
        return "{\"kind\":\"shift operator\",\"terms\":[" + String.join(",", terms) + "]}";
    }

    private static String plainShift(Shift shift) {
        List<String> parts = new ArrayList<>();
        shift.amounts().forEach((v, a) -> parts.add(v + ": " + plainAmount(a)));
        return String.join(", ", parts);
    }

    private static String plainAmount(Rational a) {
        return a.isInteger() ? a.toString() : "(" + a + ")";
    }
}
