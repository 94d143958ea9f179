package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.eval.Arguments;
import dev.contour.eval.Builtin;
import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.ExprValue;
import dev.contour.eval.ListValue;
import dev.contour.eval.TermValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.algebra.LinearFactors;
import dev.contour.mellin.GammaPower;
import dev.contour.mellin.NamedForm;
import dev.contour.mellin.Pole;
import dev.contour.mellin.PoleAnalysis;
import dev.contour.mellin.MeasureValue;
import dev.contour.mellin.MellinMeasure;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apint;

/**
 * The language's numerical built-ins: {@code complex} points, {@code value} of closed expressions
 * to a number of digits, and {@code position_value}, the Mellin-Barnes integral of an amplitude
 * against a measure at a point (U, V). Found by the interpreter through {@link java.util.ServiceLoader}.
 *
 * <p>Normalisation of {@code position_value}, as in docs/conventions.md, "Mellin representation and normalisation":
 * {@code int ds/2 dt/2 / (2 pi i)^2 U^(a s + b) V^(c t + d) M(s, t) Gamma(s, t)}, i.e.
 * {@code ds dt / (4 pi i)^2}, on the straight contours Re s = cs, Re t = ct; the one-variable form
 * is {@code int ds/2 / (2 pi i) U^(a s + b) M(s) Gamma(s)}.
 */
public final class NumericBuiltins implements BuiltinProvider {
    @Override
    public void register(BuiltinRegistry r) {
        r.register(Builtin.of("complex", 2, "complex(3/10, 1/5): the exact complex number 3/10 + 1/5 i, a point for value and position_value",
                NumericBuiltins::complex));
        r.register(new Builtin("value", 1, 1, Set.of("digits", "point"), false,
                "value(Gamma(1/3), digits: 30): a closed expression to 30 significant digits; point: {z, complex(1, 1)} sets variables",
                NumericBuiltins::value));
        r.register(Builtin.of(POLYLOG, 2, "polylog(2, x): the polylogarithm Li_n(x) of integer order n, kept exact; value(...) evaluates it",
                NumericBuiltins::polylog));
        r.register(new Builtin("position_value", 2, 2, Set.of("U", "V", "z", "zbar", "contour", "digits", "within"), false,
                "position_value(M, m, U: 1/4, V: 1/2, contour: {-1/2, -1/2}, digits: 15, within: 60): int ds/2 dt/2/(2 pi i)^2 U^.. V^.. M Gamma_m;"
                        + " z:, zbar: for U = z zbar, V = (1 - z)(1 - zbar); without contour: a separating one is chosen; within: seconds",
                NumericBuiltins::positionValue));
    }

    /** The name of the polylogarithm as a term function. */
    public static final String POLYLOG = "polylog";

    /** polylog(n, x): an exact term (numbers only through value); Li_n(0) = 0. */
    private static Value polylog(Arguments a, Span span) {
        int n = Values.integer(a.get(0), a.spanOf(0), "polylog: the order");
        Value x = a.get(1);
        Term arg;
        if (x instanceof ExprValue e) {
            if (e.value().isZero()) {
                return new ExprValue(Expression.constant(0));
            }
            arg = new Term.Leaf(e.value());
        } else if (x instanceof TermValue tv) {
            arg = tv.value();
        } else {
            throw new ContourException("polylog: the argument must be an expression (use point: for a complex x), not a "
                    + x.kind(), a.spanOf(1));
        }
        try {
            return dev.contour.eval.Arithmetic.fromTerm(new Term.Apply(POLYLOG, List.of(new Term.Leaf(Expression.constant(n)), arg)));
        } catch (ContourException e) {
            throw e.at(span);
        }
    }

    private static Value complex(Arguments a, Span span) {
        return new ComplexValue(Values.rational(a.get(0), a.spanOf(0), "complex: the real part"),
                Values.rational(a.get(1), a.spanOf(1), "complex: the imaginary part"));
    }

    // ------------------------------------------------------------------------------------ value

