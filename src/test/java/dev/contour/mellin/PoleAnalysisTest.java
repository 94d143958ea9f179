package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class PoleAnalysisTest {
    private static final List<String> MELLIN = AdS5S5.mellinVariables();
    private static final List<NamedForm> FORMS = AdS5S5.poleForms(pc(2)); // s, t, u = 8 - s - t

    @Test
    void plantedPolesAreFoundWithOrdersAndNames() {
        Expression f = sigma().multiply(inv(s().subtract(c(2)).pow(2).multiply(t().subtract(c(4)))))
                .add(tau().multiply(inv(s().add(t()).subtract(c(6)))))
                .add(inv(c(2).multiply(s()).subtract(t()).subtract(c(1))).multiply(inv(p().subtract(c(1)))));
        PoleAnalysis.Result r = PoleAnalysis.of(f, FORMS, MELLIN);
        List<Pole> sigmaPoles = r.byMonomial().get(Collect.monomial(Map.of("sigma", 1)));
        assertEquals(List.of("s = 2", "t = 4"), sigmaPoles.stream().map(Pole::describe).sorted().toList());
        assertEquals(2, sigmaPoles.stream().filter(x -> x.form().equals("s")).findFirst().orElseThrow().order());
        // s + t - 6 = 0 is u = 2 with u = 8 - s - t.
        List<Pole> tauPoles = r.byMonomial().get(Collect.monomial(Map.of("tau", 1)));
        assertEquals("u = 2", tauPoles.get(0).describe());
        // 2s - t - 1 = 0 lies on no named form; (p - 1) is no pole in s, t.
        List<Pole> general = r.byMonomial().get(Monomial.ONE);
        assertEquals(1, general.size());
        assertNull(general.get(0).form());
        assertEquals(4, r.all().size());
    }

    @Test
    void polesOutsideTheAllowedSet() {
        Expression f = sigma().multiply(inv(s().subtract(c(2)).pow(2).multiply(t().subtract(c(4)))))
                .add(inv(s().add(t()).subtract(c(6))));
        List<PoleAnalysis.Violation> v = PoleAnalysis.of(f, FORMS, MELLIN).outside(AdS5S5.allowedPoles(2));
        // allowed for p = 2: simple poles at s, t, u = 2. The double pole at s = 2 and t = 4 are outside.
        assertEquals(List.of("s = 2 (order 2) in the coefficient of sigma", "t = 4 in the coefficient of sigma"),
                v.stream().map(PoleAnalysis.Violation::describe).sorted().toList());
    }

    @Test
    void fullAmplitudeHasOnlyAllowedPoles() {
        // docs/conventions.md, "AdS5×S5" sections: only simple poles at s, t, u = 2, ..., 2p-2 (p = 3, equal coefficients,
        // arXiv:1608.06624).
        Expression m = AdS5S5.ward(3).apply(AdS5S5.reducedAnsatz(3, (i, j, k) -> Expression.ONE));
        PoleAnalysis.Result r = PoleAnalysis.of(m, AdS5S5.poleForms(pc(3)), MELLIN);
        assertEquals(List.of(), r.outside(AdS5S5.allowedPoles(3)));
        assertEquals(6, r.all().size());
    }

    @Test
    void symbolicLocations() {
        Polynomial p = symbolicP();
        Expression f = inv(s().subtract(c(2).multiply(p())).add(c(2)));
        Pole pole = PoleAnalysis.of(f, AdS5S5.poleForms(p), MELLIN).all().get(0);
        assertEquals("s", pole.form());
        assertEquals(p.multiply(dev.contour.algebra.Rational.of(2)).subtract(pc(2)), pole.location());
    }
}
