package dev.contour.cft;

import dev.contour.algebra.Rational;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The singlet long sector of &lt;pppp&gt; through the library file and the language: SU(4) harmonics and
 * their projection, a^(0) from the free correlator, the averaged anomalous dimensions from the reduced
 * amplitude, and the placement of amplitude poles by channel in small_u.
 */
class CftPpppTest {

    /** The entry of a shown table printed as `block_coefficient(NAME, twist, l) = x`. */
    private static String showEntries(String table, int lowestTwist, int nmax, int lmax) {
        StringBuilder b = new StringBuilder();
        for (int n = 0; n <= nmax; n++) {
            for (int l = 0; l <= lmax; l += 2) {
                b.append("show block_coefficient(").append(table).append(", ").append(lowestTwist + 2 * n).append(", ").append(l).append(")\n");
            }
        }
        return b.toString();
    }

    private static Rational entry(String out, String table, int twist, int l) {
        return CftScripts.number(out, "block_coefficient(" + table + ", " + twist + ", " + l + ")");
    }

    @Test
    void harmonicsAreTheSo6ProjectorsAndOrthogonal() {
        // Common practice (SO(6) tensor algebra): for two vectors the symmetric traceless exchange is
        // (sigma + tau)/2 - 1/6 and the antisymmetric one (sigma - tau)/2, in units of t12 t34; the singlet is 1.
        // The Legendre form of the harmonics is that of hep-th/0407060 and hep-th/0412335.
        StringBuilder s = new StringBuilder("""
                use "ads5s5_cftdata.ctr"
                check su4_harmonic(0, 0) == 1
                check su4_harmonic(1, 0) == 3*(sigma - tau)
                check su4_harmonic(1, 1) == 6*((sigma + tau)/2 - 1/6)
                """);
        // Orthogonality for the pairing the projection uses (degree <= 4: every harmonic <4444> needs).
        for (int n = 0; n <= 4; n++) {
            for (int m = 0; m <= n; m++) {
                for (int n2 = n; n2 <= 4; n2++) {
                    for (int m2 = 0; m2 <= n2; m2++) {
                        if (n2 == n && m2 <= m) {
                            continue;
                        }
                        s.append("check su4_integral(su4_harmonic(").append(n).append(", ").append(m).append(")*su4_harmonic(")
                                .append(n2).append(", ").append(m2).append(")) == 0\n");
                    }
                }
            }
        }
        s.append("show su4_integral(su4_harmonic(2, 2)^2)\n");
        String out = CftScripts.run(s.toString());
        assertTrue(CftScripts.number(out, "su4_integral(su4_harmonic(2, 2)^2)").signum() > 0, out);
        assertFalse(out.contains("FAILED"), out);
    }

    @Test
    void theWardFactorFeedsTheTopChannelsTriangularly() {
        // The mechanism long_component relies on: R Y_nm has a Y_(n+2, m+2) component that is a number times
        // U^2 (physics reference section 7 for n = m = 0: R projects to U^2/6 in the [0,4,0] channel, there with
        // another normalisation of the harmonic) and none on Y_(n'+2, m'+2) when n' > n, or n' = n and m' > m.
        String out = CftScripts.run("""
                use "ads5s5_cftdata.ctr"
                show su4_component(ward_factor, 2, 2)
                show su4_component(ward_factor*su4_harmonic(1, 0), 3, 2)
                show su4_component(ward_factor*su4_harmonic(2, 1), 4, 3)
                check su4_component(ward_factor, 3, 2) == 0
                check su4_component(ward_factor*su4_harmonic(1, 0), 3, 3) == 0
                check su4_component(ward_factor*su4_harmonic(2, 0), 4, 3) == 0
                check su4_component(ward_factor*su4_harmonic(2, 1), 4, 4) == 0
                check su4_component(ward_factor*su4_harmonic(1, 1), 4, 4) == 0
                """);
        assertTrue(out.contains("su4_component(ward_factor, 2, 2) = 1/60*U^2"), out);
        assertTrue(out.contains("su4_component(ward_factor*su4_harmonic(1, 0), 3, 2) = 1/70*U^2"), out);
        assertTrue(out.contains("su4_component(ward_factor*su4_harmonic(2, 1), 4, 3) = 1/126*U^2"), out);
        assertFalse(out.contains("FAILED"), out);
    }

