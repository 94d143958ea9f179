package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reduction of products of Gamma functions whose arguments differ by integers to Pochhammer
 * symbols, i.e. to exact rational functions.
 *
 * <p>Kept in one small class so that a term-rewriting engine can later route the same reduction
 * through rules: {@link #pochhammer} is the single identity {@code Gamma(x + n) / Gamma(x) = (x)_n}
 * used for every integer n of either sign.
 */
public final class GammaRatio {
    private GammaRatio() { }

    /**
     * The Pochhammer symbol {@code (x)_n = Gamma(x + n) / Gamma(x)}: {@code x (x+1) ... (x+n-1)} for
     * n >= 0 and {@code 1 / ((x-1)(x-2) ... (x+n))} for n < 0.
     */
    public static RationalFunction pochhammer(Polynomial x, int n) {
        Polynomial p = Polynomial.ONE;
        for (int i = 0; i < Math.abs(n); i++) {
            p = p.multiply(x.add(Polynomial.constant(n >= 0 ? i : -(i + 1))));
        }
        return n >= 0 ? RationalFunction.of(p) : RationalFunction.of(Polynomial.ONE, p);
    }

    /**
     * The product of the given Gamma powers as a rational function.
     *
     * <p>Arguments are grouped by their non-constant part; within a group every argument must differ
     * from the others by an integer and the exponents must add up to zero. Otherwise the product is
     * not rational and a ContourException names the factor that does not cancel.
     */
    public static RationalFunction reduce(List<GammaPower> factors) {
        Map<Polynomial, List<GammaPower>> groups = new LinkedHashMap<>();
        for (GammaPower g : factors) {
            if (g.exponent() != 0) {
                groups.computeIfAbsent(variablePart(g.argument()), k -> new ArrayList<>()).add(g);
            }
        }
        RationalFunction result = RationalFunction.ONE;
        for (List<GammaPower> group : groups.values()) {
            // Offsets are measured from the first argument; the base is the argument with the
            // smallest constant term, so every Pochhammer symbol has a non-negative length.
            Rational first = constantPart(group.get(0).argument());
            GammaPower lowest = group.get(0);
            for (GammaPower g : group) {
                Rational offset = constantPart(g.argument()).subtract(first);
                if (!offset.isInteger()) {
                    throw new ContourException("Gamma ratio is not rational: " + g + " and "
                            + group.get(0) + " differ by " + offset + ", not an integer");
                }
                if (constantPart(g.argument()).compareTo(constantPart(lowest.argument())) < 0) {
                    lowest = g;
                }
            }
            Polynomial base = lowest.argument();
            Rational baseConstant = constantPart(base);
            int total = 0;
            RationalFunction part = RationalFunction.ONE;
            for (GammaPower g : group) {
                int offset = constantPart(g.argument()).subtract(baseConstant).intValueExact();
                part = part.multiply(pochhammer(base, offset).pow(g.exponent()));
                total += g.exponent();
            }
            if (total != 0) {
                throw new ContourException("Gamma ratio is not rational: Gamma(" + base + ") is left with power "
                        + total + " after cancelling the factors " + group);
            }
            result = result.multiply(part);
        }
        return result;
    }

    /** The ratio {@code prod numerator / prod denominator}. */
    public static RationalFunction reduce(List<GammaPower> numerator, List<GammaPower> denominator) {
        List<GammaPower> all = new ArrayList<>(numerator);
        denominator.forEach(g -> all.add(g.inverse()));
        return reduce(all);
    }

    static Rational constantPart(Polynomial p) {
        return p.evaluatePartially(zeroPoint(p)).constantValue();
    }

    private static Polynomial variablePart(Polynomial p) {
        return p.subtract(Polynomial.constant(constantPart(p)));
    }

    private static Map<String, Rational> zeroPoint(Polynomial p) {
        Map<String, Rational> z = new LinkedHashMap<>();
        p.variables().forEach(v -> z.put(v, Rational.ZERO));
        return z;
    }
}
