package dev.contour.calculus;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Derivatives;
import dev.contour.algebra.Expression;
import dev.contour.algebra.MonicRemainder;
import dev.contour.eval.Arguments;
import dev.contour.eval.Builtin;
import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.ExprValue;
import dev.contour.eval.ListValue;
import dev.contour.eval.StringValue;
import dev.contour.eval.Values;
import dev.contour.eval.Value;
import dev.contour.print.PlainPrinter;

/**
 * Built-ins for calculus on exact expressions: derivatives, Euler operators and the remainder
 * modulo a monic polynomial; found by the interpreter through {@link java.util.ServiceLoader}.
 */
public final class CalculusBuiltins implements BuiltinProvider {
    @Override
    public void register(BuiltinRegistry r) {
        r.register(Builtin.of("derivative", 2,
                "derivative(e, x): d e/dx of a rational expression, in an inner or a collected variable x",
                CalculusBuiltins::derivative));
        r.register(Builtin.of("euler_derivative", 2,
                "euler_derivative(e, x): x d e/dx, the Euler operator of any declared variable x",
                CalculusBuiltins::euler));
        r.register(Builtin.of("remainder", 3,
                "remainder(e, m, x): e modulo m, a polynomial in the collected variable x with leading coefficient 1",
                CalculusBuiltins::remainder));
        r.register(Builtin.of("degree", 2,
                "degree(e, {x, y}): the highest total degree of e in the chosen collected variables (0 for an expression free of them)",
                CalculusBuiltins::degree));
        r.register(Builtin.of("require_polynomial_in", 3,
                "require_polynomial_in(e, {x, y}, \"what\"): e when no power of the listed collected variables is negative, "
                        + "else an error naming what and the term",
                CalculusBuiltins::requirePolynomialIn));
        r.register(Builtin.of("require_number", 2,
                "require_number(x, \"what\"): x when it is a rational number, else an error naming what",
                CalculusBuiltins::requireNumber));
        r.register(Builtin.of("require_integer", 2,
                "require_integer(x, \"what\"): x when it is an integer >= 0, else an error naming what",
                CalculusBuiltins::requireInteger));
    }

    private static java.util.List<String> collectedList(Arguments a, int i) {
        if (!(a.get(i) instanceof ListValue names)) {
            throw new ContourException(a.function() + ": argument " + (i + 1) + " lists collected variables, such as {sigma, tau}",
                    a.spanOf(i));
        }
        java.util.List<String> chosen = new java.util.ArrayList<>();
        for (Value v : names.items()) {
            Expression x = v instanceof ExprValue ev ? ev.value() : null;
            if (x == null || x.collectedVariables().size() != 1 || !x.innerVariables().isEmpty()
                    || !x.equals(Expression.collectedVariable(x.collectedVariables().first()))) {
                throw new ContourException(a.function() + ": argument " + (i + 1) + " lists collected variables, such as {sigma, tau}",
                        a.spanOf(i));
            }
            chosen.add(x.collectedVariables().first());
        }
        return chosen;
    }

    private static Value requirePolynomialIn(Arguments a, Span span) {
        Expression e = rational(a, 0);
        java.util.List<String> chosen = collectedList(a, 1);
        if (!(a.get(2) instanceof StringValue what)) {
            throw new ContourException(a.function() + ": the third argument is a string naming the value", a.spanOf(2));
        }
        for (var m : e.terms().keySet()) {
            for (String v : chosen) {
                if (m.exponent(v) < 0) {
                    throw new ContourException(what.value() + " must be a polynomial in " + String.join(", ", chosen)
                            + ", but it has the power " + v + "^" + m.exponent(v), a.spanOf(0));
                }
            }
        }
        return a.get(0);
    }

    private static Value degree(Arguments a, Span span) {
        Expression e = rational(a, 0);
        java.util.List<String> chosen = collectedList(a, 1);
        if (e.isZero()) {
            throw new ContourException("degree: the expression is zero, which has no degree", a.spanOf(0));
        }
        int best = Integer.MIN_VALUE;
        for (var m : e.terms().keySet()) {
            int d = 0;
            for (String v : chosen) {
                d += m.exponent(v);
            }
            best = Math.max(best, d);
        }
        return Values.of(best);
    }

    private static Value requireNumber(Arguments a, Span span) {
        Value v = a.get(0);
        if (v instanceof ExprValue e && e.value().isConstant()) {
            return v;
        }
        throw new ContourException(what(a) + " must be a rational number such as 2 or 1/2, not " + describe(v), a.spanOf(0));
    }

    private static Value requireInteger(Arguments a, Span span) {
        Value v = a.get(0);
        if (v instanceof ExprValue e && e.value().isConstant() && e.value().constantValue().isInteger()
                && e.value().constantValue().signum() >= 0) {
            return v;
        }
        throw new ContourException(what(a) + " must be an integer >= 0, not " + describe(v), a.spanOf(0));
    }

    private static String what(Arguments a) {
        if (a.get(1) instanceof StringValue s) {
            return s.value();
        }
        throw new ContourException(a.function() + ": the second argument is a string naming the value", a.spanOf(1));
    }

    private static String describe(Value v) {
        return v instanceof ExprValue e ? PlainPrinter.expression(e.value(), false) : "a " + v.kind();
    }

    private static Value derivative(Arguments a, Span span) {
        String x = variableName(a, 1);
        return new ExprValue(Derivatives.derivative(rational(a, 0), x));
    }

    private static Value euler(Arguments a, Span span) {
        String x = variableName(a, 1);
        return new ExprValue(Derivatives.euler(rational(a, 0), x));
    }

    private static Value remainder(Arguments a, Span span) {
        String x = variableName(a, 2);
        Expression e = rational(a, 0);
        Expression m = rational(a, 1);
        if (!e.collectedVariables().contains(x) && e.innerVariables().contains(x)
                || !m.collectedVariables().contains(x) && m.innerVariables().contains(x)) {
            throw new ContourException("remainder: '" + x + "' must be a collected variable (vars " + x + " collected)", a.spanOf(2));
        }
        try {
            return new ExprValue(MonicRemainder.of(e, m, x));
        } catch (ContourException err) {
            String msg = err.getMessage();
            throw new ContourException(msg, msg.contains("modulus") ? a.spanOf(1) : a.spanOf(0));
        }
    }

    private static Expression rational(Arguments a, int i) {
        Value v = a.get(i);
        if (v instanceof ExprValue e) {
            return e.value();
        }
        throw new ContourException(a.function() + ": argument " + (i + 1) + " must be a rational expression, not a "
                + v.kind() + " (Gamma functions and other calls have no derivative here)", a.spanOf(i));
    }

    /** A declared variable written alone, inner or collected. */
    private static String variableName(Arguments a, int i) {
        Expression e = rational(a, i);
        if (e.innerVariables().size() == 1 && e.collectedVariables().isEmpty()
                && e.equals(Expression.variable(e.innerVariables().first()))) {
            return e.innerVariables().first();
        }
        if (e.collectedVariables().size() == 1 && e.innerVariables().isEmpty()
                && e.equals(Expression.collectedVariable(e.collectedVariables().first()))) {
            return e.collectedVariables().first();
        }
        throw new ContourException(a.function() + ": argument " + (i + 1) + " must be a variable such as s or chi, got "
                + PlainPrinter.expression(e, false), a.spanOf(i));
    }
}
