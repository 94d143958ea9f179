package dev.contour.algebra;

import dev.contour.ContourException;
import java.math.BigInteger;

/**
 * An exact rational number in lowest terms with a positive denominator.
 *
 * <p>Representation: when numerator and denominator both fit in a {@code long} (excluding
 * {@link Long#MIN_VALUE}, whose negation overflows) they are stored as longs and arithmetic uses
 * {@code Math.*Exact}; any overflow falls back to {@link BigInteger}. The choice of representation is
 * a function of the value alone, so equal values are structurally equal. Division by zero throws
 * {@link ContourException} naming the operation.
 */
public final class Rational implements Comparable<Rational> {
    private static final Rational[] SMALL = new Rational[1025 + 128];

    static {
        for (int i = -128; i <= 1024; i++) {
            SMALL[i + 128] = new Rational(i, 1);
        }
    }

    public static final Rational ZERO = of(0);
    public static final Rational ONE = of(1);
    public static final Rational MINUS_ONE = of(-1);

    private static final BigInteger LONG_MIN = BigInteger.valueOf(Long.MIN_VALUE);

    /** Valid when {@code bnum == null}. */
    private final long num;
    private final long den;
    /** Non-null exactly when the value does not fit the long representation. */
    private final BigInteger bnum;
    private final BigInteger bden;

    private Rational(long num, long den) {
        this.num = num;
        this.den = den;
        this.bnum = null;
        this.bden = null;
    }

    private Rational(BigInteger num, BigInteger den) {
        this.num = 0;
        this.den = 0;
        this.bnum = num;
        this.bden = den;
    }

    public static Rational of(long n) {
        if (n >= -128 && n <= 1024) {
            return SMALL[(int) n + 128];
        }
        if (n == Long.MIN_VALUE) {
            return new Rational(LONG_MIN, BigInteger.ONE);
        }
        return new Rational(n, 1);
    }

    public static Rational of(long num, long den) {
        if (den == 0) {
            throw new ContourException("division by zero: rational " + num + "/0");
        }
        if (num == Long.MIN_VALUE || den == Long.MIN_VALUE) {
            return of(BigInteger.valueOf(num), BigInteger.valueOf(den));
        }
        if (den < 0) {
            num = -num;
            den = -den;
        }
        long g = gcd(Math.abs(num), den);
        if (g != 1) {
            num /= g;
            den /= g;
        }
        return den == 1 ? of(num) : new Rational(num, den);
    }

    public static Rational of(BigInteger n) {
        return fits(n) ? of(n.longValue()) : new Rational(n, BigInteger.ONE);
    }

    public static Rational of(BigInteger num, BigInteger den) {
        if (den.signum() == 0) {
            throw new ContourException("division by zero: rational " + num + "/0");
        }
        if (den.signum() < 0) {
            num = num.negate();
            den = den.negate();
        }
        BigInteger g = num.gcd(den);
        if (!g.equals(BigInteger.ONE)) {
            num = num.divide(g);
            den = den.divide(g);
        }
        return reduced(num, den);
    }

    /** Builds from an already reduced pair with positive denominator. */
    private static Rational reduced(BigInteger num, BigInteger den) {
        if (fits(num) && fits(den)) {
            long d = den.longValue();
            return d == 1 ? of(num.longValue()) : new Rational(num.longValue(), d);
        }
        return new Rational(num, den);
    }

    /** From a reduced long pair with positive denominator (MIN_VALUE is routed to BigInteger). */
    private static Rational reduced(long num, long den) {
        if (num == Long.MIN_VALUE || den == Long.MIN_VALUE) {
            return reduced(BigInteger.valueOf(num), BigInteger.valueOf(den));
        }
        return den == 1 ? of(num) : new Rational(num, den);
    }

    private static boolean fits(BigInteger b) {
        return b.bitLength() <= 63 && !b.equals(LONG_MIN);
    }

    /** Parses {@code "-3"}, {@code "3/4"}, {@code "-12/5"}. */
    public static Rational parse(String text) {
        String t = text.strip();
        try {
            int slash = t.indexOf('/');
            if (slash < 0) {
                return of(new BigInteger(t));
            }
            return of(new BigInteger(t.substring(0, slash).strip()), new BigInteger(t.substring(slash + 1).strip()));
        } catch (NumberFormatException e) {
            throw new ContourException("not a rational number: '" + text + "'");
        }
    }

    static long gcd(long a, long b) {
        while (b != 0) {
            long r = a % b;
            a = b;
            b = r;
        }
        return Math.abs(a);
    }

    /** Whether numerator and denominator are held as longs (then {@link #longNum()} and {@link #longDen()} apply). */
    public boolean isSmall() {
        return bnum == null;
    }

    /** Numerator as a long; only valid when {@link #isSmall()} (a fast path that allocates nothing). */
    public long longNum() {
        return num;
    }

    /** Denominator as a long; only valid when {@link #isSmall()}. */
    public long longDen() {
        return den;
    }

