package dev.contour.lang;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.List;
import org.junit.jupiter.api.Test;

class ScriptParserTest {
    private static Expr expr(String text) {
        return ScriptParser.parseExpression(text, "t.ctr");
    }

    private static ContourException syntaxError(String script) {
        return assertThrows(ContourException.class, () -> ScriptParser.parseScript(script, "t.ctr"));
    }

    @Test
    void spansDoNotTakePartInEquality() {
        assertEquals(expr("a + b*c"), expr("  a +\n b * c"));
        assertEquals(expr("a + b*c").hashCode(), expr("a+b*c").hashCode());
        assertNotEquals(expr("a + b*c"), expr("(a + b)*c"));
    }

    @Test
    void precedenceReadsLikeMathematics() {
        // unary minus binds looser than ^, so -x^2 is -(x^2); x^-2*y is (x^-2)*y
        Expr minusSquare = expr("-x^2");
        Expr.Negate n = assertInstanceOf(Expr.Negate.class, minusSquare);
        assertInstanceOf(Expr.Binary.class, n.operand());
        Expr.Binary product = assertInstanceOf(Expr.Binary.class, expr("x^-2*y"));
        assertEquals(Expr.Operator.MULTIPLY, product.operator());
        // ^ is right associative
        assertEquals(expr("a^(b^c)"), expr("a^b^c"));
        // - and / are left associative
        assertEquals(expr("(a - b) - c"), expr("a - b - c"));
        assertEquals(expr("(a / b) / c"), expr("a / b / c"));
        // postfix factorial binds tightest
        assertEquals(expr("(n!)^2"), expr("n!^2"));
    }

    @Test
    void decimalsAreExactRationals() {
        Expr.Number n = assertInstanceOf(Expr.Number.class, expr("0.25"));
        assertEquals(1, n.numerator().intValue());
        assertEquals(4, n.denominator().intValue());
    }

    @Test
    void sumBodiesReachAsFarRightAsPossible() {
        Expr.Sum s = assertInstanceOf(Expr.Sum.class, expr("sum i, j with i + j = 4, i >= 1 : i + j"));
        assertEquals(List.of("i", "j"), s.indices().names());
        assertEquals(2, s.indices().constraints().size());
        assertEquals(IndexSet.Relation.AT_LEAST, s.indices().constraints().get(1).relation());
        assertInstanceOf(Expr.Binary.class, s.body());
    }

    @Test
    void substitutionsAndSolutionsAreLoosestPostfixForms() {
        Expr.At at = assertInstanceOf(Expr.At.class, expr("a + b at (s = t, t = s)"));
        assertEquals(2, at.assignments().size());
        assertInstanceOf(Expr.Binary.class, at.target());
        Expr.With w = assertInstanceOf(Expr.With.class, expr("M with sol normalized a[0, 1] = 1"));
        assertEquals("a", w.normalizedTarget().name());
        assertEquals(2, w.normalizedTarget().indices().size());
    }

    @Test
    void callsTakePositionalNamedAndDomainArguments() {
        Expr.Call c = assertInstanceOf(Expr.Call.class, expr("f(M, poles: 3, s in 2..8 step 2)"));
        assertEquals(List.of(Expr.ArgumentKind.POSITIONAL, Expr.ArgumentKind.NAMED, Expr.ArgumentKind.DOMAIN),
                c.arguments().stream().map(Expr.Argument::kind).toList());
        Expr.Range r = assertInstanceOf(Expr.Range.class, c.arguments().get(2).value());
        assertInstanceOf(Expr.Number.class, r.step());
        // a call of a call: ward(p)(M)
        Expr.Call outer = assertInstanceOf(Expr.Call.class, expr("ward(p)(M)"));
        assertInstanceOf(Expr.Call.class, outer.callee());
    }

