package dev.contour.cft;

import dev.contour.algebra.Rational;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Unmixing the singlet double traces of twist 6 and 8 from the family &lt;ppqq&gt; through the library
 * and the language, and the exact eigenvalues it rests on.
 */
class UnmixingTest {

    /** The mixing matrices 2 A^-1 M of twist 6 (block twist 10) and twist 8 (block twist 12) at every even spin to 8. */
    private static final String SCRIPT = """
            use "ads5s5_cftdata.ctr"
            let A2 = free_long_pppp(2, 2, 8)
            let A3 = free_long_pppp(3, 1, 8)
            let A4 = free_long_pppp(4, 0, 8)
            let L22 = log_part_ppqq(sugra_ppqq(2, 2), 2, 2, 2, 8)
            let L33 = log_part_ppqq(sugra_ppqq(3, 3), 3, 3, 1, 8)
            let L44 = log_part_ppqq(sugra_ppqq(4, 4), 4, 4, 0, 8)
            let L23 = log_part_ppqq(sugra_ppqq(2, 3), 2, 3, 1, 8)
            let L24 = log_part_ppqq(sugra_ppqq(2, 4), 2, 4, 0, 8)
            let L34 = log_part_ppqq(sugra_ppqq(3, 4), 3, 4, 0, 8)
            let G2 = gamma_pppp(sugra_ppqq(2, 2), 2, 2, 8)
            let G3 = gamma_pppp(sugra_ppqq(3, 3), 3, 1, 8)
            let G4 = gamma_pppp(sugra_ppqq(4, 4), 4, 0, 8)
            def k(L, A, tw, l) = 2*block_coefficient(L, tw, l)/block_coefficient(A, tw, l)
            for l in 0..8 step 2 {
                show rational_eigenvalues({{k(L22, A2, 10, l), k(L23, A2, 10, l)}, {k(L23, A3, 10, l), k(L33, A3, 10, l)}})
                show block_coefficient(G2, 10, l) + block_coefficient(G3, 10, l)
                show rational_eigenvalues({{k(L22, A2, 12, l), k(L23, A2, 12, l), k(L24, A2, 12, l)},
                                           {k(L23, A3, 12, l), k(L33, A3, 12, l), k(L34, A3, 12, l)},
                                           {k(L24, A4, 12, l), k(L34, A4, 12, l), k(L44, A4, 12, l)}})
                show block_coefficient(G2, 12, l) + block_coefficient(G3, 12, l) + block_coefficient(G4, 12, l)
            }
            """;

    private static final String OUT = CftScripts.run(SCRIPT);

    /**
     * The published unmixed anomalous dimensions (arXiv:1706.02822, recalled from memory, units of 1/N^2):
     * for twist 2t, spin l and [O_i O_i], i = 2..t: -4 M_t M_(t+l+1) / (l + 2i - 3)_6, M_t = (t-1) t (t+1) (t+2).
     */
    private static List<Rational> published(int t, int l) {
        List<Rational> out = new ArrayList<>();
        for (int i = 2; i <= t; i++) {
            out.add(Rational.of(-4L * mt(t) * mt(t + l + 1)).divide(ExactGamma.pochhammer(Rational.of(l + 2 * i - 3), 6)));
        }
        out.sort(Rational::compareTo);
        return out;
    }

    private static long mt(int t) {
        return (long) (t - 1) * t * (t + 1) * (t + 2);
    }

    private static List<Rational> shownList(String line) {
        String v = line.substring(line.lastIndexOf(" = {") + 4, line.lastIndexOf('}'));
        List<Rational> out = new ArrayList<>();
        for (String x : v.split(",")) {
            out.add(Rational.parse(x.strip()));
        }
        return out;
    }

    private static List<String> lines(String start) {
        return OUT.lines().filter(l -> l.contains(start)).toList();
    }

    @Test
    void twistSixAndEightSpectraAreThePublishedOnes() {
        // The normalisation sugra_ppqq (8 p q closed_form) was fixed on the diagonal by the averaged gammas and,
        // for <2233>, by rational eigenvalues at twist 6, l = 0; the other spins at twist 6 and all of twist 8
        // (with <2244> and <3344> entering for the first time) are predictions.
        List<String> eig = lines("rational_eigenvalues(");
        assertEquals(10, eig.size(), OUT);
        for (int i = 0; i < 5; i++) {
            int l = 2 * i;
            assertTrue(eig.get(2 * i).startsWith("[l = " + l + "]"), eig.get(2 * i));
            assertEquals(published(3, l), shownList(eig.get(2 * i)), "twist 6, l=" + l);
            assertEquals(published(4, l), shownList(eig.get(2 * i + 1)), "twist 8, l=" + l);
        }
    }

