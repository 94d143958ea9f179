package dev.contour.eval;

import dev.contour.Span;
import dev.contour.algebra.Expression;

/** A value that assigns values to unknowns, applied by {@code target with binding}. */
public interface BindingValue extends Value {
    /** The target with the binding applied. */
    Value applyTo(Value target, Span span);

    /** The binding with its free parameters fixed so that {@code member} (an unknown) equals {@code value}. */
    BindingValue normalized(Expression member, Value value, Span span);

    /**
     * As {@link #normalized}, knowing the target it will be applied to (a binding may first drop
     * free parameters that do not change the target).
     */
    default BindingValue normalizedFor(Value target, Expression member, Value value, Span span) {
        return normalized(member, value, span);
    }
}
