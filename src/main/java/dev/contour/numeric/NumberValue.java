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
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;

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
     * The result claiming at most the requested digits. The value keeps its guard digits (it is
     * rounded only when printed, see {@link NumericResult#shown()}), so a number used again in
     * arithmetic loses nothing to rounding.
     */
    public static NumberValue of(NumericResult r, int requested, boolean showError) {
        return new NumberValue(r.capped(requested), showError);
    }

    @Override
    public String kind() {
        return "number";
    }

    /** The digits as printed, {@code a} or {@code a + b i}: the value rounded (not cut) to its claim. */
    public String digitsText() {
        return result.shownText();
    }

    /**
     * The stated error to two digits, rounded up, such as {@code 3.1e-18}: it bounds the distance from
     * the printed digits to the true value (the computed bound plus what rounding to the claim moved).
     */
    public String errorText() {
        return Magnitudes.errorText(result.shown().errorEstimate());
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

    /** An operand: its value, its claimed digits (Integer.MAX_VALUE when exact) and its absolute error bound. */
    private record Operand(Apcomplex value, int digits, double log10Error) {
        boolean exact() {
            return digits == Integer.MAX_VALUE;
        }
    }

    /** The unrounded value and its bound: arithmetic works with these, so it does not pay for printed rounding. */
    private Operand operand() {
        return new Operand(result.value(), result.digits(), Magnitudes.log10Abs(result.errorEstimate()));
    }

    /** The value as printed and its stated error (bound plus rounding): what a comparison allows. */
    private Operand stated() {
        NumericResult shown = result.shown();
        return new Operand(result.value(), result.digits(), Magnitudes.log10Abs(shown.errorEstimate()));
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
     * Whether this number and {@code other} (a number, an exact rational or a complex point) agree:
     * their distance is within the sum of their stated errors (each the printed error, which covers the
     * rounding of the printed digits; an exact value has none). Null when other is of another kind.
     */
    @Override
    public Boolean agreesWith(Value other) {
        Operand me = stated();
        long precision = Math.max(workingDigits(result.value()), other instanceof NumberValue n ? workingDigits(n.result.value()) : 0) + 20;
        Operand you = other instanceof NumberValue n ? n.stated() : operand(other, precision);
        if (you == null) {
            return null;
        }
        Apcomplex d = me.value().precision(precision).subtract(you.value().precision(precision));
        if (d.isZero()) {
            return true;
        }
        // The subtraction at this precision is itself off by at most one unit in its last place.
        double rounding = Math.max(Magnitudes.log10Abs(me.value()), Magnitudes.log10Abs(you.value())) - precision + 1;
        double allowed = Magnitudes.log10Sum(Magnitudes.log10Sum(me.log10Error(), you.log10Error()), rounding);
        return Magnitudes.log10Abs(d) <= allowed;
    }

    private static long workingDigits(Apcomplex v) {
        long p = v.precision();
        return p == Apcomplex.INFINITE ? 0 : p;
    }

    /**
     * Numbers combine with numbers, exact rationals and complex points: + - * / and integer powers.
     * The result claims the smaller of the operands' digits; a sum or difference claims fewer when
     * it cancels (the digits its absolute error leaves), a power n loses log10 |n| digits.
     */
    @Override
    public Value combine(Expr.Operator op, Value other, boolean thisOnLeft, Span span) {
        long precision = Math.max(workingDigits(result.value()), result.digits()) + 20L;
        if (other instanceof NumberValue n) {
            precision = Math.max(precision, Math.max(workingDigits(n.result.value()), n.result.digits()) + 20L);
        }
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
            if (k == 0) {
                return rounded(v, result.digits(), Double.NEGATIVE_INFINITY, precision, showError);
            }
            // |(x + e)^k - x^k| <= |x|^k ((1 + r)^k - 1) with r = e/|x|; for k r < 1/2 this is at most 2 k r |x|^k.
            double r = me.log10Error() - Magnitudes.log10Abs(me.value());
            double kr = r + Math.log10(Math.abs(k));
            if (kr > Math.log10(0.5)) {
                return rounded(v, 0, Magnitudes.log10Abs(v), precision, true);
            }
            return rounded(v, result.digits(), kr + Math.log10(2) + Magnitudes.log10Abs(v), precision, showError);
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
                return rounded(v, digits, Magnitudes.log10Sum(left.log10Error(), right.log10Error()), precision, error);
            }
            case MULTIPLY: {
                Apcomplex v = a.multiply(b);
                return rounded(v, digits, relative(left, right, false) + Magnitudes.log10Abs(v), precision, error);
            }
            case DIVIDE: {
                if (b.isZero()) {
                    throw new ContourException("division by zero" + (right.exact() ? "" : ": the divisor is zero to its claimed precision"), span);
                }
                double rel = relative(left, right, true);
                if (rel == Double.POSITIVE_INFINITY) {
                    throw new ContourException("division by a number that may be zero: its error bound is as large as its value", span);
                }
                Apcomplex v = a.divide(b);
                return rounded(v, digits, rel + Magnitudes.log10Abs(v), precision, error);
            }
            default:
                return null;
        }
    }

    /**
     * log10 of the relative error of a product or quotient. With relative errors a, b of the operands
     * a product is off by at most a + b + ab, a quotient by at most (a + b)/(1 - b) (common practice).
     * Positive infinity when a divisor's relative error reaches 1/2.
     */
    private static double relative(Operand x, Operand y, boolean quotient) {
        double a = x.log10Error() - Magnitudes.log10Abs(x.value());
        double b = y.log10Error() - Magnitudes.log10Abs(y.value());
        double sum = Magnitudes.log10Sum(a, b);
        if (quotient) {
            if (b > Math.log10(0.5)) {
                return Double.POSITIVE_INFINITY;
            }
            double oneMinusB = b == Double.NEGATIVE_INFINITY ? 0 : Math.log10(1 - Math.pow(10, b));
            return sum - oneMinusB;
        }
        return a == Double.NEGATIVE_INFINITY || b == Double.NEGATIVE_INFINITY ? sum : Magnitudes.log10Sum(sum, a + b);
    }

    /**
     * A computed number: {@code v} (at {@code precision} working digits) with absolute error at most
     * {@code 10^log10Error} from the operands, plus one unit in the last working place for the
     * arithmetic itself; it claims at most {@code digits} digits and no more than the error allows.
     */
    private static NumberValue rounded(Apcomplex v, int digits, double log10Error, long precision, boolean showError) {
        if (digits == Integer.MAX_VALUE) {
            throw new IllegalStateException("an exact result is not a number value");
        }
        double arithmetic = v.isZero() ? Double.NEGATIVE_INFINITY : Magnitudes.log10Abs(v) - precision + 1;
        double err = Magnitudes.log10Sum(Double.isNaN(log10Error) ? Double.NEGATIVE_INFINITY : log10Error, arithmetic);
        NumericResult r = NumericResult.of(v, err, digits);
        // With no digit left (full cancellation) only the error says anything: show it.
        return new NumberValue(r, showError || r.digits() == 0);
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
        return Magnitudes.log10Abs(result.value()) <= Magnitudes.log10Abs(result.shown().errorEstimate());
    }
}
