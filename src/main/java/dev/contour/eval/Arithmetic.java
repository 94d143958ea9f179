package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.lang.Expr.Operator;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.util.List;

/**
 * The operators on values. Rational values stay {@link Expression}s throughout (no term trees);
 * symbolic terms combine as trees and are normalised at once, falling back to expressions when the
 * result is rational; other kinds decide for themselves through {@link OperandValue}.
 */
public final class Arithmetic {
    private Arithmetic() { }

    public static Value binary(Operator op, Value left, Value right, Span span, EvaluationLimits limits) {
        try {
            if (left instanceof ExprValue a && right instanceof ExprValue b) {
                return new ExprValue(expressions(op, a.value(), b.value(), span, limits));
            }
            if (isSymbolic(left) && isSymbolic(right)) {
                return terms(op, term(left), right, span, limits);
            }
            if (left instanceof OperandValue o) {
                Value v = o.combine(op, right, true, span);
                if (v != null) {
                    return v;
                }
            }
            if (right instanceof OperandValue o) {
                Value v = o.combine(op, left, false, span);
                if (v != null) {
                    return v;
                }
            }
        } catch (ContourException e) {
            throw e.at(span);
        }
        throw new ContourException("cannot apply '" + op.symbol() + "' to " + Values.describe(left) + " and "
                + Values.describe(right), span);
    }

    public static Value negate(Value v, Span span) {
        if (v instanceof ExprValue e) {
            return new ExprValue(e.value().negate());
        }
        if (v instanceof TermValue t) {
            return fromTerm(new Term.Product(List.of(Terms.of(Expression.constant(-1)), t.value())));
        }
        if (v instanceof OperandValue o) {
            return o.negate(span);
        }
        throw new ContourException("cannot negate " + Values.describe(v), span);
    }

    /** True when {@code v} is zero; null when the kind cannot tell. */
    public static Boolean isZero(Value v) {
        if (v instanceof ExprValue e) {
            return e.value().isZero();
        }
        if (v instanceof TermValue) {
            return false; // normalised terms that are zero are Leaf zeros, i.e. ExprValues
        }
        if (v instanceof OperandValue o) {
            return o.isZero();
        }
        return null;
    }

    /** A normalised term as a value: an expression when rational. */
    public static Value fromTerm(Term t) {
        Term n = Terms.normalize(t);
        return n instanceof Term.Leaf l ? new ExprValue(l.value()) : new TermValue(n);
    }

    static boolean isSymbolic(Value v) {
        return v instanceof ExprValue || v instanceof TermValue;
    }

    /** The value as a term (expressions become leaves). */
    public static Term term(Value v) {
        if (v instanceof ExprValue e) {
            return Terms.of(e.value());
        }
        if (v instanceof TermValue t) {
            return t.value();
        }
        throw new IllegalArgumentException("not symbolic: " + v.kind());
    }

    private static Expression expressions(Operator op, Expression a, Expression b, Span span, EvaluationLimits limits) {
        if (a.isConstant() && b.isConstant() && op != Operator.POWER) {
            if (op == Operator.MULTIPLY || op == Operator.DIVIDE) {
                checkNumberSize(bits(a.constantValue()) + bits(b.constantValue()), "this product", span, limits);
            }
            return numbers(op, a.constantValue(), b.constantValue(), span);
        }
        return switch (op) {
            case ADD -> a.add(b);
            case SUBTRACT -> a.subtract(b);
            case MULTIPLY -> a.multiply(b);
            case DIVIDE -> {
                if (b.isZero()) {
                    throw new ContourException("division by zero", span);
                }
                yield a.divide(b);
            }
            case POWER -> {
                int e = exponent(new ExprValue(b), span, limits);
                if (e < 0 && a.isZero()) {
                    throw new ContourException("zero to a negative power", span);
                }
                checkExpansionSize(a, e, span, limits);
                yield a.pow(e);
            }
        };
    }

    /** Most terms a power may expand to, estimated before expanding (so a typo cannot hang a run). */
    static final double MAX_EXPANDED_TERMS = 2e6;

    /** Most coefficient products the last squaring of a power may take (a fixed limit of one power). */
    static final double MAX_TERM_PRODUCTS = 2e9;

