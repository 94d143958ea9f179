package dev.contour.bench;


import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.mellin.AdS5S5;
import dev.contour.mellin.PoleAnalysis;
import dev.contour.mellin.ResiduePolynomiality;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The "ward" benchmark's script computes what the Java construction of the same amplitude does
 * (the dictionary applied to the all-ones reduced ansatz), and its analysis counts agree with the
 * analyses called directly, so the benchmark times the right thing.
 */
class WardWorkloadTest {
    @Test
    void theScriptBuildsTheAmplitudeOfTheDirectConstruction() {
        for (int p : new int[] {2, 3, 5, 8}) {
            WardBench.Row row = WardBench.run(p);
            Expression direct = AdS5S5.ward(p).apply(AdS5S5.reducedAnsatz(p, (i, j, k) -> Expression.ONE));
            assertEquals(direct, row.amplitude(), "p = " + p);
            var forms = AdS5S5.poleForms(Polynomial.constant(p));
            assertEquals(PoleAnalysis.of(direct, forms, AdS5S5.mellinVariables()).all().size(), row.poles(), "p = " + p);
            assertEquals(ResiduePolynomiality.check(direct, forms, AdS5S5.mellinVariables()).failures().size(),
                    row.nonPolynomial(), "p = " + p);
        }
        // p = 3 with equal coefficients has polynomial residues (docs/conventions.md, "AdS5×S5" sections,
        // arXiv:1608.06624). At p = 4 the solution's coefficients are not all equal (this project's
        // solver tests find them), so the all-ones ansatz must fail the check.
        assertEquals(0, WardBench.run(3).nonPolynomial());
        assertTrue(WardBench.run(4).nonPolynomial() > 0);
    }
}
