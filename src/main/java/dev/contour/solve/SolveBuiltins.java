package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.eval.Arguments;
import dev.contour.eval.Builtin;
import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.ExprValue;
import dev.contour.eval.ListValue;
import dev.contour.eval.RangeValue;
import dev.contour.eval.Solver;
import dev.contour.eval.UnknownFamilyValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The solver and the condition built-ins of the language: residues_polynomial, poles_only_at,
 * polynomial_in, growth_at_most, vanishes, and free_unknowns for solutions.
 */
public final class SolveBuiltins implements BuiltinProvider {

    @Override
    public void register(BuiltinRegistry r) {
        r.register(new Builtin("residues_polynomial", 1, 1, Set.of("total"), true,
                "residues_polynomial(M, s in S, t in S, u in S, total: 4*p): at the listed poles the residues of M"
                        + " are polynomial and the poles simple (u = total - s - t when u is not a variable of M)",
                (a, span) -> poleCondition(a, span, true)));
        r.register(new Builtin("poles_only_at", 1, 1, Set.of("total"), true,
                "poles_only_at(M, s in S, ..., total: 4*p): poles of M on lines s = c occur only for c in S",
                (a, span) -> poleCondition(a, span, false)));
        r.register(new Builtin("polynomial_in", 2, Integer.MAX_VALUE, Set.of(), false,
                "polynomial_in(E, s, t): E is a polynomial in s and t", SolveBuiltins::polynomialIn));
        r.register(new Builtin("growth_at_most", 3, Integer.MAX_VALUE, Set.of(), false,
                "growth_at_most(E, d, s, t): E(b s, b t) grows at most like b^d as b grows", SolveBuiltins::growth));
        r.register(Builtin.of("vanishes", 1, "vanishes(E): E is identically zero",
                (a, span) -> new ConditionValue(List.of(new ConditionValue.Part(a.expressionValue(0), new Constraint.Vanishes())),
                        "vanishes")));
        r.register(Builtin.of("free_unknowns", 1, "free_unknowns(sol): the unknowns a family of solutions leaves free",
                SolveBuiltins::freeUnknowns));
        r.register(Builtin.of("function_basis", 2,
                "function_basis(E, sol): linearly independent functions that E with sol moves through as its free unknowns vary",
                (a, span) -> new ListValue(relations(a).basisFunctions().stream().map(f -> (Value) new ExprValue(f)).toList())));
        r.register(Builtin.of("function_count", 2,
                "function_count(E, sol): how many independent functions the free unknowns of sol move E through",
                (a, span) -> Values.of(relations(a).dimension())));
        r.register(Builtin.of("family", 2,
                "family(E, sol): how many functions E with sol describes, and how many free unknowns only re-express them",
                (a, span) -> new FamilyValue(relations(a))));
        r.register(Builtin.of("system_size", 1,
                "system_size(sol): {unknowns, equations} of the linear system the solve built",
                SolveBuiltins::systemSize));
        r.setSolver(SolveBuiltins::solve);
    }

    /** solve c1, c2 for a, b: every condition becomes constraints at its own place in the script. */
    static Value solve(List<Solver.Condition> conditions, List<UnknownFamilyValue> families, Span span) {
        List<String> unknowns = new ArrayList<>();
        families.forEach(f -> unknowns.addAll(f.memberNames()));
        if (new LinkedHashSet<>(unknowns).size() != unknowns.size()) {
            throw new ContourException("an unknown family is listed twice", span);
        }
        LinearConstraintBuilder builder = new LinearConstraintBuilder(unknowns);
        for (Solver.Condition c : conditions) {
            String label = "condition at line " + c.span().line();
            try {
                if (c.right() != null) {
                    Expression diff = expression(c.left(), c.span()).subtract(expression(c.right(), c.span()));
                    builder.add(Constraint.on(diff, unknowns, new Constraint.Vanishes(), c.span(), label));
                } else if (c.left() instanceof ConditionValue cv) {
                    for (ConditionValue.Part part : cv.parts()) {
                        builder.add(Constraint.on(part.target(), unknowns, part.condition(), c.span(), cv.description()));
                    }
                } else {
                    throw new ContourException("a condition is 'A == B' or a condition such as residues_polynomial(M, ...),"
                            + " not a " + c.left().kind(), c.span());
                }
            } catch (ContourException e) {
                throw e.at(c.span());
            }
        }
        try (SolveProgress progress = SolveProgress.to(System.err)) {
            long t0 = System.nanoTime();
            SparseSystem system = builder.build(progress);
            long t1 = System.nanoTime();
            Solution solution = system.solve(progress);
            long t2 = System.nanoTime();
            return new SolutionValue(solution, new SolutionValue.Figures(unknowns.size(), system.equations(),
                    (t1 - t0) / 1e9, (t2 - t1) / 1e9));
        }
    }

