package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;

/**
 * An error a library raises about its caller's input ({@code require}): the interpreter moves its
 * location outward through every user-defined function call, so it lands on the call the user wrote,
 * not on the line of the library that tested the input.
 */
public final class CallerError extends ContourException {
    public CallerError(String message, Span span) {
        super(message, span);
    }

    /** The same error, located at the call that led to it. */
    CallerError relocated(Span call) {
        CallerError moved = new CallerError(getMessage(), call);
        moved.setStackTrace(getStackTrace());
        return moved;
    }
}
