package dev.contour.mellin;

import dev.contour.algebra.Polynomial;

import java.util.Comparator;

/**
 * A pole along the hyperplane {@code factor = 0}, of the given order; when the factor is a named
 * form minus a constant the pole is also described as {@code form = location} (e.g. {@code u = 2}).
 *
 * @param form the name of the form the factor belongs to, or null for a general linear form
 * @param location the value of the form on the pole (null for a general form)
 * @param factor the canonical linear denominator factor
 * @param order the multiplicity of the factor
 */
public record Pole(String form, Polynomial location, Polynomial factor, int order) {
    /** Named forms first (alphabetically), numeric locations in increasing order, then the rest by text. */
    public static final Comparator<Pole> DISPLAY_ORDER = Comparator
            .comparing((Pole p) -> p.form() == null)
            .thenComparing(p -> p.form() == null ? "" : p.form())
            .thenComparing(p -> p.location() != null && p.location().isConstant() ? p.location().constantValue() : null,
                    Comparator.nullsLast(Comparator.naturalOrder()))
            .thenComparing(p -> String.valueOf(p.factor()));

    /** {@code "s = 2"}, or {@code "s + 2*t - 1 = 0"} for a general form. */
    public String describe() {
        return form != null ? form + " = " + location : factor + " = 0";
    }

    /** The same pole with another order. */
    public Pole withOrder(int k) {
        return new Pole(form, location, factor, k);
    }
}
