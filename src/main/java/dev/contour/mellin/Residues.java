package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.HashMap;
import java.util.Map;

/**
 * Residues in one variable at poles of any order, as functions of the remaining variables.
 *
 * <p>With {@code f = N / (L^n D)} and {@code L = lambda (x - x0)} the residue is
 * {@code 1/(n-1)! d^(n-1)/dx^(n-1) [(x - x0)^n f]} at {@code x = x0}; for a simple pole (the
 * common case) that is one multiplication by the known factor and one linear substitution.
 */
public final class Residues {
    private Residues() { }

    /** {@code Res_(x = at) f}; {@code at} must not mention x. Zero when f has no pole there. */
    public static RationalFunction residue(RationalFunction f, String x, Polynomial at) {
        if (at.variables().contains(x)) {
            throw new ContourException("residue location " + at + " must not depend on " + x);
        }
        Map<String, Polynomial> onPole = Map.of(x, at);
        for (LinearFactors.Factor d : f.denominatorFactors()) {
            Polynomial base = d.base();
            if (base.degree(x) == 1 && base.totalDegree() == 1 && base.substitute(onPole).isZero()) {
                return residueAtFactor(f, x, base, d.multiplicity(), at);
            }
        }
        return RationalFunction.ZERO;
    }

    /** The residue at the pole {@code factor = 0}, solved for x. */
    public static RationalFunction residueAtFactor(RationalFunction f, String x, Polynomial factor) {
        for (LinearFactors.Factor d : f.denominatorFactors()) {
            if (d.base().equals(factor)) {
                return residueAtFactor(f, x, factor, d.multiplicity(), solve(factor, x));
            }
        }
        return residue(f, x, solve(factor, x));
    }

    /** Coefficient-wise residue of an expression (collected structure kept). */
    public static Expression residue(Expression f, String x, Polynomial at) {
        Map<Monomial, RationalFunction> out = new HashMap<>();
        f.terms().forEach((m, c) -> out.put(m, residue(c, x, at)));
        return Expression.of(out);
    }

    /** The root {@code x0} of the linear polynomial {@code factor} in x. */
    public static Polynomial solve(Polynomial factor, String x) {
        if (factor.degree(x) != 1 || factor.totalDegree() != 1) {
            throw new ContourException("cannot solve " + factor + " = 0 for " + x + ": not linear in it");
        }
        Rational lambda = factor.coefficient(x, 1).constantValue();
        return factor.coefficient(x, 0).multiply(lambda.inverse()).negate();
    }

    private static RationalFunction residueAtFactor(RationalFunction f, String x, Polynomial factor, int n, Polynomial at) {
        Rational lambda = factor.coefficient(x, 1).constantValue();
        RationalFunction g = f.multiply(RationalFunction.of(factor.pow(n))).multiply(lambda.pow(-n));
        Rational factorial = Rational.ONE;
        for (int k = 1; k < n; k++) {
            g = g.derivative(x);
            factorial = factorial.multiply(Rational.of(k));
        }
        return g.substituteLinear(Map.of(x, at)).multiply(factorial.inverse());
    }
}
