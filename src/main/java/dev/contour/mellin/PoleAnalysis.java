package dev.contour.mellin;

import dev.contour.Cancellation;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * The poles of every coefficient of an expression in the Mellin variables, read off the factored
 * denominators (no factorisation or GCD needed), each classified against named forms.
 */
public final class PoleAnalysis {
    private PoleAnalysis() { }

    /** Poles per collected monomial, and their union. */
    public record Result(SortedMap<Monomial, List<Pole>> byMonomial) {
        public Result {
            byMonomial = Collections.unmodifiableSortedMap(new TreeMap<>(byMonomial));
        }

        /**
         * Every pole of any coefficient, with the highest order in which it occurs, sorted the way
         * people list them: by form (s, t, u, then general linear forms), then by location.
         */
        public List<Pole> all() {
            Map<Polynomial, Pole> union = new LinkedHashMap<>();
            byMonomial.values().forEach(list -> list.forEach(p -> union.merge(p.factor(), p,
                    (a, b) -> a.order() >= b.order() ? a : b)));
            List<Pole> sorted = new ArrayList<>(union.values());
            sorted.sort(Pole.DISPLAY_ORDER);
            return List.copyOf(sorted);
        }

        /** The poles the allowed set does not admit, with the monomial whose coefficient has them. */
        public List<Violation> outside(AllowedPoles allowed) {
            List<Violation> out = new ArrayList<>();
            byMonomial.forEach((m, list) -> list.stream().filter(p -> !allowed.allows(p))
                    .forEach(p -> out.add(new Violation(m, p))));
            return out;
        }
    }

    /** A pole outside the allowed set, in the coefficient of {@code monomial}. */
    public record Violation(Monomial monomial, Pole pole) {
        public String describe() {
            return pole.describe() + (pole.order() > 1 ? " (order " + pole.order() + ")" : "")
                    + " in the coefficient of " + Collect.describe(monomial);
        }
    }

    /** The poles of every coefficient of {@code f} in the variables {@code mellin}, classified by {@code forms}. */
    public static Result of(Expression f, List<NamedForm> forms, Collection<String> mellin) {
        TreeMap<Monomial, List<Pole>> by = new TreeMap<>();
        // each coefficient on its own, on the shared pool; the memo is shared (a factor classified
        // twice gives the same pole), the map is filled in the order of the monomials
        Map<LinearFactors.Factor, Pole> memo = new java.util.concurrent.ConcurrentHashMap<>();
        List<Map.Entry<Monomial, RationalFunction>> terms = new ArrayList<>(f.terms().entrySet());
        dev.contour.Parallel.forEachOrdered(terms.size(), i -> poles(terms.get(i).getValue(), forms, mellin, memo), (i, poles) -> {
            if (!poles.isEmpty()) {
                by.put(terms.get(i).getKey(), poles);
            }
        });
        return new Result(by);
    }

    /** The poles of one rational function. */
    public static List<Pole> poles(RationalFunction c, List<NamedForm> forms, Collection<String> mellin) {
        return poles(c, forms, mellin, null);
    }

    /**
     * As {@link #poles(RationalFunction, List, Collection)}, with a memo of classified factors
     * (null for none): the coefficients of one amplitude share a few hundred denominator factors.
     */
    static List<Pole> poles(RationalFunction c, List<NamedForm> forms, Collection<String> mellin,
                            Map<LinearFactors.Factor, Pole> memo) {
        List<Pole> poles = new ArrayList<>();
        for (LinearFactors.Factor d : c.denominatorFactors()) {
            Pole known = memo == null ? null : memo.get(d);
            if (known != null) {
                poles.add(known);
            } else if (mentionsAny(d.base(), mellin)) {
                Pole pole = classify(d.base(), d.multiplicity(), forms, mellin);
                poles.add(pole);
                if (memo != null) {
                    memo.put(d, pole);
                }
            }
        }
        return poles;
    }

    /**
     * The pole {@code factor = 0} described by the first form it is a multiple of (up to a constant
     * offset free of the Mellin variables), or as a general form when there is none.
     */
    public static Pole classify(Polynomial factor, int order, List<NamedForm> forms, Collection<String> mellin) {
        for (NamedForm nf : factor.totalDegree() == 1 ? forms : List.<NamedForm>of()) {
            Polynomial x = nf.form();
            Rational lambda = null;
            boolean proportional = true;
            for (String v : mellin) {
                Rational fv = linearCoefficient(factor, v);
                Rational xv = linearCoefficient(x, v);
                if (xv.isZero() != fv.isZero()) {
                    proportional = false;
                    break;
                }
                if (!xv.isZero()) {
                    Rational r = fv.divide(xv);
                    if (lambda == null) {
                        lambda = r;
                    } else if (!lambda.equals(r)) {
                        proportional = false;
                        break;
                    }
                }
            }
            if (proportional && lambda != null) {
                // factor = lambda * (form - location)
                Polynomial location = x.subtract(factor.multiply(lambda.inverse()));
                return new Pole(nf.name(), location, factor, order);
            }
        }
        return new Pole(null, null, factor, order);
    }

    /** The (numeric) coefficient of {@code v} in a polynomial of total degree at most 1. */
    static Rational linearCoefficient(Polynomial p, String v) {
        Polynomial c = p.coefficient(v, 1);
        return c.isZero() ? Rational.ZERO : c.constantValue();
    }

    static boolean mentionsAny(Polynomial p, Collection<String> vars) {
        for (String v : p.variables()) {
            if (vars.contains(v)) {
                return true;
            }
        }
        return false;
    }
}
