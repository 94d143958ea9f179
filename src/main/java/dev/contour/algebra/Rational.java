package dev.contour.algebra;

import java.math.BigInteger;

/**
 * An exact rational number in lowest terms with a positive denominator.
 *
 * <p>API CONTRACT (skeleton): the algebra helper fills in the implementation; signatures are fixed
 * so that other packages can code against them. Machine-word fast path, BigInteger beyond it,
 * overflow always detected. Division by zero throws {@link dev.contour.ContourException}.
 */
public final class Rational implements Comparable<Rational> {
    public static final Rational ZERO = null;
    public static final Rational ONE = null;
    public static final Rational MINUS_ONE = null;

    private Rational() { }

    public static Rational of(long n) { throw todo(); }
    public static Rational of(long num, long den) { throw todo(); }
    public static Rational of(BigInteger n) { throw todo(); }
    public static Rational of(BigInteger num, BigInteger den) { throw todo(); }
    /** Parses {@code "-3"}, {@code "3/4"}, {@code "-12/5"}. */
    public static Rational parse(String text) { throw todo(); }

    public Rational add(Rational o) { throw todo(); }
    public Rational subtract(Rational o) { throw todo(); }
    public Rational multiply(Rational o) { throw todo(); }
    public Rational divide(Rational o) { throw todo(); }
    public Rational negate() { throw todo(); }
    public Rational inverse() { throw todo(); }
    public Rational pow(int exponent) { throw todo(); }
    public Rational abs() { throw todo(); }
    public int signum() { throw todo(); }
    public boolean isZero() { throw todo(); }
    public boolean isOne() { throw todo(); }
    public boolean isInteger() { throw todo(); }
    public BigInteger numerator() { throw todo(); }
    public BigInteger denominator() { throw todo(); }
    /** The value as an int, or a ContourException when it is not an integer fitting in an int. */
    public int intValueExact() { throw todo(); }
    public double doubleValue() { throw todo(); }

    @Override public int compareTo(Rational o) { throw todo(); }
    @Override public boolean equals(Object o) { throw todo(); }
    @Override public int hashCode() { throw todo(); }
    /** {@code "-3/4"} or {@code "5"}. */
    @Override public String toString() { throw todo(); }

    static UnsupportedOperationException todo() { return new UnsupportedOperationException("algebra: not yet implemented"); }
}
