package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class CrossingMapTest {
    @Test
    void swapActsSimultaneously() {
        CrossingMap swap = CrossingMap.of(Map.of("s", pt(), "t", ps()), Map.of(), Expression.ONE);
        Expression f = s().multiply(s()).add(t().multiply(c(3))).multiply(inv(s().subtract(c(2))));
        Expression expected = t().multiply(t()).add(s().multiply(c(3))).multiply(inv(t().subtract(c(2))));
        assertEquals(expected, swap.apply(f));
    }

    @Test
    void crossing13OnAMonomial() {
        // tau^p M(t, s; sigma/tau, 1/tau) with p = 3 on sigma tau^2 / (s - 2): tau^3 sigma tau^-3 / (t - 2).
        Expression f = sigma().multiply(tau().pow(2)).multiply(inv(s().subtract(c(2))));
        assertEquals(sigma().multiply(inv(t().subtract(c(2)))), AdS5S5.crossing13(3).apply(f));
    }

    @Test
    void identityEntriesAreDropped() {
        CrossingMap m = CrossingMap.of(Map.of("s", ps()), Map.of("sigma", sigma()), Expression.ONE);
        assertTrue(m.isIdentity());
        assertThrows(ContourException.class, () -> CrossingMap.of(Map.of("s", ps().multiply(pt())), Map.of(), Expression.ONE));
    }

    @Test
    void compositeOfTwoSwapsHasOrderThree() {
        // Two transpositions of S3 compose to a 3-cycle (common practice).
        CrossingMap c = AdS5S5.crossing13(3).compose(AdS5S5.crossing12(pc(3)));
        assertFalse(c.isInvolution());
        assertTrue(c.compose(c).compose(c).isIdentity());
        assertEquals(AdS5S5.crossing12(pc(3)).compose(AdS5S5.crossing13(3)), c.inverse());
    }

    @Test
    void inverseOfAnInfiniteOrderMapFails() {
        CrossingMap step = CrossingMap.of(Map.of("s", ps().add(pc(1))), Map.of(), Expression.ONE);
        assertThrows(ContourException.class, step::inverse);
    }

    @Property(tries = 50)
    void crossingMapsAppliedTwiceGiveTheIdentity(@ForAll @IntRange(min = 2, max = 6) int p,
                                                 @ForAll("amplitudes") Expression f) {
        Polynomial pp = pc(p);
        for (CrossingMap m : new CrossingMap[] {AdS5S5.crossing13(p), AdS5S5.crossing12(pp),
                AdS5S5.crossing13Reduced(p), AdS5S5.crossing12Reduced(pp), AdS5S5.crossing12(symbolicP())}) {
            assertTrue(m.isInvolution(), m.toString());
            assertEquals(f, m.apply(m.apply(f)));
            assertEquals(m, m.inverse());
        }
    }

    @Property(tries = 30)
    void composeMatchesSuccessiveApplication(@ForAll @IntRange(min = 2, max = 5) int p, @ForAll("amplitudes") Expression f) {
        CrossingMap a = AdS5S5.crossing13(p);
        CrossingMap b = AdS5S5.crossing12(pc(p));
        assertEquals(a.apply(b.apply(f)), a.compose(b).apply(f));
        assertEquals(b.apply(a.apply(f)), b.compose(a).apply(f));
    }

    @Provide
    Arbitrary<Expression> amplitudes() {
        return Combinators.combine(Arbitraries.integers().between(-6, 6), Arbitraries.integers().between(-6, 6),
                Arbitraries.integers().between(0, 3), Arbitraries.integers().between(0, 3), Arbitraries.integers().between(1, 5))
                .as((a, b, i, j, k) -> sigma().pow(i).multiply(tau().pow(j)).multiply(c(k))
                        .multiply(inv(s().add(c(a)).multiply(t().add(c(b)))))
                        .add(tau().multiply(s().multiply(t()).add(p()))));
    }
}
