package dev.contour.rewrite;

import dev.contour.Span;
import dev.contour.term.Term;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * A named one-way rewrite rule loaded from a rule file: left side, right side, guards, and the
 * span of the statement it came from (for traces and errors).
 */
public record Rule(String name, Pattern left, Pattern right, List<Guard> guards, Span span) {
    public Rule {
        guards = List.copyOf(guards);
    }

    /** Whether every guard holds under these bindings. */
    public boolean admits(Map<String, Term> bindings) {
        for (Guard g : guards) {
            if (!g.holds(bindings)) {
                return false;
            }
        }
        return true;
    }

    /** {@code gamma.ctr:12:1}: the file's own name, line and column, short enough for a trace line. */
    public String shortLocation() {
        String file = span.file();
        try {
            Path name = Path.of(file).getFileName();
            file = name == null ? file : name.toString();
        } catch (RuntimeException e) {
            // An odd file label is shown as it is.
        }
        return file + ":" + span.line() + ":" + span.column();
    }
}
