package dev.contour.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
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
