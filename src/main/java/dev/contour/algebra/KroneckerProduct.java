package dev.contour.algebra;

import dev.contour.Cancellation;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;

/**
 * Multiplication of large polynomials by Kronecker substitution: both factors are mapped to dense
 * univariate polynomials (mixed-radix exponent index), then to single integers with one fixed-width
 * slot per coefficient, multiplied with {@link BigInteger#multiply} (Karatsuba/Toom-Cook), and read
 * back. Wins over term-by-term products when the polynomials are fairly dense with large
 * coefficients, as the numerators of big sums of fractions are.
 */
final class KroneckerProduct {
    private KroneckerProduct() { }

    /** Whether the dense encoding is small enough compared with the term-by-term work. */
    static boolean worthwhile(int[][] a, int[][] b, int n) {
        if (a.length < 16 || b.length < 16) {
            return false;
        }
        double slots = 1;
        for (int v = 0; v < n; v++) {
            slots *= maxExp(a, v) + maxExp(b, v) + 1;
        }
        return slots <= 8.0 * a.length * b.length && slots < 5e7;
    }

    /**
     * Whether one big integer product beats the term-by-term one, given the slot width: Java's
     * BigInteger multiplies huge numbers by Toom-Cook 3 (about n^1.465 word operations, common
     * practice), so a sparse polynomial (a homogeneous one fills only a diagonal of its dense box)
     * with long coefficients must not be packed: (s + t)^200 squared packs 160,000 slots of 52 bytes,
     * minutes of multiplication, where 40,000 coefficient products take milliseconds.
     */
    static boolean cheaperThanTerms(int[][] a, Rational[] ca, int[][] b, Rational[] cb, int n) {
        long slots = 1;
        for (int v = 0; v < n; v++) {
            slots *= maxExp(a, v) + maxExp(b, v) + 1;
        }
        int bitsA = coefficientBits(ca);
        int bitsB = coefficientBits(cb);
        int widthBytes = (bitsA + bitsB + 64 + 7) / 8;
        return cheaperThanTerms(slots, widthBytes, a.length, b.length, bitsA, bitsB);
    }

    /** Bits of the largest numerator plus those of the largest denominator (a bound on the packed integers' size). */
    private static int coefficientBits(Rational[] c) {
        int num = 0;
        int den = 0;
        for (Rational r : c) {
            num = Math.max(num, r.numerator().bitLength());
            den = Math.max(den, r.denominator().bitLength());
        }
        return num + den;
    }

    static boolean cheaperThanTerms(long slots, int widthBytes, int termsA, int termsB, int bitsA, int bitsB) {
        double words = slots * (double) widthBytes / 8;
        double packed = Math.pow(Math.max(words, 1), 1.465);
        double byTerms = (double) termsA * termsB * (Math.ceil(bitsA / 64.0) * Math.ceil(bitsB / 64.0) + 8);
        return packed <= byTerms;
    }

    static int maxExp(int[][] e, int v) {
        int d = 0;
        for (int[] t : e) {
            d = Math.max(d, t[v]);
        }
        return d;
    }

    /** Above this many bits in one packed factor, the term-by-term product is used instead. */
    private static final double MAX_PACKED_BITS = 1 << 27;

    /**
     * The product over variables u (exponent vectors over u), as a canonical polynomial; null when
     * the packed integers would be too large (far past where BigInteger multiplication is quick,
     * and towards the end of its range).
     */
    static Polynomial multiply(String[] u, int[][] a, Rational[] ca, int[][] b, Rational[] cb) {
        int n = u.length;
        int[] radix = new int[n];
        long[] weight = new long[n];
        long w = 1;
        for (int v = 0; v < n; v++) {
            radix[v] = maxExp(a, v) + maxExp(b, v) + 1;
            weight[v] = w;
            w *= radix[v];
        }
        long slots = w;
        BigInteger da = commonDenominator(ca);
        BigInteger db = commonDenominator(cb);
        BigInteger[] ia = integers(ca, da);
        BigInteger[] ib = integers(cb, db);
        int bitsA = maxBits(ia);
        int bitsB = maxBits(ib);
        int guard = 64 - Long.numberOfLeadingZeros(Math.min(a.length, b.length)) + 2;
        int width = (bitsA + bitsB + guard + 7) / 8;
        if ((double) slots * width * 8 > MAX_PACKED_BITS) {
            return null;
        }
        BigInteger x = pack(a, ia, weight, slots, width);
        BigInteger y = pack(b, ib, weight, slots, width);
        Cancellation.check();
        BigInteger z = x.multiply(y);
        Cancellation.check();
        BigInteger den = da.multiply(db);
        return unpack(z, u, radix, slots, width, den);
    }

