package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;

/** Conversions between values with located errors. */
public final class Values {
    private Values() { }

    /** The value as an int; {@code what} names it in the error. */
    public static int integer(Value v, Span span, String what) {
        Rational r = rational(v, span, what);
        if (r.fitsInt()) {
            return r.intValueExact();
        }
        if (!r.isInteger()) {
            throw new ContourException(what + " must be an integer, not " + r, span);
        }
        if (r.numerator().bitLength() > 31) {
            throw new ContourException(what + " is too large (" + r + ")", span);
        }
        return r.intValueExact();
    }

    /** The value as an exact number. */
    public static Rational rational(Value v, Span span, String what) {
        if (v instanceof ExprValue e && e.value().isConstant()) {
            return e.value().constantValue();
        }
        throw new ContourException(what + " must be a number, not " + describe(v), span);
    }

    /** "the expression s + t", "a function", ... for messages. */
    public static String describe(Value v) {
        if (v instanceof ExprValue) {
            return "a symbolic expression";
        }
        String k = v.kind();
        return (k.matches("^[aeiou].*") ? "an " : "a ") + k;
    }

    // Wide enough for the index arithmetic of weights in the hundreds (2*p - 2 + 2*k and the like).
    private static final int CACHED_MIN = -4096;
    private static final ExprValue[] SMALL = new ExprValue[4096 - CACHED_MIN];

    /** Wraps an exact integer (small ones are shared: sums and loops bind indices to them constantly). */
    public static ExprValue of(long n) {
        if (n >= CACHED_MIN && n < CACHED_MIN + SMALL.length) {
            int i = (int) (n - CACHED_MIN);
            ExprValue v = SMALL[i];
            if (v == null) {
                v = new ExprValue(Expression.constant(n));
                SMALL[i] = v;
            }
            return v;
        }
        return new ExprValue(Expression.constant(n));
    }

    /** The constant expression with value r, shared for small integers. */
    static Expression constant(Rational r) {
        if (r.fitsInt()) {
            return of(r.intValueExact()).value();
        }
        return Expression.constant(r);
    }
}
