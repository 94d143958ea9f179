package dev.contour.eval;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.RationalFunction;
import dev.contour.ContourException;
import dev.contour.lang.Stmt;
import dev.contour.print.CollectedView;
import dev.contour.print.FormView;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/** Lays out what {@code show} and {@code check} print, in the session's output format. */
final class Display {
    private final OutputFormat format;

    Display(OutputFormat format) {
        this.format = format;
    }

    String show(Stmt.Show sh, Value v, String context) {
        return show(sh, v, context, null);
    }

    /** As {@link #show(Stmt.Show, Value, String)}, with linear factors written through {@code forms} when not null. */
    String show(Stmt.Show sh, Value v, String context, List<FormView.Form> forms) {
        this.forms = forms;
        try {
            return showChecked(sh, v, context);
        } finally {
            this.forms = null;
        }
    }

    /** The named forms of the statement being shown ({@code show ... in m}), or null. */
    private List<FormView.Form> forms;

    private String showChecked(Stmt.Show sh, Value v, String context) {
        OutputFormat f = format;
        for (Stmt.ShowOption o : sh.options()) {
            if (o instanceof Stmt.As as) {
                f = OutputFormat.valueOf(as.format().toUpperCase(java.util.Locale.ROOT));
            }
        }
        if (format == OutputFormat.JSON && v instanceof StringValue) {
            f = OutputFormat.JSON; // a heading is text in any form
        }
        if (format != OutputFormat.JSON || f == OutputFormat.JSON) {
            return showIn(sh, v, context, f);
        }
        // a run printing JSON stays JSON: the text a statement asks for ('as latex') goes into a field
        String text = showIn(sh, v, context, f);
        if (f == OutputFormat.LATEX) {
            text = text.substring(text.indexOf('\n') + 1); // the "% label" line is the JSON "show" field
        }
        return "{\"show\":" + JsonPrinter.string(context + sh.label()) + (f == OutputFormat.LATEX ? ",\"latex\":" : ",\"text\":")
                + JsonPrinter.string(text.endsWith("\n") ? text.substring(0, text.length() - 1) : text) + "}\n";
    }

    /** The statement printed in format f. */
    private String showIn(Stmt.Show sh, Value v, String context, OutputFormat f) {
        boolean factored = false;
        List<String> collect = null;
        for (Stmt.ShowOption o : sh.options()) {
            if (o instanceof Stmt.Factored) {
                factored = true;
            } else if (o instanceof Stmt.CollectedBy c) {
                collect = c.variables();
            }
        }
        if (v instanceof StringValue s) {
            return f == OutputFormat.JSON ? "{\"show\":" + JsonPrinter.string(sh.label()) + ",\"text\":" + JsonPrinter.string(s.value()) + "}\n"
                    : (f == OutputFormat.LATEX ? "% " : "") + s.value() + "\n";
        }
        if (collect != null) {
            if (!(v instanceof ExprValue e)) {
                throw new ContourException("'collected' lays out rational expressions, not " + Values.describe(v), sh.span());
            }
            try {
                return collected(context + sh.label(), e.value(), collect, factored, f);
            } catch (ContourException x) {
                throw x.at(sh.span());
            }
        }
        String label = sh.label();
        boolean whole = sh.options().stream().anyMatch(o -> o instanceof Stmt.FactoredWhole);
        if ((whole || forms != null) && f != OutputFormat.JSON) {
            if (!(v instanceof ExprValue e)) {
                throw new ContourException("'factored whole' and 'in' lay out rational expressions, not " + Values.describe(v), sh.span());
            }
            List<FormView.Form> in = forms == null ? List.of() : forms;
            return f == OutputFormat.PLAIN ? context + label + " = " + FormView.plain(e.value(), in, whole) + "\n"
                    : "% " + context + label + "\n" + FormView.latex(e.value(), in, whole) + "\n";
        }
        return switch (f) {
            case PLAIN -> {
                String text = plain(v, factored);
                yield context + (text.equals(label) ? text : label + " = " + text) + "\n";
            }
            case LATEX -> "% " + context + label + "\n" + latex(v, factored) + "\n";
            case JSON -> "{\"show\":" + JsonPrinter.string(context + label) + ",\"value\":" + json(v) + "}\n";
        };
    }

