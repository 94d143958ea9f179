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
    static String describe(Value v) {
        if (v instanceof ExprValue) {
            return "a symbolic expression";
        }
        String k = v.kind();
        return (k.matches("^[aeiou].*") ? "an " : "a ") + k;
    }

    /** Wraps an exact integer. */
    public static ExprValue of(long n) {
        return new ExprValue(Expression.constant(n));
    }
}