    private static Value value(Arguments a, Span span) {
        int digits = digits(a, span);
        Map<String, ComplexValue> point = point(a);
        Value v = a.get(0);
        Term term;
        if (v instanceof ComplexValue c) {
            return NumberValue.of(at(a.spanOf(0), () -> SpecialFunctions.evaluate(c::at, digits)), digits, false);
        } else if (v instanceof ExprValue e) {
            term = new Term.Leaf(e.value());
        } else if (v instanceof TermValue t) {
            term = t.value();
        } else {
            throw new ContourException("value: the argument must be an expression, not a " + v.kind(), a.spanOf(0));
        }
        Term closed = term;
        return NumberValue.of(at(a.spanOf(0), () -> SpecialFunctions.evaluate(p -> {
            Map<String, Apcomplex> values = new HashMap<>();
            point.forEach((name, c) -> values.put(name, c.at(p + 5)));
            return new TermNumerics(values, p + 5).value(closed).precision(p);
        }, digits)), digits, false);
    }

    /** The {@code point: {z, complex(1, 1)}} or {@code point: {{x, 1/3}, {z, complex(1, 1)}}} argument. */
    private static Map<String, ComplexValue> point(Arguments a) {
        Map<String, ComplexValue> point = new LinkedHashMap<>();
        Optional<Arguments.Argument> arg = a.named("point");
        if (arg.isEmpty()) {
            return point;
        }
        Span span = arg.get().span();
        List<Value> items = list(arg.get().value(), span, "value: point");
        List<Value> pairs = !items.isEmpty() && items.get(0) instanceof ListValue ? items : List.of(arg.get().value());
        for (Value pair : pairs) {
            List<Value> xy = list(pair, span, "value: point");
            if (xy.size() != 2 || !(xy.get(0) instanceof ExprValue name) || name.value().innerVariables().size() != 1
                    || !name.value().equals(Expression.variable(name.value().innerVariables().first()))) {
                throw new ContourException("value: point is {variable, number} or a list of such pairs, such as {{x, 1/3}, {z, complex(1, 2)}}", span);
            }
            point.put(name.value().innerVariables().first(), complexOf(xy.get(1), span, "value: the value of a point variable"));
        }
        return point;
    }

    // ---------------------------------------------------------------------------- position_value