    private String collected(String label, Expression e, List<String> vars, boolean factored, OutputFormat f) {
        List<CollectedView.Row> rows = CollectedView.of(e, vars);
        String by = String.join(", ", vars);
        switch (f) {
            case JSON -> {
                List<String> items = new ArrayList<>();
                for (CollectedView.Row r : rows) {
                    Map<String, Integer> exps = CollectedView.asMap(vars, r.exponents());
                    items.add("{\"monomial\":{" + exps.entrySet().stream().map(x -> JsonPrinter.string(x.getKey()) + ":" + x.getValue())
                            .collect(Collectors.joining(",")) + "},\"value\":" + JsonPrinter.expression(r.coefficient()) + "}");
                }
                return "{\"show\":" + JsonPrinter.string(label) + ",\"collected\":[" + vars.stream().map(JsonPrinter::string)
                        .collect(Collectors.joining(",")) + "],\"rows\":[" + String.join(",", items) + "]}\n";
            }
            case LATEX -> {
                StringBuilder out = new StringBuilder("% " + label + ", collected in " + by + "\n\\begin{aligned}\n");
                for (CollectedView.Row r : rows) {
                    Monomial m = Monomial.of(CollectedView.asMap(vars, r.exponents()));
                    out.append("  & ").append(LatexPrinter.monomial(m)).append(" &&: \\quad ")
                            .append(LatexPrinter.expression(r.coefficient(), factored)).append(" \\\\\n");
                }
                return out.append("\\end{aligned}\n").toString();
            }
            default -> {
                StringBuilder out = new StringBuilder(label + ", collected in " + by + " (" + rows.size()
                        + (rows.size() == 1 ? " term" : " terms") + "):\n");
                List<String> labels = new ArrayList<>();
                for (CollectedView.Row r : rows) {
                    labels.add(PlainPrinter.monomial(Monomial.of(CollectedView.asMap(vars, r.exponents()))));
                }
                int width = labels.stream().mapToInt(String::length).max().orElse(1);
                for (int i = 0; i < rows.size(); i++) {
                    out.append("    ").append(pad(labels.get(i), width)).append("  |  ")
                            .append(PlainPrinter.expression(rows.get(i).coefficient(), factored)).append('\n');
                }
                if (rows.isEmpty()) {
                    out.append("    0\n");
                }
                return out.toString();
            }
        }
    }

    String check(Stmt.Check c, CheckOutcome o, boolean oneLine, String context) {
        if (format == OutputFormat.JSON) {
            StringBuilder out = new StringBuilder("{\"check\":" + JsonPrinter.string(context + c.label()) + ",\"line\":" + c.span().line()
                    + ",\"ok\":" + o.holds());
            if (!o.holds() && o.firstDifference() != null) {
                out.append(",\"monomial\":").append(JsonPrinter.string(PlainPrinter.monomial(o.firstDifference())))
                        .append(",\"left\":").append(JsonPrinter.expression(Expression.of(o.leftCoefficient())))
                        .append(",\"right\":").append(JsonPrinter.expression(Expression.of(o.rightCoefficient())));
            }
            if (!o.holds() && o.point() != null) {
                out.append(",\"point\":{").append(o.point().entrySet().stream()
                                .map(x -> JsonPrinter.string(x.getKey()) + ":" + JsonPrinter.string(x.getValue().toString()))
                                .collect(Collectors.joining(",")))
                        .append("},\"leftAtPoint\":").append(JsonPrinter.string(o.leftAtPoint().toString()))
                        .append(",\"rightAtPoint\":").append(JsonPrinter.string(o.rightAtPoint().toString()));
            }
            return out.append("}\n").toString();
        }
        String prefix = format == OutputFormat.LATEX ? "% " : "";
        if (o.holds()) {
            return prefix + "check " + context + c.label() + "  ok\n";
        }
        // A check between constants has no point to name: its left and right values say it all.
        String at = o.point() == null || o.point().isEmpty() ? null : o.point().entrySet().stream()
                .map(x -> x.getKey() + " = " + x.getValue()).collect(Collectors.joining(", "));
        if (oneLine) {
            StringBuilder out = new StringBuilder(prefix + "check " + context + c.label() + "  FAILED");
            List<String> notes = new ArrayList<>();
            notes.add("line " + c.span().line());
            if (o.firstDifference() != null) {
                notes.add("coefficient of " + PlainPrinter.monomial(o.firstDifference()) + " differs");
            }
            if (at != null) {
                notes.add("at " + at + ": " + o.leftAtPoint() + " vs " + o.rightAtPoint());
            }
            if (!notes.isEmpty()) {
                out.append(" (").append(String.join("; ", notes)).append(")");
            }
            return out.append('\n').toString();
        }
        StringBuilder out = new StringBuilder(prefix + "check " + context + c.label() + "  FAILED (line " + c.span().line() + ")\n");
        if (o.firstDifference() != null) {
            out.append(prefix).append("    first difference, in the coefficient of ")
                    .append(PlainPrinter.monomial(o.firstDifference())).append(":\n");
            out.append(prefix).append("        left   ").append(rf(o.leftCoefficient())).append('\n');
            out.append(prefix).append("        right  ").append(rf(o.rightCoefficient())).append('\n');
        } else {
            out.append(prefix).append("    left   ").append(plain(o.left(), false)).append('\n');
            out.append(prefix).append("    right  ").append(plain(o.right(), false)).append('\n');
        }
        if (at != null) {
            out.append(prefix).append("    the sides differ at ").append(at).append(":\n");
            out.append(prefix).append("        left   ").append(o.leftAtPoint()).append('\n');
            out.append(prefix).append("        right  ").append(o.rightAtPoint()).append('\n');
        }
        return out.toString();
    }

