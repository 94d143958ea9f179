package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.algebra.ShiftedSum;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A difference operator: a finite sum of {@link Expression} coefficients times {@link Shift}s,
 * acting as {@code (c * E) f = c * f(shifted)}.
 *
 * <p>Products are compositions and obey the commutation rule {@code E * f = f(shifted) * E}, so
 * every operator is kept in the normal form "coefficients on the left". Terms are stored by
 * shift in canonical order with no zero coefficient, so equal operators are equal objects.
 */
public final class ShiftOperator {
    private static final ShiftOperator ZERO = new ShiftOperator(new TreeMap<>());
    private static final ShiftOperator IDENTITY = new ShiftOperator(new TreeMap<>(Map.of(Shift.NONE, Expression.ONE)));

    private final SortedMap<Shift, Expression> terms;

    private ShiftOperator(TreeMap<Shift, Expression> terms) {
        this.terms = Collections.unmodifiableSortedMap(terms);
    }

    public static ShiftOperator zero() {
        return ZERO;
    }

    public static ShiftOperator identity() {
        return IDENTITY;
    }

    /** The operator {@code coefficient * shift}. */
    public static ShiftOperator of(Shift shift, Expression coefficient) {
        TreeMap<Shift, Expression> t = new TreeMap<>();
        if (!coefficient.isZero()) {
            t.put(shift, coefficient);
        }
        return new ShiftOperator(t);
    }

    /** The sum of {@code coefficient * shift} over the entries (coefficients of equal shifts add). */
    public static ShiftOperator of(Map<Shift, Expression> terms) {
        TreeMap<Shift, Expression> t = new TreeMap<>();
        terms.forEach((sh, c) -> t.merge(sh, c, Expression::add));
        t.values().removeIf(Expression::isZero);
        return new ShiftOperator(t);
    }

    /** The pure shift {@code f -> f(v + amount, ...)}. */
    public static ShiftOperator shift(Shift shift) {
        return of(shift, Expression.ONE);
    }

    /** Multiplication by {@code f}, an operator without shift. */
    public static ShiftOperator multiplication(Expression f) {
        return of(Shift.NONE, f);
    }

    /** Terms in canonical order: shift to its (non-zero) coefficient. */
    public SortedMap<Shift, Expression> terms() {
        return terms;
    }

    /** The coefficient of {@code shift} (zero when absent). */
    public Expression coefficient(Shift shift) {
        return terms.getOrDefault(shift, Expression.ZERO);
    }

    public boolean isZero() {
        return terms.isEmpty();
    }

    public boolean isIdentity() {
        return equals(IDENTITY);
    }

    public ShiftOperator add(ShiftOperator o) {
        TreeMap<Shift, Expression> t = new TreeMap<>(terms);
        o.terms.forEach((sh, c) -> t.merge(sh, c, Expression::add));
        t.values().removeIf(Expression::isZero);
        return new ShiftOperator(t);
    }

    public ShiftOperator subtract(ShiftOperator o) {
        return add(o.negate());
    }

    public ShiftOperator negate() {
        return multiply(Expression.constant(-1));
    }

    /** Left multiplication {@code f * this}: every coefficient times {@code f}. */
    public ShiftOperator multiply(Expression f) {
        TreeMap<Shift, Expression> t = new TreeMap<>();
        terms.forEach((sh, c) -> t.put(sh, f.multiply(c)));
        t.values().removeIf(Expression::isZero);
        return new ShiftOperator(t);
    }