    private static Value positionValue(Arguments a, Span span) {
        int digits = digits(a, span);
        if (!(a.get(1) instanceof MeasureValue mv)) {
            throw new ContourException("position_value: the second argument must be a Mellin measure (from mellin_measure), not a "
                    + a.get(1).kind(), a.spanOf(1));
        }
        MellinMeasure m = mv.measure();
        String s = m.s();
        String t = m.t();
        // The point: U (and V), or z and zbar with U = z zbar, V = (1 - z)(1 - zbar).
        Optional<Arguments.Argument> uArg = a.named("U");
        Optional<Arguments.Argument> vArg = a.named("V");
        Optional<Arguments.Argument> zArg = a.named("z");
        Optional<Arguments.Argument> zbArg = a.named("zbar");
        ComplexValue u0;
        ComplexValue v0;
        if (zArg.isPresent() || zbArg.isPresent()) {
            if (uArg.isPresent() || vArg.isPresent()) {
                Arguments.Argument second = (uArg.isPresent() ? uArg : vArg).get();
                throw new ContourException("position_value: give the point either as U:, V: or as z:, zbar:, not both", second.span());
            }
            Arguments.Argument z = required(a, "z", span);
            Arguments.Argument zb = required(a, "zbar", span);
            ComplexValue zv = complexOf(z.value(), z.span(), "position_value: z");
            ComplexValue zbv = complexOf(zb.value(), zb.span(), "position_value: zbar");
            u0 = times(zv, zbv);
            v0 = times(oneMinus(zv), oneMinus(zbv));
        } else {
            Arguments.Argument ua = required(a, "U", span);
            u0 = complexOf(ua.value(), ua.span(), "position_value: U");
            v0 = vArg.isPresent() ? complexOf(vArg.get().value(), vArg.get().span(), "position_value: V") : null;
        }
        boolean twoVariables = v0 != null;
        Set<String> allowed = twoVariables ? Set.of(s, t) : Set.of(s);
        String variablesText = twoVariables ? s + " and " + t : s + " (without V: the one-variable integral)";

        if (!(a.get(0) instanceof ExprValue ev) || !ev.value().isRational() || !ev.value().collectedVariables().isEmpty()) {
            throw new ContourException("position_value: the amplitude must be a rational function of " + variablesText
                    + ", not " + a.get(0).kind() + " (substitute sigma, tau and parameters first)", a.spanOf(0));
        }
        RationalFunction amplitude;
        try {
            amplitude = m.resolve(ev.value()).asRationalFunction();
        } catch (ContourException e) {
            throw new ContourException("position_value: " + e.getMessage(), a.spanOf(0));
        }
        requireOnly(amplitude.variables(), allowed, a.spanOf(0), "the amplitude", variablesText);
        List<ContourChoice.AmplitudePole> poles = new ArrayList<>();
        List<NamedForm> named = twoVariables ? m.poleForms() : List.of(NamedForm.of(s));
        List<NamedForm> formsOfPoles = new ArrayList<>();
        boolean curved = false;
        for (LinearFactors.Factor d : amplitude.denominatorFactors()) {
            if (d.base().totalDegree() != 1) {
                curved |= d.base().totalDegree() > 1;
                continue;
            }
            Pole pole = PoleAnalysis.classify(d.base(), d.multiplicity(), named, allowed);
            poles.add(new ContourChoice.AmplitudePole(d.base(), pole.describe()));
            formsOfPoles.add(pole.form() == null ? null : named.stream().filter(n -> n.name().equals(pole.form())).findFirst().orElse(null));
        }
        for (GammaPower g : m.factors()) {
            requireOnly(g.argument().variables(), allowed, a.spanOf(1), "the Gamma argument " + g.argument(), variablesText);
        }
        requireOnly(m.uOffset().variables(), Set.of(), a.spanOf(1), "the kernel exponent of U", "numbers");
        if (twoVariables) {
            requireOnly(m.vOffset().variables(), Set.of(), a.spanOf(1), "the kernel exponent of V", "numbers");
        }
        Optional<Arguments.Argument> cArg = a.named("contour");
        Rational cs;
        Rational ct;
        String chosen = null;
        if (cArg.isPresent()) {
            List<Value> contour = cArg.get().value() instanceof ListValue l ? l.items() : List.of(cArg.get().value());
            if (contour.size() != (twoVariables ? 2 : 1)) {
                throw new ContourException("position_value: contour is " + (twoVariables ? "{Re " + s + ", Re " + t + "}" : "{Re " + s + "}")
                        + ", got " + contour.size() + " number" + (contour.size() == 1 ? "" : "s"), cArg.get().span());
            }
            cs = Values.rational(contour.get(0), cArg.get().span(), "position_value: the contour");
            ct = twoVariables ? Values.rational(contour.get(1), cArg.get().span(), "position_value: the contour") : null;
        } else {
            if (curved) {
                throw new ContourException("position_value: the amplitude's denominator has a factor that is not linear in " + variablesText
                        + ", whose poles no straight contour can be placed against by rule; give contour: explicitly", a.spanOf(0));
            }
            Rational[] c = at(a.spanOf(0), () -> ContourChoice.choose(m.factors(), poles, s, twoVariables ? t : null));
            cs = c[0];
            ct = twoVariables ? c[1] : null;
            chosen = "contour {" + cs + (twoVariables ? ", " + ct : "") + "} chosen";
        }
        // Where the amplitude's poles lie: the contour may not pass through one, and the result says on which side each is.
        Map<String, Rational> onContour = new HashMap<>();
        onContour.put(s, cs);
        if (twoVariables) {
            onContour.put(t, ct);
        }
        List<String> sides = new ArrayList<>();
        for (int i = 0; i < poles.size(); i++) {
            ContourChoice.AmplitudePole pole = poles.get(i);
            NamedForm form = formsOfPoles.get(i);
            if (pole.factor().evaluate(onContour).signum() == 0) {
                throw new ContourException("position_value: the contour {" + cs + (twoVariables ? ", " + ct : "")
                        + "} passes through the amplitude's pole at " + pole.name(), cArg.isPresent() ? cArg.get().span() : a.spanOf(0));
            }
            if (form != null) {
                Rational re = form.form().evaluate(onContour);
                Rational at = Rational.ZERO.subtract(pole.factor().evaluate(onContour)).divide(coefficientOf(pole.factor(), form, s, t)).add(re);
                sides.add(pole.name() + (re.compareTo(at) < 0 ? " right of Re " + form.name() + " = " + re : " left of Re " + form.name() + " = " + re));
            } else {
                sides.add(pole.name() + (pole.factor().evaluate(onContour).signum() > 0 ? " where it is negative" : " where it is positive"));
            }
        }
        if (!sides.isEmpty()) {
            String where = "amplitude poles: " + String.join(", ", sides);
            chosen = chosen == null ? where : chosen + "; " + where;
        }
        IntegrationLimits limits = IntegrationLimits.defaults();
        Optional<Arguments.Argument> within = a.named("within");
        if (within.isPresent()) {
            Rational seconds = Values.rational(within.get().value(), within.get().span(), "position_value: within (seconds)");
            if (seconds.signum() <= 0) {
                throw new ContourException("position_value: within is a positive number of seconds, got " + seconds, within.get().span());
            }
            Rational ms = seconds.multiply(Rational.of(1000));
            limits = limits.withTimeLimit(java.time.Duration.ofMillis(Math.max(1, ms.numerator().divide(ms.denominator()).longValue())));
        }
        IntegrationLimits bounds = limits;

        long wp = MellinBarnes.workingPrecision(digits) + 5;
        long gammaPrecision = MellinBarnes.workingPrecision(digits);
        Apcomplex u = u0.at(wp);
        Apcomplex half = new Apcomplex(new org.apfloat.Apfloat(1, wp)).divide(new Apint(2));
        NumericResult r = at(span, () -> {
            if (twoVariables) {
                MeasureIntegrand f = new MeasureIntegrand(m, amplitude, u, v0.at(wp), gammaPrecision);
                return scaled(MellinBarnes.integrate2(f, PointEvaluation.rational(cs, wp), PointEvaluation.rational(ct, wp), digits, bounds),
                        half.multiply(half));
            }
            MeasureIntegrand f = new MeasureIntegrand(m, amplitude, u, null, gammaPrecision);
            return scaled(MellinBarnes.integrate1(f, PointEvaluation.rational(cs, wp), digits, bounds), half);
        });
        return NumberValue.of(r, digits, true).withNote(chosen);
    }

