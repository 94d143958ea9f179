package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.eval.Arguments;
import dev.contour.eval.Builtin;
import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.ExprValue;
import dev.contour.eval.ListValue;
import dev.contour.eval.RangeValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The language's built-ins for shift operators, measures, the dictionary, crossing and the
 * analyses; found by the interpreter through {@link java.util.ServiceLoader}.
 */
public final class MellinBuiltins implements BuiltinProvider {
    @Override
    public void register(BuiltinRegistry r) {
        r.register(new Builtin("shift", 0, 2, Set.of(Builtin.ANY_VARIABLE), false,
                "shift(s: -2, t: 2) or shift({x, y}, {a, b}): the operator f(s, t) -> f(s - 2, t + 2)", MellinBuiltins::shift));
        r.register(new Builtin("mellin_measure", 0, 0, Set.of("gamma", "kernel", "eliminate", "total"), false,
                "mellin_measure(gamma: {x, {y, 2}}, kernel: {s/2, t/2 - p}, eliminate: u, total: 4*p): Gamma(x) Gamma(y)^2 with U^(s/2) V^(t/2-p)",
                MellinBuiltins::measure));
        r.register(new Builtin("mellin", 1, 1, Set.of("from", "to", "cross"), false,
                "mellin(X, from: m1, to: m2): X, a polynomial in U, V or a position operator with euler(U), euler(V), as a shift operator from measure m1 to m2",
                MellinBuiltins::mellin));
        r.register(new Builtin("euler", 1, 1, Set.of("cross"), false,
                "euler(U): the position operator U d/dU (euler(V): V d/dV); compose with '*' in written order, "
                        + "so euler(U)*U == U*euler(U) + U",
                MellinBuiltins::euler));
        r.register(new Builtin("position_operator", 1, 1, Set.of("euler", "cross"), false,
                "position_operator(P, euler: {DU, DV}): P, a polynomial in U, V and two stand-ins DU, DV, as the position "
                        + "operator with U^m V^n DU^j DV^k read as U^m V^n euler(U)^j euler(V)^k (the Euler operators act first)",
                MellinBuiltins::positionOperator));
        r.register(new Builtin("crossing", 2, 2, Set.of("factor"), false,
                "crossing({s, t, sigma, tau}, {t, s, sigma/tau, 1/tau}, factor: tau^2): M -> factor * M(replaced)",
                MellinBuiltins::crossing));
        r.register(new Builtin("poles", 2, 2, Set.of(), false,
                "poles(M, m): the poles of every coefficient of M along the forms of measure m, with orders",
                MellinBuiltins::poles));
        r.register(new Builtin("poles_outside", 2, 2, Set.of("order"), true,
                "poles_outside(M, m, s in 2..4 step 2, t in {2, 4}, u in {2}, order: 1): poles not in the allowed set",
                MellinBuiltins::polesOutside));
        r.register(Builtin.of("residue", 3,
                "residue(M, s, 2): the residue of every coefficient of M in s at s = 2 (the location may depend on t)",
                MellinBuiltins::residue));
        r.register(Builtin.of("residue_check", 2,
                "residue_check(M, m): the pole pairs whose residues are not polynomial (a report; 0 when none)",
                MellinBuiltins::residueCheck));
        r.register(Builtin.of("growth", 2, "growth(M, m): the degree of M(b s, b t) as b grows", MellinBuiltins::growth));
        r.register(Builtin.of("leading", 2, "leading(M, m): lim M(b s, b t) / b^growth, the flat-space term",
                MellinBuiltins::leading));
        r.register(new Builtin("partial_fractions", 2, 2, Set.of("by"), false,
                "partial_fractions(M, s, by: {sigma, tau}): each coefficient as a polynomial plus poles in s",
                MellinBuiltins::partialFractions));
    }

