package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.util.HashMap;
import java.util.Map;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;

/**
 * Exact polynomials and rational functions of {@code dev.contour.algebra} evaluated at complex
 * apfloat points: to a number of digits (checked at two precisions, so cancellation is caught), or
 * at a fixed working precision for use inside integrands. Point values are taken as exact decimals.
 */
public final class PointEvaluation {
    private PointEvaluation() { }

    /** p at the point to {@code digits} correct digits; every variable of p must have a value. */
    public static NumericResult polynomial(Polynomial p, Map<String, ? extends Apcomplex> point, int digits) {
        return SpecialFunctions.evaluate(wp -> polynomialAt(p, point, wp), digits);
    }

    /** f at the point to {@code digits} correct digits; a vanishing denominator factor is a ContourException. */
    public static NumericResult rationalFunction(RationalFunction f, Map<String, ? extends Apcomplex> point, int digits) {
        return SpecialFunctions.evaluate(wp -> rationalFunctionAt(f, point, wp), digits);
    }

    /** p at the point, computed at {@code precision} digits (no claim about the result's accuracy). */
    public static Apcomplex polynomialAt(Polynomial p, Map<String, ? extends Apcomplex> point, long precision) {
        return sum(p, point, precision, new Powers(point, precision)).value;
    }

    /** f at the point, computed at {@code precision} digits; ContourException at a pole. */
    public static Apcomplex rationalFunctionAt(RationalFunction f, Map<String, ? extends Apcomplex> point, long precision) {
        Powers powers = new Powers(point, precision);
        Apcomplex value = sum(f.numerator(), point, precision, powers).value;
        Apcomplex denominator = Apcomplex.ONE;
        for (LinearFactors.Factor factor : f.denominatorFactors()) {
            Sum d = sum(factor.base(), point, precision, powers);
            // Zero, or smaller than the rounding of its own terms: a pole as far as this precision can tell.
            if (d.value.isZero() || Magnitudes.log10Abs(d.value) < d.log10TermMax - precision + 3) {
                throw new PoleException("the point is a pole: the denominator factor " + factor.base()
                        + " vanishes there", d.value);
            }
            denominator = denominator.multiply(ApcomplexMath.pow(d.value, factor.multiplicity()));
        }
        return value.divide(denominator).precision(precision);
    }

    private record Sum(Apcomplex value, double log10TermMax) { }

    private static Sum sum(Polynomial p, Map<String, ? extends Apcomplex> point, long precision, Powers powers) {
        Apcomplex total = Apcomplex.ZERO;
        double termMax = Double.NEGATIVE_INFINITY;
        for (Polynomial.Term term : p.terms()) {
            Apcomplex t = rational(term.coefficient(), precision + 5);
            for (Map.Entry<String, Integer> e : term.exponents().entrySet()) {
                t = t.multiply(powers.of(e.getKey(), e.getValue()));
            }
            termMax = Math.max(termMax, Magnitudes.log10Abs(t));
            total = total.add(t);
        }
        return new Sum(total.precision(precision), termMax);
    }

    static Apfloat rational(Rational r, long precision) {
        return new Apfloat(r.numerator(), precision).divide(new Apfloat(r.denominator(), precision));
    }

    /** Integer powers of the point's coordinates, each computed once per evaluation. */
    private static final class Powers {
        private final Map<String, ? extends Apcomplex> point;
        private final long precision;
        private final Map<String, Map<Integer, Apcomplex>> cache = new HashMap<>();

        Powers(Map<String, ? extends Apcomplex> point, long precision) {
            this.point = point;
            this.precision = precision + 5;
        }

        Apcomplex of(String variable, int exponent) {
            return cache.computeIfAbsent(variable, v -> new HashMap<>()).computeIfAbsent(exponent, e -> {
                Apcomplex x = point.get(variable);
                if (x == null) {
                    throw new ContourException("no value given for the variable " + variable);
                }
                return ApcomplexMath.pow(x.precision(precision), e);
            });
        }
    }
}
