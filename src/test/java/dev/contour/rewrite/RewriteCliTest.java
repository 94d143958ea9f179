package dev.contour.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Rule files, derivations and proofs through the command line (dev.contour.cli.Main in-process). */
class RewriteCliTest {
    @TempDir
    Path dir;

    private record Run(int code, String out, String err) { }

    private Run run(String script, String... files) throws IOException {
        for (int i = 0; i < files.length; i += 2) {
            Files.writeString(dir.resolve(files[i]), files[i + 1]);
        }
        Path main = dir.resolve("main.ctr");
        Files.writeString(main, script);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = Main.run(new String[] {"run", "--rules=" + Path.of("rules").toAbsolutePath(), main.toString()},
                new ByteArrayInputStream(new byte[0]), new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Run(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    private void rejects(String rules, String where, String message) throws IOException {
        Run r = run("vars s\nderive Gamma(s) using \"bad.ctr\"\n", "bad.ctr", rules);
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertTrue(r.err().contains(dir.resolve("bad.ctr") + ":" + where + ": "), r.err());
        assertTrue(r.err().contains(message), r.err());
    }

    @Test
    void validationErrorsNameTheRuleFileLineAndColumn() throws IOException {
        rejects("rule up : Gamma(@x + 1) becomes @y * Gamma(@x)\n", "1:33",
                "rule 'up': @y in the right side is not bound on the left side");
        rejects("rule up : Gamma(@x + @n) becomes Gamma(@x) when integer(@m)\n", "1:57",
                "rule 'up': @m in the guard is not bound on the left side");
        rejects("rule up : Gamma(@x) becomes 1\nrule up : poch(@x, 0) becomes 1\n", "2:1",
                "rule name 'up' is already used by the rule at");
        rejects("rule Gamma_up : Gamma(@x) becomes 1\n", "1:1", "rule name 'Gamma_up' is not kebab-case");
        rejects("rule everything : @x becomes 0\n", "1:19", "the left side is the bare variable @x");
        rejects("rule five : Gamma(2 + 3) becomes 24\n", "1:19", "the numbers in '2 + 3' never stand apart in the canonical form");
        rejects("rule half : Gamma(@x) becomes Gamma(@x/2) when odd(@x)\n", "1:48", "unknown guard 'odd'");
        rejects("rule plain : 2*3 becomes 6\n", "1:14", "the left side has no function call");
        rejects("rule sq : Gamma(@x)*Gamma(@x) becomes 1\n", "1:11", "two equal factors never occurs in the canonical form");
        rejects("vars s\n", "1:1", "a rule file holds only 'rule' statements");
    }

    @Test
    void leftSidesTheCanonicalFormNeverContainsAreRejected() throws IOException {
        rejects("rule cancel : Gamma(@x) / Gamma(@x) becomes 2\n", "1:15",
                "rule 'cancel': the factor Gamma(@x) is both in the numerator and in the denominator");
        rejects("rule cancel : Gamma(@x)^3 / Gamma(@x) becomes 2\n", "1:15",
                "rule 'cancel': the factor Gamma(@x) is both in the numerator and in the denominator");
        rejects("rule twice : Gamma(@x)^2 * Gamma(@x) * poch(@x, 2) becomes 2\n", "1:14",
                "rule 'twice': the factor Gamma(@x) appears twice with different powers");
        rejects("rule like : 2*Gamma(@x) + 3*Gamma(@x) becomes 2\n", "1:13",
                "rule 'like': the summands 2*Gamma(@x) and 3*Gamma(@x) differ only by a number");
        rejects("rule like : Gamma(@x) - Gamma(@x) + poch(@x, 2) becomes 2\n", "1:13",
                "rule 'like': the summands Gamma(@x) and -1*Gamma(@x) differ only by a number");
        rejects("rule sq : (@x + 1)^2 * Gamma(@x) becomes 2\n", "1:11",
                "rule 'sq': a positive power of a sum never occurs in the canonical form");
    }

    @Test
    void tooLargeExponentsAreLocatedErrors() throws IOException {
        rejects("rule big : (Gamma(@x)^1000000)^1000000 becomes 1\n", "1:12",
                "rule 'big': the exponent 1000000*1000000 is too large");
        rejects("rule big : Gamma(@x) becomes (2^1000000)^1000000\n", "1:31", "rule 'big': the number");
        Run r = run("vars s\nrule pw : f(@x) becomes f(@x)^1000000\nderive f(s + 1) within 3 steps\n");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals(dir.resolve("main.ctr") + ":3:1: the exponent 1000000*1000000 is too large (exponents are at most 2147483647)"
                + " while rewriting with rule 'pw' (" + dir.resolve("main.ctr") + ":2:1)\n"
                + "    derive f(s + 1) within 3 steps\n"
                + "    ^~~~~~~~~~~~~~~~~~~~~~~~~~~~~~\n", r.err());
    }

    @Test
    void errorsWhileRewritingNameTheStatementAndTheRule() throws IOException {
        Run inv = run("vars s\nrule inv : f(@x) becomes 1/@x\nderive f(0)\n");
        assertEquals(Main.BAD_INPUT, inv.code(), inv.err());
        assertEquals(dir.resolve("main.ctr") + ":3:1: division by zero while rewriting with rule 'inv' ("
                + dir.resolve("main.ctr") + ":2:1)\n    derive f(0)\n    ^~~~~~~~~~~\n", inv.err());
        Run poch = run("vars s\nuse \"gamma.ctr\"\nuse \"pochhammer.ctr\"\nderive 1/poch(-2, 3)\n");
        assertEquals(Main.BAD_INPUT, poch.code(), poch.err());
        assertTrue(poch.err().startsWith(dir.resolve("main.ctr") + ":4:1: division by zero while rewriting with rule 'poch-expand' ("),
                poch.err());
        assertTrue(poch.err().contains("pochhammer.ctr:11:1)\n    derive 1/poch(-2, 3)\n    ^~~"), poch.err());
    }

    @Test
    void affinePatternsAreSolvedAgainstPolynomialArguments() throws IOException {
        Run r = run("""
                vars s, t
                rule a2 : g(@x + @y) becomes B(@x, @y)
                derive g(s + t)
                rule a4 : k(@x, 1 - @x) becomes D(@x)
                derive k(s + 1/2, 1/2 - s)
                derive k(s + 1/2, 1/3 - s)
                rule refl : Gamma(@x)*Gamma(1 - @x) becomes R(@x)
                derive Gamma(1/2 - s)*Gamma(s + 1/2)
                rule half : h(2*@x + 1) becomes H(@x)
                derive h(s)
                """);
        assertEquals(Main.OK, r.code(), r.err());
        assertTrue(r.out().contains("    g(s + t)\n  = B(s, t)\n        by a2 "), r.out());
        assertTrue(r.out().contains("  = D(s + 1/2)\n        by a4 "), r.out());
        assertTrue(r.out().contains("    k(s + 1/2, -s + 1/3)\n  normal form after 0 steps\n"), r.out());
        assertTrue(r.out().contains("  = R(-s + 1/2)\n        by refl "), r.out());
        assertTrue(r.out().contains("  = H(1/2*s - 1/2)\n        by half "), r.out());
    }

    @Test
    void theTimeLimitStopsALongRewriteAndSaysSo() throws IOException {
        Run r = run("vars s\nderive poch(s, 100000) using \"pochhammer.ctr\" within 1 second, 1000000 steps, 100000000 nodes\n");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertTrue(r.err().startsWith(dir.resolve("main.ctr") + ":2:1: rewriting stopped at the time limit (1000 ms) after "), r.err());
        assertTrue(r.err().contains("; rule 'poch-expand' ("), r.err());
        assertTrue(r.err().contains("the rewrite may simply be long; raise the limit with 'within N seconds'"), r.err());
        Run steps = run("vars s\nderive wrap(s) using \"creep.ctr\" within 30 steps\n", "creep.ctr",
                "rule creep : wrap(@x) becomes wrap(@x + 1)\n");
        assertTrue(steps.err().contains("fired 30 times: the rules may not terminate\n"), steps.err());
    }

    @Test
    void rulesStatedInAScriptAreCheckedToo() throws IOException {
        Run r = run("vars s\nuse \"gamma.ctr\"\nrule gamma-shift-up : Gamma(@x) becomes Gamma(@x)\n");
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.err().contains("main.ctr:3:1: rule name 'gamma-shift-up' is already used by the rule at "), r.err());
    }

    @Test
    void aTwoStepProofPrintsItsTrace() throws IOException {
        Run r = run("vars s\ncheck Gamma(s + 2) == (s + 1)*s*Gamma(s) by rules using \"step.ctr\"\n",
                "step.ctr", "rule gamma-step : Gamma(@x + 1) becomes @x * Gamma(@x)\n");
        assertEquals(Main.OK, r.code(), r.err());
        assertEquals("""
                check Gamma(s + 2) == (s + 1)*s*Gamma(s) by rules  ok
                  left, 2 steps:
                      Gamma(s + 2)
                    = (s + 1)*Gamma(s + 1)
                          by gamma-step (step.ctr:1:1) at the top
                    = (s^2 + s)*Gamma(s)
                          by gamma-step (step.ctr:1:1) at 2: Gamma(s + 1)
                  right, 0 steps:
                      (s^2 + s)*Gamma(s)
                  both sides reach (s^2 + s)*Gamma(s)
                """, r.out());
    }

    @Test
    void aFailedProofShowsWhereTheNormalFormsDiffer() throws IOException {
        Run r = run("vars s, t\nuse \"gamma.ctr\"\nuse \"pochhammer.ctr\"\ncheck Gamma(s + 1) == t*Gamma(s) by rules\n");
        assertEquals(Main.CHECK_FAILED, r.code(), r.err());
        assertEquals("""
                check Gamma(s + 1) == t*Gamma(s) by rules  FAILED (line 4)
                  left, 3 steps:
                      Gamma(s + 1)
                    = Gamma(s)*poch(s, 1)
                          by gamma-shift-up (gamma.ctr:14:1) at the top
                    = s*Gamma(s)*poch(s, 0)
                          by poch-expand (pochhammer.ctr:11:1) at 2: poch(s, 1)
                    = s*Gamma(s)
                          by poch-zero-length (pochhammer.ctr:10:1) at 3: poch(s, 0)
                  right, 0 steps:
                      t*Gamma(s)
                  the normal forms differ at 1:
                      left   s
                      right  t
                """, r.out());
    }

    @Test
    void deriveShowsEachRuleWithItsSpan() throws IOException {
        Run r = run("vars s\nderive Gamma(s + 2)/Gamma(s) using \"gamma.ctr\", \"pochhammer.ctr\"\n");
        assertEquals(Main.OK, r.code(), r.err());
        assertTrue(r.out().startsWith("""
                derive Gamma(s + 2)/Gamma(s)
                    Gamma(s + 2)/Gamma(s)
                  = poch(s, 2)
                        by gamma-ratio-up (gamma.ctr:"""), r.out());
        assertTrue(r.out().endsWith("  = s^2 + s\n        by poch-zero-length (pochhammer.ctr:10:1) at 2: poch(s, 0)\n"
                + "  normal form after 4 steps\n"), r.out());
    }

    @Test
    void aRunawayRuleIsStoppedByTheLimitsWithItsName() throws IOException {
        String grow = "rule grow : wrap(@x) becomes wrap(@x * wrap(@x))\n";
        Run size = run("vars s\nderive wrap(s) using \"grow.ctr\" within 300 nodes\n", "grow.ctr", grow);
        assertEquals(Main.BAD_INPUT, size.code());
        assertTrue(size.err().contains("main.ctr:2:1: rewriting stopped at the size limit (terms of 300 nodes) after "), size.err());
        assertTrue(size.err().contains("rule 'grow' (" + dir.resolve("grow.ctr") + ":1:1) fired "), size.err());
        Run steps = run("vars s\nderive wrap(s) using \"creep.ctr\" within 30 steps\n", "creep.ctr",
                "rule creep : wrap(@x) becomes wrap(@x + 1)\n");
        assertEquals(Main.BAD_INPUT, steps.code());
        assertTrue(steps.err().contains("rewriting stopped at the step limit (30 steps) after 30 steps; rule 'creep'"), steps.err());
        Run unit = run("vars s\nderive wrap(s) using \"grow.ctr\" within 30 hours\n", "grow.ctr", grow);
        assertTrue(unit.err().contains("main.ctr:2:40: unknown limit 'hours': use steps, nodes or seconds"), unit.err());
    }
}
