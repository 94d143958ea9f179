package dev.contour.numeric;

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
import dev.contour.eval.TermValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.mellin.GammaPower;
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
 * <p>Normalisation of {@code position_value}, as in physics-reference section 2:
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
        r.register(new Builtin("position_value", 2, 2, Set.of("U", "V", "contour", "digits"), false,
                "position_value(M, m, U: 1/4, V: 1/2, contour: {-1/2, -1/2}, digits: 15): int ds/2 dt/2/(2 pi i)^2 U^.. V^.. M Gamma_m",
                NumericBuiltins::positionValue));
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
        Arguments.Argument uArg = required(a, "U", span);
        Optional<Arguments.Argument> vArg = a.named("V");
        Arguments.Argument cArg = required(a, "contour", span);
        boolean twoVariables = vArg.isPresent();
        Set<String> allowed = twoVariables ? Set.of(s, t) : Set.of(s);
        String variablesText = twoVariables ? s + " and " + t : s + " (without V: the one-variable integral)";

        if (!(a.get(0) instanceof ExprValue ev) || !ev.value().isRational() || !ev.value().collectedVariables().isEmpty()) {
            throw new ContourException("position_value: the amplitude must be a rational function of " + variablesText
                    + ", not " + a.get(0).kind() + " (substitute sigma, tau and parameters first)", a.spanOf(0));
        }
        RationalFunction amplitude = ev.value().asRationalFunction();
        requireOnly(amplitude.variables(), allowed, a.spanOf(0), "the amplitude", variablesText);
        for (GammaPower g : m.factors()) {
            requireOnly(g.argument().variables(), allowed, a.spanOf(1), "the Gamma argument " + g.argument(), variablesText);
        }
        requireOnly(m.uOffset().variables(), Set.of(), a.spanOf(1), "the kernel exponent of U", "numbers");
        if (twoVariables) {
            requireOnly(m.vOffset().variables(), Set.of(), a.spanOf(1), "the kernel exponent of V", "numbers");
        }
        List<Value> contour = cArg.value() instanceof ListValue l ? l.items() : List.of(cArg.value());
        if (contour.size() != (twoVariables ? 2 : 1)) {
            throw new ContourException("position_value: contour is " + (twoVariables ? "{Re " + s + ", Re " + t + "}" : "{Re " + s + "}")
                    + ", got " + contour.size() + " number" + (contour.size() == 1 ? "" : "s"), cArg.span());
        }
        Rational cs = Values.rational(contour.get(0), cArg.span(), "position_value: the contour");
        Rational ct = twoVariables ? Values.rational(contour.get(1), cArg.span(), "position_value: the contour") : null;
        ComplexValue u0 = complexOf(uArg.value(), uArg.span(), "position_value: U");
        ComplexValue v0 = twoVariables ? complexOf(vArg.get().value(), vArg.get().span(), "position_value: V") : null;

        long wp = MellinBarnes.workingPrecision(digits) + 5;
        Apcomplex u = u0.at(wp);
        Polynomial uExp = m.uExponent();
        Polynomial vExp = m.vExponent();
        Apcomplex half = new Apcomplex(new org.apfloat.Apfloat(1, wp)).divide(new Apint(2));
        NumericResult r = at(span, () -> {
            if (twoVariables) {
                Apcomplex v = v0.at(wp);
                Integrand2 f = (sv, tv) -> {
                    Map<String, Apcomplex> x = Map.of(s, sv, t, tv);
                    long p = wp;
                    Apcomplex g = gammas(m, x, p);
                    return ComplexFunctions.power(u, PointEvaluation.polynomialAt(uExp, x, p))
                            .multiply(ComplexFunctions.power(v, PointEvaluation.polynomialAt(vExp, x, p)))
                            .multiply(PointEvaluation.rationalFunctionAt(amplitude, x, p)).multiply(g);
                };
                return scaled(MellinBarnes.integrate2(f, PointEvaluation.rational(cs, wp), PointEvaluation.rational(ct, wp), digits),
                        half.multiply(half));
            }
            Integrand1 f = sv -> {
                Map<String, Apcomplex> x = Map.of(s, sv);
                long p = wp;
                return ComplexFunctions.power(u, PointEvaluation.polynomialAt(uExp, x, p))
                        .multiply(PointEvaluation.rationalFunctionAt(amplitude, x, p)).multiply(gammas(m, x, p));
            };
            return scaled(MellinBarnes.integrate1(f, PointEvaluation.rational(cs, wp), digits), half);
        });
        return NumberValue.of(r, digits, true);
    }

    /** The measure's Gamma factors at the point. */
    private static Apcomplex gammas(MellinMeasure m, Map<String, Apcomplex> x, long p) {
        Apcomplex g = Apcomplex.ONE;
        for (GammaPower f : m.factors()) {
            g = g.multiply(ApcomplexMath.pow(ComplexFunctions.gamma(PointEvaluation.polynomialAt(f.argument(), x, p)), f.exponent()));
        }
        return g;
    }

    /** The result times an exact factor (1/2 or 1/4): the digits claim and the relative error are unchanged. */
    private static NumericResult scaled(NumericResult r, Apcomplex factor) {
        return new NumericResult(r.value().multiply(factor).precision(r.value().precision()), r.digits(),
                r.errorEstimate().multiply(factor.real()).precision(3));
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
                default:
                    throw new ContourException("value: no numerical value is known for the function '" + a.function() + "'");
            }
        }
    }
}
