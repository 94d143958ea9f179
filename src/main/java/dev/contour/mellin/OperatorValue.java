package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.ShiftedSum;
import dev.contour.eval.Arguments;
import dev.contour.eval.CallableValue;
import dev.contour.eval.ExprValue;
import dev.contour.eval.OperandValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.SubstitutableValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.lang.Expr;

import java.util.Map;
import java.util.TreeMap;

/**
 * A shift operator as a value of the language: {@code E*F} composes, {@code f*E} multiplies on the
 * left, {@code E*f} composes with multiplication by f, {@code E + 1} adds the identity times 1,
 * {@code E^n} is a power and {@code E(M)} applies E to an amplitude.
 *
 * <p>An operator made by {@code mellin(..., from: m1, to: m2)} acts on amplitudes of m1: when m1
 * eliminates a variable (utilde = total - s - t), {@code E(M)} first writes M in s and t alone
 * ({@link Elimination#resolve}), since shifting s and t moves utilde too. That elimination is the
 * operator's {@code domain} (null for a plain shift); sums, products and powers keep it, and two
 * operators with different domains do not combine.
 */
public record OperatorValue(ShiftOperator operator, Elimination domain) implements OperandValue, CallableValue, SubstitutableValue {
    public OperatorValue(ShiftOperator operator) {
        this(operator, null);
    }

    @Override
    public String kind() {
        return "shift operator";
    }

    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        ShiftOperator o;
        Elimination d = domain;
        if (other instanceof OperatorValue ov) {
            o = ov.operator;
            d = joinDomains(ov.domain, span);
        } else if (other instanceof ExprValue e) {
            o = ShiftOperator.multiplication(e.value());
        } else {
            return null;
        }
        ShiftOperator left = thisOnLeft ? operator : o;
        ShiftOperator right = thisOnLeft ? o : operator;
        Elimination dom = d;
        return switch (op) {
            case ADD -> new OperatorValue(left.add(right), dom);
            case SUBTRACT -> new OperatorValue(left.subtract(right), dom);
            case MULTIPLY -> new OperatorValue(left.multiply(right), dom);
            case DIVIDE -> {
                if (thisOnLeft && other instanceof ExprValue e && e.value().isConstant() && !e.value().isZero()) {
                    yield new OperatorValue(operator.multiply(Expression.ONE.divide(e.value())), dom);
                }
                throw new ContourException("an operator divides only by a non-zero number; write (1/f)*E or E*(1/f)", span);
            }
            case POWER -> {
                if (!thisOnLeft || !(other instanceof ExprValue)) {
                    throw new ContourException("only an operator can be raised to a power, by an integer >= 0", span);
                }
                yield new OperatorValue(operator.pow(Values.integer(other, span, "the power of an operator")), dom);
            }
        };
    }

    /** The domain of a combination: the one domain present, or the common one; an error when they differ. */
    private Elimination joinDomains(Elimination other, Span span) {
        if (domain == null) {
            return other;
        }
        if (other == null || other.equals(domain)) {
            return domain;
        }
        throw new ContourException("these operators act on amplitudes of different measures (" + domain + " and " + other + "): they do not combine", span);
    }

    @Override
    public Value negate(Span span) {
        return new OperatorValue(operator.negate(), domain);
    }

    @Override
    public boolean isZero() {
        return operator.isZero();
    }

    /** {@code E(M)}: the operator applied to one amplitude. */
    @Override
    public Value call(Arguments arguments, Span span) {
        if (arguments.all().size() != 1 || arguments.positional().size() != 1) {
            throw new ContourException("a shift operator applies to one amplitude: E(M)", span);
        }
        ExprValue arg = arguments.expressionValue(0);
        if (domain != null && mentions(arg, domain.variable())) {
            // The eliminated variable moves with s and t: write the amplitude in s and t first.
            try {
                arg = new ExprValue(domain.resolve(arg.value()));
            } catch (ContourException e) {
                throw new ContourException(e.getMessage(), arguments.spanOf(0));
            }
        }
        // E(F(f)) = (E*F)(f): compose instead of collecting the inner application
        ShiftedSum inner = arg.shiftedSum().orElse(null);
        ShiftedSum applied = inner != null
                ? operator.multiply(ShiftOperator.ofBlocks(inner.blocks())).applyDeferred(inner.argument())
                : operator.applyDeferred(arg.value());
        return applied != null ? ExprValue.deferred(applied) : new ExprValue(operator.apply(arg.value()));
    }

    /** Whether the value mentions the variable; a deferred application is read through its argument, not collected. */
    private static boolean mentions(ExprValue v, String name) {
        ShiftedSum d = v.shiftedSum().orElse(null);
        if (d == null) {
            return v.value().innerVariables().contains(name) || v.value().collectedVariables().contains(name);
        }
        Expression a = d.argument();
        if (a.innerVariables().contains(name) || a.collectedVariables().contains(name)) {
            return true;
        }
        for (ShiftedSum.Block b : d.blocks()) {
            if (b.coefficient().innerVariables().contains(name) || b.coefficient().collectedVariables().contains(name)) {
                return true;
            }
        }
        return false;
    }

    /** Substitution in the coefficients; a variable the operator shifts cannot be replaced. */
    @Override
    public Value substitute(Map<String, Expression> values, Span span) {
        TreeMap<Shift, Expression> terms = new TreeMap<>();
        for (Map.Entry<Shift, Expression> e : operator.terms().entrySet()) {
            for (String v : values.keySet()) {
                if (e.getKey().amounts().containsKey(v)) {
                    throw new ContourException("cannot replace '" + v + "': the operator shifts it", span);
                }
            }
            terms.put(e.getKey(), e.getValue().substitute(values));
        }
        Elimination d;
        try {
            d = domain == null ? null : domain.substitute(values);
        } catch (ContourException e) {
            throw e.at(span);
        }
        return new OperatorValue(ShiftOperator.of(terms), d);
    }

    @Override
    public String render(OutputFormat format) {
        return render(format, false);
    }

    @Override
    public String render(OutputFormat format, boolean factored) {
        return switch (format) {
            case PLAIN -> OperatorPrinter.plain(operator, factored);
            case LATEX -> OperatorPrinter.latex(operator, factored);
            case JSON -> OperatorPrinter.json(operator);
        };
    }
}
