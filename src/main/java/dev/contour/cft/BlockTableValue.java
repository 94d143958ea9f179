package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Rational;
import dev.contour.eval.ExprValue;
import dev.contour.eval.OperandValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.lang.Expr;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;

/**
 * A table of exact data by twist (or n) and spin as a value of the language: what {@code decompose}
 * returns and what entry-wise arithmetic ({@code 2*D1/D2}) and {@code data_table} make of it.
 */
public record BlockTableValue(BlockTable table) implements OperandValue {
    @Override
    public String kind() {
        return "block table";
    }

    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        char c = switch (op) {
            case ADD -> '+';
            case SUBTRACT -> '-';
            case MULTIPLY -> '*';
            case DIVIDE -> '/';
            default -> 0;
        };
        if (c == 0) {
            return null;
        }
        if (other instanceof BlockTableValue o) {
            return new BlockTableValue(thisOnLeft ? table.combine(o.table, c) : o.table.combine(table, c));
        }
        if (other instanceof ExprValue e && e.value().isConstant()) {
            return new BlockTableValue(table.combine(e.value().constantValue(), c, thisOnLeft));
        }
        return null;
    }

    @Override
    public Value negate(Span span) {
        return new BlockTableValue(table.combine(Rational.MINUS_ONE, '*', true));
    }

    @Override
    public boolean isZero() {
        return table.entries().values().stream().allMatch(Rational::isZero)
                && (table.residual() == null || table.residual().isZero());
    }

    @Override
    public String render(OutputFormat format) {
        return switch (format) {
            case PLAIN -> plain();
            case LATEX -> latex();
            case JSON -> json();
        };
    }

    private String cell(Integer t, Integer l, boolean latex) {
        Rational x = table.entries().get(List.of(t, l));
        if (x == null) {
            return latex ? "\\cdot" : ".";
        }
        return latex ? LatexPrinter.rational(x) : PlainPrinter.rational(x);
    }

    private String plain() {
        List<List<String>> rows = new ArrayList<>();
        List<String> head = new ArrayList<>();
        head.add(table.rowName() + " \\ spin");
        table.spins().forEach(l -> head.add(String.valueOf(l)));
        rows.add(head);
        for (int t : table.twists()) {
            List<String> r = new ArrayList<>();
            r.add(table.rowLabel(t));
            for (int l : table.spins()) {
                r.add(cell(t, l, false));
            }
            rows.add(r);
        }
        int cols = head.size();
        int[] width = new int[cols];
        for (List<String> r : rows) {
            for (int i = 0; i < cols; i++) {
                width[i] = Math.max(width[i], r.get(i).length());
            }
        }
        StringBuilder b = new StringBuilder(table.title() + " (" + table.twists().size() + " x " + table.spins().size() + "):");
        for (List<String> r : rows) {
            b.append("\n   ");
            for (int i = 0; i < cols; i++) {
                String x = r.get(i);
                b.append(i == 0 ? " " + " ".repeat(width[i] - x.length()) + x + " |" : "  " + " ".repeat(width[i] - x.length()) + x);
            }
        }
        if (table.residual() != null) {
            b.append("\n    residual: ").append(residualText());
        }
        return b.toString();
    }

    private String residualText() {
        DoubleSeries r = table.residual();
        if (r.isZero()) {
            return "0 to total degree " + r.order() + " (complete)";
        }
        List<DoubleSeries.Entry> terms = r.terms();
        DoubleSeries.Entry first = terms.get(0);
        return terms.size() + " non-zero terms to total degree " + r.order() + ", the lowest " + PlainPrinter.rational(first.coefficient())
                + "*z^" + first.i() + "*zbar^" + first.j();
    }

    private String latex() {
        StringBuilder b = new StringBuilder("\\begin{array}{r|" + "r".repeat(table.spins().size()) + "}\n");
        b.append(table.lowestTwist() == null ? "\\tau" : "n").append(" \\backslash \\ell");
        table.spins().forEach(l -> b.append(" & ").append(l));
        b.append(" \\\\ \\hline");
        for (int t : table.twists()) {
            b.append("\n").append(table.rowLabel(t));
            for (int l : table.spins()) {
                b.append(" & ").append(cell(t, l, true));
            }
            b.append(" \\\\");
        }
        return b.append("\n\\end{array}").toString();
    }

    private String json() {
        List<String> items = new ArrayList<>();
        for (int t : table.twists()) {
            for (int l : table.spins()) {
                Rational x = table.entries().get(List.of(t, l));
                if (x != null) {
                    items.add("{\"twist\":" + t + (table.lowestTwist() == null ? "" : ",\"n\":" + table.rowLabel(t)) + ",\"spin\":" + l
                            + ",\"value\":" + JsonPrinter.string(x.toString()) + "}");
                }
            }
        }
        String residual = table.residual() == null ? "" : ",\"residual_zero\":" + table.residual().isZero()
                + ",\"residual_order\":" + table.residual().order();
        return "{\"kind\":\"block table\",\"title\":" + JsonPrinter.string(table.title()) + residual + ",\"entries\":["
                + String.join(",", items) + "]}";
    }

    static BlockTableValue of(Value v, Span span, String what) {
        if (v instanceof BlockTableValue b) {
            return b;
        }
        throw new ContourException(what + " must be a block table (from decompose), not a " + v.kind(), span);
    }
}
