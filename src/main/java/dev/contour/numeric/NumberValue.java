package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Rational;
import dev.contour.eval.ExprValue;
import dev.contour.eval.OperandValue;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.lang.Expr;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import java.math.RoundingMode;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;

/**
 * A numerical result as a value of the language: the number to its claimed digits, printed with
 * that claim (and, for integrals, the error estimate behind it) so a printed number never hides
 * its precision.
 */
public record NumberValue(NumericResult result, boolean showError, String note) implements OperandValue {
    public NumberValue(NumericResult result, boolean showError) {
        this(result, showError, null);
    }

    /** The same number with a remark printed beside its claim (such as the contour chosen), or none for null. */
    public NumberValue withNote(String text) {
        return new NumberValue(result, showError, text);
    }

    /**
     * The result shown to at most the requested digits (the guard digits beyond them are rounded away,
     * half to even, so the printed claim is the one the user asked for when it was reached).
     */
    public static NumberValue of(NumericResult r, int requested, boolean showError) {
        int digits = Math.min(r.digits(), requested);
        if (digits == 0 || r.value().isZero()) {
            return new NumberValue(r, showError);
        }
        // Round both parts at the scale of the larger one, so the claim is relative to |value|.
        long scale = r.value().scale();
        long places = digits - scale;
        Apcomplex v = new Apcomplex(round(r.value().real(), places), round(r.value().imag(), places));
        return new NumberValue(new NumericResult(v, digits, r.errorEstimate()), showError);
    }

    private static Apfloat round(Apfloat x, long places) {
        if (x.signum() == 0) {
            return x;
        }
        long keep = x.scale() + places;
        return keep <= 0 ? Apfloat.ZERO : ApfloatMath.round(x, keep, RoundingMode.HALF_EVEN);
    }

    @Override
    public String kind() {
        return "number";
    }

    /** The digits as printed, {@code a} or {@code a + b i}. */
    public String digitsText() {
        return Magnitudes.format(result.value(), Math.max(result.digits(), 1));
    }

    /** The absolute error estimate to two digits, such as {@code 3.1e-18}. */
    public String errorText() {
        return String.format("%.1e", ApcomplexMath.abs(result.errorEstimate()).doubleValue());
    }

    @Override
    public String render(OutputFormat format) {
        String claim = result.digits() + " digits" + (showError ? ", error <= " + errorText() : "")
                + (note == null ? "" : ", " + note);
        return switch (format) {
            case PLAIN -> digitsText() + " (" + claim + ")";
            case LATEX -> digitsText().replace(" i", "\\,i") + "\\ " + LatexPrinter.text("(" + claim + ")");
            case JSON -> "{\"kind\":\"number\",\"value\":" + JsonPrinter.string(digitsText()) + ",\"digits\":" + result.digits()
                    + ",\"error\":" + JsonPrinter.string(errorText())
                    + (note == null ? "" : ",\"note\":" + JsonPrinter.string(note)) + "}";
        };
    }

    // ------------------------------------------------------------------------------ arithmetic

    /** An operand: its value, its claimed digits (Integer.MAX_VALUE when exact) and its absolute error. */
    private record Operand(Apcomplex value, int digits, double log10Error) {
        boolean exact() {
            return digits == Integer.MAX_VALUE;
        }
    }

    private Operand operand() {
        Apcomplex v = result.value();
        // The printed digits are the claim: the error is the larger of the estimate and half a unit in the last claimed place.
        double claimed = v.isZero() ? Double.NEGATIVE_INFINITY : Magnitudes.log10Abs(v) - result.digits() + Math.log10(0.5);
        double estimate = Magnitudes.log10Abs(result.errorEstimate());
        return new Operand(v, result.digits(), Math.max(claimed, estimate));
    }

    private static Operand operand(Value v, long precision) {
        if (v instanceof NumberValue n) {
            return n.operand();
        }
        if (v instanceof ExprValue e && e.value().isConstant()) {
            return new Operand(PointEvaluation.rational(e.value().constantValue(), precision), Integer.MAX_VALUE, Double.NEGATIVE_INFINITY);
        }
        if (v instanceof ComplexValue c) {
            return new Operand(c.at(precision), Integer.MAX_VALUE, Double.NEGATIVE_INFINITY);
        }
        return null;
    }

