package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Partial fractions in one variable x:
 * {@code f = polynomial part + sum coefficient / (x - location)^order}, with coefficients and
 * locations functions of the other variables.
 *
 * <p>Each principal-part coefficient is a residue, {@code c_j = Res_(x = x0) (x - x0)^(j-1) f}, so
 * the decomposition reuses {@link Residues} and needs no polynomial division.
 */
public final class PartialFractions {
    private PartialFractions() { }

    /** One term {@code coefficient / (variable - location)^order}. */
    public record Term(Polynomial location, int order, RationalFunction coefficient) { }

    /** The decomposition of a function in {@code variable}. */
    public record Result(String variable, RationalFunction polynomialPart, List<Term> terms) {
        public Result {
            terms = List.copyOf(terms);
        }

        /** The sum of all parts, equal to the decomposed function. */
        public RationalFunction recombine() {
            RationalFunction sum = polynomialPart;
            for (Term t : terms) {
                Polynomial d = Polynomial.variable(variable).subtract(t.location()).pow(t.order());
                sum = sum.add(t.coefficient().multiply(RationalFunction.of(Polynomial.ONE, d)));
            }
            return sum;
        }
    }

    /** The decomposition of {@code f} in {@code x}; every denominator factor mentioning x must be linear. */
    public static Result of(RationalFunction f, String x) {
        List<Term> terms = new ArrayList<>();
        RationalFunction rest = f;
        for (LinearFactors.Factor d : f.denominatorFactors()) {
            if (d.base().degree(x) == 0) {
                continue;
            }
            if (d.base().totalDegree() != 1) {
                throw new ContourException("partial fractions in " + x + " need linear denominator factors, got " + d.base());
            }
            Polynomial at = Residues.solve(d.base(), x);
            Polynomial shifted = Polynomial.variable(x).subtract(at);
            for (int j = d.multiplicity(); j >= 1; j--) {
                RationalFunction c = Residues.residue(f.multiply(RationalFunction.of(shifted.pow(j - 1))), x, at);
                if (!c.isZero()) {
                    terms.add(new Term(at, j, c));
                    rest = rest.subtract(c.multiply(RationalFunction.of(Polynomial.ONE, shifted.pow(j))));
                }
            }
        }
        for (LinearFactors.Factor d : rest.denominatorFactors()) {
            if (d.base().degree(x) > 0) {
                throw new ContourException("internal: partial fractions left " + d.base() + " in the polynomial part");
            }
        }
        return new Result(x, rest, terms);
    }

    /** The decomposition of each coefficient after collecting {@code f} by monomials in {@code collectBy}. */
    public static SortedMap<Monomial, Result> of(Expression f, String x, Collection<String> collectBy) {
        TreeMap<Monomial, Result> out = new TreeMap<>();
        Collect.by(f, collectBy).forEach((m, e) -> {
            if (!e.isRational()) {
                throw new ContourException("partial fractions: the coefficient of " + Collect.describe(m)
                        + " still has collected variables " + e.collectedVariables() + "; collect by them too");
            }
            out.put(m, of(e.asRationalFunction(), x));
        });
        return out;
    }
}
