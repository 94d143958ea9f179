package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
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
import java.util.Map;
import java.util.TreeMap;

/**
 * A position-space operator as a value of the language: a polynomial in the cross ratios (named
 * {@code u} and {@code v}, U and V by default) and their Euler operators {@code euler(U) = U d/dU},
 * {@code euler(V) = V d/dV}, with coefficients such as sigma and tau. Made by {@code euler(U)};
 * {@code *} composes in written order (the right factor acts first), so
 * {@code euler(U)*U == U*euler(U) + U}; {@code mellin(X, from: m1, to: m2)} translates it.
 */
public record PositionOperatorValue(PositionOperator operator, String u, String v) implements OperandValue {
    @Override
    public String kind() {
        return "position operator";
    }

    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        PositionOperator o;
        if (other instanceof PositionOperatorValue p) {
            if (!p.u.equals(u) || !p.v.equals(v)) {
                throw new ContourException("these position operators use different cross ratios: {" + u + ", " + v
                        + "} and {" + p.u + ", " + p.v + "}", span);
            }
            o = p.operator;
        } else if (other instanceof ExprValue e) {
            o = multiplication(e.value(), span);
        } else {
            return null;
        }
        PositionOperator left = thisOnLeft ? operator : o;
        PositionOperator right = thisOnLeft ? o : operator;
        return switch (op) {
            case ADD -> with(left.add(right));
            case SUBTRACT -> with(left.add(right.multiply(Expression.constant(-1))));
            case MULTIPLY -> with(left.multiply(right));
            case DIVIDE -> {
                if (thisOnLeft && other instanceof ExprValue e && e.value().isConstant() && !e.value().isZero()) {
                    yield with(operator.multiply(Expression.ONE.divide(e.value())));
                }
                throw new ContourException("a position operator divides only by a non-zero number", span);
            }
            case POWER -> {
                if (!thisOnLeft || !(other instanceof ExprValue)) {
                    throw new ContourException("only a position operator can be raised to a power, by an integer >= 0", span);
                }
                int n = Values.integer(other, span, "the power of a position operator");
                if (n < 0) {
                    throw new ContourException("a position operator can only be raised to a power >= 0, not " + n, span);
                }
                yield with(operator.pow(n));
            }
        };
    }

    /** Multiplication by {@code f}, a Laurent polynomial in the two cross ratios. */
    private PositionOperator multiplication(Expression f, Span span) {
        for (String name : f.innerVariables()) {
            if (name.equals(u) || name.equals(v)) {
                throw new ContourException("'" + name + "' must be a collected variable (vars " + u + ", " + v
                        + " collected) to take part in a position operator", span);
            }
        }
        return PositionOperator.multiplication(f, u, v);
    }

    private PositionOperatorValue with(PositionOperator p) {
        return new PositionOperatorValue(p, u, v);
    }

    @Override
    public Value negate(Span span) {
        return with(operator.multiply(Expression.constant(-1)));
    }

    @Override
    public boolean isZero() {
        return operator.isZero();
    }

    /** The terms grouped by their Euler powers {j, k}: (sum of c U^m V^n) (U d/dU)^j (V d/dV)^k. */
    private Map<List<Integer>, Expression> grouped() {
        Map<List<Integer>, Expression> out = new TreeMap<>((a, b) -> a.get(0).equals(b.get(0))
                ? Integer.compare(a.get(1), b.get(1)) : Integer.compare(a.get(0), b.get(0)));
        operator.terms().forEach((w, c) -> {
            Expression x = c.multiply(Expression.collectedVariable(u).pow(w.m()))
                    .multiply(Expression.collectedVariable(v).pow(w.n()));
            out.merge(List.of(w.j(), w.k()), x, Expression::add);
        });
        return out;
    }

    @Override
    public String render(OutputFormat format) {
        return render(format, false);
    }

    @Override
    public String render(OutputFormat format, boolean factored) {
        if (format == OutputFormat.JSON) {
            List<String> terms = new ArrayList<>();
            grouped().forEach((jk, c) -> terms.add("{\"euler\":{" + JsonPrinter.string(u) + ":" + jk.get(0) + ","
                    + JsonPrinter.string(v) + ":" + jk.get(1) + "},\"coefficient\":" + JsonPrinter.expression(c) + "}"));
            return "{\"kind\":\"position operator\",\"cross\":[" + JsonPrinter.string(u) + "," + JsonPrinter.string(v)
                    + "],\"terms\":[" + String.join(",", terms) + "]}";
        }
        if (operator.isZero()) {
            return "0";
        }
        boolean latex = format == OutputFormat.LATEX;
        StringBuilder out = new StringBuilder();
        grouped().forEach((jk, c) -> {
            String ops = euler(u, jk.get(0), latex) + euler(v, jk.get(1), latex);
            String coefficient = latex ? LatexPrinter.expression(c, factored) : PlainPrinter.expression(c, factored);
            String part;
            if (ops.isEmpty()) {
                part = (coefficient);
            } else if (c.equals(Expression.ONE)) {
                part = (latex ? ops : ops.substring(1));
            } else if (latex) {
                part = ((c.terms().size() > 1 ? "\\left(" + coefficient + "\\right)" : coefficient) + " " + ops);
            } else {
                part = ((c.terms().size() > 1 ? "(" + coefficient + ")" : coefficient) + ops);
            }
            // a single negative term joins with ' - ': -U - U*euler(U), not -U + -U*euler(U)
            boolean minus = out.length() > 0 && c.terms().size() == 1 && part.startsWith("-");
            out.append(out.length() == 0 ? "" : minus ? " - " : " + ").append(minus ? part.substring(1) : part);
        });
        return out.toString();
    }

    /** The factor (x d/dx)^n: {@code *euler(U)^2} in plain text, {@code (U\partial_{U})^{2}} in LaTeX. */
    private String euler(String x, int n, boolean latex) {
        if (n == 0) {
            return "";
        }
        if (latex) {
            String name = LatexPrinter.name(x);
            return "\\left(" + name + "\\,\\partial_{" + name + "}\\right)" + (n == 1 ? "" : "^{" + n + "}");
        }
        String call = u.equals("U") && v.equals("V") ? "euler(" + x + ")" : "euler(" + x + ", cross: {" + u + ", " + v + "})";
        return "*" + call + (n == 1 ? "" : "^" + n);
    }
}