    public Rational add(Rational o) {
        if (bnum == null && o.bnum == null) {
            try {
                if (den == o.den) {
                    return of(Math.addExact(num, o.num), den);
                }
                long g = gcd(den, o.den);
                long d1 = den / g;
                long n = Math.addExact(Math.multiplyExact(num, o.den / g), Math.multiplyExact(o.num, d1));
                return of(n, Math.multiplyExact(d1, o.den));
            } catch (ArithmeticException overflow) {
                // fall through to BigInteger
            }
        }
        if (isInteger() && o.isInteger()) {
            return reduced(numerator().add(o.numerator()), BigInteger.ONE);
        }
        return of(numerator().multiply(o.denominator()).add(o.numerator().multiply(denominator())),
                denominator().multiply(o.denominator()));
    }

    public Rational subtract(Rational o) {
        return add(o.negate());
    }

    public Rational multiply(Rational o) {
        if (bnum == null && o.bnum == null) {
            if (num == 0 || o.num == 0) {
                return ZERO;
            }
            try {
                long g1 = gcd(Math.abs(num), o.den);
                long g2 = gcd(Math.abs(o.num), den);
                return reduced(Math.multiplyExact(num / g1, o.num / g2), Math.multiplyExact(den / g2, o.den / g1));
            } catch (ArithmeticException overflow) {
                // fall through to BigInteger
            }
        }
        if (isInteger() && o.isInteger()) {
            return reduced(numerator().multiply(o.numerator()), BigInteger.ONE);
        }
        return of(numerator().multiply(o.numerator()), denominator().multiply(o.denominator()));
    }

    public Rational divide(Rational o) {
        if (o.isZero()) {
            throw new ContourException("division by zero: " + this + " / 0");
        }
        return multiply(o.inverse());
    }

    public Rational negate() {
        if (bnum == null) {
            return num == 0 ? this : reduced(-num, den);
        }
        return reduced(bnum.negate(), bden);
    }

    public Rational inverse() {
        if (isZero()) {
            throw new ContourException("division by zero: inverse of 0");
        }
        if (bnum == null) {
            return num < 0 ? reduced(-den, -num) : reduced(den, num);
        }
        return bnum.signum() < 0 ? reduced(bden.negate(), bnum.negate()) : reduced(bden, bnum);
    }

    public Rational pow(int exponent) {
        if (exponent < 0) {
            if (isZero()) {
                throw new ContourException("division by zero: 0^" + exponent);
            }
            return inverse().pow(-(long) exponent > Integer.MAX_VALUE ? Integer.MAX_VALUE : -exponent);
        }
        return Powers.bySquaring(ONE, this, exponent, Rational::multiply);
    }

    public Rational abs() {
        return signum() < 0 ? negate() : this;
    }

    public int signum() {
        return bnum == null ? Long.signum(num) : bnum.signum();
    }

    public boolean isZero() {
        return bnum == null && num == 0;
    }

    public boolean isOne() {
        return bnum == null && num == 1 && den == 1;
    }

    public boolean isInteger() {
        return bnum == null ? den == 1 : bden.equals(BigInteger.ONE);
    }

    /** Whether this is an integer in the range of int (then {@link #intValueExact()} cannot throw). */
    public boolean fitsInt() {
        return bnum == null && den == 1 && num >= Integer.MIN_VALUE && num <= Integer.MAX_VALUE;
    }

    public BigInteger numerator() {
        return bnum == null ? BigInteger.valueOf(num) : bnum;
    }

    public BigInteger denominator() {
        return bnum == null ? BigInteger.valueOf(den) : bden;
    }

    /** The value as an int, or a ContourException when it is not an integer fitting in an int. */
    public int intValueExact() {
        if (bnum == null && den == 1 && num >= Integer.MIN_VALUE && num <= Integer.MAX_VALUE) {
            return (int) num;
        }
        throw new ContourException("not an integer that fits in an int: " + this);
    }

    public double doubleValue() {
        if (bnum == null) {
            return (double) num / (double) den;
        }
        return new java.math.BigDecimal(bnum).divide(new java.math.BigDecimal(bden), java.math.MathContext.DECIMAL64)
                .doubleValue();
    }

    @Override
    public int compareTo(Rational o) {
        if (bnum == null && o.bnum == null) {
            if (den == o.den) {
                return Long.compare(num, o.num);
            }
            try {
                return Long.compare(Math.multiplyExact(num, o.den), Math.multiplyExact(o.num, den));
            } catch (ArithmeticException overflow) {
                // fall through
            }
        }
        return numerator().multiply(o.denominator()).compareTo(o.numerator().multiply(denominator()));
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof Rational r)) {
            return false;
        }
        if (bnum == null) {
            return r.bnum == null && num == r.num && den == r.den;
        }
        return r.bnum != null && bnum.equals(r.bnum) && bden.equals(r.bden);
    }

    @Override
    public int hashCode() {
        // Canonical representation: a value that fits longs is never stored as BigInteger.
        return bnum == null ? Long.hashCode(num) * 31 + Long.hashCode(den) : bnum.hashCode() * 31 + bden.hashCode();
    }

    /** {@code "-3/4"} or {@code "5"}. */
    @Override
    public String toString() {
        if (bnum == null) {
            return den == 1 ? Long.toString(num) : num + "/" + den;
        }
        return bden.equals(BigInteger.ONE) ? bnum.toString() : bnum + "/" + bden;
    }
}