    /** The factor's rate of change along its named form: factor = k * (form - location), k returned. */
    private static Rational coefficientOf(dev.contour.algebra.Polynomial factor, NamedForm form, String s, String t) {
        for (String v : t == null ? List.of(s) : List.of(s, t)) {
            dev.contour.algebra.Polynomial fc = form.form().coefficient(v, 1);
            if (!fc.isZero()) {
                dev.contour.algebra.Polynomial c = factor.coefficient(v, 1);
                return (c.isZero() ? Rational.ZERO : c.constantValue()).divide(fc.constantValue());
            }
        }
        throw new ContourException("the pole's form does not involve the Mellin variables");
    }

    private static ComplexValue times(ComplexValue x, ComplexValue y) {
        return new ComplexValue(x.re().multiply(y.re()).subtract(x.im().multiply(y.im())),
                x.re().multiply(y.im()).add(x.im().multiply(y.re())));
    }

    private static ComplexValue oneMinus(ComplexValue x) {
        return new ComplexValue(Rational.ONE.subtract(x.re()), x.im().negate());
    }

    /**
     * The result times an exact factor (1/2 or 1/4): the product is taken with two more digits, so it is
     * exact, and the error bound is scaled with it; the claim is recomputed at the new scale.
     */
    private static NumericResult scaled(NumericResult r, Apcomplex factor) {
        Apcomplex v = r.value().precision(r.value().precision() + 2).multiply(factor);
        double error = Magnitudes.log10Abs(r.errorEstimate().multiply(factor.real()));
        return NumericResult.of(v, error, r.digits() + 1);
    }

    // ---------------------------------------------------------------------------------- helpers

    private static int digits(Arguments a, Span span) {
        Arguments.Argument d = required(a, "digits", span);
        int n = Values.integer(d.value(), d.span(), a.function() + ": digits");
        if (n < 1 || n > 1000) {
            throw new ContourException(a.function() + ": digits must be between 1 and 1000, got " + n, d.span());
        }
        return n;
    }

    private static Arguments.Argument required(Arguments a, String name, Span span) {
        return a.named(name).orElseThrow(() -> new ContourException(a.function() + " needs the argument '" + name + ": ...'", span));
    }

    private static List<Value> list(Value v, Span span, String what) {
        if (v instanceof ListValue l) {
            return l.items();
        }
        throw new ContourException(what + " must be a list {...}, not a " + v.kind(), span);
    }

    /** A number or {@code complex(re, im)} as an exact complex point. */
    private static ComplexValue complexOf(Value v, Span span, String what) {
        if (v instanceof ComplexValue c) {
            return c;
        }
        if (v instanceof ExprValue e && e.value().isConstant()) {
            return new ComplexValue(e.value().constantValue(), Rational.ZERO);
        }
        throw new ContourException(what + " must be a number or complex(re, im), not a " + v.kind(), span);
    }

