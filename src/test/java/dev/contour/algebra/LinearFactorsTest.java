package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class LinearFactorsTest {
    @Provide
    Arbitrary<List<Polynomial>> linears() {
        return Gen.linearForms().list().ofMaxSize(5);
    }

    @Provide
    Arbitrary<Integer> cofactorChoice() {
        return Arbitraries.integers().between(0, 3);
    }

    private static final Polynomial S = Polynomial.variable("s");
    private static final Polynomial T = Polynomial.variable("t");
    private static final Polynomial U = Polynomial.variable("u");

    /** Cofactors with no linear factor over Q. */
    private static Polynomial cofactor(int k) {
        return switch (k) {
            case 0 -> Polynomial.ONE;
            case 1 -> S.pow(2).add(T.pow(2)).add(Polynomial.ONE);
            case 2 -> S.multiply(T).subtract(U.pow(2)).add(Polynomial.constant(3));
            default -> S.pow(3).subtract(Polynomial.constant(2));
        };
    }

    @Test
    void aMonomialSplitsIntoItsVariablesWhateverTheDegree() {
        Polynomial m = S.pow(5).multiply(U.pow(2)).multiply(Rational.of(-3, 4));
        LinearFactors.Split sp = LinearFactors.split(m);
        assertEquals(Rational.of(-3, 4), sp.unit());
        List<LinearFactors.Factor> expected = new java.util.ArrayList<>(List.of(new LinearFactors.Factor(S, 5),
                new LinearFactors.Factor(U, 2)));
        expected.sort(java.util.Comparator.comparing(LinearFactors.Factor::base));
        assertEquals(expected, sp.factors());
        assertEquals(Polynomial.ONE, sp.cofactor());
        // The general path agrees: with a binomial factor added, the same factors plus that one.
        LinearFactors.Split general = LinearFactors.split(m.multiply(T.add(Polynomial.ONE)));
        assertEquals(sp.unit(), general.unit());
        assertTrue(general.factors().containsAll(expected) && general.factors().size() == 3, general.factors().toString());
        // A degree no dense algorithm could take is still immediate.
        LinearFactors.Split huge = LinearFactors.split(S.pow(1_000_000_000));
        assertEquals(List.of(new LinearFactors.Factor(S, 1_000_000_000)), huge.factors());
    }

    @Property(tries = 150)
    void splitRecoversPlantedFactors(@ForAll("linears") List<Polynomial> ls, @ForAll("cofactorChoice") int k,
            @ForAll("cofactorChoice") int unit) {
        Polynomial p = cofactor(k).multiply(Rational.of(unit - 2 == 0 ? 5 : unit - 2, 3));
        for (Polynomial l : ls) {
            p = p.multiply(l);
        }
        LinearFactors.Split sp = LinearFactors.split(p);
        Polynomial back = sp.cofactor().multiply(sp.unit());
        int total = 0;
        for (int i = 0; i < sp.factors().size(); i++) {
            LinearFactors.Factor f = sp.factors().get(i);
            assertTrue(f.base().isLinear());
            assertEquals(f.base(), f.base().primitivePart());
            if (i > 0) {
                assertTrue(sp.factors().get(i - 1).base().compareTo(f.base()) < 0);
            }
            back = back.multiply(f.base().pow(f.multiplicity()));
            total += f.multiplicity();
        }
        assertEquals(p, back);
        assertEquals(ls.size(), total);
        assertEquals(cofactor(k), sp.cofactor());
    }

    @Test
    void rationalRootsAndRepeatedFactors() {
        // (2s - 3)^2 (3s + 1) (s^2 + 1)
        Polynomial p = S.multiply(Rational.of(2)).subtract(Polynomial.constant(3)).pow(2)
                .multiply(S.multiply(Rational.of(3)).add(Polynomial.ONE)).multiply(S.pow(2).add(Polynomial.ONE));
        LinearFactors.Split sp = LinearFactors.split(p);
        assertEquals(2, sp.factors().size());
        assertEquals(S.pow(2).add(Polynomial.ONE), sp.cofactor());
        // big coefficients: the root 10^15/7 needs a lift well past one word
        Polynomial big = S.multiply(Rational.of(7)).subtract(Polynomial.constant(1_000_000_000_000_000L)).multiply(S);
        assertEquals(2, LinearFactors.split(big).factors().size());
        assertThrows(ContourException.class, () -> LinearFactors.split(Polynomial.ZERO));
        LinearFactors.Split c = LinearFactors.split(Polynomial.constant(Rational.of(-2, 3)));
        assertEquals(Rational.of(-2, 3), c.unit());
        assertTrue(c.factors().isEmpty());
    }
}
