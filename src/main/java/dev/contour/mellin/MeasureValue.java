package dev.contour.mellin;

import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.algebra.Polynomial;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;

/** A Mellin measure as a value of the language, made by {@code mellin_measure(...)}. */
public record MeasureValue(MellinMeasure measure) implements dev.contour.eval.FormsValue {
    /** s, t, and the eliminated variable as {@code total - s - t} (when the measure has one): for {@code show M in m}. */
    @Override
    public List<dev.contour.print.FormView.Form> forms() {
        List<dev.contour.print.FormView.Form> out = new ArrayList<>();
        for (NamedForm f : measure.poleForms()) {
            out.add(new dev.contour.print.FormView.Form(f.name(), f.form()));
        }
        return out;
    }

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
            case LATEX -> latex();
            case JSON -> "{\"kind\":\"Mellin measure\",\"text\":" + JsonPrinter.string(text) + "}";
        };
    }

    /**
     * The Gamma product and the kernel, {@code \Gamma(x)^{2} ... \, U^{s/2} V^{t/2 - p}}, followed by the
     * eliminated variable's constraint when there is one.
     */
    private String latex() {
        StringBuilder b = new StringBuilder();
        for (GammaPower g : measure.factors()) {
            b.append(b.length() == 0 ? "" : " ").append("\\Gamma\\left(").append(LatexPrinter.polynomial(g.argument()))
                    .append("\\right)").append(g.exponent() == 1 ? "" : "^{" + g.exponent() + "}");
        }
        b.append(b.length() == 0 ? "" : "\\,").append(" U^{").append(LatexPrinter.polynomial(measure.uExponent()))
                .append("} V^{").append(LatexPrinter.polynomial(measure.vExponent())).append("}");
        if (measure.u() != null) {
            Polynomial u = measure.sum().subtract(Polynomial.variable(measure.s())).subtract(Polynomial.variable(measure.t()));
            b.append(",\\quad ").append(LatexPrinter.polynomial(Polynomial.variable(measure.u()))).append(" = ")
                    .append(LatexPrinter.polynomial(u));
        }
        return b.toString();
    }
}
