package dev.contour.rewrite;

import static dev.contour.rewrite.TestTerms.BUNDLED;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.term.Term;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;

/**
 * Properties of the bundled rule sets on random terms: the normal form is unique (it does not
 * depend on the order the rules are tried in), normal forms are fixed points, and every step
 * preserves the value (checked with apfloat to 30 digits at random complex points).
 */
class NormalFormProperties {
    private static final long PRECISION = 40;

    private static Rewriter.Result normalize(Term t, RuleSet rules) {
        Rewriter.Result r = Rewriter.normalize(t, rules, Limits.DEFAULT);
        assertEquals(StopReason.SATURATED, r.stopReason(), () -> "stopped: " + r.stopMessage());
        return r;
    }

    @Property(tries = 60)
    void theNormalFormDoesNotDependOnRuleOrder(@ForAll long termSeed, @ForAll long orderSeed) {
        String text = new RandomTerms(termSeed).term();
        Term t = TestTerms.term(text);
        List<Rule> shuffled = new ArrayList<>(BUNDLED.rules());
        Collections.shuffle(shuffled, new Random(orderSeed));
        Term inOrder = normalize(t, BUNDLED).term();
        Term reordered = normalize(t, RuleSet.of(shuffled)).term();
        assertEquals(inOrder, reordered, text);
    }

    @Property(tries = 60)
    void normalisingTwiceChangesNothing(@ForAll long termSeed) {
        Term t = TestTerms.term(new RandomTerms(termSeed).term());
        Rewriter.Result once = normalize(t, BUNDLED);
        Rewriter.Result twice = normalize(once.term(), BUNDLED);
        assertEquals(0, twice.steps());
        assertEquals(once.term(), twice.term());
    }

    /** Slow (apfloat's Gamma at 40 digits, many per derivation); {@link RuleNumericsTest} covers every rule quickly. */
    @Property(tries = 25)
    @net.jqwik.api.Tag("slow")
    void everyStepKeepsTheValueTo30Digits(@ForAll long termSeed) {
        String text = new RandomTerms(termSeed).term();
        Rewriter.Result r = normalize(TestTerms.term(text), BUNDLED);
        Random random = new Random(termSeed);
        NumericTerms at = new NumericTerms(Map.of("x", point(random), "y", point(random), "a", point(random)), PRECISION);
        Apcomplex previous = at.value(TestTerms.canonical(text));
        for (Rewriter.Step s : r.trace()) {
            Apcomplex next = at.value(s.after());
            assertTrue(NumericTerms.agree(previous, next, 30), () -> s.rule().name() + " changed the value of " + text
                    + " at step " + (r.trace().indexOf(s) + 1));
            previous = next;
        }
    }

    /** A complex point off the real axis, so that no Gamma function meets a pole. */
    static Apcomplex point(Random random) {
        return new Apcomplex(new Apfloat(random.nextInt(500) - 250, PRECISION).divide(new Apfloat(100, PRECISION)),
                new Apfloat(30 + random.nextInt(170), PRECISION).divide(new Apfloat(100, PRECISION)));
    }
}
