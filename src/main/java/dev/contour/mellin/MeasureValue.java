package dev.contour.mellin;

import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.print.JsonPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;

/** A Mellin measure as a value of the language, made by {@code mellin_measure(...)}. */
public record MeasureValue(MellinMeasure measure) implements Value {
    @Override
    public String kind() {
        return "Mellin measure";
    }

    @Override
    public String render(OutputFormat format) {
        List<String> gammas = new ArrayList<>();
        for (GammaPower g : measure.factors()) {
            gammas.add("{" + PlainPrinter.polynomial(g.argument()) + ", " + g.exponent() + "}");
        }
        String kernel = "{" + PlainPrinter.polynomial(measure.uExponent()) + ", " + PlainPrinter.polynomial(measure.vExponent()) + "}";
        String text = "mellin_measure(gamma: {" + String.join(", ", gammas) + "}, kernel: " + kernel
                + (measure.u() == null ? "" : ", eliminate: " + measure.u() + ", total: " + PlainPrinter.polynomial(measure.sum())) + ")";
        return switch (format) {
            case PLAIN -> text;
            case LATEX -> "\\text{" + text + "}";
            case JSON -> "{\"kind\":\"Mellin measure\",\"text\":" + JsonPrinter.string(text) + "}";
        };
    }
}
