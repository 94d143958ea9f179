package dev.contour.rewrite;

import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.eval.ExprValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.RuleContext;
import dev.contour.eval.Value;
import dev.contour.lang.Expr;
import dev.contour.lang.ScriptParser;
import dev.contour.term.Term;
import java.nio.file.Path;
import java.util.Set;

/** Test helpers: terms written in the language (every plain name is an inner variable), the bundled rules. */
final class TestTerms {
    static final Path RULES = Path.of("rules");
    static final RuleSet BUNDLED = RuleLibrary.bundled(RULES);

    private TestTerms() { }

    private static final RuleContext VARIABLES = new RuleContext() {
        @Override
        public Value evaluate(Expr e) {
            if (e instanceof Expr.Name n) {
                return new ExprValue(Expression.variable(n.name()));
            }
            if (e instanceof Expr.Number n) {
                return new ExprValue(Expression.constant(dev.contour.algebra.Rational.of(n.numerator(), n.denominator())));
            }
            if (e instanceof Expr.Negate n) {
                return new ExprValue(((ExprValue) evaluate(n.operand())).value().negate());
            }
            throw new IllegalArgumentException("test terms use names, numbers and calls only: " + e);
        }

        @Override
        public Path resolve(String file, Span span) {
            return RULES.resolve(file);
        }

        @Override
        public OutputFormat format() {
            return OutputFormat.PLAIN;
        }
    };

    /** The inert term written in {@code text}, calls of any name kept as calls. */
    static Term term(String text) {
        return InertTerms.of(ScriptParser.parseExpression(text, "test"), VARIABLES, Set.of("wrap", "f", "g"));
    }

    /** The canonical form of {@code text} without any rule. */
    static Term canonical(String text) {
        return dev.contour.term.Terms.expand(term(text));
    }

    static RuleSet rules(String text) {
        return RuleLibrary.parse(text, "test.ctr");
    }
}
