package dev.contour.rewrite;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.eval.Arithmetic;
import dev.contour.eval.ExprValue;
import dev.contour.eval.RuleContext;
import dev.contour.eval.TermValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.lang.Expr;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

/**
 * Builds the term a {@code derive} or {@code check ... by rules} statement starts from, exactly as
 * written: the interpreter would already reduce Gamma ratios, so calls of the term functions (and
 * of any function the rules mention) and the operators around them are kept inert here, and only
 * names and other expressions are evaluated in the statement's scope.
 */
final class InertTerms {
    private static final Set<String> TERM_FUNCTIONS = Set.of(Terms.GAMMA, Terms.POCH, Terms.FACTORIAL, Terms.BINOM);

    private final RuleContext context;
    private final Set<String> ruleFunctions;

    private InertTerms(RuleContext context, Set<String> ruleFunctions) {
        this.context = context;
        this.ruleFunctions = ruleFunctions;
    }

    static Term of(Expr e, RuleContext context, Set<String> ruleFunctions) {
        return new InertTerms(context, ruleFunctions).term(e);
    }

    private Term term(Expr e) {
        if (e instanceof Expr.Number n) {
            return Terms.of(Expression.constant(Rational.of(n.numerator(), n.denominator())));
        }
        if (e instanceof Expr.Negate n) {
            return new Term.Product(List.of(Terms.of(Expression.constant(-1)), term(n.operand())));
        }
        if (e instanceof Expr.Factorial f) {
            return new Term.Apply(Terms.FACTORIAL, List.of(term(f.operand())));
        }
        if (e instanceof Expr.Binary b) {
            Term left = term(b.left());
            return switch (b.operator()) {
                case ADD -> new Term.Sum(List.of(left, term(b.right())));
                case SUBTRACT -> new Term.Sum(List.of(left,
                        new Term.Product(List.of(Terms.of(Expression.constant(-1)), term(b.right())))));
                case MULTIPLY -> new Term.Product(List.of(left, term(b.right())));
                case DIVIDE -> new Term.Product(List.of(left, new Term.Power(term(b.right()), -1)));
                case POWER -> new Term.Power(left, Values.integer(context.evaluate(b.right()), b.right().span(), "the exponent"));
            };
        }
        if (e instanceof Expr.Call c && c.callee() instanceof Expr.Name name
                && (TERM_FUNCTIONS.contains(name.name()) || ruleFunctions.contains(name.name()))) {
            List<Term> args = new ArrayList<>();
            for (Expr.Argument a : c.arguments()) {
                if (a.kind() != Expr.ArgumentKind.POSITIONAL) {
                    throw new ContourException(name.name() + " takes positional arguments only", a.span());
                }
                args.add(term(a.value()));
            }
            return new Term.Apply(name.name(), args);
        }
        Value v = context.evaluate(e);
        if (v instanceof ExprValue || v instanceof TermValue) {
            return Arithmetic.term(v);
        }
        throw new ContourException("rules rewrite symbolic expressions, not a " + v.kind(), e.span());
    }
}
