package dev.contour.picture;

import java.util.List;
import java.util.Locale;

/** A {@link Canvas} that writes SVG 1.1 text (a small writer of our own: elements, attributes, escaping). */
final class SvgCanvas implements Canvas {
    private final StringBuilder body = new StringBuilder();
    private final int width;
    private final int height;
    private final String title;

    SvgCanvas(int width, int height, String title) {
        this.width = width;
        this.height = height;
        this.title = title;
    }

    @Override
    public void line(double x1, double y1, double x2, double y2, Pen pen) {
        body.append("  <line x1=\"").append(n(x1)).append("\" y1=\"").append(n(y1)).append("\" x2=\"").append(n(x2))
                .append("\" y2=\"").append(n(y2)).append('"').append(stroke(pen)).append("/>\n");
    }

    @Override
    public void polygon(List<double[]> corners, int rgb, double opacity, Pen outline) {
        if (corners.size() < 3) {
            return;
        }
        StringBuilder points = new StringBuilder();
        for (double[] c : corners) {
            points.append(points.length() == 0 ? "" : " ").append(n(c[0])).append(',').append(n(c[1]));
        }
        body.append("  <polygon points=\"").append(points).append("\" fill=\"").append(colour(rgb))
                .append("\" fill-opacity=\"").append(n(opacity)).append('"')
                .append(outline == null ? " stroke=\"none\"" : stroke(outline)).append("/>\n");
    }

    @Override
    public void rectangle(double x, double y, double w, double h, int fillRgb, Pen outline) {
        body.append("  <rect x=\"").append(n(x)).append("\" y=\"").append(n(y)).append("\" width=\"").append(n(w))
                .append("\" height=\"").append(n(h)).append("\" fill=\"").append(fillRgb < 0 ? "none" : colour(fillRgb)).append('"')
                .append(outline == null ? " stroke=\"none\"" : stroke(outline)).append("/>\n");
    }

    @Override
    public void text(double x, double y, String text, double size, int rgb, Anchor anchor, boolean bold) {
        body.append("  <text x=\"").append(n(x)).append("\" y=\"").append(n(y)).append("\" font-family=\"DejaVu Sans, sans-serif\" font-size=\"")
                .append(n(size)).append("\" fill=\"").append(colour(rgb)).append('"')
                .append(anchor == Anchor.START ? "" : " text-anchor=\"" + (anchor == Anchor.MIDDLE ? "middle" : "end") + "\"")
                .append(bold ? " font-weight=\"bold\"" : "").append('>').append(escape(text)).append("</text>\n");
    }

    @Override
    public void diamond(double x, double y, double r, int rgb) {
        body.append("  <polygon points=\"").append(n(x)).append(',').append(n(y - r)).append(' ').append(n(x + r)).append(',').append(n(y))
                .append(' ').append(n(x)).append(',').append(n(y + r)).append(' ').append(n(x - r)).append(',').append(n(y))
                .append("\" fill=\"").append(colour(rgb)).append("\" stroke=\"#ffffff\" stroke-width=\"1.5\"/>\n");
    }

    /** The whole document. */
    String document() {
        return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
                + "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"" + width + "\" height=\"" + height
                + "\" viewBox=\"0 0 " + width + " " + height + "\">\n"
                + "  <title>" + escape(title) + "</title>\n"
                + body + "</svg>\n";
    }

    private static String stroke(Pen pen) {
        StringBuilder b = new StringBuilder(" stroke=\"" + colour(pen.rgb()) + "\" stroke-width=\"" + n(pen.width()) + "\"");
        if (pen.dashes().length > 0) {
            b.append(" stroke-dasharray=\"");
            for (int i = 0; i < pen.dashes().length; i++) {
                b.append(i == 0 ? "" : ",").append(n(pen.dashes()[i]));
            }
            b.append('"');
        }
        return b.toString();
    }

    static String colour(int rgb) {
        return String.format(Locale.ROOT, "#%06x", rgb & 0xffffff);
    }

    private static String n(double x) {
        String s = String.format(Locale.ROOT, "%.2f", x);
        s = s.contains(".") ? s.replaceAll("0+$", "").replaceAll("\\.$", "") : s;
        return s.equals("-0") ? "0" : s;
    }

    static String escape(String s) {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                default -> {
                    if (c < 0x20 && c != '\t' && c != '\n') {
                        b.append(' ');
                    } else {
                        b.append(c);
                    }
                }
            }
        }
        return b.toString();
    }
}
