package dev.contour.eval;

import dev.contour.term.Term;

/** A normalised symbolic value that is not rational (it contains Gamma functions or other calls). */
public record TermValue(Term value) implements Value {
    @Override
    public String kind() {
        return "symbolic term";
    }
}
