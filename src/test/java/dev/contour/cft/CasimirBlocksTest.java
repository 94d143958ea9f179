package dev.contour.cft;

import dev.contour.algebra.Rational;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/** The Casimir recursion against the closed forms of hep-th/0011040 in d = 2 and 4. */
class CasimirBlocksTest {
    @Test
    void casimirRecursionReproducesTheClosedFormInFourDimensions() {
        // d enters the recursion only through (d - 2) and C; d = 4 exercises both. (In d = 2 the mirror
        // image z^(tau/2) zbar^(tau/2 + l) solves the same recursion and its pivots vanish: closed form there.
        // At the unitarity bound of spinning operators, twist d - 2, pivots vanish too and the recursion refuses.)
        int compared = 0;
        int refused = 0;
        for (int d : new int[] {4}) {
            for (int tw = 4; tw <= 10; tw += 2) {
                for (int l = 0; l <= 5; l++) {
                    if (d == 4 && tw < 2) {
                        continue;
                    }
                    Rational delta = Rational.of(tw + l);
                    DoubleSeries fromRecursion;
                    try {
                        fromRecursion = CasimirBlocks.block(d, delta, l, 16);
                    } catch (dev.contour.ContourException e) {
                        // A block of the same Casimir value starts at that monomial: refused, never guessed.
                        assertTrue(e.getMessage().contains("singular"), e.getMessage());
                        refused++;
                        continue;
                    }
                    assertEquals(ConformalBlocks.block(d, delta, l, 16), fromRecursion, "d=" + d + " tw=" + tw + " l=" + l);
                    compared++;
                }
            }
        }
        assertTrue(compared >= 18, "compared " + compared + ", refused " + refused);
    }

    @Test
    void sixDimensionalBlocksThroughTheLanguage() {
        // d = 6 blocks come from the Casimir recursion (above the unitarity bound, twist > 4 for l >= 1;
        // common practice). Normalisation and symmetry as in the other dimensions.
        String out = CftScripts.run("show block(6, 8, 2, order: 10)\nshow block(6, 8, 0, order: 10)");
        assertTrue(out.startsWith("block(6, 8, 2, order: 10) = z^5*zbar^3 + 4/3*z^4*zbar^4 + z^3*zbar^5 +"), out);
        // Leading twist: the Gegenbauer polynomial C_l^(nu), nu = (d - 2)/2, in z, zbar (common practice;
        // hep-th/0011040): sum_k (nu)_k (nu)_(l-k)/(k! (l-k)!) z^(h+l-k) zbar^(h+k), divided by its k = 0 term.
        for (int l = 0; l <= 5; l++) {
            DoubleSeries b = CasimirBlocks.block(6, Rational.of(6 + l), l, 6 + l);
            Rational first = ExactGamma.pochhammer(Rational.of(2), l).divide(ExactGamma.factorial(l));
            for (int k = 0; k <= l; k++) {
                Rational ck = ExactGamma.pochhammer(Rational.of(2), k).multiply(ExactGamma.pochhammer(Rational.of(2), l - k))
                        .divide(ExactGamma.factorial(k).multiply(ExactGamma.factorial(l - k)));
                assertEquals(ck.divide(first), b.coefficient(3 + l - k, 3 + k), "l=" + l + " k=" + k);
            }
        }
        DoubleSeries g = CasimirBlocks.block(6, Rational.of(10), 2, 20);
        for (int i = 0; i <= 20; i++) {
            for (int j = 0; i + j <= 20; j++) {
                assertEquals(g.coefficient(i, j), g.coefficient(j, i));
            }
        }
        assertEquals(Rational.ONE, g.coefficient(6, 4));
        assertEquals(Rational.ZERO, g.coefficient(5, 4));
    }
}


class CasimirRefusalTest {
    @Test
    void conservedCurrentsAreRefusedNotGuessed() {
        ContourExceptionHolder.assertRefused(() -> CasimirBlocks.block(6, Rational.of(6), 2, 10));
    }
}

final class ContourExceptionHolder {
    private ContourExceptionHolder() { }

    static void assertRefused(Runnable r) {
        dev.contour.ContourException e = assertThrows(dev.contour.ContourException.class, r::run);
        assertTrue(e.getMessage().contains("singular"), e.getMessage());
    }
}
