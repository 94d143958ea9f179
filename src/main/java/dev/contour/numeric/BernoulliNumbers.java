package dev.contour.numeric;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;

/**
 * Exact Bernoulli numbers B_n (B_1 = -1/2) from the recurrence sum_{k<=m} C(m+1, k) B_k = 0
 * (common practice), cached; apfloat's own routine takes seconds for the forty or so the Stirling
 * and dilogarithm series need.
 */
final class BernoulliNumbers {
    private BernoulliNumbers() { }

    /** A reduced fraction with positive denominator. */
    record Fraction(BigInteger numerator, BigInteger denominator) {
        static Fraction of(BigInteger n, BigInteger d) {
            if (d.signum() < 0) {
                n = n.negate();
                d = d.negate();
            }
            BigInteger g = n.gcd(d);
            return g.signum() == 0 || g.equals(BigInteger.ONE) ? new Fraction(n, d) : new Fraction(n.divide(g), d.divide(g));
        }

        Fraction add(Fraction o) {
            return of(numerator.multiply(o.denominator).add(o.numerator.multiply(denominator)), denominator.multiply(o.denominator));
        }
    }

    private static final List<Fraction> CACHE = new ArrayList<>(List.of(new Fraction(BigInteger.ONE, BigInteger.ONE)));

    static synchronized Fraction get(int n) {
        while (CACHE.size() <= n) {
            int m = CACHE.size();
            Fraction sum = new Fraction(BigInteger.ZERO, BigInteger.ONE);
            BigInteger binomial = BigInteger.ONE; // C(m+1, k)
            for (int k = 0; k < m; k++) {
                Fraction b = CACHE.get(k);
                sum = sum.add(Fraction.of(b.numerator.multiply(binomial), b.denominator));
                binomial = binomial.multiply(BigInteger.valueOf(m + 1 - k)).divide(BigInteger.valueOf(k + 1));
            }
            CACHE.add(Fraction.of(sum.numerator.negate(), sum.denominator.multiply(BigInteger.valueOf(m + 1))));
        }
        return CACHE.get(n);
    }
}
