package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;
import java.util.Random;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class MellinDictionaryTest {
    private static final long PRECISION = 50;

    private static MellinMeasure full(int p) {
        return AdS5S5.fullMeasure(pc(p));
    }

    private static PositionOperator word(int m, int n) {
        return PositionOperator.of(new PositionOperator.Word(m, n, 0, 0), Expression.ONE);
    }

    @Test
    void eulerOperatorsBecomeMultiplications() {
        // U d/dU acts as s/2 and V d/dV as t/2 - p on U^(s/2) V^(t/2-p) (docs/conventions.md, "The dictionary", common practice).
        MellinMeasure m = AdS5S5.fullMeasure(symbolicP());
        assertEquals(ShiftOperator.multiplication(s().multiply(c(1, 2))),
                MellinDictionary.translate(PositionOperator.uDerivative(), m, m));
        assertEquals(ShiftOperator.multiplication(t().multiply(c(1, 2)).subtract(p())),
                MellinDictionary.translate(PositionOperator.vDerivative(), m, m));
    }

    @Test
    void monomialBecomesShiftTimesPochhammers() {
        // U within one measure: f(s-2, t) Gamma(s-2,t)/Gamma(s,t) = ((2p-s)/2)_1^2 / ((2p-u)/2 - 1)^2 with u = 4p-s-t
        // (docs/conventions.md, "The dictionary"; Gamma(x+1) = x Gamma(x), common practice).
        MellinMeasure m = full(3);
        Expression a = c(6).subtract(s()).multiply(c(1, 2));
        Expression b = s().add(t()).subtract(c(6)).multiply(c(1, 2)).subtract(c(1));
        ShiftOperator expected = ShiftOperator.of(Shift.of("s", Rational.of(-2)), a.pow(2).multiply(inv(b.pow(2))));
        assertEquals(expected, MellinDictionary.translate(PositionOperator.u(), m, m));
    }

    @Test
    void commutatorOfEulerOperatorAndU() {
        // [U d/dU, U] = U (common practice); the dictionary must respect it.
        MellinMeasure m = AdS5S5.fullMeasure(symbolicP());
        PositionOperator du = PositionOperator.uDerivative();
        PositionOperator u = PositionOperator.u();
        PositionOperator commutator = du.multiply(u).add(u.multiply(du).multiply(Expression.constant(-1)));
        assertEquals(u, commutator);
        assertEquals(MellinDictionary.translate(u, m, m), MellinDictionary.translate(commutator, m, m));
    }

    @Property(tries = 30)
    void dictionaryIsMultiplicative(@ForAll @IntRange(min = -1, max = 2) int m1, @ForAll @IntRange(min = -1, max = 2) int n1,
                                    @ForAll @IntRange(min = 0, max = 2) int j, @ForAll @IntRange(min = -1, max = 2) int m2,
                                    @ForAll @IntRange(min = 0, max = 1) int k) {
        // Acting first with B then with A: translate(A B, from -> to) = translate(A, from -> to) translate(B, from -> from).
        MellinMeasure from = AdS5S5.reducedMeasure(symbolicP());
        MellinMeasure to = AdS5S5.fullMeasure(symbolicP());
        PositionOperator a = PositionOperator.of(new PositionOperator.Word(m1, n1, j, 0), sigma());
        PositionOperator b = PositionOperator.of(new PositionOperator.Word(m2, 1, 0, k), tau()).add(PositionOperator.uDerivative());
        assertEquals(MellinDictionary.translate(a, from, to).multiply(MellinDictionary.translate(b, from, from)),
                MellinDictionary.translate(a.multiply(b), from, to));
    }

    @Test
    void nonIntegerShiftNamesTheFactor() {
        // Kernel U^s with Gamma(-s/2): multiplying by U shifts s by 1, half a step of the Gamma argument.
        MellinMeasure m = new MellinMeasure("s", "t", "u", pc(0),
                List.of(new GammaPower(ps().multiply(Rational.of(-1, 2)), 1)), Rational.ONE, Polynomial.ZERO,
                Rational.ONE, Polynomial.ZERO);
        ContourException e = assertThrows(ContourException.class, () -> MellinDictionary.translate(PositionOperator.u(), m, m));
        assertTrue(e.getMessage().contains("Gamma(") && e.getMessage().contains("not an integer"), e.getMessage());
    }

    @Test
    void mismatchedMeasuresAreReported() {
        MellinMeasure lonely = new MellinMeasure("s", "t", "u", pc(8),
                List.of(new GammaPower(pc(4).subtract(ps()), 2)), Rational.of(1, 2), Polynomial.ZERO, Rational.of(1, 2), pc(-2));
        ContourException e = assertThrows(ContourException.class, () -> MellinDictionary.translate(PositionOperator.u(), full(2), lonely));
        assertTrue(e.getMessage().contains("not rational"), e.getMessage());
        MellinMeasure otherVars = new MellinMeasure("x", "y", "z", pc(8), List.of(), Rational.of(1, 2), Polynomial.ZERO,
                Rational.of(1, 2), pc(-2));
        assertThrows(ContourException.class, () -> MellinDictionary.translate(PositionOperator.u(), full(2), otherVars));
    }

    @Test
    void dictionaryAgreesWithGammaFunctionsNumerically() {
        // Gamma1(s-2m, t-2n)/Gamma2(s, t) from apfloat's Gamma at random complex points against the rational
        // function the dictionary produced, to 30 digits (working precision 50). Gamma1: reduced measure,
        // Gamma2: full measure (docs/conventions.md, "The dictionary" and "AdS5×S5: the Ward factor").
        Random random = new Random(20261201L);
        int checks = 0;
        for (int p = 2; p <= 5; p++) {
            for (int m = -1; m <= 2; m++) {
                for (int n = -1; n <= 2; n++) {
                    ShiftOperator op = MellinDictionary.translate(word(m, n), AdS5S5.reducedMeasure(pc(p)), full(p));
                    assertEquals(1, op.terms().size());
                    Shift shift = op.terms().firstKey();
                    assertEquals(Shift.of(Map.of("s", Rational.of(-2L * m), "t", Rational.of(-2L * n))), shift);
                    RationalFunction ratio = op.terms().get(shift).asRationalFunction();
                    for (int trial = 0; trial < 3; trial++) {
                        Apcomplex s = randomPoint(random);
                        Apcomplex t = randomPoint(random);
                        Apcomplex exact = Numeric.evaluate(ratio, Map.of("s", s, "t", t), PRECISION);
                        Apcomplex gammas = reducedGamma(p, s.subtract(real(2 * m)), t.subtract(real(2 * n)))
                                .divide(fullGamma(p, s, t));
                        Apfloat relative = ApcomplexMath.abs(exact.subtract(gammas)).divide(ApcomplexMath.abs(gammas));
                        assertTrue(relative.compareTo(new Apfloat("1e-30", PRECISION)) < 0,
                                "p=" + p + " U^" + m + " V^" + n + " at s=" + s + ", t=" + t + ": " + relative);
                        checks++;
                    }
                }
            }
        }
        assertEquals(4 * 16 * 3, checks);
    }

    /** Gamma((2p-s)/2)^2 Gamma((2p-t)/2)^2 Gamma((2p-u)/2)^2 with u = 4p - s - t. */
    private static Apcomplex fullGamma(int p, Apcomplex s, Apcomplex t) {
        Apcomplex u = real(4 * p).subtract(s).subtract(t);
        return gammaSquared(real(2 * p).subtract(s)).multiply(gammaSquared(real(2 * p).subtract(t)))
                .multiply(gammaSquared(real(2 * p).subtract(u)));
    }

    /** The same with utilde = 4p - 4 - s - t in place of u. */
    private static Apcomplex reducedGamma(int p, Apcomplex s, Apcomplex t) {
        Apcomplex ut = real(4 * p - 4).subtract(s).subtract(t);
        return gammaSquared(real(2 * p).subtract(s)).multiply(gammaSquared(real(2 * p).subtract(t)))
                .multiply(gammaSquared(real(2 * p).subtract(ut)));
    }

    private static Apcomplex gammaSquared(Apcomplex twiceArgument) {
        Apcomplex g = ApcomplexMath.gamma(twiceArgument.divide(real(2)));
        return g.multiply(g);
    }

    private static Apcomplex real(long n) {
        return new Apcomplex(new Apfloat(n, PRECISION));
    }

    private static Apcomplex randomPoint(Random random) {
        // Generic points away from the real axis, where no Gamma function has a pole.
        return new Apcomplex(new Apfloat(random.nextInt(2001) - 1000, PRECISION).divide(new Apfloat(137, PRECISION)),
                new Apfloat(random.nextInt(1000) + 100, PRECISION).divide(new Apfloat(211, PRECISION)));
    }
}
