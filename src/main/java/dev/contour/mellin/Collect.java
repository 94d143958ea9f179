package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.RationalFunction;

import java.util.Collection;
import java.util.HashMap;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Grouping of an expression by monomials in some of its collected variables (sigma, tau), the
 * other collected variables (unknown coefficients) staying in the grouped coefficients.
 */
public final class Collect {
    private Collect() { }

    /** {@code f = sum key * value}, keys monomials in {@code variables} only, values free of them. */
    public static SortedMap<Monomial, Expression> by(Expression f, Collection<String> variables) {
        Map<Monomial, Map<Monomial, RationalFunction>> groups = new HashMap<>();
        f.terms().forEach((m, c) -> {
            Map<String, Integer> key = new HashMap<>();
            Map<String, Integer> rest = new HashMap<>();
            m.exponents().forEach((v, e) -> (variables.contains(v) ? key : rest).put(v, e));
            groups.computeIfAbsent(monomial(key), k -> new HashMap<>()).merge(monomial(rest), c, RationalFunction::add);
        });
        TreeMap<Monomial, Expression> out = new TreeMap<>();
        groups.forEach((k, terms) -> {
            Expression e = Expression.of(terms);
            if (!e.isZero()) {
                out.put(k, e);
            }
        });
        return out;
    }

    /** The monomial with the given exponents, zero exponents left out. */
    static Monomial monomial(Map<String, Integer> exponents) {
        Map<String, Integer> kept = new HashMap<>();
        exponents.forEach((v, e) -> {
            if (e != 0) {
                kept.put(v, e);
            }
        });
        return kept.isEmpty() ? Monomial.ONE : Monomial.of(kept);
    }

    /** A monomial as {@code sigma^2*tau}, or {@code 1}; used in messages. */
    public static String describe(Monomial m) {
        if (m.isOne()) {
            return "1";
        }
        StringBuilder sb = new StringBuilder();
        m.exponents().forEach((v, e) -> sb.append(sb.length() == 0 ? "" : "*").append(v).append(e == 1 ? "" : "^" + e));
        return sb.toString();
    }
}
