package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class ResiduesTest {
    @Test
    void residuesOfEveryOrder() {
        // Res_(s=2) g/(s-2)^n = g^(n-1)(2)/(n-1)! (common practice); g = s^3 t.
        Expression g = s().pow(3).multiply(t());
        assertEquals(rf(c(8).multiply(t())), Residues.residue(rf(g.multiply(inv(s().subtract(c(2))))), "s", pc(2)));
        assertEquals(rf(c(12).multiply(t())), Residues.residue(rf(g.multiply(inv(s().subtract(c(2)).pow(2)))), "s", pc(2)));
        assertEquals(rf(c(6).multiply(t())), Residues.residue(rf(g.multiply(inv(s().subtract(c(2)).pow(3)))), "s", pc(2)));
        // A scaled factor: 1/(2s - 4) has residue 1/2; no pole gives zero.
        assertEquals(RationalFunction.constant(dev.contour.algebra.Rational.of(1, 2)),
                Residues.residue(rf(inv(c(2).multiply(s()).subtract(c(4)))), "s", pc(2)));
        assertTrue(Residues.residue(rf(inv(s().subtract(c(4)))), "s", pc(2)).isZero());
    }

    @Test
    void residueAtAMovingPole() {
        // u = 8 - s - t = 2, i.e. s = 6 - t: Res_s t/((s + t - 6)(s - 1)) = t/(5 - t).
        RationalFunction f = rf(t().multiply(inv(s().add(t()).subtract(c(6)).multiply(s().subtract(c(1))))));
        Polynomial at = pc(6).subtract(pt());
        assertEquals(rf(t().multiply(inv(c(5).subtract(t())))), Residues.residue(f, "s", at));
        assertEquals(Residues.residue(f, "s", at), Residues.residueAtFactor(f, "s", ps().add(pt()).subtract(pc(6))));
    }

    @Property(tries = 60)
    void partialFractionsRecombine(@ForAll("planted") Tuple.Tuple2<RationalFunction, Integer> planted) {
        RationalFunction f = planted.get1();
        PartialFractions.Result r = PartialFractions.of(f, "s");
        assertEquals(f, r.recombine());
        assertEquals(planted.get2().intValue(), r.terms().size());
        for (var d : r.polynomialPart().denominatorFactors()) {
            assertEquals(0, d.base().degree("s"));
        }
    }

    @Test
    void partialFractionsOfAKnownFunction() {
        // s^2/((s-1)(s-2)) = 1 - 1/(s-1) + 4/(s-2) (common practice).
        PartialFractions.Result r = PartialFractions.of(rf(s().pow(2).multiply(inv(s().subtract(c(1)).multiply(s().subtract(c(2)))))), "s");
        assertEquals(RationalFunction.ONE, r.polynomialPart());
        assertEquals(List.of(new PartialFractions.Term(pc(1), 1, RationalFunction.constant(-1)),
                new PartialFractions.Term(pc(2), 1, RationalFunction.constant(4))),
                r.terms().stream().sorted((a, b) -> a.location().constantValue().compareTo(b.location().constantValue())).toList());
    }

    @Test
    void partialFractionsCollectBySigmaTau() {
        Expression f = sigma().multiply(inv(s().subtract(c(2)))).add(tau().multiply(s()));
        var by = PartialFractions.of(f, "s", List.of("sigma", "tau"));
        assertEquals(2, by.size());
        assertEquals(1, by.get(Collect.monomial(Map.of("sigma", 1))).terms().size());
        assertEquals(0, by.get(Collect.monomial(Map.of("tau", 1))).terms().size());
    }

    @Provide
    Arbitrary<Tuple.Tuple2<RationalFunction, Integer>> planted() {
        // Sum of c/(s - a)^j over distinct a (c depending on t), plus a polynomial: the number of terms is known.
        return Arbitraries.integers().between(-5, 5).set().ofMinSize(1).ofMaxSize(3).flatMap(locations ->
                Arbitraries.integers().between(1, 3).list().ofSize(locations.size()).map(orders -> {
                    Expression sum = s().multiply(t()).add(c(1));
                    int terms = 0;
                    int idx = 0;
                    for (int a : locations) {
                        int order = orders.get(idx++);
                        for (int j = 1; j <= order; j++) {
                            sum = sum.add(t().add(c(j)).multiply(inv(s().subtract(c(a)).pow(j))));
                            terms++;
                        }
                    }
                    return Tuple.of(rf(sum), terms);
                }));
    }
}