    /**
     * Numbers combine with numbers, exact rationals and complex points: + - * / and integer powers.
     * The result claims the smaller of the operands' digits; a sum or difference claims fewer when
     * it cancels (the digits its absolute error leaves), a power n loses log10 |n| digits.
     */
    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        long precision = result.digits() + 20L;
        Operand me = operand();
        if (op == Expr.Operator.POWER) {
            if (!thisOnLeft || !(other instanceof ExprValue e) || !e.value().isConstant() || !e.value().constantValue().isInteger()) {
                throw new ContourException("a number to a power: the exponent must be an integer", span);
            }
            Rational n = e.value().constantValue();
            if (n.abs().compareTo(Rational.of(1_000_000)) > 0) {
                throw new ContourException("a number to a power: the exponent " + n + " is too large", span);
            }
            long k = n.numerator().longValue();
            if (me.value().isZero() && k < 0) {
                throw new ContourException("division by zero: a number that is zero to its claimed precision, to a negative power", span);
            }
            Apcomplex v = ApcomplexMath.pow(me.value().precision(precision), k);
            int digits = k == 0 ? result.digits() : (int) Math.max(0, result.digits() - Math.floor(Math.log10(Math.abs(k))));
            return rounded(v, digits, me.log10Error() + Math.log10(Math.max(1, Math.abs(k))) - Magnitudes.log10Abs(me.value())
                    + Magnitudes.log10Abs(v), showError);
        }
        Operand you = operand(other, precision);
        if (you == null) {
            return null;
        }
        Operand left = thisOnLeft ? me : you;
        Operand right = thisOnLeft ? you : me;
        Apcomplex a = left.value().precision(precision);
        Apcomplex b = right.value().precision(precision);
        int digits = Math.min(left.digits(), right.digits());
        boolean error = showError || other instanceof NumberValue n && n.showError();
        switch (op) {
            case ADD, SUBTRACT: {
                Apcomplex v = op == Expr.Operator.ADD ? a.add(b) : a.subtract(b);
                double abs = log10Sum(left.log10Error(), right.log10Error());
                int kept = v.isZero() ? 0 : (int) Math.max(0, Math.floor(Magnitudes.log10Abs(v) - abs - Math.log10(0.5)));
                return rounded(v, Math.min(digits, kept), abs, error);
            }
            case MULTIPLY: {
                Apcomplex v = a.multiply(b);
                return rounded(v, digits, relative(left, right) + Magnitudes.log10Abs(v), error);
            }
            case DIVIDE: {
                if (b.isZero()) {
                    throw new ContourException("division by zero" + (right.exact() ? "" : ": the divisor is zero to its claimed precision"), span);
                }
                Apcomplex v = a.divide(b);
                return rounded(v, digits, relative(left, right) + Magnitudes.log10Abs(v), error);
            }
            default:
                return null;
        }
    }

    /** log10 of the relative error of a product or quotient: the relative errors add. */
    private static double relative(Operand x, Operand y) {
        return log10Sum(x.log10Error() - Magnitudes.log10Abs(x.value()), y.log10Error() - Magnitudes.log10Abs(y.value()));
    }

    private static double log10Sum(double x, double y) {
        if (x == Double.NEGATIVE_INFINITY) {
            return y;
        }
        if (y == Double.NEGATIVE_INFINITY) {
            return x;
        }
        double m = Math.max(x, y);
        return m + Math.log10(Math.pow(10, x - m) + Math.pow(10, y - m));
    }

    private static NumberValue rounded(Apcomplex v, int digits, double log10Error, boolean showError) {
        if (digits == Integer.MAX_VALUE) {
            throw new IllegalStateException("an exact result is not a number value");
        }
        double err = Double.isInfinite(log10Error) || Double.isNaN(log10Error) ? Magnitudes.log10Abs(v) - digits - 1 : log10Error;
        // With no digit left (full cancellation) only the error says anything: show it.
        return NumberValue.of(new NumericResult(v, digits, Magnitudes.pow10(err)), digits, showError || digits == 0);
    }

    @Override
    public Value negate(Span span) {
        return new NumberValue(new NumericResult(result.value().negate(), result.digits(), result.errorEstimate()), showError, note);
    }

    @Override
    public boolean isZero() {
        return result.value().isZero();
    }

    /** Zero when the value lies within its own (absolute) error bound: no claimed digit survives. */
    @Override
    public boolean isZeroToItsPrecision() {
        if (result.value().isZero()) {
            return true;
        }
        return Magnitudes.log10Abs(result.value()) <= Magnitudes.log10Abs(result.errorEstimate());
    }
}
