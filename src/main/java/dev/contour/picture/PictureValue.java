package dev.contour.picture;

import dev.contour.eval.OutputFormat;
import dev.contour.eval.Value;
import dev.contour.print.JsonPrinter;
import dev.contour.print.LatexPrinter;

import java.nio.file.Path;
import java.util.List;

/**
 * A pole map as a value of the language: {@code show} prints its summary (one row per amplitude
 * line), a derivation report draws it as a figure, {@code draw(P, "file.svg")} writes it.
 *
 * @param written the files this value was written to, in order (empty when not written)
 */
public record PictureValue(PoleMap map, List<Path> written) implements Value {
    public PictureValue {
        written = List.copyOf(written);
    }

    @Override
    public String kind() {
        return "pole map";
    }

    @Override
    public String render(OutputFormat format) {
        String text = map.summary() + (written.isEmpty() ? "" : "\n    written to " + String.join(", ",
                written.stream().map(Path::toString).toList()));
        return switch (format) {
            case PLAIN -> text;
            case LATEX -> LatexPrinter.text(text);
            case JSON -> jsonOf();
        };
    }

    private String jsonOf() {
        StringBuilder b = new StringBuilder("{\"kind\":\"pole map\",\"title\":" + JsonPrinter.string(map.title())
                + ",\"window\":[" + JsonPrinter.string(map.low().toString()) + "," + JsonPrinter.string(map.high().toString()) + "],\"lines\":[");
        boolean first = true;
        for (PoleMap.Line l : map.lines()) {
            b.append(first ? "" : ",").append("{\"channel\":").append(JsonPrinter.string(l.channel().name().toLowerCase(java.util.Locale.ROOT)))
                    .append(",\"line\":").append(JsonPrinter.string(l.label())).append(",\"order\":").append(l.order());
            if (l.channel() != PoleMap.Channel.MEASURE) {
                b.append(",\"residueDegree\":").append(l.residueDegree() < 0 ? "null" : String.valueOf(l.residueDegree()));
            }
            b.append('}');
            first = false;
        }
        b.append(']');
        if (map.contour() != null) {
            b.append(",\"contour\":[").append(JsonPrinter.string(map.contour()[0].toString())).append(',')
                    .append(JsonPrinter.string(map.contour()[1].toString())).append(']');
        }
        b.append(",\"written\":[").append(String.join(",", written.stream().map(p -> JsonPrinter.string(p.toString())).toList()))
                .append("]}");
        return b.toString();
    }
}
