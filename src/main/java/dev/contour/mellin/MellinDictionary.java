package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.Map;

/**
 * The position-to-Mellin dictionary: a position-space operator acting on a function with Mellin
 * measure {@code from} becomes a shift operator on its Mellin amplitude with respect to measure
 * {@code to}.
 *
 * <p>Multiplying by {@code U^m V^n} moves the contour: with the kernel {@code U^(a s + b)} the
 * amplitude is shifted by {@code s -> s - m/a} (also absorbing any difference of kernel offsets)
 * and multiplied by the Gamma ratio {@code Gamma_from(shifted) / Gamma_to}, reduced exactly by
 * {@link GammaRatio}; {@code U d/dU} and {@code V d/dV} become multiplication by the kernel
 * exponents {@code a s + b} and {@code c t + d} of {@code from}.
 */
public final class MellinDictionary {
    private MellinDictionary() { }

    /** The Mellin-space form of {@code op}, taking an amplitude for {@code from} to one for {@code to}. */
    public static ShiftOperator translate(PositionOperator op, MellinMeasure from, MellinMeasure to) {
        if (!from.s().equals(to.s()) || !from.t().equals(to.t())) {
            throw new ContourException("the two measures use different Mellin variables: " + from.variables()
                    + " and " + to.variables());
        }
        if (!from.uScale().equals(to.uScale()) || !from.vScale().equals(to.vScale())) {
            throw new ContourException("the two measures' kernels scale s or t differently; no shift relates them");
        }
        Rational du = constantDifference(from.uOffset(), to.uOffset(), "U");
        Rational dv = constantDifference(from.vOffset(), to.vOffset(), "V");
        Polynomial uExp = from.uExponent();
        Polynomial vExp = from.vExponent();
        ShiftOperator result = ShiftOperator.zero();
        for (Map.Entry<PositionOperator.Word, Expression> e : op.terms().entrySet()) {
            PositionOperator.Word w = e.getKey();
            Expression c = e.getValue();
            for (String v : from.variables()) {
                if (c.innerVariables().contains(v) || c.collectedVariables().contains(v)) {
                    throw new ContourException("a position-space coefficient must not depend on the Mellin variable '"
                            + v + "': " + c);
                }
            }
            // U^(a s + b_from) U^m = U^(a s' + b_to) with s = s' - (m + b_from - b_to)/a.
            Rational ds = Rational.of(w.m()).add(du).divide(from.uScale()).negate();
            Rational dt = Rational.of(w.n()).add(dv).divide(from.vScale()).negate();
            Shift shift = Shift.of(Map.of(from.s(), ds, from.t(), dt));
            RationalFunction ratio = from.ratioTo(to, shift);
            ShiftOperator jump = ShiftOperator.of(shift, c.multiply(ratio));
            if (w.j() > 0 || w.k() > 0) {
                Polynomial q = uExp.pow(w.j()).multiply(vExp.pow(w.k()));
                jump = jump.multiply(ShiftOperator.multiplication(Expression.of(RationalFunction.of(q))));
            }
            result = result.add(jump);
        }
        return result;
    }

    /** The Mellin-space form of multiplication by {@code f}, a polynomial in collected U and V. */
    public static ShiftOperator translate(Expression f, String uName, String vName, MellinMeasure from, MellinMeasure to) {
        return translate(PositionOperator.multiplication(f, uName, vName), from, to);
    }

    private static Rational constantDifference(Polynomial a, Polynomial b, String which) {
        Polynomial d = a.subtract(b);
        if (!d.isConstant()) {
            throw new ContourException("the kernels' " + which + " exponents differ by " + d + ", which is not a number");
        }
        return d.constantValue();
    }
}
