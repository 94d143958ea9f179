package dev.contour.mellin;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.Parallel;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Whether every residue of every coefficient is polynomial in the remaining Mellin variable, i.e.
 * no two poles are simultaneous.
 *
 * <p>A pole on a form mentioning s is taken as a residue in s (t held fixed); a pole in t alone as a
 * residue in t. A non-polynomial residue is reported as the offending pair of poles, the second one
 * named by the original denominator factor it comes from, e.g. {@code s = 2 and t = 4 (coefficient of sigma*tau)}.
 */
public final class ResiduePolynomiality {
    private ResiduePolynomiality() { }

    /**
     * A non-polynomial residue: at {@code pole}, the residue still has a pole on {@code remaining}
     * (a factor of its denominator, in the remaining variables); {@code other} names the original
     * pole that factor comes from.
     */
    public record Failure(Monomial monomial, Pole pole, Pole other, Polynomial remaining) {
        public String describe() {
            return pole.describe() + " and " + other.describe() + " (coefficient of " + Collect.describe(monomial) + ")";
        }
    }

    /** The outcome of a check: every failure found. */
    public record Result(List<Failure> failures) {
        public Result {
            failures = List.copyOf(failures);
        }

        public boolean holds() {
            return failures.isEmpty();
        }

        /** A ContourException naming the first offending pair, unless the check holds. */
        public void require() {
            if (!holds()) {
                throw new ContourException("residue not polynomial at " + failures.get(0).describe()
                        + (failures.size() > 1 ? " and " + (failures.size() - 1) + " more" : ""));
            }
        }
    }

    /** A linear condition (in the unknowns) that polynomial residues require: {@code value = 0}. */
    public record Condition(Expression value, String description) { }

    /** Checks every coefficient of {@code f} (no unknowns: each collected monomial on its own). */
    public static Result check(Expression f, List<NamedForm> forms, List<String> mellin) {
        // Each coefficient is checked on its own (on the shared pool); the failures are listed in
        // the order of the monomials whatever the number of threads.
        List<Map.Entry<Monomial, RationalFunction>> terms = new ArrayList<>(f.terms().entrySet());
        Map<LinearFactors.Factor, Pole> memo = new java.util.concurrent.ConcurrentHashMap<>();
        List<Failure> failures = new ArrayList<>();
        Parallel.forEachOrdered(terms.size(), i -> {
            Monomial m = terms.get(i).getKey();
            RationalFunction c = terms.get(i).getValue();
            List<Failure> found = new ArrayList<>();
            // A simultaneous pole shows up twice (the residue at s = 2 keeps t = 4, the one at t = 4
            // keeps s = 2): report each unordered pair once per coefficient.
            java.util.Set<java.util.Set<Polynomial>> seen = new java.util.HashSet<>();
            for (Pole pole : PoleAnalysis.poles(c, forms, mellin, memo)) {
                Cancellation.check();
                String x = residueVariable(pole.factor(), mellin);
                LinearFactors.Factor d = firstInnerPole(c, pole, x, mellin);
                if (d != null) {
                    Pole other = origin(c, pole, x, d, forms, mellin);
                    if (seen.add(java.util.Set.of(pole.factor(), other.factor()))) {
                        found.add(new Failure(m, pole, other, d.base()));
                    }
                }
            }
            return found;
        }, (i, found) -> failures.addAll(found));
        return new Result(failures);
    }