    private static Value shift(Arguments a, Span span) {
        Map<String, Rational> amounts = new LinkedHashMap<>();
        if (a.positional().size() == 2) {
            List<Value> vars = list(a.get(0), a.spanOf(0), "shift: the first argument");
            List<Value> by = list(a.get(1), a.spanOf(1), "shift: the second argument");
            if (vars.size() != by.size()) {
                throw new ContourException("shift: " + vars.size() + " variables but " + by.size() + " amounts", span);
            }
            for (int i = 0; i < vars.size(); i++) {
                String v = innerName(vars.get(i), a.spanOf(0));
                if (amounts.put(v, Values.rational(by.get(i), a.spanOf(1), "shift: the amount for " + v)) != null) {
                    throw new ContourException("shift: '" + v + "' is given twice", a.spanOf(0));
                }
            }
        } else if (a.positional().isEmpty()) {
            for (Arguments.Argument x : a.named()) {
                amounts.put(x.name(), Values.rational(x.value(), x.span(), "shift: the amount for " + x.name()));
            }
        } else {
            throw new ContourException("shift takes named amounts, shift(s: -2, t: 2), or two lists, shift({s, t}, {-2, 2})", span);
        }
        return new OperatorValue(ShiftOperator.shift(Shift.of(amounts)));
    }

    private static Value measure(Arguments a, Span span) {
        Arguments.Argument gamma = required(a, "gamma", span);
        Arguments.Argument kernel = required(a, "kernel", span);
        List<GammaPower> factors = new ArrayList<>();
        for (Value g : list(gamma.value(), gamma.span(), "mellin_measure: gamma")) {
            if (g instanceof ListValue pair) {
                if (pair.items().size() != 2) {
                    throw new ContourException("mellin_measure: a Gamma factor with a power is {argument, power}", gamma.span());
                }
                factors.add(new GammaPower(polynomial(pair.items().get(0), gamma.span(), "a Gamma argument"),
                        Values.integer(pair.items().get(1), gamma.span(), "the power of a Gamma factor")));
            } else {
                factors.add(new GammaPower(polynomial(g, gamma.span(), "a Gamma argument"), 1));
            }
        }
        List<Value> k = list(kernel.value(), kernel.span(), "mellin_measure: kernel");
        if (k.size() != 2) {
            throw new ContourException("mellin_measure: the kernel is {exponent of U, exponent of V}, such as {s/2, t/2 - p}", kernel.span());
        }
        Polynomial eu = polynomial(k.get(0), kernel.span(), "the exponent of U");
        Polynomial ev = polynomial(k.get(1), kernel.span(), "the exponent of V");
        Optional<Arguments.Argument> elim = a.named("eliminate");
        Optional<Arguments.Argument> sum = a.named("total");
        if (elim.isPresent() != sum.isPresent()) {
            throw new ContourException("mellin_measure: 'eliminate' and 'total' go together (s + t + u = total)", span);
        }
        Set<String> exclude = new LinkedHashSet<>();
        String u = null;
        Polynomial total = null;
        if (elim.isPresent()) {
            u = innerName(elim.get().value(), elim.get().span());
            total = polynomial(sum.get().value(), sum.get().span(), "the total");
            exclude.add(u);
        }
        String s = kernelVariable(eu, total, exclude, kernel.span(), "U");
        String t = kernelVariable(ev, total, exclude, kernel.span(), "V");
        Rational us = eu.coefficient(s, 1).constantValue();
        Rational vs = ev.coefficient(t, 1).constantValue();
        return new MeasureValue(new MellinMeasure(s, t, u, total, factors, us, eu.coefficient(s, 0), vs, ev.coefficient(t, 0)));
    }

    /** The one variable of a kernel exponent that is not a parameter (not in the sum), e.g. s in s/2. */
    private static String kernelVariable(Polynomial e, Polynomial sum, Set<String> exclude, Span span, String which) {
        List<String> candidates = new ArrayList<>();
        for (String v : e.variables()) {
            if (!exclude.contains(v) && (sum == null || !sum.variables().contains(v))) {
                candidates.add(v);
            }
        }
        if (candidates.size() != 1 || e.totalDegree() != 1 || !e.coefficient(candidates.get(0), 1).isConstant()) {
            throw new ContourException("mellin_measure: the exponent of " + which + " must be a*x + b for one Mellin variable x, got "
                    + PlainPrinter.polynomial(e), span);
        }
        return candidates.get(0);
    }

    private static Value mellin(Arguments a, Span span) {
        MellinMeasure from = measureArg(required(a, "from", span));
        MellinMeasure to = measureArg(required(a, "to", span));
        Optional<String[]> cross = crossRatios(a);
        if (a.get(0) instanceof PositionOperatorValue x) {
            if (cross.isPresent() && (!cross.get()[0].equals(x.u()) || !cross.get()[1].equals(x.v()))) {
                throw new ContourException("mellin: the operator is in the cross ratios {" + x.u() + ", " + x.v()
                        + "}, not {" + cross.get()[0] + ", " + cross.get()[1] + "}", a.spanOf(0));
            }
            try {
                return new OperatorValue(MellinDictionary.translate(x.operator(), from, to), from.elimination());
            } catch (ContourException e) {
                throw e.at(a.spanOf(0));
            }
        }
        String[] uv = cross.orElse(new String[] {"U", "V"});
        return new OperatorValue(MellinDictionary.translate(a.expression(0), uv[0], uv[1], from, to), from.elimination());
    }