    private static String rf(RationalFunction f) {
        return PlainPrinter.expression(Expression.of(f), false);
    }

    static String plain(Value v, boolean factored) {
        if (v instanceof ExprValue e) {
            return PlainPrinter.expression(e.value(), factored);
        }
        if (v instanceof TermValue t) {
            return PlainPrinter.term(t.value(), factored);
        }
        if (v instanceof StringValue s) {
            return "\"" + s.value().replace("\\", "\\\\").replace("\"", "\\\"").replace("\n", "\\n").replace("\t", "\\t") + "\"";
        }
        if (v instanceof RangeValue r) {
            return r.from() + ".." + r.to() + (r.step() == 1 ? "" : " step " + r.step());
        }
        if (v instanceof ListValue l) {
            return l.items().stream().map(x -> plain(x, factored)).collect(Collectors.joining(", ", "{", "}"));
        }
        if (v instanceof FunctionValue f) {
            return f.source();
        }
        if (v instanceof Builtin b) {
            return b.summary();
        }
        if (v instanceof UnknownFamilyValue u) {
            List<String> names = u.memberNames();
            String listed = names.size() <= 12 ? String.join(", ", names)
                    : String.join(", ", names.subList(0, 12)) + ", ...";
            return names.size() + (names.size() == 1 ? " unknown: " : " unknowns: ") + listed;
        }
        return v.render(OutputFormat.PLAIN, factored);
    }

    static String latex(Value v, boolean factored) {
        if (v instanceof ExprValue e) {
            return LatexPrinter.expression(e.value(), factored);
        }
        if (v instanceof TermValue t) {
            return LatexPrinter.term(t.value(), factored);
        }
        if (v instanceof ListValue l && l.items().stream().allMatch(x -> x instanceof ExprValue || x instanceof TermValue
                || x instanceof ListValue)) {
            return l.items().stream().map(x -> latex(x, factored))
                    .collect(Collectors.joining(", ", "\\left\\{", "\\right\\}"));
        }
        return isCore(v) ? LatexPrinter.text(plain(v, factored)) : v.render(OutputFormat.LATEX, factored);
    }

    private static String json(Value v) {
        if (v instanceof ExprValue e) {
            return JsonPrinter.expression(e.value());
        }
        if (v instanceof TermValue t) {
            return JsonPrinter.term(t.value());
        }
        if (v instanceof ListValue l && l.items().stream().allMatch(x -> x instanceof ExprValue || x instanceof TermValue
                || x instanceof ListValue)) {
            return l.items().stream().map(Display::json).collect(Collectors.joining(",", "{\"kind\":\"list\",\"items\":[", "]}"));
        }
        if (isCore(v)) {
            return "{\"kind\":" + JsonPrinter.string(v.kind()) + ",\"text\":" + JsonPrinter.string(plain(v, false)) + "}";
        }
        return v.render(OutputFormat.JSON);
    }

    private static boolean isCore(Value v) {
        return v instanceof StringValue || v instanceof RangeValue || v instanceof ListValue || v instanceof FunctionValue
                || v instanceof Builtin || v instanceof UnknownFamilyValue;
    }

    /** The value as script text that evaluates back to it, or null when there is none. */
    String scriptText(Value v) {
        return hasScriptForm(v) ? plain(v, false) : null;
    }

    /** Whether {@link #scriptText} gives text for the value (decided without rendering it). */
    static boolean hasScriptForm(Value v) {
        if (v instanceof ExprValue || v instanceof TermValue || v instanceof StringValue || v instanceof RangeValue) {
            return true;
        }
        return v instanceof ListValue l && l.items().stream().allMatch(Display::hasScriptForm);
    }

    private static String pad(String s, int width) {
        return s + " ".repeat(Math.max(0, width - s.length()));
    }

}
