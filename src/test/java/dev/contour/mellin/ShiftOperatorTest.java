package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

import java.util.Map;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class ShiftOperatorTest {
    private static final Shift S_MINUS_2 = Shift.of("s", Rational.of(-2));

    @Test
    void shiftActsBySubstitution() {
        Expression f = sigma().multiply(s().multiply(t())).add(inv(s().subtract(c(4))));
        Expression expected = sigma().multiply(s().subtract(c(2)).multiply(t())).add(inv(s().subtract(c(6))));
        assertEquals(expected, ShiftOperator.shift(S_MINUS_2).apply(f));
        assertTrue(ShiftOperator.shift(S_MINUS_2).apply(f).isCanonical());
    }

    @Test
    void commutationRuleMovesCoefficientsLeft() {
        // E * f = f(shifted) * E, the defining rule of a difference operator (common practice).
        ShiftOperator e = ShiftOperator.shift(S_MINUS_2);
        ShiftOperator f = ShiftOperator.multiplication(s().multiply(s()));
        ShiftOperator expected = ShiftOperator.of(S_MINUS_2, s().subtract(c(2)).pow(2));
        assertEquals(expected, e.multiply(f));
        assertEquals(ShiftOperator.of(S_MINUS_2, s().multiply(s())), f.multiply(e));
    }

    @Test
    void equalityIsCanonicalAndCancellationLeavesZero() {
        ShiftOperator a = ShiftOperator.of(S_MINUS_2, sigma()).add(ShiftOperator.multiplication(t()));
        ShiftOperator b = ShiftOperator.multiplication(t()).add(ShiftOperator.of(S_MINUS_2, sigma()));
        assertEquals(a, b);
        assertEquals(a.hashCode(), b.hashCode());
        assertTrue(a.subtract(b).isZero());
        assertEquals(2, a.terms().size());
        assertTrue(ShiftOperator.identity().isIdentity());
        assertEquals(ShiftOperator.identity(), ShiftOperator.shift(S_MINUS_2).multiply(ShiftOperator.shift(S_MINUS_2.inverse())));
    }

    @Test
    void identityAndPowers() {
        Expression f = tau().multiply(inv(s().add(t())));
        assertEquals(f, ShiftOperator.identity().apply(f));
        ShiftOperator e = ShiftOperator.shift(S_MINUS_2);
        assertEquals(ShiftOperator.shift(Shift.of("s", Rational.of(-6))), e.pow(3));
        assertThrows(ContourException.class, () -> e.pow(-1));
    }

    @Test
    void evaluatingAShiftedVariableIsAnError() {
        ShiftOperator e = ShiftOperator.of(S_MINUS_2, p());
        assertEquals(ShiftOperator.of(S_MINUS_2, c(3)), e.evaluatePartially(Map.of("p", Rational.of(3))));
        ContourException x = assertThrows(ContourException.class, () -> e.evaluatePartially(Map.of("s", Rational.ONE)));
        assertTrue(x.getMessage().contains("'s'"), x.getMessage());
    }

    @Property(tries = 60)
    void compositionIsAssociative(@ForAll("operators") ShiftOperator a, @ForAll("operators") ShiftOperator b,
                                  @ForAll("operators") ShiftOperator c) {
        assertEquals(a.multiply(b).multiply(c), a.multiply(b.multiply(c)));
    }

    @Property(tries = 60)
    void productActsAsSuccessiveApplication(@ForAll("operators") ShiftOperator a, @ForAll("operators") ShiftOperator b,
                                            @ForAll("amplitudes") Expression f) {
        Expression direct = a.multiply(b).apply(f);
        assertEquals(a.apply(b.apply(f)), direct);
        assertTrue(direct.isCanonical());
    }

    @Property(tries = 40)
    void sumDistributesOverApplication(@ForAll("operators") ShiftOperator a, @ForAll("operators") ShiftOperator b,
                                       @ForAll("amplitudes") Expression f) {
        assertEquals(a.apply(f).add(b.apply(f)), a.add(b).apply(f));
    }

    @Provide
    Arbitrary<ShiftOperator> operators() {
        Arbitrary<ShiftOperator> term = Combinators.combine(
                Arbitraries.integers().between(-2, 2), Arbitraries.integers().between(-2, 2),
                Arbitraries.integers().between(-3, 3), Arbitraries.integers().between(-5, 5),
                Arbitraries.integers().between(0, 2)).as((ds, dt, k, pole, sig) -> {
                    Shift sh = Shift.of(Map.of("s", Rational.of(ds), "t", Rational.of(dt, 2)));
                    Expression coeff = c(k).add(s().multiply(t())).multiply(inv(s().add(c(pole))))
                            .multiply(sigma().pow(sig));
                    return ShiftOperator.of(sh, coeff);
                });
        return term.list().ofMinSize(1).ofMaxSize(3).map(list -> list.stream().reduce(ShiftOperator.zero(), ShiftOperator::add));
    }

    @Provide
    Arbitrary<Expression> amplitudes() {
        return Combinators.combine(Arbitraries.integers().between(-6, 6), Arbitraries.integers().between(-6, 6),
                Arbitraries.integers().between(0, 2), Arbitraries.integers().between(1, 5))
                .as((a, b, j, k) -> tau().pow(j).multiply(c(k)).multiply(inv(s().add(c(a)).multiply(t().add(c(b)))))
                        .add(sigma().multiply(s())));
    }
}
