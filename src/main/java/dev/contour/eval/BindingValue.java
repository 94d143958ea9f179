package dev.contour.eval;

import dev.contour.Span;
import dev.contour.algebra.Expression;

/** A value that assigns values to unknowns, applied by {@code target with binding}. */
public interface BindingValue extends Value {
    /** The target with the binding applied. */
    Value applyTo(Value target, Span span);

    /** The binding with its free parameters fixed so that {@code member} (an unknown) equals {@code value}. */
    BindingValue normalized(Expression member, Value value, Span span);
}
