package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;

/** A Gamma function of a linear form raised to a non-zero integer power, {@code Gamma(argument)^exponent}. */
public record GammaPower(Polynomial argument, int exponent) {
    public GammaPower {
        if (argument == null) {
            throw new ContourException("a Gamma factor needs an argument");
        }
        if (argument.totalDegree() > 1) {
            throw new ContourException("Gamma argument must be linear, got " + argument);
        }
    }

    /** The same Gamma function with the opposite power. */
    public GammaPower inverse() {
        return new GammaPower(argument, -exponent);
    }

    @Override
    public String toString() {
        return "Gamma(" + argument + ")" + (exponent == 1 ? "" : "^" + exponent);
    }
}
