package dev.contour.print;

import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.Map;
import java.util.List;

/**
 * A rational function split the way people write it: a sign, an integer times factors over an
 * integer times factors, e.g. {@code -(s - 4)*(t - 4)/(16*(s + t - 6))}.
 *
 * <p>The denominator keeps the factors the canonical form stores; the numerator is one expanded
 * polynomial, or its linear factors and cofactor when {@code factored}.
 */
record FractionParts(int sign, BigInteger numeratorScalar, List<LinearFactors.Factor> numerator,
                     BigInteger denominatorScalar, List<LinearFactors.Factor> denominator) {

    /**
     * The order people write factors in: by their variables (s before t, one-variable factors
     * before mixed ones), then by the size of the constant term, so s*(s - 1)*(s - 2),
     * s*(s + 2)*(s + 4) and (s - 2)*(t - 4)*(s + t - 6). The canonical form's own order is an
     * implementation detail.
     */
    static final Comparator<LinearFactors.Factor> DISPLAY_ORDER = Comparator
            .comparing((LinearFactors.Factor f) -> f.base().totalDegree())
            .thenComparing(f -> f.base().variables().size())
            .thenComparing(f -> String.join(",", f.base().variables()))
            .thenComparing(f -> constantTerm(f).abs())
            .thenComparing(FractionParts::constantTerm)
            .thenComparing(f -> f.base().toString());

    private static Rational constantTerm(LinearFactors.Factor f) {
        Map<String, Rational> origin = new HashMap<>();
        for (String v : f.base().variables()) {
            origin.put(v, Rational.ZERO);
        }
        return f.base().evaluate(origin);
    }

    static FractionParts of(RationalFunction f, boolean factored) {
        Polynomial num = f.numerator();
        if (num.isZero()) {
            return new FractionParts(0, BigInteger.ZERO, List.of(), BigInteger.ONE, List.of());
        }
        Polynomial primitive = num.primitivePart();
        Rational scalar = num.leadingCoefficient().divide(primitive.leadingCoefficient());
        List<LinearFactors.Factor> factors = new ArrayList<>();
        if (factored && !primitive.isConstant()) {
            LinearFactors.Split split = LinearFactors.split(primitive);
            scalar = scalar.multiply(split.unit());
            factors.addAll(split.factors());
            if (!split.cofactor().isConstant()) {
                factors.add(new LinearFactors.Factor(split.cofactor(), 1));
            } else {
                scalar = scalar.multiply(split.cofactor().constantValue());
            }
        } else if (!primitive.isConstant()) {
            factors.add(new LinearFactors.Factor(primitive, 1));
        } else {
            scalar = scalar.multiply(primitive.constantValue());
        }
        List<LinearFactors.Factor> den = new ArrayList<>();
        Rational denScalar = Rational.ONE;
        for (LinearFactors.Factor d : f.denominatorFactors()) {
            if (d.base().isConstant()) {
                denScalar = denScalar.multiply(d.base().constantValue().pow(d.multiplicity()));
            } else {
                den.add(d);
            }
        }
        scalar = scalar.divide(denScalar);
        factors.sort(DISPLAY_ORDER);
        den.sort(DISPLAY_ORDER);
        return new FractionParts(scalar.signum(), scalar.numerator().abs(), List.copyOf(factors),
                scalar.denominator(), List.copyOf(den));
    }

    boolean isZero() {
        return sign == 0;
    }

    boolean hasDenominator() {
        return !denominator.isEmpty() || !denominatorScalar.equals(BigInteger.ONE);
    }
}
