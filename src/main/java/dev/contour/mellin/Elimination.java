package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;

import java.util.Map;

/**
 * A measure's eliminated variable and its value, such as {@code utilde = 4p - 4 - s - t}: the
 * constraint s + t + u = total read as a substitution.
 *
 * <p>An analysis that read u as a free parameter would treat 1/(u - 2) as a constant in s and t and
 * miss its pole and its decay, and a shift of s and t that did not move u would change the
 * function; so every use of an amplitude with a measure passes it through {@link #resolve}.
 */
public record Elimination(String variable, Polynomial value) {

    /**
     * {@code f} with the variable, where f mentions it, replaced by its value. A ContourException
     * (without a span: the caller places it) when f uses the variable as a collected one.
     */
    public Expression resolve(Expression f) {
        if (f.collectedVariables().contains(variable)) {
            throw new ContourException("the amplitude has '" + variable + "' as a collected variable, but the measure eliminates it ("
                    + this + "); declare " + variable + " as an inner variable");
        }
        if (!f.innerVariables().contains(variable)) {
            return f;
        }
        return f.substituteLinear(Map.of(variable, value));
    }

    /** Values given to parameters of the value (such as p = 4); a ContourException when the value stops being a polynomial. */
    public Elimination substitute(Map<String, Expression> values) {
        if (values.containsKey(variable)) {
            throw new ContourException("cannot replace '" + variable + "': the measure eliminates it (" + this + ")");
        }
        Expression v = Expression.of(dev.contour.algebra.RationalFunction.of(value)).substitute(values);
        if (!v.isRational() || !v.asRationalFunction().isPolynomial()) {
            throw new ContourException("the eliminated variable's value " + value + " must stay a polynomial, got " + v);
        }
        return new Elimination(variable, v.asRationalFunction().numerator());
    }

    @Override
    public String toString() {
        return variable + " = " + value;
    }
}
