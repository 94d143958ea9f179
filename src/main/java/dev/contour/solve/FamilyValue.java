package dev.contour.solve;

import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;

/** {@code family(E, sol)}: how many functions a solution leaves, and how many free unknowns only re-express them. */
public record FamilyValue(FunctionRelations.Result result) implements Value {
    @Override
    public String kind() {
        return "family report";
    }

    /** "a one-dimensional family of functions; 3 further free unknowns only re-express it". */
    public String sentence() {
        int d = result.dimension();
        int extra = result.free().size() - d;
        String head = d == 0 ? "a single function" : d == 1 ? "a one-dimensional family of functions"
                : "a " + d + "-dimensional family of functions";
        String free = " (" + result.free().size() + " free unknown" + (result.free().size() == 1 ? "" : "s") + ")";
        if (extra == 0) {
            return head + free;
        }
        return head + "; " + extra + " further free unknown" + (extra == 1 ? " only re-expresses " : "s only re-express ")
                + (d == 1 || d == 0 ? "it" : "them");
    }

    @Override
    public String render(OutputFormat format) {
        return switch (format) {
            case JSON -> "{\"kind\":\"family\",\"functions\":" + result.dimension() + ",\"free\":" + result.free().size()
                    + ",\"basis\":[" + String.join(",", result.basis().stream().map(JsonPrinter::string).toList()) + "]}";
            case LATEX -> LatexPrinter.text(sentence());
            default -> sentence();
        };
    }
}
