package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;

import java.util.Collections;
import java.util.HashMap;
import java.util.Iterator;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A shift of inner variables by rational amounts, {@code f(s, t) -> f(s + a, t + b)}.
 *
 * <p>Only non-zero amounts are stored, so equal shifts have equal representations; the order
 * (by variable, then amount) is the canonical order of a {@link ShiftOperator}'s terms.
 */
public record Shift(SortedMap<String, Rational> amounts) implements Comparable<Shift> {
    /** The shift by nothing. */
    public static final Shift NONE = new Shift(new TreeMap<>());

    public Shift {
        TreeMap<String, Rational> kept = new TreeMap<>();
        for (Map.Entry<String, Rational> e : amounts.entrySet()) {
            if (e.getKey() == null || e.getValue() == null) {
                throw new ContourException("a shift needs a variable name and an amount");
            }
            if (!e.getValue().isZero()) {
                kept.put(e.getKey(), e.getValue());
            }
        }
        amounts = Collections.unmodifiableSortedMap(kept);
    }

    /** The shift given as variable to amount; zero amounts are dropped. */
    public static Shift of(Map<String, Rational> amounts) {
        return amounts.isEmpty() ? NONE : new Shift(new TreeMap<>(amounts));
    }

    /** The shift of one variable. */
    public static Shift of(String variable, Rational amount) {
        return of(Map.of(variable, amount));
    }

    /** The amount by which {@code variable} moves (zero when it does not). */
    public Rational amount(String variable) {
        return amounts.getOrDefault(variable, Rational.ZERO);
    }

    public boolean isNone() {
        return amounts.isEmpty();
    }

    /** Applying this shift after {@code o} (shifts commute, amounts add). */
    public Shift then(Shift o) {
        Map<String, Rational> sum = new HashMap<>(amounts);
        o.amounts.forEach((v, a) -> sum.merge(v, a, Rational::add));
        return of(sum);
    }

    /** The shift undoing this one. */
    public Shift inverse() {
        Map<String, Rational> neg = new HashMap<>();
        amounts.forEach((v, a) -> neg.put(v, a.negate()));
        return of(neg);
    }

    /** The shift as a linear substitution {@code v -> v + amount}, for {@code substituteLinear}. */
    public Map<String, Polynomial> substitution() {
        return dev.contour.algebra.ShiftedSum.translation(amounts);
    }

    @Override
    public int compareTo(Shift o) {
        Iterator<Map.Entry<String, Rational>> a = amounts.entrySet().iterator();
        Iterator<Map.Entry<String, Rational>> b = o.amounts.entrySet().iterator();
        while (a.hasNext() && b.hasNext()) {
            Map.Entry<String, Rational> x = a.next();
            Map.Entry<String, Rational> y = b.next();
            int c = x.getKey().compareTo(y.getKey());
            if (c != 0) {
                return c;
            }
            c = x.getValue().compareTo(y.getValue());
            if (c != 0) {
                return c;
            }
        }
        return Boolean.compare(a.hasNext(), b.hasNext());
    }

    /** A debugging form such as {@code s: -2, t: 2}; user-facing printing lives in print/. */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        amounts.forEach((v, a) -> sb.append(sb.length() == 0 ? "" : ", ").append(v).append(": ").append(a));
        return sb.toString();
    }
}
