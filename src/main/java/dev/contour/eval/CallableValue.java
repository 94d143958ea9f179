package dev.contour.eval;

import dev.contour.Span;

/** A value that can be called: {@code f(x, y)}, {@code ward(p)(M)}. */
public interface CallableValue extends Value {
    Value call(Arguments arguments, Span span);
}
