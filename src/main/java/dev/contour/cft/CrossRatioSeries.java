package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.Map;

/**
 * Exact series in z, zbar of functions of the cross ratios U = z zbar, V = (1 - z)(1 - zbar):
 * Laurent polynomials in U, V (non-negative powers of U, any powers of V) with rational coefficients,
 * and small-U expansions ({@link SmallUExpansion}).
 */
public final class CrossRatioSeries {
    private CrossRatioSeries() { }

    /** The series of an expression in u, v (collected or inner; denominators only powers of v). */
    public static DoubleSeries of(Expression e, String u, String v, int order) {
        DoubleSeries sum = DoubleSeries.zero(order);
        for (Map.Entry<Monomial, RationalFunction> term : e.terms().entrySet()) {
            Monomial m = term.getKey();
            for (String x : m.exponents().keySet()) {
                if (!x.equals(u) && !x.equals(v)) {
                    throw new ContourException("the expression depends on '" + x + "'; a series in z, zbar needs a function of "
                            + u + " and " + v + " only");
                }
            }
            RationalFunction f = term.getValue();
            for (String x : f.variables()) {
                if (!x.equals(u) && !x.equals(v)) {
                    throw new ContourException("the expression depends on '" + x + "'; a series in z, zbar needs a function of "
                            + u + " and " + v + " only");
                }
            }
            LinearFactors.Split den = LinearFactors.split(f.denominator());
            int vDen = 0;
            for (LinearFactors.Factor fac : den.factors()) {
                if (!fac.base().equals(Polynomial.variable(v))) {
                    throw new ContourException("the denominator factor " + fac.base() + " is not a power of " + v
                            + "; only powers of " + v + " may divide");
                }
                vDen = fac.multiplicity();
            }
            if (!den.cofactor().isConstant()) {
                throw new ContourException("the denominator factor " + den.cofactor() + " is not a power of " + v);
            }
            Rational scale = den.unit().multiply(den.cofactor().constantValue()).inverse();
            for (Polynomial.Term pt : f.numerator().terms()) {
                int a = m.exponent(u) + pt.exponents().getOrDefault(u, 0);
                int b = m.exponent(v) + pt.exponents().getOrDefault(v, 0) - vDen;
                if (a < 0) {
                    throw new ContourException("U^" + a + " has no series in z, zbar; multiply by a power of U first");
                }
                if (2 * a > order) {
                    continue;
                }
                sum = sum.combine(DoubleSeries.powerOfV(b, order - 2 * a).timesU(a), pt.coefficient().multiply(scale));
            }
        }
        return sum;
    }

    /**
     * The coefficient of (log U)^log of a small-U expansion, times U^shift, as a series to the order.
     * Every power of U that reaches the order must be in the expansion and computed.
     */
    public static DoubleSeries of(SmallUExpansion.Result r, int log, int shift, int order) {
        Rational lastNeeded = Rational.of(order, 2).subtract(Rational.of(shift));
        if (r.through().compareTo(lastNeeded) < 0) {
            throw new ContourException("total degree " + order + " needs the powers of U up to U^" + lastNeeded
                    + ", but the expansion stops at U^" + r.through() + "; raise through:");
        }
        DoubleSeries sum = DoubleSeries.zero(order);
        for (SmallUExpansion.Term t : r.terms()) {
            if (t.log() != log) {
                continue;
            }
            Rational power = t.power().add(Rational.of(shift));
            if (!power.isInteger()) {
                throw new ContourException("U^" + power + " is not an integer power; its series in z, zbar has square roots");
            }
            int a = power.intValueExact();
            if (2 * a > order) {
                continue;
            }
            if (!t.computed()) {
                throw new ContourException("the coefficient of U^" + t.power() + " (log U)^" + log + " is not known: " + t.note());
            }
            sum = sum.add(DoubleSeries.fromOneMinusV(a, t.series(), order));
        }
        return sum;
    }
}
