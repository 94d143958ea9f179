package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;

import java.util.Collection;
import java.util.HashMap;
import java.util.Map;
import java.util.OptionalInt;

/**
 * Large-s,t behaviour: the degree d of {@code f(beta s, beta t)} as beta goes to infinity and the
 * leading term {@code lim f(beta s, beta t) / beta^d}, a homogeneous rational function (the
 * flat-space limit of a Mellin amplitude).
 *
 * <p>Parameters (such as p) are held fixed. Each coefficient is canonical, so its numerator's top
 * homogeneous part cannot cancel; the denominator's top part is the product of its factors' top parts.
 */
public final class Growth {
    private Growth() { }

    /** The degree (empty for the zero expression) and the leading homogeneous term. */
    public record Result(OptionalInt degree, Expression leading) { }

    public static Result of(Expression f, Collection<String> mellin) {
        Map<Monomial, RationalFunction> lead = new HashMap<>();
        Integer best = null;
        for (Map.Entry<Monomial, RationalFunction> e : f.terms().entrySet()) {
            RationalFunction c = e.getValue();
            Top num = top(c.numerator(), mellin);
            int degree = num.degree;
            Polynomial den = Polynomial.ONE;
            for (LinearFactors.Factor d : c.denominatorFactors()) {
                Top t = top(d.base(), mellin);
                degree -= t.degree * d.multiplicity();
                den = den.multiply(t.part.pow(d.multiplicity()));
            }
            if (best == null || degree > best) {
                best = degree;
                lead.clear();
            }
            if (degree == best) {
                lead.put(e.getKey(), RationalFunction.of(num.part, den));
            }
        }
        return new Result(best == null ? OptionalInt.empty() : OptionalInt.of(best), Expression.of(lead));
    }

    /** The degree of {@code f(beta s, beta t)} (empty for zero). */
    public static OptionalInt degree(Expression f, Collection<String> mellin) {
        return of(f, mellin).degree();
    }

    private record Top(int degree, Polynomial part) { }

    /** The part of highest total degree in the Mellin variables. */
    private static Top top(Polynomial p, Collection<String> mellin) {
        int max = Integer.MIN_VALUE;
        for (Polynomial.Term t : p.terms()) {
            max = Math.max(max, degreeIn(t, mellin));
        }
        Polynomial part = Polynomial.ZERO;
        for (Polynomial.Term t : p.terms()) {
            if (degreeIn(t, mellin) == max) {
                part = part.add(Polynomial.monomial(t.coefficient(), t.exponents()));
            }
        }
        return new Top(max, part);
    }

    private static int degreeIn(Polynomial.Term t, Collection<String> mellin) {
        int d = 0;
        for (Map.Entry<String, Integer> e : t.exponents().entrySet()) {
            if (mellin.contains(e.getKey())) {
                d += e.getValue();
            }
        }
        return d;
    }
}
