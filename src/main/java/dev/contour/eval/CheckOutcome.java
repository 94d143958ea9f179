package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.lang.Expr;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;
import java.util.TreeSet;

/**
 * The exact verdict of {@code check left == right}: the canonical forms of the difference decide.
 * On failure it carries evidence: the first collected monomial whose coefficients differ, and an
 * exact rational point (avoiding poles) where the two sides take different values.
 */
public record CheckOutcome(boolean holds, Value left, Value right, Monomial firstDifference,
                           RationalFunction leftCoefficient, RationalFunction rightCoefficient,
                           Map<String, Rational> point, Rational leftAtPoint, Rational rightAtPoint) {

    /** Fixed, so that a failing script prints the same counterexample every time. */
    private static final long SEED = 0x5eed_c0de_2026L;

    static CheckOutcome compare(Value left, Value right, Span span, EvaluationLimits limits) {
        if (left instanceof ListValue a && right instanceof ListValue b) {
            // Lists are equal when they have the same length and equal items in order; a failure
            // reports the first differing item.
            if (a.items().size() != b.items().size()) {
                return new CheckOutcome(false, left, right, null, null, null, null, null, null);
            }
            for (int i = 0; i < a.items().size(); i++) {
                CheckOutcome item = compare(a.items().get(i), b.items().get(i), span, limits);
                if (!item.holds()) {
                    return item;
                }
            }
            return new CheckOutcome(true, left, right, null, null, null, null, null, null);
        }
        // A number against a number or an exact value: equal within their combined stated errors.
        Boolean agree = left instanceof OperandValue l ? l.agreesWith(right) : null;
        if (agree == null && right instanceof OperandValue r) {
            agree = r.agreesWith(left);
        }
        if (agree != null) {
            return new CheckOutcome(agree, left, right, null, null, null, null, null, null);
        }
        Value difference = Arithmetic.binary(Expr.Operator.SUBTRACT, left, right, span, limits);
        Boolean zero = Arithmetic.isZero(difference);
        if (Boolean.FALSE.equals(zero) && difference instanceof OperandValue o) {
            zero = o.isZeroToItsPrecision();
        }
        if (zero == null) {
            throw new ContourException("cannot compare " + Values.describe(left) + " with " + Values.describe(right), span);
        }
        if (zero) {
            return new CheckOutcome(true, left, right, null, null, null, null, null, null);
        }
        if (!(left instanceof ExprValue a) || !(right instanceof ExprValue b) || !(difference instanceof ExprValue d)) {
            return new CheckOutcome(false, left, right, null, null, null, null, null, null);
        }
        Monomial first = d.value().terms().firstKey();
        RationalFunction lc = coefficientOrZero(a.value(), first);
        RationalFunction rc = coefficientOrZero(b.value(), first);
        Map<String, Rational> point = differingPoint(a.value(), b.value());
        if (point == null) {
            return new CheckOutcome(false, left, right, first, lc, rc, null, null, null);
        }
        return new CheckOutcome(false, left, right, first, lc, rc, point,
                valueAt(a.value(), point), valueAt(b.value(), point));
    }

    private static RationalFunction coefficientOrZero(Expression e, Monomial m) {
        RationalFunction c = e.terms().get(m);
        return c == null ? RationalFunction.ZERO : c;
    }

    /** Small random rationals for every variable until both sides are finite and differ. */
    private static Map<String, Rational> differingPoint(Expression a, Expression b) {
        TreeSet<String> vars = new TreeSet<>();
        vars.addAll(a.innerVariables());
        vars.addAll(a.collectedVariables());
        vars.addAll(b.innerVariables());
        vars.addAll(b.collectedVariables());
        Random random = new Random(SEED);
        for (int attempt = 0; attempt < 200; attempt++) {
            int size = 3 + attempt / 20;
            Map<String, Rational> point = new LinkedHashMap<>();
            for (String v : vars) {
                int num = random.nextInt(2 * size + 1) - size;
                int den = 1 + random.nextInt(attempt < 20 ? 1 : size);
                point.put(v, Rational.of(num, den));
            }
            try {
                if (!valueAt(a, point).equals(valueAt(b, point))) {
                    return point;
                }
            } catch (ContourException pole) {
                // A pole of either side: try another point.
            }
        }
        return null;
    }

    private static Rational valueAt(Expression e, Map<String, Rational> point) {
        Map<String, Expression> values = new LinkedHashMap<>();
        point.forEach((k, v) -> values.put(k, Expression.constant(v)));
        Expression x = e.substitute(values);
        if (!x.isConstant()) {
            throw new ContourException("not constant at the point");
        }
        return x.constantValue();
    }
}
