package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearSystem;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class ResiduePolynomialityTest {
    private static final List<String> MELLIN = AdS5S5.mellinVariables();

    private static Expression full(int p, AdS5S5.Coefficients a) {
        return AdS5S5.ward(p).apply(AdS5S5.reducedAnsatz(p, a));
    }

    @Test
    void equalCoefficientsAtP3GivePolynomialResidues() {
        // docs/conventions.md, "AdS5×S5" sections: for p = 3 the unique solution has a_001 = a_010 = a_100
        // (arXiv:1608.06624, arXiv:1710.05923); p = 2 is the normalised amplitude.
        for (int p = 2; p <= 3; p++) {
            ResiduePolynomiality.Result r = ResiduePolynomiality.check(full(p, (i, j, k) -> Expression.ONE),
                    AdS5S5.poleForms(pc(p)), MELLIN);
            assertTrue(r.holds(), () -> r.failures().toString());
            r.require();
        }
    }

    @Test
    void perturbedCoefficientsFailAndNameAPolePair() {
        Expression m = full(3, (i, j, k) -> c(i == 1 ? 2 : 1));
        ResiduePolynomiality.Result r = ResiduePolynomiality.check(m, AdS5S5.poleForms(pc(3)), MELLIN);
        assertFalse(r.holds());
        for (ResiduePolynomiality.Failure f : r.failures()) {
            assertTrue(f.describe().matches("[stu] = -?\\d+ and [stu] = -?\\d+ \\(coefficient of [^)]+\\)"), f.describe());
            // The named second pole really is a pole of the reported residue.
            String x = ResiduePolynomiality.residueVariable(f.pole().factor(), MELLIN);
            var onPole = Map.of(x, Residues.solve(f.pole().factor(), x));
            var restricted = f.other().factor().substitute(onPole).primitivePart();
            assertEquals(restricted, f.remaining(), f.describe());
            RationalFunction residue = Residues.residueAtFactor(m.coefficient(f.monomial()), x, f.pole().factor());
            assertTrue(residue.denominatorFactors().stream().anyMatch(d -> d.base().equals(restricted)), f.describe());
        }
        ContourException e = assertThrows(ContourException.class, r::require);
        assertTrue(e.getMessage().contains(r.failures().get(0).describe()), e.getMessage());
    }

    @Test
    void simultaneousPolesAreNamed() {
        // A planted simultaneous pole: sigma tau / ((s - 2)(t - 4)) has residue 1/(t - 4) at s = 2.
        Expression f = sigma().multiply(tau()).multiply(inv(s().subtract(c(2)).multiply(t().subtract(c(4)))));
        ResiduePolynomiality.Result r = ResiduePolynomiality.check(f, AdS5S5.poleForms(pc(3)), MELLIN);
        // The pair is found from both sides (the residue at s = 2 keeps t = 4 and vice versa) and reported once.
        assertEquals(1, r.failures().size(), r.failures().toString());
        String pair = r.failures().get(0).describe();
        assertTrue(pair.equals("s = 2 and t = 4 (coefficient of sigma*tau)") || pair.equals("t = 4 and s = 2 (coefficient of sigma*tau)"), pair);
    }

    /** Solves the conditions with unknowns a[i,j,k]; returns the solution family's null basis. */
    private static LinearSystem.Solution solveConditions(int p) {
        Expression m = AdS5S5.ward(p).apply(AdS5S5.reducedAnsatz(p));
        List<ResiduePolynomiality.Condition> conditions = ResiduePolynomiality.conditions(m, AdS5S5.poleForms(pc(p)),
                MELLIN, List.of("sigma", "tau"));
        assertFalse(conditions.isEmpty());
        List<String> unknowns = new ArrayList<>();
        for (int i = 0; i <= p - 2; i++) {
            for (int j = 0; i + j <= p - 2; j++) {
                unknowns.add(AdS5S5.unknownName(i, j, p - 2 - i - j));
            }
        }
        LinearSystem system = new LinearSystem(unknowns.size());
        for (ResiduePolynomiality.Condition c : conditions) {
            Map<Integer, Rational> row = new HashMap<>();
            for (Map.Entry<Monomial, RationalFunction> t : c.value().terms().entrySet()) {
                assertEquals(1, t.getKey().totalDegree(), c.description());
                row.put(unknowns.indexOf(t.getKey().exponents().firstKey()), t.getValue().constantValue());
            }
            system.addRow(row, Rational.ZERO, c.description());
        }
        return system.solve();
    }

    @Test
    void conditionsFixTheP3AnsatzUpToScale() {
        // arXiv:1608.06624: polynomial residues fix a_ijk up to one constant; for p = 3 all equal.
        LinearSystem.Family f = assertInstanceOf(LinearSystem.Family.class, solveConditions(3));
        assertEquals(1, f.freeColumns().size());
        List<Rational> v = f.nullBasis().get(0);
        assertEquals(v.get(0), v.get(1));
        assertEquals(v.get(1), v.get(2));
        assertFalse(v.get(0).isZero());
    }

    @Test
    void conditionsFixTheP4AnsatzUpToScaleAndTheSolutionIsCrossingSymmetric() {
        // arXiv:1608.06624 and arXiv:1710.05923: a unique solution up to one overall constant.
        LinearSystem.Family f = assertInstanceOf(LinearSystem.Family.class, solveConditions(4));
        assertEquals(1, f.freeColumns().size());
        List<Rational> v = f.nullBasis().get(0);
        Map<String, Rational> byName = new HashMap<>();
        int idx = 0;
        for (int i = 0; i <= 2; i++) {
            for (int j = 0; i + j <= 2; j++) {
                byName.put(i + "," + j + "," + (2 - i - j), v.get(idx++));
            }
        }
        Expression reduced = AdS5S5.reducedAnsatz(4, (i, j, k) -> Expression.constant(byName.get(i + "," + j + "," + k)));
        assertEquals(reduced, AdS5S5.crossing13Reduced(4).apply(reduced));
        assertEquals(reduced, AdS5S5.crossing12Reduced(pc(4)).apply(reduced));
        assertTrue(ResiduePolynomiality.check(AdS5S5.ward(4).apply(reduced), AdS5S5.poleForms(pc(4)), MELLIN).holds());
    }
}
