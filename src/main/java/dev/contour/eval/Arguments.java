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
        return only(ArgumentKind.POSITIONAL);
    }

    public List<Argument> named() {
        return only(ArgumentKind.NAMED);
    }

    public List<Argument> domains() {
        return only(ArgumentKind.DOMAIN);
    }

    // Called for every argument a built-in reads, inside sums over thousands of terms: a plain loop,
    // and the whole list when every argument is of the kind (the common case), not a stream each time.
    private List<Argument> only(ArgumentKind kind) {
        int n = 0;
        for (Argument a : all) {
            if (a.kind() == kind) {
                n++;
            }
        }
        if (n == all.size()) {
            return all;
        }
        if (n == 0) {
            return List.of();
        }
        List<Argument> out = new java.util.ArrayList<>(n);
        for (Argument a : all) {
            if (a.kind() == kind) {
                out.add(a);
            }
        }
        return java.util.Collections.unmodifiableList(out);
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