    @Test
    void peelingAndTheRecursiveTriangularSolveAgree() {
        // Two ways of solving the same triangular system for the singlet component of H.
        String out = CftScripts.run("""
                use "ads5s5_cftdata.ctr"
                check singlet_long_part(free_pppp(2), 2) == 1 + V^-2
                check singlet_long_part(free_pppp(3), 3) == long_component(free_pppp(3), 3, 0, 0)
                """);
        assertFalse(out.contains("FAILED"), out);
        assertEquals(2, out.lines().filter(l -> l.startsWith("check")).count(), out);
    }

    @Test
    @Tag("slow")
    void peelingAndTheRecursiveTriangularSolveAgreeAtP4() {
        // The recursion makes 32 calls at p = 4 (half a minute on a loaded machine).
        String out = CftScripts.run("""
                use "ads5s5_cftdata.ctr"
                check singlet_long_part(free_pppp(4), 4) == long_component(free_pppp(4), 4, 0, 0)
                """);
        assertFalse(out.contains("FAILED"), out);
        assertEquals(1, out.lines().filter(l -> l.startsWith("check")).count(), out);
    }

    @Test
    void theGeneralRouteReproducesThe2222TablesExactly() {
        String out = CftScripts.run("""
                use "ads5s5_cftdata.ctr"
                let Mred = 1/((s - 2)*(t - 2)*(utilde - 2)) at utilde = 4 - s - t
                check free_long_pppp(2, 3, 8) == free_long_2222(3, 8)
                check gamma_pppp(Mred, 2, 3, 8) == gamma_2222(Mred, 3, 8)
                check gamma_pppp(closed_form({2, 2, 2, 2}), 2, 1, 4) == gamma_2222(Mred, 1, 4)
                """);
        assertFalse(out.contains("FAILED"), out);
        assertEquals(3, out.lines().filter(l -> l.startsWith("check")).count(), out);
    }

    @Test
    void freeLongCoefficientsArePositiveAndStartAtTwist2p() {
        // At order N^0 <pppp> contains only the double traces [O_p O_p]: singlet long multiplets of twist
        // 2p + 2n (block twist 2p + 4 + 2n in U^2 H) with positive coefficients (unitarity), and none of
        // twist 4 .. 2p - 2 ([O_2 O_2], [O_3 O_3], ...); the protected multiplets sit at block twists 4 and 6.
        // Common practice (large-N factorisation); the gap is a test of the projection, which does not
        // assume it.
        for (int p = 3; p <= 4; p++) {
            int order = 2 * p + 4 + 2 * 3 + 6;
            String out = CftScripts.run("use \"ads5s5_cftdata.ctr\"\n"
                    + "let D = decompose(zseries(U^2 * long_component(free_pppp(" + p + "), " + p + ", 0, 0), order: " + order
                    + "), d: 4, twists: 0.." + order + " step 2, spins: 0..6)\n"
                    + "show residual(D)\n"
                    + "let A = free_long_pppp(" + p + ", 3, 6)\n"
                    + showEntries("D", 4, p + 3, 6) + showEntries("A", 2 * p + 4, 3, 6));
            assertTrue(out.contains("residual(D) = 0"), out);
            for (int twist = 8; twist < 2 * p + 4; twist += 2) {
                for (int l = 0; l <= 6; l += 2) {
                    assertEquals(Rational.ZERO, entry(out, "D", twist, l), "p=" + p + " twist " + twist + " spin " + l);
                }
            }
            for (int n = 0; n <= 3; n++) {
                for (int l = 0; l <= 6; l += 2) {
                    Rational a = entry(out, "A", 2 * p + 4 + 2 * n, l);
                    assertTrue(a.signum() > 0, "p=" + p + " n=" + n + " l=" + l + ": " + a);
                    assertEquals(a, entry(out, "D", 2 * p + 4 + 2 * n, l));
                }
            }
        }
    }

