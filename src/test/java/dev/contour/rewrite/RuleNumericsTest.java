package dev.contour.rewrite;

import static dev.contour.rewrite.TestTerms.BUNDLED;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeSet;
import org.apfloat.Apcomplex;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Every bundled Gamma and Pochhammer rule, checked against apfloat's complex Gamma
 * ({@code ApcomplexMath.gamma}, the independent reference): along derivations that use each rule,
 * every step keeps the value to 30 digits at random complex points. The Pochhammer symbol is
 * evaluated by its definition, DLMF 5.2.4 and 5.2.5 (recalled from memory; see {@link NumericTerms}).
 */
class RuleNumericsTest {
    /** Terms whose derivations use every bundled rule between them. */
    private static final List<String> EXAMPLES = List.of(
            "Gamma(x + 3)/Gamma(x)",
            "Gamma(y - 1/3)/Gamma(y + 2 - 1/3)",
            "Gamma(x/2 + 3 - y)",
            "Gamma(x - 5/2)",
            "Gamma(5)*Gamma(y + 1/2)",
            "poch(x, 4) + poch(y, -3)",
            "poch(x, a + 2)",
            "poch(x + 1/2, a)",
            "factorial(4)*factorial(x + 1/3)",
            "binom(x, 3) + binom(y, 0) + binom(x, -2)",
            "binom(x + 1, a)");

    @Test
    void everyStepOfEveryRuleKeepsTheValue() {
        check(1);
    }

    /** The same at more points (apfloat's Gamma takes a few hundred ms at 40 digits). */
    @Test
    @Tag("slow")
    void everyStepOfEveryRuleKeepsTheValueAtMorePoints() {
        check(4);
    }

    private static void check(int points) {
        Random random = new Random(20261202L);
        Set<String> fired = new TreeSet<>();
        for (String text : EXAMPLES) {
            Rewriter.Result r = Rewriter.normalize(TestTerms.term(text), BUNDLED, Limits.DEFAULT);
            assertEquals(StopReason.SATURATED, r.stopReason(), text);
            for (int point = 0; point < points; point++) {
                NumericTerms at = new NumericTerms(Map.of("x", NormalFormProperties.point(random),
                        "y", NormalFormProperties.point(random), "a", NormalFormProperties.point(random)), 40);
                Apcomplex previous = at.value(TestTerms.canonical(text));
                for (Rewriter.Step s : r.trace()) {
                    Apcomplex next = at.value(s.after());
                    assertTrue(NumericTerms.agree(previous, next, 30),
                            () -> s.rule().name() + " changed the value in the derivation of " + text);
                    previous = next;
                    fired.add(s.rule().name());
                }
            }
        }
        Set<String> all = new TreeSet<>();
        BUNDLED.rules().forEach(rule -> all.add(rule.name()));
        assertEquals(all, fired, "every bundled rule is exercised");
    }

    @Test
    void theReferenceItselfTellsWrongRulesApart() {
        // A check that cannot fail proves nothing: an off-by-one Gamma shift must be caught.
        RuleSet wrong = TestTerms.rules("rule off-by-one : Gamma(@x + @n) becomes poch(@x, @n + 1) * Gamma(@x) when positive_integer(@n)");
        Rewriter.Result r = Rewriter.normalize(TestTerms.term("Gamma(x + 2)"), wrong.plus(RuleLibrary.load(TestTerms.RULES.resolve("pochhammer.ctr"))),
                Limits.DEFAULT);
        NumericTerms at = new NumericTerms(Map.of("x", NormalFormProperties.point(new Random(7))), 40);
        assertTrue(!NumericTerms.agree(at.value(TestTerms.canonical("Gamma(x + 2)")), at.value(r.term()), 30));
    }
}
