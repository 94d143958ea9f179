package dev.contour.mellin;

import dev.contour.Span;
import dev.contour.eval.ExprValue;
import dev.contour.eval.OperandValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.lang.Expr;
import dev.contour.print.JsonPrinter;

import java.util.List;

/**
 * The findings of an analysis (poles outside the allowed set, non-polynomial residues, ...).
 *
 * <p>In arithmetic a report counts as its number of findings, so {@code check residue_check(M, m) == 0}
 * states "no findings" and a failure shows how many there are.
 */
public record ReportValue(String title, List<String> findings, String whenEmpty) implements OperandValue {
    public ReportValue {
        findings = List.copyOf(findings);
    }

    @Override
    public String kind() {
        return "report";
    }

    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        if (!(other instanceof ExprValue) || (op != Expr.Operator.ADD && op != Expr.Operator.SUBTRACT)) {
            return null;
        }
        ExprValue count = Values.of(findings.size());
        ExprValue x = (ExprValue) other;
        ExprValue left = thisOnLeft ? count : x;
        ExprValue right = thisOnLeft ? x : count;
        return new ExprValue(op == Expr.Operator.ADD ? left.value().add(right.value()) : left.value().subtract(right.value()));
    }

    @Override
    public Value negate(Span span) {
        return Values.of(-findings.size());
    }

    @Override
    public boolean isZero() {
        return findings.isEmpty();
    }

    @Override
    public String render(OutputFormat format) {
        if (format == OutputFormat.JSON) {
            return "{\"kind\":\"report\",\"title\":" + JsonPrinter.string(title) + ",\"findings\":["
                    + String.join(",", findings.stream().map(JsonPrinter::string).toList()) + "]}";
        }
        String prefix = format == OutputFormat.LATEX ? "% " : "";
        if (findings.isEmpty()) {
            return prefix + title + ": " + whenEmpty;
        }
        StringBuilder out = new StringBuilder(prefix + title + " (" + findings.size() + "):");
        findings.forEach(f -> out.append('\n').append(prefix).append("    ").append(f));
        return out.toString();
    }
}
