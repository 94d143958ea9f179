package dev.contour.eval;

import dev.contour.Span;
import dev.contour.algebra.Expression;
import java.util.Map;

/** A value kind that supports {@code value at (s = t, t = s)}. */
public interface SubstitutableValue extends Value {
    /** Simultaneous substitution of the given variables. */
    Value substitute(Map<String, Expression> values, Span span);
}
