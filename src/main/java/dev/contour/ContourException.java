package dev.contour;

/**
 * The project's one error type: everything wrong with a user's input or computation surfaces as
 * this exception (or a subclass), never as a raw Java exception.
 *
 * <p>The span is optional: algebra code that knows nothing of sources throws without one, and the
 * evaluator attaches the span of the expression being evaluated with {@link #at(Span)}.
 */
public class ContourException extends RuntimeException {
    private final Span span;

    public ContourException(String message) {
        this(message, null, null);
    }

    public ContourException(String message, Span span) {
        this(message, span, null);
    }

    public ContourException(String message, Span span, Throwable cause) {
        super(message, cause);
        this.span = span;
    }

    /** The place in the source the error refers to, or {@code null} when unknown. */
    public Span span() {
        return span;
    }

    /** The same error located at {@code where}, unless it already has a location. */
    public ContourException at(Span where) {
        if (span != null && span.isKnown()) {
            return this;
        }
        ContourException located = new ContourException(getMessage(), where, this);
        located.setStackTrace(getStackTrace());
        return located;
    }
}
