package dev.contour.eval;

import dev.contour.Span;
import dev.contour.lang.Expr;

/** A value kind that takes part in {@code + - * / ^} with other values. */
public interface OperandValue extends Value {
    /**
     * {@code this op other} when {@code thisOnLeft}, else {@code other op this}; null when this kind
     * does not combine with {@code other} that way (the evaluator then reports the mismatch).
     */
    Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span);

    /** {@code -this}. */
    Value negate(Span span);

    /** True when the value is zero (used by {@code check}). */
    boolean isZero();

    /**
     * True when the value is zero to the precision it claims: for exact kinds, exactly zero; for a
     * number known to some digits, when its magnitude is within its error bound. {@code check}
     * decides with this, so two numbers are equal when they agree to their stated precision.
     */
    default boolean isZeroToItsPrecision() {
        return isZero();
    }

    /**
     * For a value known to some precision: whether it and {@code other} agree within their combined
     * stated errors ({@code check} between numbers, or a number and an exact value, decides with
     * this). Null when this kind has no such notion or does not compare with other.
     */
    default Boolean agreesWith(Value other) {
        return null;
    }
}
