package dev.contour.algebra;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedSet;

/**
 * A sparse multivariate polynomial over Q in named variables, in a fixed monomial order that does
 * not depend on the order in which variables were first seen (so printed output is reproducible).
 *
 * <p>API CONTRACT (skeleton). Immutable; the zero polynomial has no terms.
 */
public final class Polynomial {
    public static final Polynomial ZERO = null;
    public static final Polynomial ONE = null;

    private Polynomial() { }

    public static Polynomial constant(Rational c) { throw Rational.todo(); }
    public static Polynomial constant(long c) { throw Rational.todo(); }
    public static Polynomial variable(String name) { throw Rational.todo(); }
    /** c * prod vars^exps; exponents non-negative. */
    public static Polynomial monomial(Rational c, Map<String, Integer> exponents) { throw Rational.todo(); }

    public Polynomial add(Polynomial o) { throw Rational.todo(); }
    public Polynomial subtract(Polynomial o) { throw Rational.todo(); }
    public Polynomial multiply(Polynomial o) { throw Rational.todo(); }
    public Polynomial multiply(Rational c) { throw Rational.todo(); }
    public Polynomial negate() { throw Rational.todo(); }
    public Polynomial pow(int exponent) { throw Rational.todo(); }
    /** this / d when d divides exactly; ContourException otherwise (and for d = 0). */
    public Polynomial divideExact(Polynomial d) { throw Rational.todo(); }
    /** this / d when d divides exactly, else empty. */
    public Optional<Polynomial> tryDivide(Polynomial d) { throw Rational.todo(); }

    /** Simultaneous substitution of polynomials for variables. */
    public Polynomial substitute(Map<String, Polynomial> values) { throw Rational.todo(); }
    /** Value at a point; every variable of this polynomial must be given. */
    public Rational evaluate(Map<String, Rational> point) { throw Rational.todo(); }
    /** Partial evaluation: the given variables replaced by numbers, the rest kept. */
    public Polynomial evaluatePartially(Map<String, Rational> point) { throw Rational.todo(); }
    public Polynomial derivative(String variable) { throw Rational.todo(); }

    public int degree(String variable) { throw Rational.todo(); }
    public int totalDegree() { throw Rational.todo(); }
    public SortedSet<String> variables() { throw Rational.todo(); }
    public int termCount() { throw Rational.todo(); }
    /** Terms in the canonical monomial order, leading term first. */
    public List<Term> terms() { throw Rational.todo(); }
    /** Coefficients with respect to the chosen variables: exponent list (same order as vars) to coefficient polynomial. */
    public Map<List<Integer>, Polynomial> coefficients(List<String> vars) { throw Rational.todo(); }
    /** Coefficient of variable^power, a polynomial in the other variables. */
    public Polynomial coefficient(String variable, int power) { throw Rational.todo(); }

    /** Positive rational content: gcd of numerators over lcm of denominators, sign of the leading term. */
    public Rational content() { throw Rational.todo(); }
    /** this / content(): integer coefficients with gcd 1 and positive leading coefficient. */
    public Polynomial primitivePart() { throw Rational.todo(); }
    public Rational leadingCoefficient() { throw Rational.todo(); }

    public boolean isZero() { throw Rational.todo(); }
    public boolean isConstant() { throw Rational.todo(); }
    public boolean isOne() { throw Rational.todo(); }
    /** The constant value; ContourException when not constant. */
    public Rational constantValue() { throw Rational.todo(); }

    @Override public boolean equals(Object o) { throw Rational.todo(); }
    @Override public int hashCode() { throw Rational.todo(); }
    /** A debugging form such as {@code 3*s^2*t - 1/2}; user-facing printing lives in print/. */
    @Override public String toString() { throw Rational.todo(); }

    /** One term: coefficient times prod variable^exponent (exponents > 0 only). */
    public record Term(Rational coefficient, Map<String, Integer> exponents) { }
}
