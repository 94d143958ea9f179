package dev.contour.mellin;

import dev.contour.algebra.Expression;
import org.junit.jupiter.api.Test;

import java.util.List;

import static dev.contour.mellin.Fixtures.*;
import static org.junit.jupiter.api.Assertions.*;

class GrowthTest {
    private static final List<String> MELLIN = List.of("s", "t");

    @Test
    void degreeAndLeadingTermOfAPlantedExpression() {
        // sigma (s^2 t + p)/((s-2)(t+1)) + tau/(s+t) grows like beta; leading sigma s^2 t/(s t) = sigma s.
        Expression f = sigma().multiply(s().pow(2).multiply(t()).add(p())).multiply(inv(s().subtract(c(2)).multiply(t().add(c(1)))))
                .add(tau().multiply(inv(s().add(t()))));
        Growth.Result g = Growth.of(f, MELLIN);
        assertEquals(1, g.degree().getAsInt());
        assertEquals(sigma().multiply(s()), g.leading());
    }

    @Test
    void negativeDegreeAndZero() {
        Growth.Result g = Growth.of(tau().multiply(inv(s().multiply(t()).add(c(1)))), MELLIN);
        assertEquals(-2, g.degree().getAsInt());
        assertEquals(tau().multiply(inv(s().multiply(t()))), g.leading());
        assertTrue(Growth.of(Expression.ZERO, MELLIN).degree().isEmpty());
    }
}
