package dev.contour.algebra;

import java.util.Map;
import java.util.SortedMap;
import java.util.SortedSet;

/**
 * The exact value of the language: a Laurent polynomial in <em>collected</em> variables whose
 * coefficients are canonical rational functions in the other (<em>inner</em>) variables
 * (API CONTRACT skeleton).
 *
 * <p>Why: Mellin amplitudes are polynomials in the R-symmetry cross ratios sigma, tau (and linear in
 * unknown ansatz coefficients a[i,j,k]) whose coefficients are rational functions of s, t with small
 * factored denominators. Over one common denominator they explode (p = 128 has ~8000 sigma-tau
 * monomials each with its own denominator); collected, each coefficient stays small.
 *
 * <p>Whether a variable is collected is fixed when it is made: {@link #collectedVariable} versus
 * {@link #variable}. When an operation meets a name that is collected in one operand and inner in
 * the other, the inner occurrence is expanded as a polynomial in it (a ContourException if it sits
 * in a denominator). Division by an expression with collected variables is allowed only when it is a
 * single monomial (Laurent). No zero coefficients are stored; equal values have identical
 * representations.
 */
public final class Expression {
    public static final Expression ZERO = null;
    public static final Expression ONE = null;

    private Expression() { }

    public static Expression constant(Rational c) { throw Rational.todo(); }
    public static Expression constant(long c) { throw Rational.todo(); }
    public static Expression of(RationalFunction f) { throw Rational.todo(); }
    /** An inner variable: may appear in denominators. */
    public static Expression variable(String name) { throw Rational.todo(); }
    /** A collected variable: kept as a Laurent monomial (sigma, tau, unknowns). */
    public static Expression collectedVariable(String name) { throw Rational.todo(); }
    /** The sum of coefficient * monomial over the map's entries (zero coefficients dropped). */
    public static Expression of(Map<Monomial, RationalFunction> terms) { throw Rational.todo(); }

    public Expression add(Expression o) { throw Rational.todo(); }
    public Expression subtract(Expression o) { throw Rational.todo(); }
    public Expression multiply(Expression o) { throw Rational.todo(); }
    public Expression multiply(RationalFunction c) { throw Rational.todo(); }
    public Expression negate() { throw Rational.todo(); }
    /** Division; the divisor must be free of collected variables or a single monomial. */
    public Expression divide(Expression o) { throw Rational.todo(); }
    public Expression pow(int exponent) { throw Rational.todo(); }

    /** Simultaneous substitution for inner and collected variables. */
    public Expression substitute(Map<String, Expression> values) { throw Rational.todo(); }
    /** Linear substitution of inner variables (shifts, swaps, t -> 4p - s - t): the fast path. */
    public Expression substituteLinear(Map<String, Polynomial> values) { throw Rational.todo(); }
    /** Inner variables replaced by numbers; collected structure kept. */
    public Expression evaluatePartially(Map<String, Rational> point) { throw Rational.todo(); }

    /** Terms in canonical order: monomial in collected variables to its coefficient. */
    public SortedMap<Monomial, RationalFunction> terms() { throw Rational.todo(); }
    public RationalFunction coefficient(Monomial m) { throw Rational.todo(); }
    public SortedSet<String> collectedVariables() { throw Rational.todo(); }
    public SortedSet<String> innerVariables() { throw Rational.todo(); }
    public boolean isZero() { throw Rational.todo(); }
    /** True when no collected variable occurs. */
    public boolean isRational() { throw Rational.todo(); }
    /** The value as one rational function; ContourException if a collected variable occurs. */
    public RationalFunction asRationalFunction() { throw Rational.todo(); }
    public boolean isConstant() { throw Rational.todo(); }
    public Rational constantValue() { throw Rational.todo(); }
    public boolean isCanonical() { throw Rational.todo(); }

    @Override public boolean equals(Object o) { throw Rational.todo(); }
    @Override public int hashCode() { throw Rational.todo(); }
    @Override public String toString() { throw Rational.todo(); }
}