    /** The names given by {@code cross: {U, V}}, if any. */
    private static Optional<String[]> crossRatios(Arguments a) {
        Optional<Arguments.Argument> cross = a.named("cross");
        if (cross.isEmpty()) {
            return Optional.empty();
        }
        List<Value> names = list(cross.get().value(), cross.get().span(), a.function() + ": cross");
        if (names.size() != 2) {
            throw new ContourException(a.function() + ": cross names the two cross ratios, such as {U, V}", cross.get().span());
        }
        String u = collectedName(names.get(0), cross.get().span());
        String v = collectedName(names.get(1), cross.get().span());
        if (u.equals(v)) {
            throw new ContourException(a.function() + ": the two cross ratios must differ", cross.get().span());
        }
        return Optional.of(new String[] {u, v});
    }

    /** {@code euler(U)}: the Euler operator U d/dU of one of the two cross ratios ({U, V} unless cross: says). */
    private static Value euler(Arguments a, Span span) {
        String[] uv = crossRatios(a).orElse(new String[] {"U", "V"});
        String x;
        try {
            x = collectedName(a.get(0), a.spanOf(0));
        } catch (ContourException e) {
            throw new ContourException("euler: the argument must be a cross ratio, " + uv[0] + " or " + uv[1]
                    + " (declared with 'vars " + uv[0] + ", " + uv[1] + " collected')", a.spanOf(0));
        }
        if (x.equals(uv[0])) {
            return new PositionOperatorValue(PositionOperator.uDerivative(), uv[0], uv[1]);
        }
        if (x.equals(uv[1])) {
            return new PositionOperatorValue(PositionOperator.vDerivative(), uv[0], uv[1]);
        }
        throw new ContourException("euler: '" + x + "' is not a cross ratio; they are " + uv[0] + " and " + uv[1]
                + " (name others with cross: {X, Y})", a.spanOf(0));
    }

    /** {@code position_operator(P, euler: {DU, DV})}: stand-ins DU, DV read as euler(U), euler(V), acting first. */
    private static Value positionOperator(Arguments a, Span span) {
        String[] uv = crossRatios(a).orElse(new String[] {"U", "V"});
        Arguments.Argument stand = required(a, "euler", span);
        List<Value> names = list(stand.value(), stand.span(), "position_operator: euler");
        if (names.size() != 2) {
            throw new ContourException("position_operator: euler names the two stand-ins for euler(" + uv[0] + ") and euler("
                    + uv[1] + "), such as {DU, DV}", stand.span());
        }
        String du = collectedName(names.get(0), stand.span());
        String dv = collectedName(names.get(1), stand.span());
        if (du.equals(dv) || List.of(uv).contains(du) || List.of(uv).contains(dv)) {
            throw new ContourException("position_operator: the two stand-ins must differ from each other and from "
                    + uv[0] + ", " + uv[1], stand.span());
        }
        Expression p = a.expression(0);
        for (String name : p.innerVariables()) {
            if (name.equals(uv[0]) || name.equals(uv[1]) || name.equals(du) || name.equals(dv)) {
                throw new ContourException("position_operator: '" + name + "' must be a collected variable", a.spanOf(0));
            }
        }
        PositionOperator out = PositionOperator.constant(Expression.ZERO);
        for (Map.Entry<dev.contour.algebra.Monomial, dev.contour.algebra.RationalFunction> t : p.terms().entrySet()) {
            Map<String, Integer> rest = new HashMap<>(t.getKey().exponents());
            int m = orZero(rest.remove(uv[0]));
            int n = orZero(rest.remove(uv[1]));
            int j = orZero(rest.remove(du));
            int k = orZero(rest.remove(dv));
            if (j < 0 || k < 0) {
                throw new ContourException("position_operator: " + (j < 0 ? du : dv) + " has a negative power in the term "
                        + Collect.describe(t.getKey()) + "; an Euler operator has no inverse here", a.spanOf(0));
            }
            Expression c = Expression.of(Map.of(Collect.monomial(rest), t.getValue()));
            out = out.add(PositionOperator.of(new PositionOperator.Word(m, n, j, k), c));
        }
        return new PositionOperatorValue(out, uv[0], uv[1]);
    }

