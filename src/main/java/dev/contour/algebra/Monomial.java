package dev.contour.algebra;

import java.util.SortedMap;

/**
 * A Laurent monomial in collected variables: variable name to a non-zero integer exponent
 * (API CONTRACT skeleton). Immutable; ordered canonically (Comparable) independent of creation order.
 */
public final class Monomial implements Comparable<Monomial> {
    public static final Monomial ONE = null;

    private Monomial() { }

    public static Monomial of(String variable, int exponent) { throw Rational.todo(); }
    public static Monomial of(java.util.Map<String, Integer> exponents) { throw Rational.todo(); }

    public Monomial multiply(Monomial o) { throw Rational.todo(); }
    public Monomial pow(int e) { throw Rational.todo(); }
    public Monomial inverse() { throw Rational.todo(); }
    public int exponent(String variable) { throw Rational.todo(); }
    public SortedMap<String, Integer> exponents() { throw Rational.todo(); }
    public int totalDegree() { throw Rational.todo(); }
    public boolean isOne() { throw Rational.todo(); }

    @Override public int compareTo(Monomial o) { throw Rational.todo(); }
    @Override public boolean equals(Object o) { throw Rational.todo(); }
    @Override public int hashCode() { throw Rational.todo(); }
    @Override public String toString() { throw Rational.todo(); }
}