    @Test
    @Tag("slow")
    void twistTenSpectrumFromTenCorrelators() {
        // Twist 10, four operators [O_i O_i], i = 2..5: every <ppqq> with 2 <= p <= q <= 5, no constant fitted.
        String out = CftScripts.run("""
                use "ads5s5_cftdata.ctr"
                let A2 = free_long_pppp(2, 3, 2)
                let A3 = free_long_pppp(3, 2, 2)
                let A4 = free_long_pppp(4, 1, 2)
                let A5 = free_long_pppp(5, 0, 2)
                def L(p, q) = log_part_ppqq(sugra_ppqq(p, q), p, q, 5 - max(p, q), 2)
                let L22 = L(2, 2)
                let L23 = L(2, 3)
                let L24 = L(2, 4)
                let L25 = L(2, 5)
                let L33 = L(3, 3)
                let L34 = L(3, 4)
                let L35 = L(3, 5)
                let L44 = L(4, 4)
                let L45 = L(4, 5)
                let L55 = L(5, 5)
                def k(L, A, l) = 2*block_coefficient(L, 14, l)/block_coefficient(A, 14, l)
                for l in 0..2 step 2 {
                  show rational_eigenvalues({{k(L22, A2, l), k(L23, A2, l), k(L24, A2, l), k(L25, A2, l)},
                                             {k(L23, A3, l), k(L33, A3, l), k(L34, A3, l), k(L35, A3, l)},
                                             {k(L24, A4, l), k(L34, A4, l), k(L44, A4, l), k(L45, A4, l)},
                                             {k(L25, A5, l), k(L35, A5, l), k(L45, A5, l), k(L55, A5, l)}})
                }
                """);
        List<String> eig = out.lines().filter(l -> l.contains("rational_eigenvalues(")).toList();
        assertEquals(2, eig.size(), out);
        assertEquals(published(5, 0), shownList(eig.get(0)));
        assertEquals(published(5, 2), shownList(eig.get(1)));
    }

    @Test
    void averagedGammasAreTheWeightedAveragesOfTheUnmixedOnes() {
        // gamma_avg(p) = sum_K (c_pK^2 / a0_p) gamma_K with sum_p c_pK^2 / a0_p = 1 for each K (the columns of
        // the orthogonal matrix that diagonalises A^-1/2 M A^-1/2): summed over p, the averaged values of the
        // diagonal correlators <pppp> add up to the sum of the eigenvalues.
        List<String> eig = lines("rational_eigenvalues(");
        List<String> sums = lines("block_coefficient(G2, ");
        assertEquals(10, sums.size(), OUT);
        for (int i = 0; i < 10; i++) {
            Rational total = shownList(eig.get(i)).stream().reduce(Rational.ZERO, Rational::add);
            String line = sums.get(i);
            assertEquals(total, Rational.parse(line.substring(line.lastIndexOf(" = ") + 3).strip()), line);
        }
    }

    @Test
    void eigenvaluesRefuseAnIrrationalFactorAtTheCall() {
        try {
            CftScripts.run("show 1\nshow rational_eigenvalues({{0, 1}, {2, 0}})\n");
            fail("expected a refusal");
        } catch (dev.contour.ContourException e) {
            assertTrue(e.getMessage().contains("x^2 - 2") && e.getMessage().contains("no rational root"), e.getMessage());
            assertEquals(2, e.span().line());
        }
        String out = CftScripts.run("show rational_eigenvalues({{2, 1}, {1, 2}})\nshow rational_eigenvalues({{1, 1}, {0, 1}})\n");
        assertTrue(out.contains("= {1, 3}") && out.contains("= {1, 1}"), out);
    }

    /** Planted answer: P T P^-1 with T upper triangular and P unimodular has the diagonal of T as eigenvalues. */
    @Property(tries = 60)
    void similarTriangularMatricesGiveTheirDiagonal(@ForAll @Size(min = 1, max = 5) List<@IntRange(min = -9, max = 9) Integer> diagonal,
                                                    @ForAll @Size(25) List<@IntRange(min = -3, max = 3) Integer> noise) {
        int n = diagonal.size();
        Rational[][] t = new Rational[n][n];
        Rational[][] p = new Rational[n][n];
        Rational[][] pInverse = new Rational[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                t[i][j] = i == j ? Rational.of(diagonal.get(i)) : i < j ? Rational.of(noise.get(i * 5 + j), 7) : Rational.ZERO;
                // P = unit upper triangular with integer entries, P^-1 computed by back substitution below.
                p[i][j] = i == j ? Rational.ONE : i < j ? Rational.of(noise.get(j * 5 + i)) : Rational.ZERO;
            }
        }
        for (int j = 0; j < n; j++) {
            for (int i = n - 1; i >= 0; i--) {
                Rational x = i == j ? Rational.ONE : Rational.ZERO;
                for (int k = i + 1; k < n; k++) {
                    x = x.subtract(p[i][k].multiply(pInverse[k][j]));
                }
                pInverse[i][j] = x;
            }
        }
        // Lower-triangular conjugation too, so that the result is not triangular: Q = P^T.
        Rational[][] m = product(product(transpose(p), product(product(p, t), pInverse)), transpose(pInverse));
        List<List<Rational>> rows = new ArrayList<>();
        for (Rational[] row : m) {
            rows.add(List.of(row));
        }
        List<Rational> want = new ArrayList<>();
        diagonal.forEach(d -> want.add(Rational.of(d)));
        want.sort(Rational::compareTo);
        assertEquals(want, RationalEigenvalues.of(rows));
    }

    private static Rational[][] transpose(Rational[][] a) {
        int n = a.length;
        Rational[][] out = new Rational[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                out[i][j] = a[j][i];
            }
        }
        return out;
    }

    private static Rational[][] product(Rational[][] a, Rational[][] b) {
        int n = a.length;
        Rational[][] out = new Rational[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                Rational s = Rational.ZERO;
                for (int k = 0; k < n; k++) {
                    s = s.add(a[i][k].multiply(b[k][j]));
                }
                out[i][j] = s;
            }
        }
        return out;
    }
}