    private static BigInteger commonDenominator(Rational[] c) {
        BigInteger l = BigInteger.ONE;
        for (Rational r : c) {
            if (!r.isInteger()) {
                BigInteger d = r.denominator();
                l = l.divide(l.gcd(d)).multiply(d);
            }
        }
        return l;
    }

    private static BigInteger[] integers(Rational[] c, BigInteger l) {
        BigInteger[] out = new BigInteger[c.length];
        for (int i = 0; i < c.length; i++) {
            out[i] = l.equals(BigInteger.ONE) ? c[i].numerator() : c[i].numerator().multiply(l.divide(c[i].denominator()));
        }
        return out;
    }

    private static int maxBits(BigInteger[] c) {
        int m = 0;
        for (BigInteger b : c) {
            m = Math.max(m, b.bitLength());
        }
        return m;
    }

    /** sum c_i * 2^(8 * width * index_i), built as (positive part) - (negative part) from byte arrays. */
    private static BigInteger pack(int[][] e, BigInteger[] c, long[] weight, long slots, int width) {
        long totalBytes = slots * width;
        if (totalBytes > Integer.MAX_VALUE - 16) {
            throw new ArithmeticException("Kronecker encoding too large");
        }
        byte[] pos = null;
        byte[] neg = null;
        int len = (int) totalBytes;
        for (int t = 0; t < e.length; t++) {
            long index = 0;
            for (int v = 0; v < weight.length; v++) {
                index += e[t][v] * weight[v];
            }
            BigInteger m = c[t];
            byte[] mag = m.abs().toByteArray();
            byte[] target;
            if (m.signum() >= 0) {
                if (pos == null) {
                    pos = new byte[len];
                }
                target = pos;
            } else {
                if (neg == null) {
                    neg = new byte[len];
                }
                target = neg;
            }
            // big-endian: slot `index` occupies bytes [len - (index+1)*width, len - index*width)
            int end = (int) (len - index * width);
            int start = mag[0] == 0 ? 1 : 0;
            int count = mag.length - start;
            System.arraycopy(mag, start, target, end - count, count);
        }
        BigInteger p = pos == null ? BigInteger.ZERO : new BigInteger(1, pos);
        BigInteger q = neg == null ? BigInteger.ZERO : new BigInteger(1, neg);
        return p.subtract(q);
    }

    /** Reads signed slot values back (two's complement with a running borrow) and divides by den. */
    private static Polynomial unpack(BigInteger z, String[] u, int[] radix, long slots, int width, BigInteger den) {
        int n = u.length;
        byte[] bytes = z.toByteArray();
        int len = bytes.length;
        boolean negative = z.signum() < 0;
        List<int[]> ex = new ArrayList<>();
        List<Rational> co = new ArrayList<>();
        BigInteger full = BigInteger.ONE.shiftLeft(8 * width);
        BigInteger half = BigInteger.ONE.shiftLeft(8 * width - 1);
        int carry = 0;
        byte[] chunk = new byte[width];
        for (long index = 0; index < slots; index++) {
            int end = (int) (len - index * width);
            int start = end - width;
            boolean allZero = true;
            for (int k = 0; k < width; k++) {
                int pos = start + k;
                byte bv = pos >= 0 && pos < len ? bytes[pos] : (negative ? (byte) 0xff : 0);
                chunk[k] = bv;
                allZero &= bv == 0;
            }
            if (allZero && carry == 0) {
                continue;
            }
            BigInteger r = new BigInteger(1, chunk);
            if (carry != 0) {
                r = r.add(BigInteger.ONE);
            }
            if (r.compareTo(half) >= 0) {
                r = r.subtract(full);
                carry = 1;
            } else {
                carry = 0;
            }
            if (r.signum() != 0) {
                int[] e = new int[n];
                long rest = index;
                for (int v = 0; v < n; v++) {
                    e[v] = (int) (rest % radix[v]);
                    rest /= radix[v];
                }
                ex.add(e);
                co.add(Rational.of(r, den));
            }
        }
        return Polynomial.fromArrays(u, ex.toArray(new int[0][]), co.toArray(new Rational[0]), false);
    }
}
