package dev.contour.algebra;

/** Greatest common divisors of multivariate polynomials over Q (API CONTRACT skeleton). */
public final class PolynomialGcd {
    private PolynomialGcd() { }

    /** The gcd, primitive with positive leading coefficient; gcd(0, 0) = 0; correct for every input. */
    public static Polynomial gcd(Polynomial a, Polynomial b) { throw Rational.todo(); }
}
