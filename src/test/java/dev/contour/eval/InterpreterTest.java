package dev.contour.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class InterpreterTest {
    private static ContourException error(String script) {
        return assertThrows(ContourException.class, () -> Scripts.output(script));
    }

    @Test
    void showPrintsLabelAndExactValue() {
        assertEquals("1/3 + 1/6 = 1/2\n", Scripts.output("show 1/3 + 1/6"));
        assertEquals("5\n", Scripts.output("show 5"));
        assertEquals("text\n", Scripts.output("show \"text\""));
        assertEquals("0.25 + 1 = 5/4\n", Scripts.output("show 0.25 + 1"));
        assertEquals("x = s^2 - 1\n", Scripts.output("vars s\nlet x = (s - 1)*(s + 1)\nshow x"));
        assertEquals("x = (s - 1)*(s + 1)\n", Scripts.output("vars s\nlet x = s^2 - 1\nshow x factored"));
        assertEquals("2^-2 = 1/4\n", Scripts.output("show 2^-2"));
    }

    @Test
    void checkDecidesExactlyAndCountsResults() {
        Scripts s = new Scripts();
        String out = s.run("vars s, t\ncheck (s + t)^2 == s^2 + 2*s*t + t^2\ncheck 1/(s - 1) - 1/(s + 1) == 2/(s^2 - 1)");
        assertEquals("check (s + t)^2 == s^2 + 2*s*t + t^2  ok\ncheck 1/(s - 1) - 1/(s + 1) == 2/(s^2 - 1)  ok\n", out);
        RunResult r = s.interpreter.run("vars s\ncheck s == s + 1/1000000\ncheck s == s", "t.ctr");
        assertEquals(new RunResult(1, 1), r);
        assertFalse(r.ok());
    }

    @Test
    void failedCheckGivesCoefficientAndAPointWhereTheSidesDiffer() {
        String out = Scripts.output("vars s, t\nvars x collected\ncheck x^2*s + x/(t - 1) == x^2*s + x/(t + 1)");
        assertTrue(out.startsWith("check x^2*s + x/(t - 1) == x^2*s + x/(t + 1)  FAILED (line 3)\n"), out);
        assertTrue(out.contains("in the coefficient of x:\n        left   1/(t - 1)\n        right  1/(t + 1)\n"), out);
        // the printed point really separates the sides: re-evaluate both at it
        String point = out.substring(out.indexOf("differ at ") + 10, out.indexOf(":\n", out.indexOf("differ at ")));
        String left = out.split("left   ")[2].split("\n")[0];
        String right = out.split("right  ")[2].split("\n")[0];
        Scripts again = new Scripts();
        String subst = "(" + point + ")";
        String check = again.run("vars s, t\nvars x collected\nshow (x^2*s + x/(t - 1)) at " + subst
                + "\nshow (x^2*s + x/(t + 1)) at " + subst);
        assertTrue(check.contains(" = " + left + "\n"), check + " / " + left);
        assertTrue(check.contains(" = " + right + "\n"), check + " / " + right);
        assertFalse(left.equals(right));
    }

    @Test
    void checksOnlyModePrintsOneLinePerCheckAndNoShows() {
        String out = new Scripts(OutputFormat.PLAIN, true).run("vars s\nshow s\ncheck s == s\ncheck s == 2*s");
        List<String> lines = out.lines().toList();
        assertEquals(2, lines.size(), out);
        assertEquals("check s == s  ok", lines.get(0));
        assertTrue(lines.get(1).startsWith("check s == 2*s  FAILED (line 4; coefficient of 1 differs; at s = "), lines.get(1));
    }

    @Test
    void listsAreComparedItemByItem() {
        String out = Scripts.output("vars s, t\ncheck {1, s} == {1, s}\ncheck {1, s} == {1, t}\ncheck {1} == {1, 2}");
        assertTrue(out.startsWith("check {1, s} == {1, s}  ok\ncheck {1, s} == {1, t}  FAILED (line 3)\n"
                + "    first difference, in the coefficient of 1:\n        left   s\n        right  t\n"), out);
        assertTrue(out.endsWith("check {1} == {1, 2}  FAILED (line 4)\n    left   {1}\n    right  {1, 2}\n"), out);
    }

    @Test
    void aParameterNamedTwiceIsAnError() {
        ContourException e = error("vars s\ndef f(a, a) = a + s");
        assertEquals("the parameter 'a' of f is named twice", e.getMessage());
        assertEquals(2, e.span().line());
    }

    @Test
    void aFailedCheckBetweenConstantsNamesNoPoint() {
        String out = Scripts.output("check 1 == 2");
        assertEquals("check 1 == 2  FAILED (line 1)\n    first difference, in the coefficient of 1:\n        left   1\n        right  2\n", out);
        assertEquals("check 1 == 2  FAILED (line 1; coefficient of 1 differs)\n", new Scripts(OutputFormat.PLAIN, true).run("check 1 == 2"));
    }

    @Test
    void collectedLayoutGroupsByChosenVariables() {
        String defs = "vars s\nvars x, y collected";
        List<String> lines = Scripts.output(defs + "\nshow (x + y + s)^2 collected x").lines().toList();
        assertEquals("(x + y + s)^2, collected in x (3 terms):", lines.get(0));
        assertEquals(4, lines.size());
        List<String> labels = List.of("x^2", "x", "1");
        List<String> expected = List.of("1", "2*y + 2*s", "(y + s)^2");
        int bar = lines.get(1).indexOf('|');
        for (int row = 0; row < 3; row++) {
            String line = lines.get(row + 1);
            assertEquals(bar, line.indexOf('|'), "aligned: " + line);
            assertEquals(labels.get(row), line.substring(0, bar).trim());
            assertEquals(value(defs, expected.get(row)), value(defs, line.substring(bar + 1).trim()), line);
        }
        // collecting by an inner variable works while it stays out of denominators
        assertTrue(Scripts.output("vars s, t\nshow (s + t)^2/(t - 1) collected s").contains("s^2  |  1/(t - 1)"));
        assertTrue(error("vars s, t\nshow 1/(s + t) collected s").getMessage().contains("denominator"));
    }

    @Test
    void gammaRatiosWithIntegerShiftsAreRational() {
        assertEquals("g = s*(s + 1)*(s + 2)\n", Scripts.output("vars s\nlet g = Gamma(s + 3)/Gamma(s)\nshow g factored"));
        assertEquals("Gamma(5) + 4! + binom(6, 2) + poch(3, 2) = 75\n",
                Scripts.output("show Gamma(5) + 4! + binom(6, 2) + poch(3, 2)"));
        assertTrue(Scripts.output("vars s\nshow Gamma(s/2)").contains("Gamma(1/2*s)"));
        assertTrue(error("show Gamma(-2)").getMessage().contains("pole"));
    }

    /** The value of an expression after the given definitions, as an exact expression. */
    private static Expression value(String definitions, String expression) {
        Scripts s = new Scripts();
        s.run(definitions);
        return assertInstanceOf(ExprValue.class, s.interpreter.evaluate(expression, "test.ctr")).value();
    }

    @Test
    void sumsOverIndexSetsWithConstraints() {
        // planted: i + j + k = n has binom(n + 2, 2) non-negative solutions
        for (int n = 0; n < 6; n++) {
            assertEquals(Expression.constant((n + 2) * (n + 1) / 2), value("", "sum i, j, k with i + j + k = " + n + " : 1"));
        }
        assertEquals(Expression.constant(30), value("", "sum i in 1..4 : i^2"));
        // i + j = 4 with i >= 1 and j > 1: (1, 3) and (2, 2)
        assertEquals(Expression.constant(2), value("", "sum i, j with i + j = 4, i >= 1, j > 1 : 1"));
        assertEquals(Expression.constant(15), value("", "sum i in 0..10 step 5 : i"));
        assertEquals(Expression.constant(-3), value("", "sum i in -3..2 : i"));
        assertTrue(error("show sum i, j with i >= 2 : 1").getMessage().contains("infinite"));
        assertTrue(error("show sum i, j with i*j = 4 : 1").getMessage().contains("linear"));
    }

    @Test
    void unknownFamiliesAreCollectedVariables() {
        Scripts s = new Scripts();
        String out = s.run("let p = 3\nunknown a[i, j] with i + j = p - 1\nshow a\nshow a[0, 2]*a[1, 1]");
        assertEquals("a = 3 unknowns: a[0,2], a[1,1], a[2,0]\na[0, 2]*a[1, 1] = a[0,2]*a[1,1]\n", out);
        UnknownFamilyValue family = assertInstanceOf(UnknownFamilyValue.class, s.interpreter.lookup("a"));
        assertEquals(List.of("a[0,2]", "a[1,1]", "a[2,0]"), family.memberNames());
        ContourException e = assertThrows(ContourException.class, () -> s.run("show a[3, 3]"));
        assertTrue(e.getMessage().contains("not in the family"), e.getMessage());
    }

    @Test
    void substitutionIsSimultaneous() {
        assertEquals(value("vars s, t", "t - 2*s"), value("vars s, t", "(s - 2*t) at (s = t, t = s)"));
        assertEquals(value("vars s, t", "(s + 2)^2/(t - s)"), value("vars s, t", "(s^2/t) at (s = s + 2, t = t - s)"));
        assertEquals(value("unknown a[i] with i <= 1", "a[0] + 5"),
                value("unknown a[i] with i <= 1", "(a[1] + a[0]) at a[1] = 5"));
        assertTrue(error("vars s\nlet k = 2\nshow s at (k = 1)").getMessage().contains("not a variable"));
    }

    @Test
    void functionsLoopsAndScopes() {
        String out = Scripts.output("""
                def f(x, y) = x^2 - y
                let total = 0
                for q in 1..4 {
                    let total = total + f(q, 1)
                }
                show total
                """);
        assertEquals("total = 26\n", out);
        assertTrue(error("def f(x) = x\nshow f(1, 2)").getMessage().contains("takes 1 argument"));
        assertTrue(error("def f(n) = f(n + 1)\nshow f(1)").getMessage().contains("recursive"));
        assertTrue(error("vars s\nlet s = 2").getMessage().contains("already a variable"));
        assertTrue(error("let Gamma = 2").getMessage().contains("built-in"));
    }

    @Test
    void aLoopBodyMayDeclareItsOwnUnknownsAndFunctionsOfTheLoopVariable() {
        String out = Scripts.output("""
                for n in 1..3 {
                    unknown c[i] with i <= n
                    def total(x) = x * (sum i with i <= n : c[i])
                    show c
                    show total(2)
                }
                """);
        assertEquals("""
                [n = 1] c = 2 unknowns: c[0], c[1]
                [n = 1] total(2) = 2*c[1] + 2*c[0]
                [n = 2] c = 3 unknowns: c[0], c[1], c[2]
                [n = 2] total(2) = 2*c[2] + 2*c[1] + 2*c[0]
                [n = 3] c = 4 unknowns: c[0], c[1], c[2], c[3]
                [n = 3] total(2) = 2*c[3] + 2*c[2] + 2*c[1] + 2*c[0]
                """, out);
        // a second 'unknown' statement for the same name is still a mistake
        assertTrue(error("unknown c[i] with i <= 1\nunknown c[i] with i <= 1").getMessage()
                .contains("already an unknown family"));
        // a loop's function sees the iteration's value of the loop variable, parameters shadow it
        assertEquals("f(1) = 11\n", Scripts.output("for n in 10..10 {\n def f(x) = x + n\n}\nshow f(1)"));
        assertEquals("[n = 10] f(1) = 2\n", Scripts.output("for n in 10..10 {\n def f(n) = n + 1\n show f(1)\n}"));
    }

    @Test
    void unknownNamesSuggestTheNearestOne() {
        ContourException e = error("vars sigma, tau collected\nshow sigam + tau");
        assertEquals("unknown name 'sigam'; did you mean 'sigma'?", e.getMessage());
        assertEquals(new Span("test.ctr", 2, 6, 5), e.span());
    }

    @Test
    void errorsCarryTheSpanOfTheFailingExpression() {
        ContourException e = error("vars s\nshow 1 + s/(s - s)");
        assertEquals("division by zero", e.getMessage());
        assertEquals(2, e.span().line());
        assertEquals(10, e.span().column());
    }

    @Test
    void exponentsThatOutgrowAMachineWordAreALocatedErrorNeverAWrappedPower() {
        // s^(3 * 10^9) does not fit the exponent's int: before, it printed s^-1294967296 and a check
        // built on it passed. Now it is an error at the product.
        ContourException e = error("vars s\nlet a = ((s^1000)^1000)^1000\nshow a*a*a");
        assertTrue(e.getMessage().startsWith("exponent overflow"), e.getMessage());
        assertEquals(new Span("test.ctr", 3, 6, 5), e.span());
        // Collected variables carry exponents in monomials: the same limit, the same kind of error.
        ContourException c = error("vars x collected\nlet a = ((x^1000)^1000)^1000\nshow a*a*a");
        assertTrue(c.getMessage().contains("overflow"), c.getMessage());
        assertEquals(3, c.span().line());
    }

    @Test
    void aSingleDenominatorFactorIsParenthesisedOnce() {
        // (a value printed as its own label is shown once)
        assertEquals("3/(3*s - 1)\n", Scripts.output("vars s\nshow 3/(3*s - 1)"));
        assertEquals("1/(3*s - 1)^2\n", Scripts.output("vars s\nshow 1/(3*s - 1)^2"));
        // two factors, or a scalar and a factor, still need the parentheses
        assertEquals("x = 1/(2*s*(s - 1))\n", Scripts.output("vars s\nlet x = 1/(2*s*(s - 1))\nshow x"));
    }

    @Test
    void familyMembersWithSubscriptedNamesGiveCompilableLatex() {
        String out = Scripts.output("unknown c_x[i, j] with i + j = 1\nshow c_x[1, 0] as latex");
        assertTrue(out.contains("{c_{x}}_{1,0}"), out);
        assertFalse(out.contains("}_{x}_{"), out);
    }

    @Test
    void collectingByAnUndeclaredNameIsAnErrorWithASuggestion() {
        ContourException e = error("vars s\nvars sigma collected\nshow (sigma + 1)^2 collected sigm");
        assertEquals("'sigm' is not a declared variable, so nothing can be collected by it; did you mean 'sigma'?", e.getMessage());
        assertEquals(3, e.span().line());
        // a different case is the nearest name of all
        assertEquals("unknown name 'X'; did you mean 'x'?", error("vars s, x\nshow X").getMessage());
    }

    @Test
    void highPowersOfOneVariableCancelWithoutDenseWork() {
        // Cancelling s^(10^9) is reading off an exponent, not 10^9 divisions or a dense coefficient array.
        assertEquals("b/(b*b) = 1/s^1000000000\n",
                Scripts.output("vars s\nlet b = ((s^1000)^1000)^1000\nshow b/(b*b)"));
    }

    @Test
    void limitsStopRunawayScripts() {
        PrintStream quiet = new PrintStream(new ByteArrayOutputStream());
        EvaluationLimits tight = new EvaluationLimits(10, 100, 50, 20, Duration.ofSeconds(5));
        Interpreter i = new Interpreter(InterpreterOptions.to(quiet).withLimits(tight));
        assertTrue(assertThrows(ContourException.class, () -> i.run("vars s\nshow s^11", "t")).getMessage().contains("limit"));
        assertTrue(assertThrows(ContourException.class, () -> i.run("show sum k in 0..1000 : k", "t")).getMessage().contains("limit"));
        assertTrue(assertThrows(ContourException.class, () -> i.run("show sum j, k with j + k = 100 : 1", "t")).getMessage().contains("100"));
        assertTrue(assertThrows(ContourException.class, () -> i.run("for q in 1..60 { show q }", "t")).getMessage().contains("loop"));
    }

    @Test
    void useLoadsLibrariesRelativeToTheScriptThenFromTheRulesFolder(@TempDir Path dir) throws IOException {
        Path rules = Files.createDirectories(dir.resolve("rules"));
        Files.writeString(rules.resolve("lib.ctr"), "def twice(x) = 2*x\n");
        Path scripts = Files.createDirectories(dir.resolve("work"));
        Files.writeString(scripts.resolve("local.ctr"), "def thrice(x) = 3*x\n");
        Path main = scripts.resolve("main.ctr");
        String text = "use \"lib.ctr\"\nuse \"local.ctr\"\nuse \"local.ctr\"\nshow twice(thrice(1))\n";
        Files.writeString(main, text);
        ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        Interpreter i = new Interpreter(new InterpreterOptions(new PrintStream(buffer), OutputFormat.PLAIN, false, rules, false));
        i.run(text, main.toString());
        assertEquals("twice(thrice(1)) = 6\n", buffer.toString());
        ContourException missing = assertThrows(ContourException.class, () -> i.run("use \"nowhere.ctr\"", main.toString()));
        assertTrue(missing.getMessage().startsWith("cannot find 'nowhere.ctr'"));
    }

    @Test
    void solveAndRulesNeedTheirEnginesAndSaySo() {
        // The solver is on the class path now: it receives the condition and rejects a bare expression.
        assertTrue(error("unknown a[i] with i <= 1\nlet sol = solve a[0] - 1 for a").getMessage().contains("a condition is 'A == B'"));
        // The rewriting engine is on the class path now: it receives the rule and rejects this one.
        assertTrue(error("rule r : 1 becomes 2").getMessage().contains("left side has no function call"));
    }

    @Test
    void registeredSolversAndBuiltinsAreReachable() {
        BuiltinRegistry registry = BuiltinRegistry.standard();
        registry.register(Builtin.of("double", 1, "twice its argument",
                (args, span) -> new ExprValue(args.expression(0).multiply(Expression.constant(2)))));
        // a toy solver: every member of the family becomes the value of the first condition's left side
        registry.setSolver((conditions, unknowns, span) -> new BindingValue() {
            @Override public Value applyTo(Value target, Span where) {
                Expression e = ((ExprValue) target).value();
                java.util.Map<String, Expression> values = new java.util.HashMap<>();
                unknowns.get(0).memberNames().forEach(m -> values.put(m, ((ExprValue) conditions.get(0).left()).value()));
                return new ExprValue(e.substitute(values));
            }
            @Override public BindingValue normalized(Expression member, Value value, Span where) { return this; }
            @Override public String kind() { return "solution"; }
        });
        ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        Interpreter i = new Interpreter(InterpreterOptions.to(new PrintStream(buffer)), registry);
        i.run("unknown a[k] with k <= 2\nlet sol = solve 7 for a\nshow double(a[0] + a[2]) with sol", "t.ctr");
        assertEquals("double(a[0] + a[2]) with sol = 28\n", buffer.toString());
        assertTrue(i.namesInScope().containsAll(Set.of("a", "sol", "double", "Gamma")));
    }

    @Test
    void definitionsReplayAsAScript() {
        Scripts s = new Scripts();
        s.run("""
                vars s, t
                vars x collected
                let p = 2
                let p = 3
                def f(y) = y^p
                unknown a[i] with i <= p
                let v = (s + x)^2/(t - 1) + a[1]
                let g = Gamma(s/3)
                """);
        String script = s.interpreter.definitionsAsScript();
        assertFalse(script.contains("let p = 2"), script);
        Scripts replay = new Scripts();
        replay.run(script);
        for (String name : List.of("p", "v", "g", "a")) {
            assertEquals(s.run("show " + name), replay.run("show " + name), name);
        }
        assertEquals(s.run("show f(s)"), replay.run("show f(s)"));
    }
}