    /**
     * Composition {@code this * o} (first {@code o}, then this), moving the coefficients of
     * {@code o} to the left through the shifts of this: {@code E_a * (g * E_b) = g(shifted by a) * E_(a+b)}.
     */
    public ShiftOperator multiply(ShiftOperator o) {
        TreeMap<Shift, Expression> t = new TreeMap<>();
        for (Map.Entry<Shift, Expression> a : terms.entrySet()) {
            Map<String, Polynomial> sub = a.getKey().substitution();
            for (Map.Entry<Shift, Expression> b : o.terms.entrySet()) {
                Expression moved = sub.isEmpty() ? b.getValue() : b.getValue().substituteLinear(sub);
                t.merge(a.getKey().then(b.getKey()), a.getValue().multiply(moved), Expression::add);
            }
        }
        t.values().removeIf(Expression::isZero);
        return new ShiftOperator(t);
    }

    /** The {@code n}-fold composition (n >= 0). */
    public ShiftOperator pow(int n) {
        if (n < 0) {
            throw new ContourException("a shift operator can only be raised to a power >= 0, not " + n);
        }
        ShiftOperator r = IDENTITY;
        for (int i = 0; i < n; i++) {
            r = r.multiply(this);
        }
        return r;
    }

    /** The operator applied to {@code f}: {@code sum c * f(shifted)}, collected. */
    public Expression apply(Expression f) {
        ShiftedSum d = applyDeferred(f);
        return d != null ? d.value() : ShiftedSum.expandAt(blocks(), f);
    }

    /**
     * The operator applied to {@code f}, kept unexpanded (see {@link ShiftedSum}); null when a
     * shift moves a collected variable of f.
     */
    public ShiftedSum applyDeferred(Expression f) {
        return ShiftedSum.of(blocks(), f);
    }

    /** The operator as the blocks of a {@link ShiftedSum}. */
    public List<ShiftedSum.Block> blocks() {
        List<ShiftedSum.Block> out = new ArrayList<>(terms.size());
        terms.forEach((sh, c) -> out.add(new ShiftedSum.Block(sh.amounts(), c)));
        return out;
    }

    /** The operator whose blocks these are. */
    public static ShiftOperator ofBlocks(List<ShiftedSum.Block> blocks) {
        Map<Shift, Expression> t = new HashMap<>();
        blocks.forEach(b -> t.merge(Shift.of(b.shift()), b.coefficient(), Expression::add));
        return of(t);
    }

    /** Adds {@code c * g} into {@code acc}, term by term. */
    static void accumulate(Map<Monomial, RationalFunction> acc, Expression c, Expression g) {
        for (Map.Entry<Monomial, RationalFunction> x : c.terms().entrySet()) {
            for (Map.Entry<Monomial, RationalFunction> y : g.terms().entrySet()) {
                acc.merge(x.getKey().multiply(y.getKey()), x.getValue().multiply(y.getValue()), RationalFunction::add);
            }
        }
    }

    /**
     * Numbers substituted for parameters in the coefficients (for example {@code p = 3}); a
     * variable the operator shifts cannot be given a value.
     */
    public ShiftOperator evaluatePartially(Map<String, Rational> point) {
        TreeMap<Shift, Expression> t = new TreeMap<>();
        for (Map.Entry<Shift, Expression> e : terms.entrySet()) {
            for (String v : e.getKey().amounts().keySet()) {
                if (point.containsKey(v)) {
                    throw new ContourException("cannot give '" + v + "' a value: the operator shifts it");
                }
            }
            t.merge(e.getKey(), e.getValue().evaluatePartially(point), Expression::add);
        }
        t.values().removeIf(Expression::isZero);
        return new ShiftOperator(t);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ShiftOperator other && terms.equals(other.terms);
    }

    @Override
    public int hashCode() {
        return terms.hashCode();
    }

    /** A debugging form such as {@code (s - 2)*shift(s: -2) + 1}; user-facing printing lives in print/. */
    @Override
    public String toString() {
        if (terms.isEmpty()) {
            return "0";
        }
        StringBuilder sb = new StringBuilder();
        terms.forEach((sh, c) -> {
            sb.append(sb.length() == 0 ? "" : " + ");
            sb.append(sh.isNone() ? "(" + c + ")" : "(" + c + ")*shift(" + sh + ")");
        });
        return sb.toString();
    }
}