    private static int orZero(Integer x) {
        return x == null ? 0 : x;
    }

    private static Value crossing(Arguments a, Span span) {
        List<Value> vars = list(a.get(0), a.spanOf(0), "crossing: the first argument");
        List<Value> images = list(a.get(1), a.spanOf(1), "crossing: the second argument");
        if (vars.size() != images.size()) {
            throw new ContourException("crossing: " + vars.size() + " variables but " + images.size() + " images", span);
        }
        Map<String, Polynomial> inner = new HashMap<>();
        Map<String, Expression> collected = new HashMap<>();
        for (int i = 0; i < vars.size(); i++) {
            Expression x = expression(vars.get(i), a.spanOf(0), "a variable");
            Expression image = expression(images.get(i), a.spanOf(1), "an image");
            if (x.collectedVariables().size() == 1 && x.innerVariables().isEmpty()) {
                collected.put(collectedName(vars.get(i), a.spanOf(0)), image);
            } else {
                inner.put(innerName(vars.get(i), a.spanOf(0)), polynomial(images.get(i), a.spanOf(1), "the image of an inner variable"));
            }
        }
        Expression factor = a.named("factor").map(f -> expression(f.value(), f.span(), "the factor")).orElse(Expression.ONE);
        return new CrossingValue(CrossingMap.of(inner, collected, factor));
    }

    private static Value poles(Arguments a, Span span) {
        MellinMeasure m = measureArg(a, 1);
        PoleAnalysis.Result r = PoleAnalysis.of(amplitude(a, m), m.poleForms(), m.variables());
        List<String> lines = new ArrayList<>();
        for (Pole p : r.all()) {
            lines.add(p.describe() + (p.order() == 1 ? "" : " (order " + p.order() + ")"));
        }
        return new ReportValue("poles", lines, "none");
    }

    private static Value polesOutside(Arguments a, Span span) {
        MellinMeasure m = measureArg(a, 1);
        Map<String, Set<Polynomial>> allowed = new LinkedHashMap<>();
        for (Arguments.Argument d : a.domains()) {
            Set<Polynomial> at = new LinkedHashSet<>();
            for (Value x : members(d.value(), d.span())) {
                at.add(polynomial(x, d.span(), "an allowed pole location"));
            }
            allowed.put(d.name(), at);
        }
        int order = a.named("order").map(o -> Values.integer(o.value(), o.span(), "order")).orElse(1);
        List<String> lines = new ArrayList<>();
        PoleAnalysis.of(amplitude(a, m), m.poleForms(), m.variables()).outside(new AllowedPoles(allowed, order))
                .forEach(v -> lines.add(v.describe()));
        return new ReportValue("poles outside the allowed set", lines, "none");
    }

    private static Value residue(Arguments a, Span span) {
        String x = innerName(a.get(1), a.spanOf(1));
        Polynomial at = polynomial(a.get(2), a.spanOf(2), "the pole location");
        return new ExprValue(Residues.residue(a.expression(0), x, at));
    }

    private static Value residueCheck(Arguments a, Span span) {
        MellinMeasure m = measureArg(a, 1);
        List<String> lines = new ArrayList<>();
        ResiduePolynomiality.check(amplitude(a, m), m.poleForms(), m.variables()).failures()
                .forEach(f -> lines.add(f.describe()));
        return new ReportValue("non-polynomial residues", lines, "none (every residue is polynomial)");
    }

    private static Value growth(Arguments a, Span span) {
        MellinMeasure m = measureArg(a, 1);
        Growth.Result g = Growth.of(amplitude(a, m), m.variables());
        if (g.degree().isEmpty()) {
            throw new ContourException("growth: the amplitude is zero", a.spanOf(0));
        }
        return Values.of(g.degree().getAsInt());
    }

    private static Value leading(Arguments a, Span span) {
        MellinMeasure m = measureArg(a, 1);
        return new ExprValue(Growth.of(amplitude(a, m), m.variables()).leading());
    }

