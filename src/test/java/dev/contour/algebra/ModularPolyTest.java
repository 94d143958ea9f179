package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.LongRange;
import org.junit.jupiter.api.Test;

/** The primes the modular algorithms work modulo. */
class ModularPolyTest {
    @Property(tries = 3000)
    void isPrimeAgreesWithBigIntegerBelow2To31(@ForAll @LongRange(min = 0, max = (1L << 31) - 1) long n) {
        // BigInteger's test with certainty 100 is an independent reference (error below 2^-100).
        assertEquals(BigInteger.valueOf(n).isProbablePrime(100), ModularPoly.isPrime(n), "n = " + n);
    }

    @Test
    void strongPseudoprimesToSmallBasesAreRejected() {
        // 2047 = 23*89 (base 2), 1373653 = 829*1657 (bases 2, 3), 25326001 = 2251*11251 (bases 2, 3, 5):
        // the smallest strong pseudoprimes to those bases (common practice; values from memory, the
        // factorisations checked here).
        for (long[] c : new long[][] {{2047, 23}, {1373653, 829}, {25326001, 2251}}) {
            assertEquals(0, c[0] % c[1]);
            assertFalse(ModularPoly.isPrime(c[0]), "n = " + c[0]);
        }
    }

    @Test
    void previousPrimeWalksDownThePrimes() {
        // 2^31 - 1 is a Mersenne prime; below 2^28, each step lands on a prime with none skipped.
        assertEquals((1L << 31) - 1, ModularPoly.previousPrime(1L << 31));
        long p = 1L << 28;
        for (int i = 0; i < 50; i++) {
            long q = ModularPoly.previousPrime(p);
            assertTrue(q < p && BigInteger.valueOf(q).isProbablePrime(100), "q = " + q);
            for (long k = q + 1; k < p; k++) {
                assertFalse(BigInteger.valueOf(k).isProbablePrime(100), "k = " + k);
            }
            p = q;
        }
    }
}
