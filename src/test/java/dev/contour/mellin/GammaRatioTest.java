package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import org.junit.jupiter.api.Test;

import java.util.List;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class GammaRatioTest {
    private static final Polynomial X = Polynomial.variable("x");

    @Test
    void pochhammerOfEitherSign() {
        // (x)_n = Gamma(x+n)/Gamma(x): x(x+1)(x+2) for n = 3, 1/((x-1)(x-2)) for n = -2 (common practice).
        RationalFunction up = GammaRatio.pochhammer(X, 3);
        assertEquals(RationalFunction.of(X.multiply(X.add(pc(1))).multiply(X.add(pc(2)))), up);
        RationalFunction down = GammaRatio.pochhammer(X, -2);
        assertEquals(RationalFunction.of(Polynomial.ONE, X.subtract(pc(1)).multiply(X.subtract(pc(2)))), down);
        assertTrue(up.isCanonical() && down.isCanonical());
        assertEquals(RationalFunction.ONE, GammaRatio.pochhammer(X, 0));
        // (x)_n (x+n)_(-n) = 1: the two signs are inverse to each other.
        assertEquals(RationalFunction.ONE, GammaRatio.pochhammer(X, 4).multiply(GammaRatio.pochhammer(X.add(pc(4)), -4)));
    }

    @Test
    void ratioReducesWithinGroupsOfIntegerOffsets() {
        Polynomial y = X.add(ps());
        // Gamma(x+2)^2 Gamma(y-1) / (Gamma(x)^2 Gamma(y)) = (x (x+1))^2 / (y - 1)
        RationalFunction r = GammaRatio.reduce(
                List.of(new GammaPower(X.add(pc(2)), 2), new GammaPower(y.subtract(pc(1)), 1)),
                List.of(new GammaPower(X, 2), new GammaPower(y, 1)));
        RationalFunction expected = RationalFunction.of(X.multiply(X.add(pc(1))).pow(2), y.subtract(pc(1)));
        assertEquals(expected, r);
    }

    @Test
    void nonIntegerOffsetNamesTheFactor() {
        ContourException e = assertThrows(ContourException.class, () -> GammaRatio.reduce(
                List.of(new GammaPower(X.add(Polynomial.constant(Rational.of(1, 2))), 1)), List.of(new GammaPower(X, 1))));
        assertTrue(e.getMessage().contains("Gamma(") && e.getMessage().contains("not an integer"), e.getMessage());
    }

    @Test
    void leftoverGammaNamesTheFactor() {
        ContourException e = assertThrows(ContourException.class, () -> GammaRatio.reduce(
                List.of(new GammaPower(X.add(pc(1)), 2)), List.of(new GammaPower(X, 1))));
        assertTrue(e.getMessage().contains("left with power 1"), e.getMessage());
    }
}
