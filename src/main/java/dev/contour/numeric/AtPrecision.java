package dev.contour.numeric;

import org.apfloat.Apcomplex;

/**
 * A numeric expression that can be evaluated at any working precision (significant digits), so that
 * {@link SpecialFunctions#evaluate} can compare two precisions and report the digits that agree.
 */
@FunctionalInterface
public interface AtPrecision {
    Apcomplex at(long precision);
}
