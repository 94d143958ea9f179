package dev.contour.cft;

import dev.contour.algebra.Rational;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;
import dev.contour.print.PlainPrinter;

import java.util.ArrayList;
import java.util.List;

/** A small-U expansion as a value of the language, made by {@code small_u(...)}. */
public record UExpansionValue(SmallUExpansion.Result result) implements Value {
    @Override
    public String kind() {
        return "small-U expansion";
    }

    @Override
    public String render(OutputFormat format) {
        return switch (format) {
            case PLAIN -> plain();
            case LATEX -> latex();
            case JSON -> json();
        };
    }

    private String plain() {
        StringBuilder b = new StringBuilder("small-U expansion: s-contour Re s = " + result.contourS() + " (Re t = " + result.contourT()
                + ") closed on the right" + (result.byChannel() ? ", amplitude poles on their channels' sides" : "")
                + ", powers up to U^" + result.through() + ", w = 1 - V to w^" + result.order() + ":");
        if (result.terms().isEmpty()) {
            b.append("\n    (no poles right of the contour up to that power)");
        }
        for (SmallUExpansion.Term t : result.terms()) {
            b.append("\n    ").append(head(t)).append("  |  ");
            b.append(t.computed() ? series(t.series(), OutputFormat.PLAIN) : "not computed: " + t.note());
        }
        return b.toString();
    }

    private static String head(SmallUExpansion.Term t) {
        String u = "U^" + PlainPrinter.rational(t.power());
        return t.log() == 0 ? u : u + " log(U)" + (t.log() == 1 ? "" : "^" + t.log());
    }

    private static String series(List<Rational> w, OutputFormat f) {
        List<String> parts = new ArrayList<>();
        for (int n = 0; n < w.size(); n++) {
            Rational c = w.get(n);
            if (c.isZero()) {
                continue;
            }
            String num = f == OutputFormat.LATEX ? LatexPrinter.rational(c) : PlainPrinter.rational(c);
            String pow = n == 0 ? "" : f == OutputFormat.LATEX ? (n == 1 ? "\\, w" : "\\, w^{" + n + "}") : (n == 1 ? "*w" : "*w^" + n);
            parts.add(num + pow);
        }
        int n = w.size() - 1;
        String tail = f == OutputFormat.LATEX ? "O(w^{" + (n + 1) + "})" : "O(w^" + (n + 1) + ")";
        parts.add(tail);
        return String.join(" + ", parts).replace("+ -", "- ");
    }

    private String latex() {
        List<String> rows = new ArrayList<>();
        for (SmallUExpansion.Term t : result.terms()) {
            String h = "U^{" + LatexPrinter.rational(t.power()) + "}" + (t.log() == 0 ? "" : " \\log^{" + t.log() + "} U");
            rows.add(h + " &: " + (t.computed() ? series(t.series(), OutputFormat.LATEX) : "\\text{not computed}"));
        }
        return "\\begin{aligned}" + String.join(" \\\\ ", rows) + "\\end{aligned}\\quad (w = 1 - V)";
    }

    private String json() {
        List<String> terms = new ArrayList<>();
        for (SmallUExpansion.Term t : result.terms()) {
            StringBuilder b = new StringBuilder("{\"U\":" + JsonPrinter.string(t.power().toString()) + ",\"log\":" + t.log());
            if (t.computed()) {
                List<String> cs = new ArrayList<>();
                t.series().forEach(c -> cs.add(JsonPrinter.string(c.toString())));
                b.append(",\"one_minus_V\":[").append(String.join(",", cs)).append("]");
            } else {
                b.append(",\"not_computed\":").append(JsonPrinter.string(t.note()));
            }
            terms.add(b.append("}").toString());
        }
        return "{\"kind\":\"small-U expansion\",\"contour\":{\"s\":" + JsonPrinter.string(result.contourS().toString()) + ",\"t\":"
                + JsonPrinter.string(result.contourT().toString()) + "},\"closed\":\"right\",\"sides\":\"" + (result.byChannel() ? "channels" : "contour") + "\",\"through\":"
                + JsonPrinter.string(result.through().toString()) + ",\"order\":" + result.order() + ",\"terms\":[" + String.join(",", terms) + "]}";
    }
}