    @Test
    void freeLongCoefficientsAtLowestTwistFactorise() {
        // Found here (not a published value): at n = 0 the ratio of a0(<pppp>) to the <2222> closed form
        // 2 (l+1)(2t+l+2) (t!)^2 ((t+l+1)!)^2 / ((2t)! (2t+2l+2)!) at t = p (which is a0 of <2222> at t = n + 2,
        // arXiv:1410.4717 as in CftDataTest) is (l+2)(l+7)/4 at p = 3 and 7/180 (l+2)(l+3)(l+8)(l+9) at p = 4.
        // Read off at l = 0, 2, 4; l = 6, 8 test it.
        String out = CftScripts.run("use \"ads5s5_cftdata.ctr\"\nlet A3 = free_long_pppp(3, 0, 8)\nlet A4 = free_long_pppp(4, 0, 8)\n"
                + showEntries("A3", 10, 0, 8) + showEntries("A4", 12, 0, 8));
        for (int l = 0; l <= 8; l += 2) {
            assertEquals(base(3, l).multiply(Rational.of((long) (l + 2) * (l + 7), 4)), entry(out, "A3", 10, l), "l=" + l);
            assertEquals(base(4, l).multiply(Rational.of(7L * (l + 2) * (l + 3) * (l + 8) * (l + 9), 180)), entry(out, "A4", 12, l), "l=" + l);
        }
    }

    private static Rational base(int t, int l) {
        return Rational.of(2L * (l + 1) * (2 * t + l + 2)).multiply(ExactGamma.factorial(t).pow(2)).multiply(ExactGamma.factorial(t + l + 1).pow(2))
                .divide(ExactGamma.factorial(2 * t).multiply(ExactGamma.factorial(2 * t + 2 * l + 2)));
    }

    /**
     * The unmixed anomalous dimensions of the singlet double traces of twist 2t, [O_i O_i] with i = 2..t, in
     * units of 1/N^2 (arXiv:1706.02822, recalled from memory): -4 M_t M_(t+l+1) / (l + 2i - 3)_6 with
     * M_t = (t-1) t (t+1) (t+2). The sum over i is the trace of the mixing problem, which equals the sum of the
     * averaged values the diagonal correlators <iiii> give (their a0 matrix is diagonal at order N^0).
     */
    private static Rational unmixedSum(int t, int l) {
        Rational sum = Rational.ZERO;
        for (int i = 2; i <= t; i++) {
            sum = sum.add(Rational.of(-4L * mt(t) * mt(t + l + 1)).divide(ExactGamma.pochhammer(Rational.of(l + 2 * i - 3), 6)));
        }
        return sum;
    }

    private static long mt(int t) {
        return (long) (t - 1) * t * (t + 1) * (t + 2);
    }

    /** The averaged <2222> value at row n in units of 1/N^2 (physics reference section 7, arXiv:1410.4717). */
    private static Rational gamma2222(int n, int l) {
        return Rational.of(-4L * (n + 1) * (n + 2) * (n + 3) * (n + 4), (long) (l + 1) * (l + 6 + 2 * n));
    }

    private static final String GAMMAS = """
            use "ads5s5_cftdata.ctr"
            let G3 = gamma_pppp(closed_form({3, 3, 3, 3}), 3, 1, 8)
            let G4 = gamma_pppp(closed_form({4, 4, 4, 4}), 4, 0, 8)
            """;

    @Test
    void averagedGammasMatchTheTraceOfThePublishedUnmixedSpectrum() {
        String out = CftScripts.run(GAMMAS + showEntries("G3", 10, 1, 8) + showEntries("G4", 12, 0, 8));
        // Twist 6: [O_2 O_2] (n = 1 of <2222>) and [O_3 O_3] (n = 0 of <3333>). The <3333> value in units
        // of 1/N^2 is the trace minus the <2222> one; the library's closed_form normalisation differs by one
        // constant k3, fixed at l = 0 and then tested at every other spin.
        Rational k3 = unmixedSum(3, 0).subtract(gamma2222(1, 0)).divide(entry(out, "G3", 10, 0));
        for (int l = 2; l <= 8; l += 2) {
            assertEquals(unmixedSum(3, l).subtract(gamma2222(1, l)), entry(out, "G3", 10, l).multiply(k3), "twist 6, l=" + l);
        }
        // Twist 8: [O_2 O_2] n = 2, [O_3 O_3] n = 1 (k3 as fixed above), [O_4 O_4] n = 0 with its own constant k4.
        Rational k4 = null;
        for (int l = 0; l <= 8; l += 2) {
            Rational rest = unmixedSum(4, l).subtract(gamma2222(2, l)).subtract(entry(out, "G3", 12, l).multiply(k3));
            Rational k = rest.divide(entry(out, "G4", 12, l));
            if (k4 == null) {
                k4 = k;
            }
            assertEquals(k4, k, "twist 8, l=" + l);
        }
        // Found here: the constants are 8 p^2 for closed_form at p = 3, 4 (32 = 8*2^2 for <2222>, as in CftDataTest).
        assertEquals(Rational.of(72), k3);
        assertEquals(Rational.of(128), k4);
    }

