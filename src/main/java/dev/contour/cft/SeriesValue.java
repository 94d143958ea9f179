package dev.contour.cft;

import dev.contour.algebra.Rational;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;

/** An exact double series in z, zbar to a total degree, as a value of the language. */
public record SeriesValue(DoubleSeries series) implements Value {
    /** Terms printed in plain text and LaTeX before the rest is summarised by a count. */
    public static final int SHOWN = 60;

    @Override
    public String kind() {
        return "z, zbar series";
    }

    @Override
    public String render(OutputFormat format) {
        List<DoubleSeries.Entry> terms = series.terms();
        if (format == OutputFormat.JSON) {
            List<String> items = new ArrayList<>();
            for (DoubleSeries.Entry e : terms) {
                items.add("{\"z\":" + e.i() + ",\"zbar\":" + e.j() + ",\"c\":" + JsonPrinter.string(e.coefficient().toString()) + "}");
            }
            return "{\"kind\":\"z-series\",\"order\":" + series.order() + ",\"terms\":[" + String.join(",", items) + "]}";
        }
        boolean latex = format == OutputFormat.LATEX;
        List<String> parts = new ArrayList<>();
        for (int k = 0; k < Math.min(SHOWN, terms.size()); k++) {
            DoubleSeries.Entry e = terms.get(k);
            Rational c = e.coefficient();
            String mono = (e.i() == 0 ? "" : latex ? "z^{" + e.i() + "}" : "z^" + e.i())
                    + (e.i() > 0 && e.j() > 0 ? (latex ? " " : "*") : "")
                    + (e.j() == 0 ? "" : latex ? "\\bar z^{" + e.j() + "}" : "zbar^" + e.j());
            String num = latex ? LatexPrinter.rational(c) : PlainPrinter.rational(c);
            parts.add(mono.isEmpty() ? num : (c.isOne() ? mono : c.equals(Rational.MINUS_ONE) ? "-" + mono : num + (latex ? " " : "*") + mono));
        }
        String body = parts.isEmpty() ? "0" : String.join(" + ", parts).replace("+ -", "- ");
        String more = terms.size() > SHOWN ? " + ... (" + (terms.size() - SHOWN) + " more terms)" : "";
        return body + more + (latex ? " + O(z^{" + (series.order() + 1) + "})" : " + O(degree " + (series.order() + 1) + ")");
    }
}
