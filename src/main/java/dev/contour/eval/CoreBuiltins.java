package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.print.CollectedView;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** The built-ins every interpreter has: Gamma, poch, factorial, binom and coefficient extraction. */
final class CoreBuiltins {
    private CoreBuiltins() { }

    static void register(BuiltinRegistry r) {
        r.register(Builtin.of(Terms.GAMMA, 1, "Gamma(x): exact at integers; ratios with integer shifts reduce to Pochhammer products",
                (a, span) -> symbolic(Terms.GAMMA, List.of(a.get(0)), span)));
        r.register(Builtin.of(Terms.POCH, 2, "poch(x, n) = x*(x + 1)*...*(x + n - 1), the Pochhammer symbol; exact for integer n",
                (a, span) -> symbolic(Terms.POCH, List.of(a.get(0), a.get(1)), span)));
        r.register(Builtin.of(Terms.FACTORIAL, 1, "factorial(n) = n!, exact at non-negative integers",
                (a, span) -> symbolic(Terms.FACTORIAL, List.of(a.get(0)), span)));
        r.register(Builtin.of(Terms.BINOM, 2, "binom(n, k), the binomial coefficient; exact for integer k",
                (a, span) -> symbolic(Terms.BINOM, List.of(a.get(0), a.get(1)), span)));
        r.register(new Builtin("coefficient", 2, 2, java.util.Set.of("of"), false,
                "coefficient(e, m): the part of e multiplying exactly the power product m of its variables; "
                        + "coefficient(e, m, of: {x, y}): exactly m in x and y (absent ones to the power 0), the rest kept",
                CoreBuiltins::coefficient));
    }

    /** {@code function(args)} as a normalised term, an expression whenever it is rational. */
    static Value symbolic(String function, List<Value> args, Span span) {
        Value exact = exactInteger(function, args);
        if (exact != null) {
            return exact;
        }
        List<Term> terms = new ArrayList<>();
        for (Value v : args) {
            if (!Arithmetic.isSymbolic(v)) {
                throw new ContourException(function + " needs expressions, not " + Values.describe(v), span);
            }
            terms.add(Arithmetic.term(v));
        }
        try {
            return Arithmetic.fromTerm(new Term.Apply(function, terms));
        } catch (ContourException e) {
            throw e.at(span);
        }
    }

    /**
     * n! and binom(n, k) at small non-negative integers straight from the shared table of factorials,
     * without building and normalising a term (a closed form summed over tens of thousands of index
     * tuples calls them once per tuple); null for every other case, which takes the general path.
     */
    private static Value exactInteger(String function, List<Value> args) {
        if (!function.equals(Terms.FACTORIAL) && !function.equals(Terms.BINOM)) {
            return null;
        }
        int[] n = new int[args.size()];
        for (int i = 0; i < n.length; i++) {
            if (!(args.get(i) instanceof ExprValue e) || !e.value().isConstant()) {
                return null;
            }
            Rational r = e.value().constantValue();
            if (!r.isInteger() || r.signum() < 0 || r.numerator().bitLength() > 20 || r.intValueExact() > Terms.MAX_EXACT_LENGTH) {
                return null;
            }
            n[i] = r.intValueExact();
        }
        if (function.equals(Terms.FACTORIAL)) {
            return new ExprValue(Expression.constant(Rational.of(Terms.factorial(n[0]))));
        }
        if (n[1] > n[0]) {
            return null;
        }
        return new ExprValue(Expression.constant(Rational.of(Terms.binomial(n[0], n[1]))));
    }

    private static Value coefficient(Arguments a, Span span) {
        Expression e = a.expression(0);
        Expression m = a.expression(1);
        Map<Monomial, RationalFunction> terms = m.terms();
        if (terms.size() != 1 || !terms.values().iterator().next().isOne()) {
            throw new ContourException("coefficient: the second argument must be a monomial in collected variables, such as sigma^2*tau",
                    a.spanOf(1));
        }
        Map<String, Integer> wanted = terms.keySet().iterator().next().exponents();
        List<String> vars = new ArrayList<>(wanted.keySet());
        List<Integer> exps = vars.stream().map(wanted::get).toList();
        var of = a.named("of");
        if (of.isPresent()) {
            if (!(of.get().value() instanceof ListValue names)) {
                throw new ContourException("coefficient: of: lists the variables, such as {sigma, tau}", of.get().span());
            }
            List<String> chosen = new ArrayList<>();
            for (Value v : names.items()) {
                Expression x = v instanceof ExprValue ev ? ev.value() : null;
                if (x == null || x.collectedVariables().size() != 1 || !x.innerVariables().isEmpty()
                        || !x.equals(Expression.collectedVariable(x.collectedVariables().first()))) {
                    throw new ContourException("coefficient: of: lists collected variables, such as {sigma, tau}", of.get().span());
                }
                chosen.add(x.collectedVariables().first());
            }
            for (String v : vars) {
                if (!chosen.contains(v)) {
                    throw new ContourException("coefficient: the power product mentions '" + v + "', which is not in of:", a.spanOf(1));
                }
            }
            final List<String> given = vars;
            final List<Integer> givenExps = exps;
            exps = chosen.stream().map(v -> given.contains(v) ? givenExps.get(given.indexOf(v)) : 0).toList();
            vars = chosen;
        } else if (vars.isEmpty()) {
            // coefficient(e, 1): the part of e free of every collected variable (the empty power product)
            vars = new ArrayList<>(e.collectedVariables());
            exps = vars.stream().map(v -> 0).toList();
        }
        try {
            for (CollectedView.Row row : CollectedView.of(e, vars)) {
                if (row.exponents().equals(exps)) {
                    return new ExprValue(row.coefficient());
                }
            }
        } catch (ContourException x) {
            throw x.at(a.spanOf(0));
        }
        return new ExprValue(Expression.ZERO);
    }
}
