package dev.contour.numeric;

import dev.contour.algebra.Rational;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.print.JsonPrinter;
import org.apfloat.Apcomplex;

/** An exact complex point {@code re + im i} with rational parts, made by {@code complex(re, im)}. */
public record ComplexValue(Rational re, Rational im) implements Value {
    @Override
    public String kind() {
        return "complex number";
    }

    /** The point to {@code precision} significant digits. */
    public Apcomplex at(long precision) {
        return new Apcomplex(PointEvaluation.rational(re, precision), PointEvaluation.rational(im, precision));
    }

    @Override
    public String render(OutputFormat format) {
        String text = "complex(" + re + ", " + im + ")";
        return switch (format) {
            case PLAIN -> text;
            case LATEX -> re + (im.signum() < 0 ? " - " + im.negate() : " + " + im) + "\\,i";
            case JSON -> "{\"kind\":\"complex number\",\"re\":" + JsonPrinter.string(re.toString())
                    + ",\"im\":" + JsonPrinter.string(im.toString()) + "}";
        };
    }
}