    /**
     * The conditions on unknown coefficients for polynomial residues: {@code f} is grouped by
     * monomials in {@code collectBy} (sigma, tau), the rest (unknowns) kept in the coefficients;
     * every principal-part coefficient of every residue must vanish. Each condition is linear in the
     * unknowns when {@code f} is, and is described by its pole pair and monomial.
     */
    public static List<Condition> conditions(Expression f, List<NamedForm> forms, List<String> mellin,
                                             Collection<String> collectBy) {
        List<Condition> out = new ArrayList<>();
        Collect.by(f, collectBy).forEach((key, e) -> {
            Map<Polynomial, Pole> poles = new LinkedHashMap<>();
            e.terms().values().forEach(c -> PoleAnalysis.poles(c, forms, mellin)
                    .forEach(p -> poles.merge(p.factor(), p, (a, b) -> a.order() >= b.order() ? a : b)));
            for (Pole pole : poles.values()) {
                String x = residueVariable(pole.factor(), mellin);
                Expression r = Residues.residue(e, x, Residues.solve(pole.factor(), x));
                // Poles of the residue, with the highest order over all unknowns' coefficients.
                Map<Polynomial, Integer> inner = new LinkedHashMap<>();
                Map<Polynomial, Pole> named = new LinkedHashMap<>();
                e.terms().forEach((mono, c) -> {
                    Cancellation.check();
                    RationalFunction rc = r.coefficient(mono);
                    if (rc == null || rc.isZero()) {
                        return;
                    }
                    for (LinearFactors.Factor d : rc.denominatorFactors()) {
                        if (PoleAnalysis.mentionsAny(d.base(), mellin)) {
                            inner.merge(d.base(), d.multiplicity(), Math::max);
                            named.putIfAbsent(d.base(), origin(c, pole, x, d, forms, mellin));
                        }
                    }
                });
                inner.forEach((d, order) -> {
                    String y = residueVariable(d, mellin);
                    Polynomial y0 = Residues.solve(d, y);
                    Polynomial near = Polynomial.variable(y).subtract(y0);
                    for (int j = 1; j <= order; j++) {
                        Expression weighted = j == 1 ? r : r.multiply(RationalFunction.of(near.pow(j - 1)));
                        Expression cond = Residues.residue(weighted, y, y0);
                        if (!cond.isZero()) {
                            out.add(new Condition(cond, pole.describe() + " and " + named.get(d).describe()
                                    + (order > 1 ? " (order " + j + ")" : "") + " (coefficient of " + Collect.describe(key) + ")"));
                        }
                    }
                });
            }
        });
        return out;
    }

    /**
     * The first denominator factor mentioning a Mellin variable of the residue of {@code c} at
     * {@code pole} (taken in x), or null when the residue is polynomial in them. A simple pole (the
     * common case) is decided without building the residue; a higher one builds it.
     */
    private static LinearFactors.Factor firstInnerPole(RationalFunction c, Pole pole, String x, List<String> mellin) {
        if (pole.order() == 1) {
            Polynomial d = c.firstResiduePole(x, pole.factor(), Residues.solve(pole.factor(), x),
                    f -> PoleAnalysis.mentionsAny(f, mellin));
            return d == null ? null : new LinearFactors.Factor(d, 1);
        }
        RationalFunction r = Residues.residueAtFactor(c, x, pole.factor());
        for (LinearFactors.Factor d : r.denominatorFactors()) {
            if (PoleAnalysis.mentionsAny(d.base(), mellin)) {
                return d;
            }
        }
        return null;
    }

    /** The Mellin variable a residue at {@code factor = 0} is taken in: the first one the factor mentions. */
    static String residueVariable(Polynomial factor, List<String> mellin) {
        for (String v : mellin) {
            if (factor.degree(v) > 0) {
                return v;
            }
        }
        throw new ContourException("internal: " + factor + " mentions no Mellin variable");
    }

    /**
     * The original denominator factor of {@code c} that restricts to the residue's factor {@code d}
     * on the pole, as a named pole; {@code d} itself when none does.
     */
    private static Pole origin(RationalFunction c, Pole pole, String x, LinearFactors.Factor d,
                               List<NamedForm> forms, List<String> mellin) {
        Map<String, Polynomial> onPole = Map.of(x, Residues.solve(pole.factor(), x));
        Polynomial target = d.base().primitivePart();
        for (LinearFactors.Factor o : c.denominatorFactors()) {
            if (o.base().equals(pole.factor()) || !PoleAnalysis.mentionsAny(o.base(), mellin)) {
                continue;
            }
            Polynomial restricted = o.base().substitute(onPole);
            if (!restricted.isConstant() && restricted.primitivePart().equals(target)) {
                return PoleAnalysis.classify(o.base(), o.multiplicity(), forms, mellin);
            }
        }
        return PoleAnalysis.classify(d.base(), d.multiplicity(), forms, mellin);
    }
}