    private static Value partialFractions(Arguments a, Span span) {
        String x = innerName(a.get(1), a.spanOf(1));
        List<String> by = new ArrayList<>();
        Optional<Arguments.Argument> named = a.named("by");
        if (named.isPresent()) {
            for (Value v : list(named.get().value(), named.get().span(), "partial_fractions: by")) {
                by.add(collectedName(v, named.get().span()));
            }
        } else {
            by.addAll(a.expression(0).collectedVariables());
        }
        List<String> lines = new ArrayList<>();
        PartialFractions.of(a.expression(0), x, by).forEach((mono, r) -> {
            StringBuilder line = new StringBuilder(Collect.describe(mono) + ":  ");
            line.append(PlainPrinter.rationalFunction(r.polynomialPart(), false));
            for (PartialFractions.Term t : r.terms()) {
                Polynomial d = Polynomial.variable(x).subtract(t.location());
                line.append("  +  (").append(PlainPrinter.rationalFunction(t.coefficient(), true)).append(")/(")
                        .append(PlainPrinter.polynomial(d)).append(")").append(t.order() == 1 ? "" : "^" + t.order());
            }
            lines.add(line.toString());
        });
        return new ReportValue("partial fractions in " + x, lines, "zero");
    }

    // ---------------------------------------------------------------- argument helpers

    private static Arguments.Argument required(Arguments a, String name, Span span) {
        return a.named(name).orElseThrow(() -> new ContourException(a.function() + " needs '" + name + ": ...'", span));
    }

    /**
     * The first argument as a function of the measure's s and t: its eliminated variable replaced
     * (see {@link MellinMeasure#resolve}); an error placed at the amplitude when that is impossible.
     */
    private static Expression amplitude(Arguments a, MellinMeasure m) {
        try {
            return m.resolve(a.expression(0));
        } catch (ContourException e) {
            throw new ContourException(a.function() + ": " + e.getMessage(), a.spanOf(0));
        }
    }

    private static MellinMeasure measureArg(Arguments a, int i) {
        if (a.get(i) instanceof MeasureValue m) {
            return m.measure();
        }
        throw new ContourException(a.function() + ": argument " + (i + 1) + " must be a measure (made by mellin_measure(...)), not a "
                + a.get(i).kind(), a.spanOf(i));
    }

    private static MellinMeasure measureArg(Arguments.Argument x) {
        if (x.value() instanceof MeasureValue m) {
            return m.measure();
        }
        throw new ContourException("'" + x.name() + "' must be a measure (made by mellin_measure(...)), not a " + x.value().kind(), x.span());
    }

    private static List<Value> list(Value v, Span span, String what) {
        if (v instanceof ListValue l) {
            return l.items();
        }
        throw new ContourException(what + " must be a list such as {s, t}, not a " + v.kind(), span);
    }

    private static List<Value> members(Value v, Span span) {
        if (v instanceof RangeValue r) {
            return r.members().stream().map(x -> (Value) Values.of(x)).toList();
        }
        if (v instanceof ListValue l) {
            return l.items();
        }
        return List.of(v);
    }

    private static Expression expression(Value v, Span span, String what) {
        if (v instanceof ExprValue e) {
            return e.value();
        }
        throw new ContourException(what + " must be an expression, not a " + v.kind(), span);
    }

    private static Polynomial polynomial(Value v, Span span, String what) {
        Expression e = expression(v, span, what);
        if (!e.isRational() || !e.asRationalFunction().isPolynomial()) {
            throw new ContourException(what + " must be a polynomial in inner variables, got " + PlainPrinter.expression(e, false), span);
        }
        return e.asRationalFunction().numerator();
    }

    private static String innerName(Value v, Span span) {
        Expression e = expression(v, span, "a variable");
        if (e.isRational() && e.innerVariables().size() == 1) {
            String name = e.innerVariables().first();
            if (e.equals(Expression.variable(name))) {
                return name;
            }
        }
        throw new ContourException("expected an inner variable such as s, got " + PlainPrinter.expression(e, false), span);
    }

    private static String collectedName(Value v, Span span) {
        Expression e = expression(v, span, "a variable");
        if (e.collectedVariables().size() == 1 && e.innerVariables().isEmpty()) {
            String name = e.collectedVariables().first();
            if (e.equals(Expression.collectedVariable(name))) {
                return name;
            }
        }
        throw new ContourException("expected a collected variable such as sigma, got " + PlainPrinter.expression(e, false), span);
    }

}
