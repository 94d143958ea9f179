package dev.contour.lang;

import dev.contour.ContourException;
import dev.contour.Span;

/**
 * Renders an error the way every Contour tool shows it: {@code file:line:col: message}, then the
 * source line and a caret ({@code ^~~~}) under the place.
 */
public final class Diagnostic {
    private Diagnostic() { }

    /**
     * @param source the text of the span's file, or null when it is not at hand (then only the
     *               first line prints)
     */
    public static String render(ContourException e, String source) {
        Span span = e.span();
        String message = e.getMessage() == null ? "error" : e.getMessage();
        if (span == null || !span.isKnown()) {
            return (span == null ? "" : span.file() + ": ") + message + "\n";
        }
        StringBuilder out = new StringBuilder(span + ": " + message + "\n");
        String line = source == null ? null : line(source, span.line());
        if (line != null) {
            String shown = line.replace('\t', ' ');
            int col = Math.min(Math.max(1, span.column()), shown.length() + 1);
            int length = Math.max(1, Math.min(span.length(), shown.length() - col + 1));
            out.append("    ").append(shown).append('\n');
            out.append("    ").append(" ".repeat(col - 1)).append('^').append("~".repeat(length - 1)).append('\n');
        }
        return out.toString();
    }

    private static String line(String source, int number) {
        String[] lines = source.split("\r?\n", -1);
        return number >= 1 && number <= lines.length ? lines[number - 1] : null;
    }
}
