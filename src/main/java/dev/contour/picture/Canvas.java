package dev.contour.picture;

import java.util.List;

/**
 * What a drawing needs from an output format: lines with a dash pattern, filled polygons, text and
 * small marks, in pixel coordinates with y growing downward. {@link SvgCanvas} and
 * {@link PngCanvas} implement it, so both formats show the same picture.
 */
interface Canvas {
    /** A stroke: an RGB colour (0xRRGGBB), a width in pixels, and a dash pattern (empty for solid). */
    record Pen(int rgb, double width, double[] dashes) { }

    /** How text is anchored at its point. */
    enum Anchor { START, MIDDLE, END }

    void line(double x1, double y1, double x2, double y2, Pen pen);

    void polygon(List<double[]> corners, int rgb, double opacity, Pen outline);

    void rectangle(double x, double y, double w, double h, int fillRgb, Pen outline);

    void text(double x, double y, String text, double size, int rgb, Anchor anchor, boolean bold);

    /** A diamond of the given half-diagonal, filled, with a white outline so it shows over lines. */
    void diamond(double x, double y, double r, int rgb);
}