    private static Value poleCondition(Arguments a, Span span, boolean residues) {
        ExprValue target = a.expressionValue(0);
        Set<String> inner = target.innerVariables();
        List<Arguments.Argument> domains = a.domains();
        if (domains.isEmpty()) {
            throw new ContourException(a.function() + " needs pole lists such as s in 2..6 step 2", span);
        }
        Polynomial others = Polynomial.ZERO;
        for (Arguments.Argument d : domains) {
            if (inner.contains(d.name())) {
                others = others.add(Polynomial.variable(d.name()));
            }
        }
        if (a.named("total").isPresent() && domains.size() >= 3 && domains.stream().allMatch(d -> inner.contains(d.name()))) {
            // s + t + u = total makes u a function of s and t: residues taken with u held fixed would be wrong.
            Arguments.Argument last = domains.get(domains.size() - 1);
            throw new ContourException(a.function() + ": the expression mentions " + String.join(", ", domains.stream()
                    .map(Arguments.Argument::name).toList()) + " although total: says their sum is fixed; write it without '"
                    + last.name() + "' first (at (" + last.name() + " = ...)), or leave total: out if they are independent",
                    a.named("total").get().span());
        }
        List<Constraint.Poles> poles = new ArrayList<>();
        for (Arguments.Argument d : domains) {
            Polynomial form;
            if (inner.contains(d.name())) {
                form = Polynomial.variable(d.name());
            } else if (a.named("total").isPresent()) {
                Arguments.Argument tot = a.named("total").get();
                form = Polynomial.constant(Values.rational(tot.value(), tot.span(), "total")).subtract(others);
            } else {
                throw new ContourException(d.name() + " is not a variable of the expression; give total: (the sum of the"
                        + " pole variables) to define it", d.span());
            }
            poles.add(new Constraint.Poles(d.name(), form, levels(d)));
        }
        List<ConditionValue.Part> parts = new ArrayList<>();
        if (residues) {
            parts.add(new ConditionValue.Part(target, new Constraint.ResiduesPolynomial(poles, true)));
        } else {
            poles.forEach(p -> parts.add(new ConditionValue.Part(target, new Constraint.PolesOnlyAt(p))));
        }
        String names = String.join(", ", domains.stream().map(Arguments.Argument::name).toList());
        return new ConditionValue(parts, (residues ? "residues polynomial at the poles in " : "poles only at the listed ")
                + names);
    }

    private static Set<Rational> levels(Arguments.Argument d) {
        Set<Rational> out = new LinkedHashSet<>();
        if (d.value() instanceof RangeValue r) {
            if (r.size() > 1_000_000) {
                throw new ContourException("the pole list for " + d.name() + " is too long", d.span());
            }
            r.members().forEach(m -> out.add(Rational.of(m)));
        } else if (d.value() instanceof ListValue l) {
            l.items().forEach(v -> out.add(Values.rational(v, d.span(), "a pole of " + d.name())));
        } else {
            out.add(Values.rational(d.value(), d.span(), "a pole of " + d.name()));
        }
        return out;
    }

    private static Value polynomialIn(Arguments a, Span span) {
        return new ConditionValue(List.of(new ConditionValue.Part(a.expressionValue(0),
                new Constraint.PolynomialIn(variableNames(a, 1)))), "polynomial in " + String.join(", ", variableNames(a, 1)));
    }

    private static Value growth(Arguments a, Span span) {
        int d = a.integer(1);
        List<String> vars = variableNames(a, 2);
        return new ConditionValue(List.of(new ConditionValue.Part(a.expressionValue(0), new Constraint.GrowthAtMost(vars, d))),
                "growth at most degree " + d + " in " + String.join(", ", vars));
    }

    private static List<String> variableNames(Arguments a, int from) {
        List<String> out = new ArrayList<>();
        for (int i = from; i < a.positional().size(); i++) {
            Expression v = a.expression(i);
            if (!v.isRational() || v.innerVariables().size() != 1
                    || !v.asRationalFunction().equals(RationalFunction.variable(v.innerVariables().first()))) {
                throw new ContourException(a.function() + ": argument " + (i + 1) + " must be a variable", a.spanOf(i));
            }
            out.add(v.innerVariables().first());
        }
        return out;
    }

    private static Value freeUnknowns(Arguments a, Span span) {
        if (!(a.get(0) instanceof SolutionValue sv)) {
            throw new ContourException("free_unknowns takes a solution, not a " + a.get(0).kind(), a.spanOf(0));
        }
        List<String> free = sv.solution() instanceof Solution.Family f ? f.free() : List.of();
        return new ListValue(free.stream().map(n -> (Value) new ExprValue(Expression.collectedVariable(n))).toList());
    }

    private static Value systemSize(Arguments a, Span span) {
        if (!(a.get(0) instanceof SolutionValue sv) || sv.figures() == null) {
            throw new ContourException("system_size takes the result of a solve", a.spanOf(0));
        }
        return new ListValue(List.of(Values.of(sv.figures().unknowns()), Values.of(sv.figures().equations())));
    }

    /** The directions of E with sol along sol's free unknowns, separated exactly. */
    private static FunctionRelations.Result relations(Arguments a) {
        if (!(a.get(1) instanceof SolutionValue sv)) {
            throw new ContourException(a.function() + " takes a solution second, not " + Values.describe(a.get(1)), a.spanOf(1));
        }
        if (sv.solution() instanceof Solution.Inconsistent) {
            throw new ContourException("the solution is empty: the conditions conflict", a.spanOf(1));
        }
        List<String> free = sv.solution() instanceof Solution.Family f ? f.free() : List.of();
        try {
            return FunctionRelations.of(sv.solution().substituteInto(a.expression(0)), free);
        } catch (ContourException x) {
            throw x.at(a.spanOf(0));
        }
    }

    private static Expression expression(Value v, Span span) {
        if (v instanceof ExprValue e) {
            return e.value();
        }
        throw new ContourException("both sides of a condition must be expressions, not a " + v.kind(), span);
    }
}
