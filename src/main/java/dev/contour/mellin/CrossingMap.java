package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;

import java.util.Collections;
import java.util.HashMap;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A substitution operator {@code f -> prefactor * f(x -> map(x))}: linear maps of inner variables
 * (s <-> t, t -> 4p - s - t) together with maps of collected variables (sigma -> sigma/tau,
 * tau -> 1/tau), as crossing symmetry needs.
 *
 * <p>All replacements are simultaneous. Entries that map a variable to itself are dropped, so
 * equal maps have equal representations and the identity is recognisable.
 */
public final class CrossingMap {
    /** Beyond this order {@link #inverse()} gives up: crossing groups are small. */
    private static final int MAX_ORDER = 24;
    private static final CrossingMap IDENTITY = new CrossingMap(new TreeMap<>(), new TreeMap<>(), Expression.ONE);

    private final SortedMap<String, Polynomial> inner;
    private final SortedMap<String, Expression> collected;
    private final Expression prefactor;

    private CrossingMap(TreeMap<String, Polynomial> inner, TreeMap<String, Expression> collected, Expression prefactor) {
        this.inner = Collections.unmodifiableSortedMap(inner);
        this.collected = Collections.unmodifiableSortedMap(collected);
        this.prefactor = prefactor;
    }

    public static CrossingMap identity() {
        return IDENTITY;
    }

    /**
     * The map {@code f -> prefactor * f(inner, collected)}; inner values must be polynomials of total
     * degree at most 1 in inner variables, collected values expressions (Laurent monomials in practice).
     */
    public static CrossingMap of(Map<String, Polynomial> inner, Map<String, Expression> collected, Expression prefactor) {
        TreeMap<String, Polynomial> in = new TreeMap<>();
        inner.forEach((v, x) -> {
            if (x.totalDegree() > 1) {
                throw new ContourException("crossing map: the value for '" + v + "' must be linear, got " + x);
            }
            if (!x.equals(Polynomial.variable(v))) {
                in.put(v, x);
            }
        });
        TreeMap<String, Expression> co = new TreeMap<>();
        collected.forEach((v, x) -> {
            if (!x.equals(Expression.collectedVariable(v))) {
                co.put(v, x);
            }
        });
        if (prefactor.isZero()) {
            throw new ContourException("crossing map: the prefactor must not be zero");
        }
        return new CrossingMap(in, co, prefactor);
    }

    public SortedMap<String, Polynomial> innerMap() {
        return inner;
    }

    public SortedMap<String, Expression> collectedMap() {
        return collected;
    }

    public Expression prefactor() {
        return prefactor;
    }

    /** {@code prefactor * f(replaced)}. */
    public Expression apply(Expression f) {
        return prefactor.multiply(substitute(f));
    }

    /** Only the replacement, without the prefactor. */
    private Expression substitute(Expression f) {
        Expression r = inner.isEmpty() ? f : f.substituteLinear(inner);
        // Collected values never mention the inner variables just replaced (they were replaced
        // first), so doing the two kinds in turn is the same as one simultaneous replacement.
        return collected.isEmpty() ? r : r.substitute(collected);
    }

    /** The composite {@code this o other}: first {@code other}, then this. */
    public CrossingMap compose(CrossingMap other) {
        TreeMap<String, Polynomial> in = new TreeMap<>();
        other.inner.forEach((v, x) -> in.put(v, inner.isEmpty() ? x : x.substitute(inner)));
        inner.forEach(in::putIfAbsent);
        TreeMap<String, Expression> co = new TreeMap<>();
        other.collected.forEach((v, x) -> co.put(v, substitute(x)));
        collected.forEach(co::putIfAbsent);
        Map<String, Polynomial> innerView = new HashMap<>(in);
        Map<String, Expression> collectedView = new HashMap<>(co);
        return of(innerView, collectedView, prefactor.multiply(substitute(other.prefactor)));
    }

    public boolean isIdentity() {
        return equals(IDENTITY);
    }

    /** True when applying the map twice gives back every expression. */
    public boolean isInvolution() {
        return compose(this).isIdentity();
    }

    /** The inverse, found as a power of this map (crossing maps have small finite order). */
    public CrossingMap inverse() {
        CrossingMap power = IDENTITY;
        for (int k = 1; k <= MAX_ORDER; k++) {
            CrossingMap next = power.compose(this);
            if (next.isIdentity()) {
                return power;
            }
            power = next;
        }
        throw new ContourException("crossing map has no finite order up to " + MAX_ORDER + "; cannot invert it");
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof CrossingMap c && inner.equals(c.inner) && collected.equals(c.collected)
                && prefactor.equals(c.prefactor);
    }

    @Override
    public int hashCode() {
        return Objects.hash(inner, collected, prefactor);
    }

    /** A debugging form; user-facing printing lives in print/. */
    @Override
    public String toString() {
        return "cross(" + inner + ", " + collected + ", prefactor " + prefactor + ")";
    }
}