    @Test
    void everyStatementParses() {
        List<Stmt> s = ScriptParser.parseScript("""
                # comment
                vars s, t
                vars sigma, tau collected
                let p = 3; let q = 4
                def f(x, y) = x*y
                unknown a[i, j] with i + j = p
                use "lib.ctr"
                show f(s, t) collected sigma factored as latex
                check s == s
                for q in 2..8 { show q }
                rule swap-st : f(s, t) becomes f(t, s) when is_even(p)
                """, "t.ctr");
        assertEquals(List.of(Stmt.Vars.class, Stmt.Vars.class, Stmt.Let.class, Stmt.Let.class, Stmt.Def.class,
                        Stmt.Unknown.class, Stmt.Use.class, Stmt.Show.class, Stmt.Check.class, Stmt.For.class, Stmt.Rule.class),
                s.stream().map(Object::getClass).toList());
        Stmt.Show show = (Stmt.Show) s.get(7);
        assertEquals(3, show.options().size());
        assertEquals("f(s, t)", show.label());
        assertEquals("swap-st", ((Stmt.Rule) s.get(10)).name());
        assertEquals(4, s.get(3).span().line());
        assertEquals(12, s.get(3).span().column());
    }

    @Test
    void unclosedBracketNamesWhereItOpened() {
        ContourException e = syntaxError("vars s\nlet x = (1 +\n  2\nshow x\n");
        assertEquals("expected ')' to close '(' opened at 2:9, found 'show'", e.getMessage());
        assertEquals(4, e.span().line());
        assertEquals(1, e.span().column());
        assertEquals("expected ']' to close '[' opened at 1:7, found end of input",
                syntaxError("show a[1, 2").getMessage());
        assertEquals("expected '}' to close '{' opened at 1:15, found end of input",
                syntaxError("for q in 1..3 { show q").getMessage());
    }

    @Test
    void withinMayNameAnArgumentButNotAValue() {
        // position_value(..., within: 30): the derivation keyword doubles as the name of a time limit.
        Expr.Call call = assertInstanceOf(Expr.Call.class, expr("f(x, within: 30)"));
        assertEquals(Expr.ArgumentKind.NAMED, call.arguments().get(1).kind());
        assertEquals("within", call.arguments().get(1).name());
        assertEquals("'within' is a keyword and cannot be used as a name", syntaxError("let within = 3").getMessage());
    }

    @Test
    void otherSyntaxErrorsSayWhatWasExpected() {
        assertEquals("expected an expression, found end of input", syntaxError("show 1 +").getMessage());
        assertEquals("expected a statement, found 'x'; to name a value write 'let x = ...'", syntaxError("x = 3").getMessage());
        assertTrue(syntaxError("vars s\ns + 1").getMessage().startsWith("expected a statement (vars, let"));
        assertTrue(syntaxError("vars s\ns + 1").getMessage().contains(", rule, derive)"));
        assertEquals("'sum' is a keyword and cannot be used as a name", syntaxError("let sum = 3").getMessage());
        assertEquals("unexpected character '$'", syntaxError("show 3 $ 4").getMessage());
        ContourException unterminated = syntaxError("show \"abc");
        assertTrue(unterminated.getMessage().startsWith("unterminated string"));
        assertEquals(6, unterminated.span().column());
        assertEquals("unknown output format 'pdf': use plain, latex or json", syntaxError("show x as pdf").getMessage());
    }

    @Test
    void absurdNestingIsAnErrorNotACrash() throws InterruptedException {
        String deep = "show " + "(".repeat(200_000) + "1" + ")".repeat(200_000);
        // a small stack, as a thread of some embedding application might have
        Throwable[] thrown = new Throwable[1];
        Thread t = new Thread(null, () -> {
            try {
                ScriptParser.parseScript(deep, "t.ctr");
            } catch (Throwable e) {
                thrown[0] = e;
            }
        }, "small-stack", 256 * 1024);
        t.start();
        t.join();
        assertInstanceOf(ContourException.class, thrown[0]);
        assertTrue(thrown[0].getMessage().contains("nests too deeply"));
    }

    @Test
    void labelsFoldWhiteSpaceAndCommentsButKeepStrings() {
        Stmt.Show s = (Stmt.Show) ScriptParser.parseScript("show f(1,   # note\n   \"a  # b \\\" c\")", "t.ctr").get(0);
        assertEquals("f(1, \"a  # b \\\" c\")", s.label());
    }
}
