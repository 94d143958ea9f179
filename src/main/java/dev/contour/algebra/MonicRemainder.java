package dev.contour.algebra;

import dev.contour.ContourException;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The remainder of an expression, a polynomial in one collected variable x, modulo a polynomial in
 * x whose leading coefficient is 1 (its other coefficients may be any expressions free of x).
 *
 * <p>Monic division needs no inverse of a coefficient, so the remainder is exact over any ring of
 * coefficients: each power x^k with k >= d (d the degree of the modulus) is replaced by
 * {@code -x^(k-d) * (lower terms of the modulus)}, from the highest power down.
 */
public final class MonicRemainder {
    private MonicRemainder() { }

    /**
     * {@code e mod modulus} in the collected variable {@code x}: a polynomial in x of degree below
     * the modulus's. Refuses negative powers of x (the expression must be polynomial in x) and a
     * modulus that is not monic in x.
     */
    public static Expression of(Expression e, Expression modulus, String x) {
        if (e.innerVariables().contains(x) || modulus.innerVariables().contains(x)) {
            throw new ContourException("remainder: '" + x + "' must be a collected variable (vars " + x + " collected)");
        }
        TreeMap<Integer, Expression> m = byPower(modulus, x);
        if (m.firstKey() < 0) {
            throw new ContourException("remainder: the modulus has the negative power " + x + "^" + m.firstKey()
                    + "; it must be a polynomial in " + x);
        }
        int d = m.lastKey();
        if (d < 1) {
            throw new ContourException("remainder: the modulus must have degree at least 1 in " + x);
        }
        if (!m.get(d).equals(Expression.ONE)) {
            throw new ContourException("remainder: the modulus must be monic in " + x + " (leading coefficient 1), but it is "
                    + m.get(d));
        }
        TreeMap<Integer, Expression> r = byPower(e, x);
        if (!r.isEmpty() && r.firstKey() < 0) {
            throw new ContourException("remainder: the expression has the negative power " + x + "^" + r.firstKey()
                    + "; it is not a polynomial in " + x + " (multiply by " + x + "^" + (-r.firstKey()) + " first)");
        }
        List<Map.Entry<Integer, Expression>> lower = new ArrayList<>(m.headMap(d).entrySet());
        while (!r.isEmpty() && r.lastKey() >= d) {
            int k = r.lastKey();
            Expression c = r.remove(k);
            for (Map.Entry<Integer, Expression> l : lower) {
                int power = k - d + l.getKey();
                Expression add = c.multiply(l.getValue()).negate();
                Expression sum = r.containsKey(power) ? r.get(power).add(add) : add;
                if (sum.isZero()) {
                    r.remove(power);
                } else {
                    r.put(power, sum);
                }
            }
        }
        Expression out = Expression.ZERO;
        Expression xe = Expression.collectedVariable(x);
        for (Map.Entry<Integer, Expression> t : r.entrySet()) {
            out = out.add(t.getValue().multiply(xe.pow(t.getKey())));
        }
        return out;
    }

    /** The coefficients of the powers of the collected variable x (free of x). */
    static TreeMap<Integer, Expression> byPower(Expression e, String x) {
        Map<Integer, Map<Monomial, RationalFunction>> parts = new HashMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            int k = t.getKey().exponent(x);
            Monomial rest = t.getKey().multiply(Monomial.of(x, -k));
            parts.computeIfAbsent(k, z -> new HashMap<>()).merge(rest, t.getValue(), RationalFunction::add);
        }
        TreeMap<Integer, Expression> out = new TreeMap<>();
        parts.forEach((k, terms) -> {
            Expression c = Expression.of(terms);
            if (!c.isZero()) {
                out.put(k, c);
            }
        });
        return out;
    }
}
