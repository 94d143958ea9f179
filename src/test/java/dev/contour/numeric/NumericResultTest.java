package dev.contour.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;
import org.junit.jupiter.api.Test;

class NumericResultTest {

    @Test
    void digitsFollowFromTheErrorAndNoiseBelowItIsZero() {
        Apcomplex v = new Apcomplex(new Apfloat("5.19764301454008160267", 22), new Apfloat("4.8e-19", 5));
        NumericResult r = NumericResult.of(v, -16.5, 30); // error 3.2e-17 on a value near 5.2
        assertEquals(17, r.digits());
        assertTrue(r.value().imag().isZero(), r::toString);
        assertEquals("5.1976430145400816", r.toString().substring(0, 18));
        assertTrue(r.toString().contains("17 digits"), r::toString);
    }

    @Test
    void theClaimIsCappedAndZeroClaimsNothing() {
        assertEquals(12, NumericResult.of(new Apfloat("2.5", 40), -60, 12).digits());
        assertEquals(0, NumericResult.of(Apcomplex.ZERO, -20, 12).digits());
    }
}
