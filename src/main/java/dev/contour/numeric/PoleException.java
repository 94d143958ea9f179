package dev.contour.numeric;

import dev.contour.ContourException;
import org.apfloat.Apcomplex;

/** A function was evaluated at (or, to the working precision, indistinguishably near) one of its poles. */
final class PoleException extends ContourException {
    private final transient Apcomplex argument;

    PoleException(String message, Apcomplex argument) {
        super(message);
        this.argument = argument;
    }

    Apcomplex argument() {
        return argument;
    }
}
