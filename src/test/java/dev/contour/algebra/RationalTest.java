package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.math.BigInteger;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class RationalTest {
    @Provide
    Arbitrary<Long> longs() {
        return Arbitraries.oneOf(Arbitraries.longs().between(-50, 50), Arbitraries.longs(),
                Arbitraries.of(Long.MAX_VALUE, Long.MIN_VALUE, Long.MIN_VALUE + 1, 1L << 62, -(1L << 62), 3037000500L));
    }

    /** Reference value as an exact BigInteger pair (cross-multiplied comparison). */
    private static boolean sameValue(Rational r, BigInteger n, BigInteger d) {
        return r.numerator().multiply(d).equals(n.multiply(r.denominator()));
    }

    @Property(tries = 400)
    void arithmeticMatchesBigIntegerReference(@ForAll("longs") long a, @ForAll("longs") long b, @ForAll("longs") long c,
            @ForAll("longs") long d) {
        if (b == 0 || d == 0) {
            return;
        }
        Rational x = Rational.of(a, b);
        Rational y = Rational.of(c, d);
        BigInteger ba = BigInteger.valueOf(a);
        BigInteger bb = BigInteger.valueOf(b);
        BigInteger bc = BigInteger.valueOf(c);
        BigInteger bd = BigInteger.valueOf(d);
        assertTrue(sameValue(x.add(y), ba.multiply(bd).add(bc.multiply(bb)), bb.multiply(bd)));
        assertTrue(sameValue(x.subtract(y), ba.multiply(bd).subtract(bc.multiply(bb)), bb.multiply(bd)));
        assertTrue(sameValue(x.multiply(y), ba.multiply(bc), bb.multiply(bd)));
        if (c != 0) {
            assertTrue(sameValue(x.divide(y), ba.multiply(bd), bb.multiply(bc)));
        }
        assertEquals(ba.multiply(bd).multiply(bb.signum() * bd.signum() > 0 ? BigInteger.ONE : BigInteger.ONE.negate())
                .compareTo(bc.multiply(bb).multiply(bb.signum() * bd.signum() > 0 ? BigInteger.ONE : BigInteger.ONE.negate())),
                x.compareTo(y));
        assertCanonical(x.add(y));
        assertCanonical(x.multiply(y));
    }

    /** Same value built through BigInteger gives the identical (equal, hash-equal) object. */
    private static void assertCanonical(Rational r) {
        Rational viaBig = Rational.of(r.numerator().multiply(BigInteger.valueOf(7)), r.denominator().multiply(BigInteger.valueOf(7)));
        assertEquals(viaBig, r);
        assertEquals(viaBig.hashCode(), r.hashCode());
        assertEquals(BigInteger.ONE, r.numerator().gcd(r.denominator()));
        assertEquals(1, r.denominator().signum());
    }

    @Property(tries = 200)
    void fieldLaws(@ForAll("longs") long a, @ForAll("longs") long b, @ForAll("longs") long c) {
        Rational x = Rational.of(a, 3);
        Rational y = Rational.of(b, 5);
        Rational z = Rational.of(c, 7);
        assertEquals(x.add(y).add(z), x.add(y.add(z)));
        assertEquals(x.multiply(y.add(z)), x.multiply(y).add(x.multiply(z)));
        assertEquals(x.multiply(y).multiply(z), x.multiply(y.multiply(z)));
        assertEquals(Rational.ZERO, x.subtract(x));
        if (!x.isZero()) {
            assertEquals(Rational.ONE, x.multiply(x.inverse()));
            assertEquals(y, y.divide(x).multiply(x));
        }
    }

    @Test
    void overflowPromotesToBigInteger() {
        Rational max = Rational.of(Long.MAX_VALUE);
        Rational sum = max.add(Rational.ONE);
        assertEquals(BigInteger.valueOf(Long.MAX_VALUE).add(BigInteger.ONE), sum.numerator());
        assertEquals(max, sum.subtract(Rational.ONE));
        Rational sq = max.multiply(max);
        assertEquals(BigInteger.valueOf(Long.MAX_VALUE).pow(2), sq.numerator());
        assertEquals(max, sq.divide(max));
        Rational min = Rational.of(Long.MIN_VALUE);
        assertEquals(BigInteger.valueOf(Long.MIN_VALUE).negate(), min.negate().numerator());
        assertEquals(min, min.negate().negate());
        assertEquals(Rational.of(1, Long.MAX_VALUE).add(Rational.of(1, Long.MAX_VALUE - 1)).denominator(),
                BigInteger.valueOf(Long.MAX_VALUE).multiply(BigInteger.valueOf(Long.MAX_VALUE - 1)));
        assertEquals(Rational.of(-1, 2).abs(), Rational.of(1, 2));
        assertEquals(Rational.of(1, Long.MIN_VALUE), Rational.of(-1, 1L << 62).divide(Rational.of(2)));
        assertEquals(Rational.parse("1/1024").pow(-7), Rational.of(BigInteger.TWO.pow(70)));
    }

    @Test
    void normalisation() {
        assertEquals(Rational.of(-3, 4), Rational.of(6, -8));
        assertEquals("-3/4", Rational.of(6, -8).toString());
        assertEquals("5", Rational.of(10, 2).toString());
        assertEquals(Rational.of(3, 4), Rational.parse(" 3/4 "));
        assertEquals(Rational.of(-12, 5), Rational.parse("-12/5"));
        assertEquals(Rational.of(-3), Rational.parse("-3"));
        assertTrue(Rational.of(4, 2).isInteger());
        assertFalse(Rational.of(1, 2).isInteger());
        assertEquals(7, Rational.of(14, 2).intValueExact());
        assertEquals(0.25, Rational.of(1, 4).doubleValue());
    }

    @Test
    void errorsAreContourExceptions() {
        ContourException e = assertThrows(ContourException.class, () -> Rational.of(1, 0));
        assertTrue(e.getMessage().contains("division by zero"), e.getMessage());
        e = assertThrows(ContourException.class, () -> Rational.ONE.divide(Rational.ZERO));
        assertTrue(e.getMessage().contains("division by zero"), e.getMessage());
        assertThrows(ContourException.class, () -> Rational.ZERO.inverse());
        assertThrows(ContourException.class, () -> Rational.ZERO.pow(-1));
        assertThrows(ContourException.class, () -> Rational.parse("1/x"));
        assertThrows(ContourException.class, () -> Rational.of(1, 2).intValueExact());
        assertThrows(ContourException.class, () -> Rational.of(1L << 40).intValueExact());
        assertThrows(ContourException.class, () -> Rational.of(BigInteger.ONE, BigInteger.ZERO));
    }
}
