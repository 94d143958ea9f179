package dev.contour.algebra;

import java.math.BigInteger;

/**
 * Wang's rational reconstruction: the fraction u/v with |u|, |v| at most a bound and u = v x
 * modulo m, found by the extended Euclidean algorithm stopped half-way; unique when the bound is at
 * most sqrt(m/2). Modular algorithms (root finding in {@link LinearFactors}, the solver's modular
 * propagation) rebuild exact rationals from residues with it.
 */
public final class RationalReconstruction {
    private RationalReconstruction() { }

    /** u/v with |u|, |v| &lt;= bound and u = v x (mod m), or null when there is none. */
    public static Rational of(BigInteger x, BigInteger m, BigInteger bound) {
        BigInteger r0 = m;
        BigInteger r1 = x.mod(m);
        BigInteger s0 = BigInteger.ZERO;
        BigInteger s1 = BigInteger.ONE;
        while (r1.compareTo(bound) > 0) {
            BigInteger[] qr = r0.divideAndRemainder(r1);
            r0 = r1;
            r1 = qr[1];
            BigInteger s2 = s0.subtract(qr[0].multiply(s1));
            s0 = s1;
            s1 = s2;
        }
        if (s1.signum() == 0 || s1.abs().compareTo(bound) > 0 || !r1.gcd(s1).equals(BigInteger.ONE)) {
            return null;
        }
        return Rational.of(r1, s1);
    }

    /** {@link #of(BigInteger, BigInteger, BigInteger)} with the largest bound that keeps the answer unique, sqrt(m/2). */
    public static Rational of(BigInteger x, BigInteger m) {
        return of(x, m, m.shiftRight(1).sqrt());
    }
}