    private static void requireOnly(Set<String> variables, Set<String> allowed, Span span, String what, String expected) {
        for (String v : variables) {
            if (!allowed.contains(v)) {
                throw new ContourException("position_value: " + what + " depends on '" + v + "'; it may depend only on " + expected
                        + " (fix parameters such as p when building the measure)", span);
            }
        }
    }

    /** Runs a numerical evaluation, placing its errors (poles, no decay, digits not reached) at the call. */
    private static <T> T at(Span span, java.util.function.Supplier<T> body) {
        try {
            return body.get();
        } catch (ContourException e) {
            throw e.span() == null ? new ContourException(e.getMessage(), span, e) : e;
        }
    }

    /** Terms of the language (Gamma, poch, factorial, binom over rational leaves) at a complex point. */
    private static final class TermNumerics {
        private final Map<String, Apcomplex> point;
        private final long precision;

        TermNumerics(Map<String, Apcomplex> point, long precision) {
            this.point = point;
            this.precision = precision;
        }

        Apcomplex value(Term t) {
            if (t instanceof Term.Leaf l) {
                Expression e = l.value();
                if (!e.isRational() || !e.collectedVariables().isEmpty()) {
                    throw new ContourException("value: cannot evaluate " + e + " (collected variables need values first: use 'at')");
                }
                return PointEvaluation.rationalFunctionAt(e.asRationalFunction(), point, precision);
            }
            if (t instanceof Term.Sum s) {
                Apcomplex acc = Apcomplex.ZERO;
                for (Term x : s.terms()) {
                    acc = acc.add(value(x));
                }
                return acc;
            }
            if (t instanceof Term.Product p) {
                Apcomplex acc = Apcomplex.ONE;
                for (Term x : p.factors()) {
                    acc = acc.multiply(value(x));
                }
                return acc;
            }
            if (t instanceof Term.Power w) {
                return ApcomplexMath.pow(value(w.base()), w.exponent());
            }
            Term.Apply a = (Term.Apply) t;
            Apcomplex x = value(a.arguments().get(0));
            Apcomplex one = Apcomplex.ONE;
            switch (a.function()) {
                case Terms.GAMMA:
                    return ComplexFunctions.gamma(x, precision);
                case Terms.FACTORIAL:
                    return ComplexFunctions.gamma(x.add(one), precision);
                case Terms.POCH: {
                    Apcomplex n = value(a.arguments().get(1));
                    if (n.isInteger() && Math.abs(n.real().doubleValue()) < 100_000) {
                        return ComplexFunctions.pochhammer(x, n.real().longValue(), precision);
                    }
                    return ComplexFunctions.gamma(x.add(n), precision).divide(ComplexFunctions.gamma(x, precision));
                }
                case Terms.BINOM: {
                    // binom(x, k) = Gamma(x + 1)/(Gamma(k + 1) Gamma(x - k + 1)) (common practice); integer k >= 0 as
                    // (x - k + 1)_k / k!, so that negative integer x stays finite.
                    Apcomplex k = value(a.arguments().get(1));
                    if (k.isInteger() && Math.abs(k.real().doubleValue()) < 100_000) {
                        long n = k.real().longValue();
                        if (n < 0) {
                            return Apcomplex.ZERO;
                        }
                        return ComplexFunctions.pochhammer(x.subtract(k).add(one), n, precision)
                                .divide(ComplexFunctions.gamma(k.add(one), precision));
                    }
                    return ComplexFunctions.gamma(x.add(one), precision).divide(ComplexFunctions.gamma(k.add(one), precision)
                            .multiply(ComplexFunctions.gamma(x.subtract(k).add(one), precision)));
                }
                case POLYLOG: {
                    // Li_n(x), n an integer, principal branch (cut along [1, infinity)).
                    Apcomplex x2 = value(a.arguments().get(1));
                    if (!x.isInteger() || Math.abs(x.real().doubleValue()) > 1000) {
                        throw new ContourException("value: polylog needs an integer order, got " + x);
                    }
                    return ComplexFunctions.polylog(x.real().intValue(), x2, precision);
                }
                default:
                    throw new ContourException("value: no numerical value is known for the function '" + a.function() + "'");
            }
        }
    }
}
