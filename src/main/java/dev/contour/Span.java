package dev.contour;

/**
 * A place in a source file: 1-based line and column, and the length of the marked text.
 *
 * <p>Spans locate errors and rules; AST nodes carry them, but they never take part in the
 * equality of the nodes that carry them.
 */
public record Span(String file, int line, int column, int length) {
    /** A span for values that do not come from any source text. */
    public static final Span NONE = new Span("<none>", 0, 0, 0);

    public Span {
        if (file == null) {
            file = "<input>";
        }
        length = Math.max(length, 1);
    }

    public boolean isKnown() {
        return line > 0;
    }

    /** {@code file:line:col}, the prefix of every located error message. */
    @Override
    public String toString() {
        return file + ":" + line + ":" + column;
    }
}
