package dev.contour.numeric;

import org.apfloat.Apcomplex;

/**
 * A one-variable Mellin-Barnes integrand f(s), evaluated at points of the working precision.
 *
 * <p>Build it from {@link ComplexFunctions} (Gamma, powers, logarithms at the argument's precision);
 * inside an integration those functions are memoised, so Gamma factors of s repeated over the grid
 * are computed once.
 */
@FunctionalInterface
public interface Integrand1 {
    Apcomplex at(Apcomplex s);
}
