package dev.contour.algebra;

import java.util.List;
import java.util.Map;
import java.util.SortedSet;

/**
 * A canonical rational function num/den over Q (API CONTRACT skeleton).
 *
 * <p>Canonical form: numerator and denominator coprime; the denominator is kept as a product of
 * powers of pairwise coprime factors: primitive linear factors (integer coefficients, positive
 * leading coefficient, sorted) and at most one cofactor with no linear factor over Q; all rational
 * constants live in the numerator. Equal values have identical representations, so equals/hashCode
 * are structural. Every public operation returns a canonical value.
 */
public final class RationalFunction {
    public static final RationalFunction ZERO = null;
    public static final RationalFunction ONE = null;

    private RationalFunction() { }

    public static RationalFunction of(Polynomial p) { throw Rational.todo(); }
    /** num/den, cancelled and normalised; den = 0 throws ContourException. */
    public static RationalFunction of(Polynomial num, Polynomial den) { throw Rational.todo(); }
    public static RationalFunction constant(Rational c) { throw Rational.todo(); }
    public static RationalFunction constant(long c) { throw Rational.todo(); }
    public static RationalFunction variable(String name) { throw Rational.todo(); }

    public RationalFunction add(RationalFunction o) { throw Rational.todo(); }
    public RationalFunction subtract(RationalFunction o) { throw Rational.todo(); }
    public RationalFunction multiply(RationalFunction o) { throw Rational.todo(); }
    public RationalFunction multiply(Rational c) { throw Rational.todo(); }
    public RationalFunction divide(RationalFunction o) { throw Rational.todo(); }
    public RationalFunction negate() { throw Rational.todo(); }
    public RationalFunction inverse() { throw Rational.todo(); }
    /** Integer power, negative allowed (0^negative throws). */
    public RationalFunction pow(int exponent) { throw Rational.todo(); }

    /** Simultaneous substitution of rational functions for variables. */
    public RationalFunction substitute(Map<String, RationalFunction> values) { throw Rational.todo(); }
    /**
     * Simultaneous substitution of polynomials of total degree at most 1 (shifts s -> s - 2,
     * swaps s <-> t, t -> 4p - s - t). Linear denominator factors stay linear, so this path needs
     * no GCD in the common case.
     */
    public RationalFunction substituteLinear(Map<String, Polynomial> values) { throw Rational.todo(); }
    /** Value at a point; ContourException naming the factor when the point is a pole. */
    public Rational evaluate(Map<String, Rational> point) { throw Rational.todo(); }
    public RationalFunction evaluatePartially(Map<String, Rational> point) { throw Rational.todo(); }
    public RationalFunction derivative(String variable) { throw Rational.todo(); }

    public Polynomial numerator() { throw Rational.todo(); }
    /** The expanded denominator (product of the factors). */
    public Polynomial denominator() { throw Rational.todo(); }
    /** The denominator's factors with their exponents, in canonical order. */
    public List<LinearFactors.Factor> denominatorFactors() { throw Rational.todo(); }

    public boolean isZero() { throw Rational.todo(); }
    public boolean isOne() { throw Rational.todo(); }
    public boolean isPolynomial() { throw Rational.todo(); }
    public boolean isConstant() { throw Rational.todo(); }
    public Rational constantValue() { throw Rational.todo(); }
    public SortedSet<String> variables() { throw Rational.todo(); }
    /** Re-checks every canonical-form invariant from scratch (tests call it after each operation). */
    public boolean isCanonical() { throw Rational.todo(); }

    @Override public boolean equals(Object o) { throw Rational.todo(); }
    @Override public int hashCode() { throw Rational.todo(); }
    @Override public String toString() { throw Rational.todo(); }
}
