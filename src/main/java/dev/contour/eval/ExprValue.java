package dev.contour.eval;

import dev.contour.algebra.Expression;
import dev.contour.algebra.ShiftedSum;
import java.util.Optional;

/**
 * An exact rational value (numbers included): the common case, kept free of term trees.
 *
 * <p>A value made by applying a shift operator may be held as a {@link ShiftedSum} and collected
 * only when first asked for ({@link #value()}); the solver reads the unexpanded form instead (see
 * {@link #shiftedSum()}), which keeps large ansatze factored. Equality is that of the values.
 */
public final class ExprValue implements Value {
    private final Expression value;
    private final ShiftedSum deferred;

    public ExprValue(Expression value) {
        this.value = java.util.Objects.requireNonNull(value);
        this.deferred = null;
    }

    private ExprValue(ShiftedSum deferred) {
        this.value = null;
        this.deferred = deferred;
    }

    /** The value of an operator application, collected on first use. */
    public static ExprValue deferred(ShiftedSum sum) {
        return new ExprValue(java.util.Objects.requireNonNull(sum));
    }

    /** The collected value (computing it now if it was deferred). */
    public Expression value() {
        return value != null ? value : deferred.value();
    }

    /** The inner variables of the value, read off an operator application without collecting it. */
    public java.util.SortedSet<String> innerVariables() {
        return value != null ? value.innerVariables() : deferred.innerVariables();
    }

    /** The unexpanded operator application, when this value is one. */
    public Optional<ShiftedSum> shiftedSum() {
        return Optional.ofNullable(deferred);
    }

    @Override
    public String kind() {
        return "expression";
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ExprValue e && value().equals(e.value());
    }

    @Override
    public int hashCode() {
        return value().hashCode();
    }

    @Override
    public String toString() {
        return "ExprValue[" + value() + "]";
    }
}
