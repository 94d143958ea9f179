package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;

/**
 * A named linear form in the Mellin variables, such as {@code s}, {@code t} or
 * {@code u = 4p - s - t}, along which poles are located and reported.
 */
public record NamedForm(String name, Polynomial form) {
    public NamedForm {
        if (name == null || form == null || form.totalDegree() != 1) {
            throw new ContourException("a pole form needs a name and a linear polynomial, got " + name + " = " + form);
        }
    }

    /** The form that is just the variable {@code name}. */
    public static NamedForm of(String name) {
        return new NamedForm(name, Polynomial.variable(name));
    }
}
