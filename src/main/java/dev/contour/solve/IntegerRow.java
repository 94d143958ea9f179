package dev.contour.solve;

import dev.contour.algebra.Hashing;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.Arrays;

/**
 * One equation sum a_j x_j = b scaled to primitive integers (gcd 1, first coefficient positive).
 *
 * <p>Why integers: the modular pass reduces each coefficient once, the exact pass multiplies
 * integers by the solution, and equal equations from different pieces become identical rows that
 * can be dropped before elimination. Coefficients are stored as longs when they all fit.
 */
final class IntegerRow {
    final int[] cols;
    /** Coefficients when every one fits in a long (and the rhs does); otherwise null. */
    final long[] small;
    /** Coefficients otherwise. */
    final BigInteger[] big;
    final BigInteger rhs;
    /** Index of the constraint (its source span) this row comes from. */
    final int tag;
    private final int hash;

    private IntegerRow(int[] cols, long[] small, BigInteger[] big, BigInteger rhs, int tag) {
        this.cols = cols;
        this.small = small;
        this.big = big;
        this.rhs = rhs;
        this.tag = tag;
        int h = Hashing.mix(rhs.hashCode());
        for (int c : cols) {
            h = Hashing.combine(h, c);
        }
        if (small != null) {
            for (long v : small) {
                h = Hashing.combine(h, Long.hashCode(v));
            }
        } else {
            for (BigInteger b : big) {
                h = Hashing.combine(h, b.hashCode());
            }
        }
        this.hash = h;
    }

    /** The primitive integer row of sum vals[i] x_cols[i] = rhs; cols sorted, distinct, vals non-zero. Null for 0 = 0. */
    static IntegerRow of(int[] cols, Rational[] vals, Rational rhs, int tag) {
        IntegerRow quick = small(cols, vals, rhs, tag);
        if (quick != null) {
            return quick;
        }
        BigInteger lcm = rhs.denominator();
        for (Rational v : vals) {
            lcm = lcm(lcm, v.denominator());
        }
        BigInteger[] ints = new BigInteger[vals.length];
        BigInteger gcd = BigInteger.ZERO;
        for (int i = 0; i < vals.length; i++) {
            ints[i] = vals[i].numerator().multiply(lcm.divide(vals[i].denominator()));
            gcd = gcd.gcd(ints[i]);
        }
        BigInteger b = rhs.numerator().multiply(lcm.divide(rhs.denominator()));
        gcd = gcd.gcd(b);
        if (gcd.signum() == 0) {
            return null;
        }
        if (ints.length > 0 && ints[0].signum() < 0 || ints.length == 0 && b.signum() < 0) {
            gcd = gcd.negate();
        }
        boolean fits = true;
        for (int i = 0; i < ints.length; i++) {
            ints[i] = ints[i].divide(gcd);
            fits &= ints[i].bitLength() < 63;
        }
        b = b.divide(gcd);
        if (!fits) {
            return new IntegerRow(cols, null, ints, b, tag);
        }
        long[] s = new long[ints.length];
        for (int i = 0; i < s.length; i++) {
            s[i] = ints[i].longValue();
        }
        return new IntegerRow(cols, s, null, b, tag);
    }

    /** The same in word arithmetic for a homogeneous row of small rationals; null when it does not apply. */
    private static IntegerRow small(int[] cols, Rational[] vals, Rational rhs, int tag) {
        if (!rhs.isZero() || vals.length == 0) {
            return null;
        }
        try {
            long lcm = 1;
            for (Rational v : vals) {
                if (!v.isSmall()) {
                    return null;
                }
                long d = v.longDen();
                lcm = d == 1 || d == lcm ? lcm : Math.multiplyExact(lcm / gcd(lcm, d), d);
            }
            long[] ints = new long[vals.length];
            long g = 0;
            for (int i = 0; i < vals.length; i++) {
                ints[i] = Math.multiplyExact(vals[i].longNum(), lcm / vals[i].longDen());
                g = gcd(g, Math.abs(ints[i]));
            }
            if (ints[0] < 0) {
                g = -g;
            }
            for (int i = 0; i < ints.length; i++) {
                ints[i] /= g;
            }
            return new IntegerRow(cols, ints, null, BigInteger.ZERO, tag);
        } catch (ArithmeticException overflow) {
            return null;
        }
    }

    private static long gcd(long a, long b) {
        while (b != 0) {
            long r = a % b;
            a = b;
            b = r;
        }
        return Math.abs(a);
    }

    private static BigInteger lcm(BigInteger a, BigInteger b) {
        if (a.equals(BigInteger.ONE)) {
            return b;
        }
        if (b.equals(BigInteger.ONE) || a.equals(b)) {
            return a;
        }
        return a.divide(a.gcd(b)).multiply(b);
    }

    int length() {
        return cols.length;
    }

    /** The coefficient as a Rational, without a BigInteger when it fits a long. */
    Rational rational(int i) {
        return small != null ? Rational.of(small[i]) : Rational.of(big[i]);
    }

    BigInteger coefficient(int i) {
        return small != null ? BigInteger.valueOf(small[i]) : big[i];
    }

    /** The coefficient reduced modulo a prime, in [0, prime). */
    long coefficientMod(int i, long prime) {
        if (small != null) {
            return Math.floorMod(small[i], prime);
        }
        return big[i].mod(BigInteger.valueOf(prime)).longValue();
    }

    long rhsMod(long prime) {
        return rhs.signum() == 0 ? 0 : rhs.mod(BigInteger.valueOf(prime)).longValue();
    }

    /** Same equation (coefficients and right side), ignoring the tag. */
    boolean sameEquation(IntegerRow o) {
        return hash == o.hash && Arrays.equals(cols, o.cols) && rhs.equals(o.rhs)
                && (small != null ? Arrays.equals(small, o.small) : Arrays.equals(big, o.big));
    }

    int equationHash() {
        return hash;
    }
}
