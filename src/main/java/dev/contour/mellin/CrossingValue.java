package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.eval.Arguments;
import dev.contour.eval.CallableValue;
import dev.contour.eval.ExprValue;
import dev.contour.eval.OperandValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.lang.Expr;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;

/**
 * A crossing map as a value: {@code C(M)} applies it, {@code C*D} composes (D first),
 * {@code C^n} is a power ({@code C^-1} the inverse).
 */
public record CrossingValue(CrossingMap map) implements CallableValue, OperandValue {
    @Override
    public String kind() {
        return "crossing map";
    }

    @Override
    public Value call(Arguments arguments, Span span) {
        if (arguments.all().size() != 1 || arguments.positional().size() != 1) {
            throw new ContourException("a crossing map applies to one amplitude: C(M)", span);
        }
        return new ExprValue(map.apply(arguments.expression(0)));
    }

    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        if (op == Expr.Operator.MULTIPLY && other instanceof CrossingValue c) {
            return new CrossingValue(thisOnLeft ? map.compose(c.map) : c.map.compose(map));
        }
        if (op == Expr.Operator.POWER && thisOnLeft && other instanceof ExprValue) {
            int n = Values.integer(other, span, "the power of a crossing map");
            CrossingMap base = n < 0 ? map.inverse() : map;
            CrossingMap r = CrossingMap.identity();
            for (int i = 0; i < Math.abs(n); i++) {
                r = r.compose(base);
            }
            return new CrossingValue(r);
        }
        return null;
    }

    @Override
    public Value negate(Span span) {
        throw new ContourException("a crossing map cannot be negated", span);
    }

    @Override
    public boolean isZero() {
        return false;
    }

    @Override
    public String render(OutputFormat format) {
        List<String> from = new ArrayList<>();
        List<String> to = new ArrayList<>();
        map.innerMap().forEach((v, x) -> {
            from.add(v);
            to.add(format == OutputFormat.LATEX ? LatexPrinter.polynomial(x) : PlainPrinter.polynomial(x));
        });
        map.collectedMap().forEach((v, x) -> {
            from.add(v);
            to.add(format == OutputFormat.LATEX ? LatexPrinter.expression(x, false) : PlainPrinter.expression(x, false));
        });
        return switch (format) {
            case PLAIN -> "crossing({" + String.join(", ", from) + "}, {" + String.join(", ", to) + "}, factor: "
                    + PlainPrinter.expression(map.prefactor(), false) + ")";
            case LATEX -> {
                List<String> parts = new ArrayList<>();
                for (int i = 0; i < from.size(); i++) {
                    String v = from.get(i);
                    String name = map.innerMap().containsKey(v) ? LatexPrinter.polynomial(dev.contour.algebra.Polynomial.variable(v))
                            : LatexPrinter.expression(dev.contour.algebra.Expression.collectedVariable(v), false);
                    parts.add(name + " \\mapsto " + to.get(i));
                }
                yield LatexPrinter.expression(map.prefactor(), false) + "\\, M\\big|_{" + String.join(",\\ ", parts) + "}";
            }
            case JSON -> {
                List<String> entries = new ArrayList<>();
                for (int i = 0; i < from.size(); i++) {
                    entries.add(JsonPrinter.string(from.get(i)) + ":" + JsonPrinter.string(to.get(i)));
                }
                yield "{\"kind\":\"crossing map\",\"map\":{" + String.join(",", entries) + "},\"factor\":"
                        + JsonPrinter.expression(map.prefactor()) + "}";
            }
        };
    }
}
