package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;

import cc.redberry.rings.Rings;
import cc.redberry.rings.bigint.BigInteger;
import cc.redberry.rings.poly.multivar.MultivariatePolynomial;
import java.util.List;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/** Cross-checks against an independent library (rings 2.5.8, test scope): gcds and normalised fractions. */
class RingsCrossCheckTest {
    private static final RingsBridge BRIDGE = new RingsBridge(Gen.VARS);

    @Provide
    Arbitrary<Polynomial> polys() {
        return Gen.nonZeroPolynomials(5, 3);
    }

    @Provide
    Arbitrary<RationalFunction> fns() {
        return Gen.rationalFunctions();
    }

    @Property(tries = 150)
    void gcdAgreesWithReference(@ForAll("polys") Polynomial a, @ForAll("polys") Polynomial b, @ForAll("polys") Polynomial g) {
        Polynomial x = a.multiply(g);
        Polynomial y = b.multiply(g);
        MultivariatePolynomial<BigInteger> ref = cc.redberry.rings.poly.multivar.MultivariateGCD.PolynomialGCD(BRIDGE.toRings(x), BRIDGE.toRings(y));
        assertEquals(BRIDGE.fromRings(ref).primitivePart(), PolynomialGcd.gcd(x, y));
    }

    @Property(tries = 100)
    void normalisedSumsAgreeWithReference(@ForAll("fns") RationalFunction a, @ForAll("fns") RationalFunction b) {
        RationalFunction ours = a.add(b);
        Polynomial rawNum = a.numerator().multiply(b.denominator()).add(b.numerator().multiply(a.denominator()));
        Polynomial rawDen = a.denominator().multiply(b.denominator());
        if (rawNum.isZero()) {
            assertEquals(RationalFunction.ZERO, ours);
            return;
        }
        // The reference cancels num/den by its own gcd when it builds a fraction.
        var ring = Rings.MultivariateRingZ(Gen.VARS.size());
        var ref = new cc.redberry.rings.Rational<>(ring, BRIDGE.toRings(rawNum), BRIDGE.toRings(rawDen));
        Polynomial refNum = BRIDGE.fromRings(ref.numerator());
        Polynomial refDen = BRIDGE.fromRings(ref.denominator());
        assertEquals(refNum.primitivePart(), ours.numerator().primitivePart());
        assertEquals(refDen.primitivePart(), ours.denominator().primitivePart());
        // same value: ours.num * rawDen == rawNum * ours.den
        assertEquals(ours.numerator().multiply(rawDen), rawNum.multiply(ours.denominator()));
    }
}
