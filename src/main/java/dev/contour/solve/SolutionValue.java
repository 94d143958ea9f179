package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.eval.BindingValue;
import dev.contour.eval.ExprValue;
import dev.contour.eval.ListValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The language's view of a {@link Solution}: applied with {@code EXPR with sol}, shown by {@code show sol}.
 * Carries the solve's figures (null for a solution derived from another, such as a normalisation).
 */
public record SolutionValue(Solution solution, Figures figures) implements BindingValue {

    /** How large the system was and where the time went: building the equations, then solving them. */
    public record Figures(int unknowns, int equations, double buildSeconds, double solveSeconds) { }

    public SolutionValue(Solution solution) {
        this(solution, null);
    }

    @Override
    public String kind() {
        return "solution";
    }

    @Override
    public Value applyTo(Value target, Span span) {
        if (solution instanceof Solution.Inconsistent bad) {
            throw new ContourException("the solution is empty: " + conflictText(bad), span);
        }
        if (target instanceof ExprValue e) {
            // an operator application stays uncollected when the unknowns sit in its argument only
            var sum = e.shiftedSum().orElse(null);
            if (sum != null && sum.coefficientsFreeOf(Set.copyOf(solution.unknowns()))) {
                var moved = dev.contour.algebra.ShiftedSum.of(sum.blocks(), solution.substituteInto(sum.argument()));
                if (moved != null) {
                    return ExprValue.deferred(moved);
                }
            }
            return new ExprValue(solution.substituteInto(e.value()));
        }
        if (target instanceof ListValue l) {
            return new ListValue(l.items().stream().map(v -> applyTo(v, span)).toList());
        }
        if (target instanceof dev.contour.eval.UnknownFamilyValue family) {
            // every member's value, in the family's order
            return new ListValue(family.memberNames().stream()
                    .map(m -> (Value) new ExprValue(solution.substituteInto(Expression.collectedVariable(m)))).toList());
        }
        throw new ContourException("a solution applies to expressions, lists and unknown families, not to "
                + Values.describe(target), span);
    }

    @Override
    public BindingValue normalized(Expression member, Value value, Span span) {
        if (member.terms().size() != 1 || member.collectedVariables().size() != 1
                || member.terms().firstKey().totalDegree() != 1 || !member.terms().get(member.terms().firstKey()).isOne()) {
            throw new ContourException("normalized needs a single unknown on the left", span);
        }
        String name = member.collectedVariables().first();
        if (!solution.unknowns().contains(name)) {
            throw new ContourException(name + " is not one of the unknowns solved for", span);
        }
        Rational v = Values.rational(value, span, "the normalisation value");
        return new SolutionValue(solution.normalized(name, v, span));
    }

    /**
     * The reduced representative: when the target's directions along the free unknowns obey exact
     * relations, the free unknowns that only re-express the target are set to 0 before normalising.
     * That is only sound when the normalised unknown does not move along those relations (else the
     * normalisation would not fix the function): then it is an error naming the unknown.
     */
    @Override
    public BindingValue normalizedFor(Value target, Expression member, Value value, Span span) {
        if (!(solution instanceof Solution.Family fam) || !(target instanceof ExprValue e)) {
            return normalized(member, value, span);
        }
        FunctionRelations.Result rel = FunctionRelations.of(solution.substituteInto(e.value()), fam.free());
        if (rel.relations().isEmpty()) {
            return normalized(member, value, span);
        }
        normalized(member, value, span); // the usual checks on the named unknown
        String name = member.collectedVariables().first();
        List<Rational> row = fam.affine().get(fam.unknowns().indexOf(name));
        for (Map<String, Rational> r : rel.relations()) {
            Rational moved = Rational.ZERO;
            for (Map.Entry<String, Rational> x : r.entrySet()) {
                moved = moved.add(row.get(fam.free().indexOf(x.getKey()) + 1).multiply(x.getValue()));
            }
            if (!moved.isZero()) {
                int extra = fam.free().size() - rel.dimension();
                throw new ContourException("normalized: " + name + " changes while the function stays the same ("
                        + extra + " free unknown" + (extra == 1 ? " only re-expresses" : "s only re-express")
                        + " it), so fixing it does not fix the function; normalise by a coefficient of function_basis instead", span);
            }
        }
        return new SolutionValue(fam.keeping(rel.basis())).normalized(member, value, span);
    }

