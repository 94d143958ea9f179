package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.Collections;
import java.util.HashMap;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A position-space operator: a polynomial in U, V, {@code U d/dU} and {@code V d/dV} (Laurent in U
 * and V) with coefficients free of U and V, such as sigma and tau.
 *
 * <p>Kept in normal order {@code U^m V^n (U d/dU)^j (V d/dV)^k}, derivatives acting first; products
 * re-order with {@code (U d/dU) U^m = U^m (U d/dU + m)}, so equal operators have equal terms.
 */
public final class PositionOperator {
    /** One normal-ordered word {@code U^m V^n (U d/dU)^j (V d/dV)^k}. */
    public record Word(int m, int n, int j, int k) implements Comparable<Word> {
        public Word {
            if (j < 0 || k < 0) {
                throw new ContourException("derivative powers must be >= 0");
            }
        }

        @Override
        public int compareTo(Word o) {
            int c = Integer.compare(m, o.m);
            c = c != 0 ? c : Integer.compare(n, o.n);
            c = c != 0 ? c : Integer.compare(j, o.j);
            return c != 0 ? c : Integer.compare(k, o.k);
        }
    }

    private final SortedMap<Word, Expression> terms;

    private PositionOperator(TreeMap<Word, Expression> terms) {
        terms.values().removeIf(Expression::isZero);
        this.terms = Collections.unmodifiableSortedMap(terms);
    }

    /** The operator {@code coefficient * word}. */
    public static PositionOperator of(Word word, Expression coefficient) {
        TreeMap<Word, Expression> t = new TreeMap<>();
        t.put(word, coefficient);
        return new PositionOperator(t);
    }

    public static PositionOperator constant(Expression c) {
        return of(new Word(0, 0, 0, 0), c);
    }

    /** Multiplication by U. */
    public static PositionOperator u() {
        return of(new Word(1, 0, 0, 0), Expression.ONE);
    }

    /** Multiplication by V. */
    public static PositionOperator v() {
        return of(new Word(0, 1, 0, 0), Expression.ONE);
    }

    /** The Euler operator {@code U d/dU}. */
    public static PositionOperator uDerivative() {
        return of(new Word(0, 0, 1, 0), Expression.ONE);
    }

    /** The Euler operator {@code V d/dV}. */
    public static PositionOperator vDerivative() {
        return of(new Word(0, 0, 0, 1), Expression.ONE);
    }

    /**
     * Multiplication by {@code f}, a Laurent polynomial in the collected variables {@code uName} and
     * {@code vName} (for example the factor R of a Ward identity); the other collected variables
     * stay in the coefficients.
     */
    public static PositionOperator multiplication(Expression f, String uName, String vName) {
        for (String inner : f.innerVariables()) {
            if (inner.equals(uName) || inner.equals(vName)) {
                throw new ContourException("'" + inner + "' must be a collected variable to build a position-space operator");
            }
        }
        Map<Word, Map<Monomial, RationalFunction>> split = new HashMap<>();
        f.terms().forEach((mono, c) -> {
            Map<String, Integer> rest = new HashMap<>(mono.exponents());
            Integer m = rest.remove(uName);
            Integer n = rest.remove(vName);
            Word w = new Word(m == null ? 0 : m, n == null ? 0 : n, 0, 0);
            split.computeIfAbsent(w, k -> new HashMap<>()).merge(Collect.monomial(rest), c, RationalFunction::add);
        });
        TreeMap<Word, Expression> t = new TreeMap<>();
        split.forEach((w, m) -> t.put(w, Expression.of(m)));
        return new PositionOperator(t);
    }

    public SortedMap<Word, Expression> terms() {
        return terms;
    }

    public boolean isZero() {
        return terms.isEmpty();
    }

    public PositionOperator add(PositionOperator o) {
        TreeMap<Word, Expression> t = new TreeMap<>(terms);
        o.terms.forEach((w, c) -> t.merge(w, c, Expression::add));
        return new PositionOperator(t);
    }

    public PositionOperator multiply(Expression c) {
        TreeMap<Word, Expression> t = new TreeMap<>();
        terms.forEach((w, x) -> t.put(w, c.multiply(x)));
        return new PositionOperator(t);
    }

    /** The composition {@code this * o} ({@code o} acts first), brought back to normal order. */
    public PositionOperator multiply(PositionOperator o) {
        TreeMap<Word, Expression> t = new TreeMap<>();
        for (Map.Entry<Word, Expression> a : terms.entrySet()) {
            Word x = a.getKey();
            for (Map.Entry<Word, Expression> b : o.terms.entrySet()) {
                Word y = b.getKey();
                Expression c = a.getValue().multiply(b.getValue());
                // (U d/dU)^j U^m = U^m (U d/dU + m)^j, expanded binomially; likewise for V.
                Rational[] du = binomialRow(x.j(), y.m());
                Rational[] dv = binomialRow(x.k(), y.n());
                for (int i = 0; i < du.length; i++) {
                    for (int l = 0; l < dv.length; l++) {
                        Rational w = du[i].multiply(dv[l]);
                        if (!w.isZero()) {
                            t.merge(new Word(x.m() + y.m(), x.n() + y.n(), i + y.j(), l + y.k()),
                                    c.multiply(Expression.constant(w)), Expression::add);
                        }
                    }
                }
            }
        }
        return new PositionOperator(t);
    }

    /** The n-fold product (n >= 0). */
    public PositionOperator pow(int n) {
        if (n < 0) {
            throw new ContourException("a position-space operator can only be raised to a power >= 0, not " + n);
        }
        PositionOperator r = constant(Expression.ONE);
        for (int i = 0; i < n; i++) {
            r = r.multiply(this);
        }
        return r;
    }

    /** Coefficients of {@code (D + m)^j = sum_i C(j, i) m^(j-i) D^i}. */
    private static Rational[] binomialRow(int j, int m) {
        Rational[] row = new Rational[j + 1];
        Rational binom = Rational.ONE;
        for (int i = 0; i <= j; i++) {
            row[i] = j == i ? binom : binom.multiply(Rational.of(m).pow(j - i));
            binom = binom.multiply(Rational.of(j - i, i + 1));
        }
        return row;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof PositionOperator p && terms.equals(p.terms);
    }

    @Override
    public int hashCode() {
        return terms.hashCode();
    }

    @Override
    public String toString() {
        return terms.toString();
    }
}
