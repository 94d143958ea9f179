package dev.contour.numeric;

import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
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
public record NumberValue(NumericResult result, boolean showError) implements Value {
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
        String claim = result.digits() + " digits" + (showError ? ", error <= " + errorText() : "");
        return switch (format) {
            case PLAIN -> digitsText() + " (" + claim + ")";
            case LATEX -> digitsText().replace(" i", "\\,i") + "\\ " + LatexPrinter.text("(" + claim + ")");
            case JSON -> "{\"kind\":\"number\",\"value\":" + JsonPrinter.string(digitsText()) + ",\"digits\":" + result.digits()
                    + ",\"error\":" + JsonPrinter.string(errorText()) + "}";
        };
    }
}
