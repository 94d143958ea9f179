package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.lang.Expr.ArgumentKind;
import java.util.List;
import java.util.Optional;

/** Evaluated call arguments, with helpers that report mistakes at the argument's span. */
public record Arguments(String function, List<Argument> all) {
    /** One evaluated argument: positional (name null), {@code name: value} or {@code name in value}. */
    public record Argument(ArgumentKind kind, String name, Value value, Span span) { }

    public Arguments {
        all = List.copyOf(all);
    }

    public List<Argument> positional() {
        return all.stream().filter(a -> a.kind() == ArgumentKind.POSITIONAL).toList();
    }

    public List<Argument> named() {
        return all.stream().filter(a -> a.kind() == ArgumentKind.NAMED).toList();
    }

    public List<Argument> domains() {
        return all.stream().filter(a -> a.kind() == ArgumentKind.DOMAIN).toList();
    }

    /** The i-th positional argument's value. */
    public Value get(int i) {
        return positional().get(i).value();
    }

    public Span spanOf(int i) {
        return positional().get(i).span();
    }

    public Optional<Argument> named(String name) {
        return named().stream().filter(a -> a.name().equals(name)).findFirst();
    }

    /** The i-th positional argument as an exact expression. */
    public Expression expression(int i) {
        return expressionValue(i).value();
    }

    /** The i-th positional argument as an expression value, not collected if it is an operator application. */
    public ExprValue expressionValue(int i) {
        Value v = get(i);
        if (v instanceof ExprValue e) {
            return e;
        }
        throw new ContourException(function + ": argument " + (i + 1) + " must be an expression, not a " + v.kind(), spanOf(i));
    }

    /** The i-th positional argument as an int. */
    public int integer(int i) {
        return Values.integer(get(i), spanOf(i), function + ": argument " + (i + 1));
    }
}
