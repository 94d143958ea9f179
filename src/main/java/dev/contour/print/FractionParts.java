package dev.contour.print;

import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.math.BigInteger;
import java.util.ArrayList;
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
