package dev.contour.cft;

import dev.contour.algebra.Rational;
import org.junit.jupiter.api.Test;

import java.math.BigInteger;

import static org.junit.jupiter.api.Assertions.*;

/** From the <2222> reduced amplitude to a^(0) and gamma tables, through the library file and the language. */
class CftDataTest {
    private static final String SETUP = """
            use "ads5s5_cftdata.ctr"
            let Mred = 1/((s - 2)*(t - 2)*(utilde - 2)) at utilde = 4 - s - t
            let A = free_long_2222(2, 8)
            let G = gamma_2222(Mred, 2, 8)
            """;

    private static String showAll() {
        StringBuilder b = new StringBuilder(SETUP);
        for (int n = 0; n <= 2; n++) {
            for (int l = 0; l <= 8; l += 2) {
                b.append("show block_coefficient(A, ").append(8 + 2 * n).append(", ").append(l).append(")\n");
                b.append("show block_coefficient(G, ").append(8 + 2 * n).append(", ").append(l).append(")\n");
            }
        }
        return b.toString();
    }

    private static final String OUT = CftScripts.run(showAll());

    /** Gamma(k + 1/2)/sqrt(pi) = (2k)!/(4^k k!). */
    private static Rational halfGamma(int k) {
        return ExactGamma.factorial(2 * k).divide(Rational.of(BigInteger.valueOf(4).pow(k)).multiply(ExactGamma.factorial(k)));
    }

    @Test
    void freeLongCoefficientsMatchThePublishedClosedForm() {
        // arXiv:1410.4717 (recalled from memory in the physics reference, checked there for n <= 5, l <= 9):
        // a0_(n,l) = pi (l+1)(l+2n+6) Gamma(n+3) Gamma(n+l+4) / (2^(2l+4n+9) Gamma(n+5/2) Gamma(n+l+7/2)).
        for (int n = 0; n <= 2; n++) {
            for (int l = 0; l <= 8; l += 2) {
                Rational expected = Rational.of((long) (l + 1) * (l + 2 * n + 6))
                        .multiply(ExactGamma.factorial(n + 2)).multiply(ExactGamma.factorial(n + l + 3))
                        .divide(Rational.of(BigInteger.TWO.pow(2 * l + 4 * n + 9)))
                        .divide(halfGamma(n + 2).multiply(halfGamma(n + l + 3)));
                assertEquals(expected, CftScripts.number(OUT, "block_coefficient(A, " + (8 + 2 * n) + ", " + l + ")"), "n=" + n + " l=" + l);
            }
        }
        assertEquals(Rational.of(1, 10), CftScripts.number(OUT, "block_coefficient(A, 8, 0)"));
        assertEquals(Rational.of(2, 63), CftScripts.number(OUT, "block_coefficient(A, 8, 2)"));
    }

    @Test
    void anomalousDimensionsFollowThePublishedShapeWithOneConstant() {
        // arXiv:1410.4717: gamma_(n,l) proportional to -(n+1)(n+2)(n+3)(n+4)/((l+1)(l+6+2n)).
        // With M = 1/((s-2)(t-2)(utilde-2)) and the s-contour closed on the right of Re s = 4/3 the
        // constant is 1/8, so gamma_(0,0) = -1/2 (the usual -16/N^2 is C = 32/N^2).
        for (int n = 0; n <= 2; n++) {
            for (int l = 0; l <= 8; l += 2) {
                Rational shape = Rational.of(-(long) (n + 1) * (n + 2) * (n + 3) * (n + 4)).divide(Rational.of((long) (l + 1) * (l + 6 + 2 * n)));
                assertEquals(shape.divide(Rational.of(8)), CftScripts.number(OUT, "block_coefficient(G, " + (8 + 2 * n) + ", " + l + ")"),
                        "n=" + n + " l=" + l);
            }
        }
    }

    @Test
    void spinDependenceAtLeadingTwistIsTheNormalisationFreeRatio() {
        // arXiv:1410.4717: gamma_(0,l)/gamma_(0,0) = 6/((l+1)(l+6)).
        Rational g00 = CftScripts.number(OUT, "block_coefficient(G, 8, 0)");
        for (int l = 0; l <= 8; l += 2) {
            assertEquals(Rational.of(6, (long) (l + 1) * (l + 6)), CftScripts.number(OUT, "block_coefficient(G, 8, " + l + ")").divide(g00));
        }
    }

    @Test
    void tablesPrintAsTextLatexAndJson() {
        String out = CftScripts.run(SETUP.replace("2, 8)", "1, 2)") + "show G\nshow G as latex\nshow G as json\n");
        assertTrue(out.contains("gamma (<2222>) (2 x 2):"), out);
        assertTrue(out.contains("0 |   -1/2  -1/8"), out);
        assertTrue(out.contains("\\begin{array}{r|rr}"), out);
        assertTrue(out.contains("0 & -\\frac{1}{2} & -\\frac{1}{8} \\\\"), out);
        assertTrue(out.contains("{\"twist\":8,\"n\":0,\"spin\":0,\"value\":\"-1/2\"}"), out);
    }

    @Test
    void theRationalSplittingGivesNegativeLongCoefficients() {
        // Physics reference section 7 (pitfall): G_free = G_0 + R*(U/V^2) also solves the Ward identity,
        // but its H = U/V^2 has, at block twist 8 (the long multiplet of twist 4), the coefficients
        // -1/10, -1/126, ..., of alternating sign across twists: not unitary data. The library's route
        // decomposes the [0,4,0] projection of G_free instead and gets +1/10, +2/63.
        String out = CftScripts.run("""
                vars U, V collected
                let H = decompose(zseries(U^2*(U/V^2), order: 14), d: 4, twists: 6..14 step 2, spins: 0..6)
                show block_coefficient(H, 8, 0)
                show block_coefficient(H, 8, 2)
                show block_coefficient(H, 10, 0)
                show block_coefficient(H, 12, 0)
                use "ads5s5_cftdata.ctr"
                show block_coefficient(free_long_2222(2, 2), 8, 0)
                """);
        assertEquals(Rational.of(-1, 10), CftScripts.number(out, "block_coefficient(H, 8, 0)"));
        assertEquals(Rational.of(-1, 126), CftScripts.number(out, "block_coefficient(H, 8, 2)"));
        assertTrue(CftScripts.number(out, "block_coefficient(H, 10, 0)").signum() > 0, out);
        assertTrue(CftScripts.number(out, "block_coefficient(H, 12, 0)").signum() < 0, out);
        assertEquals(Rational.of(1, 10), CftScripts.number(out, "block_coefficient(free_long_2222(2, 2), 8, 0)"));
    }
}
