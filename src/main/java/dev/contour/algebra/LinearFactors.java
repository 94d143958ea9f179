package dev.contour.algebra;

import java.util.List;

/** Splitting a polynomial into its factors that are linear over Q (API CONTRACT skeleton). */
public final class LinearFactors {
    private LinearFactors() { }

    /**
     * p = unit * prod factor_i^multiplicity_i * cofactor, where each factor is a primitive linear
     * polynomial (total degree 1, integer coefficients, positive leading coefficient), pairwise
     * distinct, and the cofactor is primitive with no linear factor over Q.
     */
    public static Split split(Polynomial p) { throw Rational.todo(); }

    public record Factor(Polynomial base, int multiplicity) { }

    public record Split(Rational unit, List<Factor> factors, Polynomial cofactor) { }
}
