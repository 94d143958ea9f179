package dev.contour.eval;

import dev.contour.algebra.Expression;

/** An exact rational value (numbers included): the common case, kept free of term trees. */
public record ExprValue(Expression value) implements Value {
    @Override
    public String kind() {
        return "expression";
    }
}