    @Test
    void channelSidesAgreeWithAStraightContourWhereOneExists() {
        // For <3333> the straight contour Re s = 5, Re t = 3/2 keeps the crossed-channel poles (utilde = 2, 4)
        // left and the t-channel poles right, for every s-pole at s >= 6: the straight and the channel
        // prescriptions must then give the same expansion. (For p = 4 no straight contour exists at s = 8:
        // the poles t = 2 and utilde = 2 meet there.)
        String out = CftScripts.run("""
                use "ads5s5_cftdata.ctr"
                let M = singlet_amplitude(closed_form({3, 3, 3, 3}))
                def blocks(E) = decompose(zseries(E, log: 1, times_u: 2, order: 16), d: 4, twists: 10..16 step 2, spins: 0..6)
                let A = blocks(small_u(M, reduced_measure(3), contour: {5, 3/2}, through: 6, order: 6))
                let B = blocks(small_u(M, reduced_measure(3), contour: {5, 3/2}, through: 6, order: 6, sides: "channels"))
                let C = blocks(small_u(M, reduced_measure(3), contour: reduced_contour(3), through: 6, order: 6, sides: "channels"))
                show A
                check A == B
                check A == C
                """);
        assertFalse(out.contains("FAILED"), out);
        assertTrue(out.contains("residual: 0 to total degree 16 (complete)"), out);
        assertEquals(2, out.lines().filter(l -> l.startsWith("check")).count(), out);
    }

    @Test
    void theStraightContourRefusesTheCrossedChannelPoleAndBadSidesAreLocated() {
        String refused = error("""
                use "ads5s5_cftdata.ctr"
                show small_u(singlet_amplitude(closed_form({3, 3, 3, 3})), reduced_measure(3), contour: reduced_contour(3), through: 4, order: 2)
                """);
        assertTrue(refused.contains("moves with t and lies right of Re s = 8/3"), refused);
        String bad = error("""
                use "ads5s5_cftdata.ctr"
                show small_u(1/(s - 2), reduced_measure(2), contour: {4/3, 4/3}, through: 3, order: 2, sides: "left")
                """);
        assertTrue(bad.startsWith("2: ") && bad.contains("sides is \"channels\""), bad);
    }

    @Test
    void aPoleWithNoChannelIsRefusedWhenPolesGoByChannel() {
        // The box measure has Gamma arguments -s, -t and 1 + s + t: nothing runs parallel to s - t (its pole lies left in s and is not picked up, but the t-integral needs its side).
        String out = error("""
                vars s, t
                let m = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
                show small_u(1/(s - t + 5), m, contour: {-1/3, -1/3}, through: 1, order: 2, sides: "channels")
                """);
        assertTrue(out.startsWith("3: ") && out.contains("no Gamma function of the measure runs parallel"), out);
    }

    /** The line and message of the error a script stops with. */
    private static String error(String script) {
        try {
            String out = CftScripts.run(script);
            fail("expected an error, got " + out);
            return null;
        } catch (dev.contour.ContourException e) {
            assertNotNull(e.span(), e.getMessage());
            return e.span().line() + ": " + e.getMessage();
        }
    }

    @Test
    void tablesForPppp() {
        String out = CftScripts.run(GAMMAS + "show G3\nshow G4 as json\n");
        assertTrue(out.contains("gamma (singlet, <pppp>) (2 x 5):"), out);
        assertTrue(out.contains("{\"twist\":12,\"n\":0,\"spin\":0,\"value\":\"-65/8\"}"), out);
    }
}
