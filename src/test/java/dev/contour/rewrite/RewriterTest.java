package dev.contour.rewrite;

import static dev.contour.rewrite.TestTerms.BUNDLED;
import static dev.contour.rewrite.TestTerms.canonical;
import static dev.contour.rewrite.TestTerms.rules;
import static dev.contour.rewrite.TestTerms.term;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.term.Term;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The runner and the matcher on hand-picked terms whose normal forms are known. */
class RewriterTest {
    private static Rewriter.Result run(String text, RuleSet rules) {
        return Rewriter.normalize(term(text), rules, Limits.DEFAULT);
    }

    @Test
    void aLeafSplitsIntoItsIntegerShiftAndTheRest() {
        RuleSet shift = rules("rule up : Gamma(@x + @n) becomes poch(@x, @n) * Gamma(@x) when integer(@n)");
        Rewriter.Result r = run("Gamma(s/2 + 3 - p)", shift);
        assertEquals(StopReason.SATURATED, r.stopReason());
        assertEquals(1, r.steps());
        assertEquals(canonical("poch(s/2 - p, 3) * Gamma(s/2 - p)"), r.term());
        assertEquals(List.of(), r.trace().get(0).position());
    }

    @Test
    void aFractionalShiftKeepsItsFractionInTheArgument() {
        assertEquals(canonical("(s + 1/2)*(s + 3/2)*Gamma(s + 1/2)"), run("Gamma(s + 5/2)", BUNDLED).term());
        assertEquals(canonical("Gamma(s + 1/2)/(s - 1/2)"), run("Gamma(s - 1/2)", BUNDLED).term());
        assertEquals(canonical("Gamma(s + 1/2)"), run("Gamma(s + 1/2)", BUNDLED).term());
    }

    @Test
    void aGammaRatioIsOneStepThenThePochhammerExpands() {
        Rewriter.Result r = run("Gamma(s + 2)/Gamma(s)", BUNDLED);
        assertEquals(canonical("s*(s + 1)"), r.term());
        assertTrue(r.term() instanceof Term.Leaf);
        assertEquals("gamma-ratio-up", r.trace().get(0).rule().name());
        Rewriter.Result down = run("Gamma(t - 1)/Gamma(t + 2)", BUNDLED);
        assertEquals(canonical("1/((t - 1)*t*(t + 1))"), down.term());
    }

    @Test
    void aBoundVariableIsTakenOutArithmetically() {
        Rewriter.Result r = run("3*Gamma(s + 3)/Gamma(s + 1)*Gamma(t)", BUNDLED);
        assertEquals(canonical("3*(s + 1)*(s + 2)*Gamma(t)"), r.term());
        assertEquals("gamma-ratio-up", r.trace().get(0).rule().name());
    }

    @Test
    void factorialsBinomialsAndPochhammersAtIntegers() {
        assertEquals(canonical("120"), run("factorial(5)", BUNDLED).term());
        assertEquals(canonical("10"), run("binom(5, 2)", BUNDLED).term());
        assertEquals(canonical("x*(x - 1)*(x - 2)/6"), run("binom(x, 3)", BUNDLED).term());
        assertEquals(canonical("0"), run("binom(x, -1)", BUNDLED).term());
        assertEquals(canonical("1/((x - 1)*(x - 2))"), run("poch(x, -2)", BUNDLED).term());
        assertEquals(canonical("6"), run("Gamma(4)", BUNDLED).term());
    }

    @Test
    void symbolicLengthsGoThroughGamma() {
        Term split = run("poch(x, a + 2)", BUNDLED).term();
        assertEquals(canonical("(x + a)*(x + a + 1)*Gamma(x + a)/Gamma(x)"), split);
        assertEquals(split, run("poch(x, a)*poch(x + a, 2)", BUNDLED).term());
    }

    @Test
    void normalisingTwiceChangesNothing() {
        Rewriter.Result once = run("Gamma(s + 7/3)*poch(s, b + 1)/binom(s, 2)", BUNDLED);
        Rewriter.Result twice = Rewriter.normalize(once.term(), BUNDLED, Limits.DEFAULT);
        assertEquals(0, twice.steps());
        assertEquals(once.term(), twice.term());
    }

    @Test
    void aGrowingRuleIsStoppedByTheSizeLimit() {
        RuleSet grow = rules("rule grow : wrap(@x) becomes wrap(@x + 1/2) * wrap(@x + 1/3)");
        Rewriter.Result r = Rewriter.normalize(term("wrap(s)"), grow, Limits.DEFAULT.withSize(200));
        assertEquals(StopReason.SIZE_LIMIT, r.stopReason());
        assertTrue(Rewriter.size(r.term()) > 200);
        assertTrue(r.stopMessage().contains("rule 'grow' (test.ctr:1:1)"), r.stopMessage());
        Rewriter.Result steps = Rewriter.normalize(term("wrap(s)"), grow, Limits.DEFAULT.withSteps(25));
        assertEquals(StopReason.STEP_LIMIT, steps.stopReason());
        assertEquals(25, steps.steps());
    }
}