    @Override
    public String render(OutputFormat format) {
        if (solution instanceof Solution.Inconsistent bad && format != OutputFormat.JSON) {
            return format == OutputFormat.LATEX ? LatexPrinter.text("no solution: " + conflictText(bad)) : "no solution: " + conflictText(bad);
        }
        if (format == OutputFormat.JSON) {
            // {"kind":"solution","solution":"family","free":[...],"values":{"a[0]":<expression>,...}}
            StringBuilder b = new StringBuilder("{\"kind\":\"solution\",\"solution\":")
                    .append(JsonPrinter.string(solution.kind()));
            if (solution instanceof Solution.Inconsistent bad) {
                return b.append(",\"conflict\":").append(JsonPrinter.string(conflictText(bad))).append('}').toString();
            }
            List<String> free = solution instanceof Solution.Family f ? f.free() : List.of();
            b.append(",\"free\":[").append(String.join(",", free.stream().map(JsonPrinter::string).toList()))
                    .append("],\"values\":{");
            boolean first = true;
            for (Map.Entry<String, Expression> e : solution.assignments().entrySet()) {
                b.append(first ? "" : ",").append(JsonPrinter.string(e.getKey())).append(':')
                        .append(JsonPrinter.expression(e.getValue()));
                first = false;
            }
            return b.append("}}").toString();
        }
        if (format == OutputFormat.LATEX) {
            // one aligned row per unknown, ready to paste
            // a free unknown's own line (c = c) says nothing: the free ones are named once instead
            StringBuilder b = new StringBuilder("\\begin{aligned}\n");
            List<String> free = solution instanceof Solution.Family f ? f.free() : List.of();
            for (Map.Entry<String, Expression> e : solution.assignments().entrySet()) {
                if (free.contains(e.getKey()) && e.getValue().equals(Expression.collectedVariable(e.getKey()))) {
                    continue;
                }
                b.append("  ").append(LatexPrinter.expression(Expression.collectedVariable(e.getKey()), false))
                        .append(" &= ").append(LatexPrinter.expression(e.getValue(), false)).append(" \\\\\n");
            }
            if (!free.isEmpty()) {
                b.append("  ").append(LatexPrinter.text(free.size() == 1 ? "free:" : "free unknowns:")).append(" &\\quad ")
                        .append(String.join(",\\ ", free.stream().map(x -> LatexPrinter.expression(Expression.collectedVariable(x), false)).toList()))
                        .append(" \\\\\n");
            }
            return b.append("\\end{aligned}").toString();
        }
        StringBuilder b = new StringBuilder();
        if (solution instanceof Solution.Family f) {
            b.append("a family with ").append(f.dimension()).append(" free unknown").append(f.dimension() == 1 ? "" : "s")
                    .append(" (").append(String.join(", ", f.free())).append(")");
        } else {
            b.append("the unique solution");
        }
        b.append(", ").append(solution.unknowns().size()).append(" unknown").append(solution.unknowns().size() == 1 ? "" : "s");
        int width = solution.unknowns().stream().mapToInt(String::length).max().orElse(0);
        for (Map.Entry<String, Expression> e : solution.assignments().entrySet()) {
            b.append("\n    ").append(String.format("%-" + width + "s", e.getKey())).append(" = ")
                    .append(PlainPrinter.expression(e.getValue(), false));
        }
        return b.toString();
    }

    static String conflictText(Solution.Inconsistent bad) {
        // line numbers, or line:column where two conflicting conditions share a line
        boolean shared = bad.conflicting().stream().map(Span::line).distinct().count() < bad.conflicting().size();
        List<String> lines = bad.conflicting().stream()
                .map(s -> !s.isKnown() ? "?" : shared ? s.line() + ":" + s.column() : String.valueOf(s.line())).toList();
        return (lines.size() == 1 ? "the condition at line " + lines.get(0) + " is contradictory"
                : "the conditions at " + (shared ? "" : "lines ") + String.join(", ", lines) + " already conflict");
    }
}
