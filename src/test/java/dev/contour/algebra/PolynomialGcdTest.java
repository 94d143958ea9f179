package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class PolynomialGcdTest {
    @Provide
    Arbitrary<Polynomial> polys() {
        return Gen.polynomials(4, 2);
    }

    @Property(tries = 150)
    void commonFactorIsFound(@ForAll("polys") Polynomial a, @ForAll("polys") Polynomial b, @ForAll("polys") Polynomial g) {
        if (g.isZero()) {
            return;
        }
        Polynomial x = a.multiply(g);
        Polynomial y = b.multiply(g);
        Polynomial d = PolynomialGcd.gcd(x, y);
        assertTrue(d.tryDivide(g).isPresent(), () -> "gcd " + d + " not divisible by " + g);
        if (!x.isZero()) {
            assertTrue(x.tryDivide(d).isPresent());
        }
        if (!y.isZero()) {
            assertTrue(y.tryDivide(d).isPresent());
        }
        // the cofactors are coprime, so d is the greatest divisor
        if (!x.isZero() && !y.isZero()) {
            assertTrue(PolynomialGcd.gcd(x.divideExact(d), y.divideExact(d)).isOne());
        }
        assertEquals(d, d.primitivePart());
        assertEquals(d, PolynomialGcd.gcd(y, x));
    }

    @Test
    void edgeCases() {
        Polynomial s = Polynomial.variable("s");
        assertEquals(Polynomial.ZERO, PolynomialGcd.gcd(Polynomial.ZERO, Polynomial.ZERO));
        assertEquals(s, PolynomialGcd.gcd(Polynomial.ZERO, s.multiply(Rational.of(-3, 2))));
        assertEquals(Polynomial.ONE, PolynomialGcd.gcd(Polynomial.constant(6), s));
        Polynomial t = Polynomial.variable("t");
        Polynomial a = s.subtract(t).pow(3).multiply(s.add(Polynomial.ONE));
        Polynomial b = s.subtract(t).pow(2).multiply(t.add(Polynomial.ONE));
        assertEquals(s.subtract(t).pow(2), PolynomialGcd.gcd(a, b));
        assertEquals(Polynomial.ONE, PolynomialGcd.gcd(s, t));
    }
}
