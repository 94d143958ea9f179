package dev.contour.eval;

import dev.contour.bench.AnsatzSumBench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/**
 * The reduced AdS5xS5 ansatz as a script writes it (the "ansatz-sum" workload) is exactly the value
 * built term by term the plain way: one expanded denominator per term, utilde eliminated by
 * substituting into numerator and denominator separately and re-factoring.
 */
class AnsatzSumTest {
    @Test
    void theScriptedAnsatzEqualsTheTermByTermConstruction() {
        for (int p : List.of(2, 3, 7)) {
            Expression scripted = AnsatzSumBench.build(p);
            assertTrue(scripted.isCanonical(), "not canonical at p = " + p);
            Expression plain = plainAnsatz(p);
            assertEquals(plain, scripted, "p = " + p);
            // p(p - 1)/2 members of i + j + k = p - 2, one monomial each.
            assertEquals((p - 1) * p / 2, scripted.terms().size());
        }
    }

    @Test
    void dividingByAWrittenProductEqualsDividingByItsExpansion() {
        // The interpreter divides by the factors of a written product at once; the value must not change.
        Scripts session = new Scripts();
        session.run("vars s, t\nvars sigma collected");
        for (String[] pair : List.of(
                new String[] {"sigma^2*s/((s - 1)*(2*t + 4)*(s - 1))", "sigma^2*s/((s - 1)^2*(2*t + 4))"},
                new String[] {"(s^2 - 1)/((s + 1)*(3/2)*(s*t + 1))", "(s^2 - 1)/(3/2*s^2*t + 3/2*s*t + 3/2*s + 3/2)"},
                new String[] {"(sigma + s)/((t - 1)*(s + t))", "(sigma + s)/(s*t + t^2 - s - t)"},
                new String[] {"6/(2*3)", "1"})) {
            Expression written = value(session, pair[0]);
            assertTrue(written.isCanonical(), pair[0]);
            assertEquals(value(session, pair[1]), written, pair[0]);
        }
        ContourException zero = assertThrows(ContourException.class, () -> session.run("show 1/((s - 1)*0)"));
        assertEquals("division by zero", zero.getMessage());
    }

    @Test
    void additiveChainsHoldingBackNumbersKeepTheirValues() {
        Scripts session = new Scripts();
        session.run("vars s, t\nvars sigma collected\nlet p = 128\nlet k = 5");
        Expression s = Expression.variable("s");
        Expression t = Expression.variable("t");
        Expression sigma = Expression.collectedVariable("sigma");
        assertEquals(s.add(Expression.constant(-2 * 128 + 2 + 2 * 5)), value(session, "s - 2*p + 2 + 2*k"));
        assertEquals(Expression.constant(3), value(session, "1 + 2 - s + s"));
        assertEquals(s.subtract(t).add(Expression.constant(3)), value(session, "1 + s + 2 - t"));
        assertEquals(sigma.multiply(s).add(Expression.constant(-1)), value(session, "sigma*s - 3 + 2 + 0"));
        assertEquals(Expression.ZERO, value(session, "s - 1 + 1 - s"));
        // a symbolic term in the chain: numbers before it are added to it as before
        assertEquals(session.run("show Gamma(s) + 3").replace("Gamma(s) + 3", "X"),
                session.run("show Gamma(s) + 1 + 2").replace("Gamma(s) + 1 + 2", "X"));
    }

    /** Index sets listed by bound propagation (the last index checked directly) equal a brute-force scan of a box. */
    @Property(tries = 60)
    void indexSetsMatchABruteForceScan(@ForAll @IntRange(min = 1, max = 3) int a, @ForAll @IntRange(min = -2, max = 3) int b,
            @ForAll @IntRange(min = 0, max = 9) int d, @ForAll @IntRange(min = -3, max = 3) int e) {
        String set = "i, j, k in -2..3 with " + a + "*i + " + b + "*j <= " + d + ", i + k >= " + e + ", j <= 6";
        Scripts session = new Scripts();
        session.run("vars x, y, z collected");
        Expression listed = value(session, "sum " + set + " : x^i*y^j*z^(k + 2)");
        Expression expected = Expression.ZERO;
        Expression x = Expression.collectedVariable("x");
        Expression y = Expression.collectedVariable("y");
        Expression z = Expression.collectedVariable("z");
        // i, j >= 0 without a domain; j <= 6 and a*i <= d - b*j <= 9 + 2*6 bound them, k ranges over its domain.
        for (int i = 0; i <= 21; i++) {
            for (int j = 0; j <= 6; j++) {
                for (int k = -2; k <= 3; k++) {
                    if (a * i + b * j <= d && i + k >= e) {
                        expected = expected.add(x.pow(i).multiply(y.pow(j)).multiply(z.pow(k + 2)));
                    }
                }
            }
        }
        assertEquals(expected, listed, set);
    }

    private static Expression value(Scripts session, String expression) {
        return ((ExprValue) session.interpreter.evaluate(expression, "test.ctr")).value();
    }

    private static Expression plainAnsatz(int p) {
        Polynomial s = Polynomial.variable("s");
        Polynomial t = Polynomial.variable("t");
        // utilde = 4p - 4 - s - t, written into each factor before anything is divided
        Polynomial utilde = Polynomial.constant(4L * p - 4).subtract(s).subtract(t);
        Map<Monomial, RationalFunction> terms = new HashMap<>();
        for (int i = 0; i <= p - 2; i++) {
            for (int j = 0; i + j <= p - 2; j++) {
                int k = p - 2 - i - j;
                Polynomial den = s.add(Polynomial.constant(-2L * p + 2 + 2L * k))
                        .multiply(t.add(Polynomial.constant(-2L * p + 2 + 2L * j)))
                        .multiply(utilde.add(Polynomial.constant(-2L * p + 2 + 2L * i)));
                Map<String, Integer> ex = new HashMap<>();
                ex.put(UnknownFamilyValue.memberName("a", List.of(i, j, k)), 1);
                ex.put("sigma", i);
                ex.put("tau", j);
                terms.put(Monomial.of(ex), RationalFunction.of(Polynomial.ONE, den));
            }
        }
        return Expression.of(terms);
    }
}