    /**
     * Rejects powers whose expansion would be enormous: a polynomial of degree d in k variables
     * raised to e has at most binom(k + d*e, k) terms.
     */
    private static void checkExpansionSize(Expression a, int e, Span span, EvaluationLimits limits) {
        if (a.isZero() || e == 0) {
            return;
        }
        // Coefficients of p^e are bounded by (sum of |coefficients of p|)^e: about |e| times the bits of
        // the largest coefficient plus log2 of the number of terms (common practice for bounding heights).
        double height = 0;
        for (var t : a.terms().values()) {
            height = Math.max(height, height(t.numerator()) + height(t.denominator()));
        }
        double bits = height * Math.abs((double) e);
        checkNumberSize(bits, "the power ^" + e, span, limits);
        if (a.terms().size() <= 1 && isMonomialCoefficient(a)) {
            return;
        }
        int k = a.innerVariables().size() + a.collectedVariables().size();
        long degree = 0;
        for (var t : a.terms().entrySet()) {
            long d = Math.abs((long) t.getKey().totalDegree()) + t.getValue().numerator().totalDegree()
                    + t.getValue().denominator().totalDegree();
            degree = Math.max(degree, d);
        }
        double n = (double) degree * Math.abs(e);
        double bound = 1;
        for (int i = 1; i <= k && bound <= MAX_EXPANDED_TERMS; i++) {
            bound = bound * (n + i) / i;
        }
        if (bound > MAX_EXPANDED_TERMS) {
            throw new ContourException("the power ^" + e + " would expand to too many terms", span);
        }
        // The last squaring multiplies two copies of the half power: about (terms of p^(e/2))^2
        // coefficient products, whatever the memory; past MAX_TERM_PRODUCTS that is minutes of work.
        double half = 1;
        for (int i = 1; i <= k && half <= MAX_EXPANDED_TERMS; i++) {
            half = half * (n / 2 + i) / i;
        }
        if (half * half > MAX_TERM_PRODUCTS) {
            throw new ContourException(String.format("the power ^%d would expand to up to %,.0f terms, and its last step alone"
                    + " would take about %.1e coefficient products, past the limit of %.0e for one power (minutes of work);"
                    + " expand a smaller power, or keep the factor unexpanded", e, bound, half * half, MAX_TERM_PRODUCTS), span);
        }
        double bytes = bound * (bits / 8 + 64);
        if (limits.maxExpansionBytes() > 0 && bytes > limits.maxExpansionBytes()) {
            throw new ContourException(String.format("the power ^%d would expand to up to %,.0f terms with coefficients of up to"
                    + " %,.0f bits (about %,.0f MiB), past the limit of %,d MiB for one expansion (a quarter of the"
                    + " statement's memory budget; raise it with --memory-budget MIB)", e, bound, bits, bytes / (1 << 20),
                    limits.maxExpansionBytes() >> 20), span);
        }
    }

    /** Bits to write a number's numerator and denominator. */
    private static long bits(Rational r) {
        return r.numerator().bitLength() + (r.isInteger() ? 0L : r.denominator().bitLength());
    }

    /** log2 of the sum of the absolute values of the coefficients (each over its own denominator), rounded up. */
    private static double height(dev.contour.algebra.Polynomial p) {
        long most = 0;
        for (var t : p.terms()) {
            most = Math.max(most, bits(t.coefficient()));
        }
        return p.isConstant() && p.terms().size() == 1 && most <= 1 ? 0 : most + Math.log(Math.max(1, p.terms().size())) / Math.log(2);
    }

    /** Refuses to build an exact number past the limit of bits, before building it. */
    private static void checkNumberSize(double bits, String what, Span span, EvaluationLimits limits) {
        if (bits > limits.maxNumberBits()) {
            throw new ContourException(String.format("%s would build exact numbers of about %,.0f digits, past the limit of"
                    + " %,d digits; raise it with --max-digits DIGITS", what, bits * Math.log10(2),
                    (long) (limits.maxNumberBits() * Math.log10(2))), span);
        }
    }

    private static boolean isMonomialCoefficient(Expression a) {
        var c = a.terms().values().iterator().next();
        return c.numerator().termCount() == 1 && c.denominatorFactors().size() <= 1;
    }

    /** Index arithmetic such as {@code 2*k + 1} runs in sums' inner loops: keep it on plain rationals. */
    private static Expression numbers(Operator op, Rational a, Rational b, Span span) {
        return Values.constant(switch (op) {
            case ADD -> a.add(b);
            case SUBTRACT -> a.subtract(b);
            case MULTIPLY -> a.multiply(b);
            case DIVIDE -> {
                if (b.isZero()) {
                    throw new ContourException("division by zero", span);
                }
                yield a.divide(b);
            }
            case POWER -> throw new IllegalArgumentException("powers take the general path");
        });
    }

    private static Value terms(Operator op, Term a, Value right, Span span, EvaluationLimits limits) {
        Term b = term(right);
        Term result = switch (op) {
            case ADD -> new Term.Sum(List.of(a, b));
            case SUBTRACT -> new Term.Sum(List.of(a, new Term.Product(List.of(Terms.of(Expression.constant(-1)), b))));
            case MULTIPLY -> new Term.Product(List.of(a, b));
            case DIVIDE -> {
                if (right instanceof ExprValue e && e.value().isZero()) {
                    throw new ContourException("division by zero", span);
                }
                yield new Term.Product(List.of(a, new Term.Power(b, -1)));
            }
            case POWER -> new Term.Power(a, exponent(right, span, limits));
        };
        return fromTerm(result);
    }

    private static int exponent(Value v, Span span, EvaluationLimits limits) {
        if (!(v instanceof ExprValue e) || !e.value().isConstant()) {
            throw new ContourException("exponents must be integers, not " + Values.describe(v), span);
        }
        int n = Values.integer(v, span, "the exponent");
        if (Math.abs((long) n) > limits.maxExponent()) {
            throw new ContourException("exponent " + n + " is past the limit of " + limits.maxExponent(), span);
        }
        return n;
    }
}
