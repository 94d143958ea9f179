package dev.contour.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.contour.ContourException;
import dev.contour.lang.Expr;
import dev.contour.lang.ScriptParser;
import dev.contour.lang.Stmt;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The statements and the pattern-variable syntax the rewriting engine adds to the language. */
class RuleSyntaxTest {
    private static Stmt one(String text) {
        List<Stmt> s = ScriptParser.parseStatement(text, "t.ctr");
        assertEquals(1, s.size());
        return s.get(0);
    }

    @Test
    void patternVariablesParseAsTheirOwnNode() {
        Stmt.Rule r = assertInstanceOf(Stmt.Rule.class,
                one("rule gamma-up : Gamma(@x + @n) becomes poch(@x, @n)*Gamma(@x) when positive_integer(@n)"));
        assertEquals("gamma-up", r.name());
        Expr.Call call = assertInstanceOf(Expr.Call.class, r.left());
        Expr.Binary sum = assertInstanceOf(Expr.Binary.class, call.arguments().get(0).value());
        Expr.PatternVariable x = assertInstanceOf(Expr.PatternVariable.class, sum.left());
        assertEquals("x", x.name());
        assertEquals(new dev.contour.Span("t.ctr", 1, 23, 2), x.span());
        assertEquals(1, r.guards().size());
    }

    @Test
    void deriveTakesLibrariesAndLimits() {
        Stmt.Derive d = assertInstanceOf(Stmt.Derive.class,
                one("derive Gamma(s + 2)/Gamma(s) using \"gamma.ctr\", \"pochhammer.ctr\" within 40 steps, 900 nodes"));
        assertEquals("Gamma(s + 2)/Gamma(s)", d.label());
        assertEquals(List.of("gamma.ctr", "pochhammer.ctr"), d.ruleFiles());
        assertEquals(List.of(40L, 900L), d.limits().stream().map(Stmt.RewriteLimit::amount).toList());
        assertEquals(List.of("steps", "nodes"), d.limits().stream().map(Stmt.RewriteLimit::unit).toList());
        Stmt.Derive bare = assertInstanceOf(Stmt.Derive.class, one("derive poch(s, 3)"));
        assertEquals(List.of(), bare.ruleFiles());
    }

    @Test
    void checkByRulesIsItsOwnStatement() {
        Stmt.CheckByRules c = assertInstanceOf(Stmt.CheckByRules.class, one("check Gamma(s + 1) == s*Gamma(s) by rules"));
        assertEquals("Gamma(s + 1) == s*Gamma(s)", c.label());
        assertInstanceOf(Stmt.Check.class, one("check Gamma(s + 1) == s*Gamma(s)"));
    }

    @Test
    void limitsAreWholeNumbers() {
        ContourException e = assertThrows(ContourException.class, () -> one("derive poch(s, 3) within 2.5 steps"));
        assertEquals(1, e.span().line());
        assertEquals(26, e.span().column());
    }

    @Test
    void ruleNamesMayUseKeywordsAsWords() {
        Stmt.Rule r = assertInstanceOf(Stmt.Rule.class, one("rule shift-by-one-step : Gamma(@x + 1) becomes @x*Gamma(@x)"));
        assertEquals("shift-by-one-step", r.name());
    }
}
