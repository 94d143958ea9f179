package dev.contour.picture;

import dev.contour.algebra.Rational;

import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;

/**
 * Lays a {@link PoleMap} out on a {@link Canvas}: a square plot of the real (s, t) plane on the
 * left, a legend and a table of the amplitude's lines on the right.
 *
 * <p>Contour's own picture style. Channels differ by colour and by dash pattern, so the map reads
 * in grey print and for colour-blind readers: s poles solid dark blue, t poles long-dashed orange,
 * u poles dash-dotted plum, other linear poles short-dashed charcoal, the measure's Gamma poles
 * thin grey dots. A line's width grows with its order. The cell holding the contour is shaded
 * pale gold and the contour's point is a black diamond.
 */
public final class PoleMapDrawing {
    /** The picture's size in (SVG) pixels. */
    public static final int WIDTH = 880;
    public static final int HEIGHT = 560;
    /** The plot square: left edge, top edge and side, in pixels. */
    public static final double LEFT = 64;
    public static final double TOP = 52;
    public static final double SIDE = 440;
    /** The background colour (white). */
    public static final int BACKGROUND = 0xffffff;

    private static final double LEGEND = 548;
    private static final int INK = 0x222222;
    private static final int GRID = 0xe4e4e4;
    private static final int REGION = 0xf2dc7d;
    private static final int MAX_TABLE_ROWS = 16;

    private final PoleMap map;
    private final double low;
    private final double high;

    public PoleMapDrawing(PoleMap map) {
        this.map = map;
        this.low = map.low().doubleValue();
        this.high = map.high().doubleValue();
    }

    /** The horizontal pixel of {@code s} (SVG pixels; a PNG drawn at scale k has it at k times this). */
    public double x(double s) {
        return LEFT + (s - low) / (high - low) * SIDE;
    }

    /** The vertical pixel of {@code t}. */
    public double y(double t) {
        return TOP + SIDE - (t - low) / (high - low) * SIDE;
    }

    /** The picture as an SVG document. */
    public String svg() {
        SvgCanvas c = new SvgCanvas(WIDTH, HEIGHT, map.title());
        draw(c);
        return c.document();
    }

    /** The picture as an image, {@code scale} image pixels per SVG pixel. */
    public BufferedImage image(double scale) {
        PngCanvas c = new PngCanvas(WIDTH, HEIGHT, scale);
        draw(c);
        return c.finish();
    }

    /** The pen each family of lines is drawn with, widened by the order. */
    static Canvas.Pen pen(PoleMap.Channel channel, int order) {
        return switch (channel) {
            case S -> new Canvas.Pen(0x1f4f9e, 1.8 + 1.4 * (order - 1), new double[0]);
            case T -> new Canvas.Pen(0xd2700c, 1.8 + 1.4 * (order - 1), new double[] {10, 5});
            case U -> new Canvas.Pen(0x8a3a88, 1.8 + 1.4 * (order - 1), new double[] {10, 4, 2, 4});
            case OTHER -> new Canvas.Pen(0x3a3a3a, 1.8 + 1.4 * (order - 1), new double[] {4, 4});
            case MEASURE -> new Canvas.Pen(0x8c8c8c, 0.9 + 0.7 * (order - 1), new double[] {1.5, 3.5});
        };
    }

    private void draw(Canvas c) {
        c.rectangle(0, 0, WIDTH, HEIGHT, BACKGROUND, null);
        c.text(LEFT, 24, "Poles of " + shorten(map.title(), 70) + " in the real (" + map.s() + ", " + map.t() + ") plane", 14, INK, Canvas.Anchor.START, true);
        grid(c);
        if (!map.region().isEmpty()) {
            List<double[]> corners = new ArrayList<>();
            map.region().forEach(p -> corners.add(new double[] {x(p[0]), y(p[1])}));
            c.polygon(corners, REGION, 0.55, null);
        }
        for (PoleMap.Line l : map.measureLines()) {
            segment(c, l);
        }
        for (PoleMap.Line l : map.amplitudeLines()) {
            double[] seg = segment(c, l);
            if (seg != null) {
                label(c, l, seg);
            }
        }
        if (map.contour() != null) {
            Rational[] p = map.contour();
            c.diamond(x(p[0].doubleValue()), y(p[1].doubleValue()), 7, 0x000000);
        }
        c.rectangle(LEFT, TOP, SIDE, SIDE, -1, new Canvas.Pen(INK, 1.2, new double[0]));
        legend(c);
    }

    private void grid(Canvas c) {
        double step = niceStep((high - low) / 8);
        Canvas.Pen gridPen = new Canvas.Pen(GRID, 1, new double[0]);
        for (double v = Math.ceil(low / step) * step; v <= high + 1e-9; v += step) {
            c.line(x(v), TOP, x(v), TOP + SIDE, gridPen);
            c.line(LEFT, y(v), LEFT + SIDE, y(v), gridPen);
            c.text(x(v), TOP + SIDE + 16, number(v), 11, INK, Canvas.Anchor.MIDDLE, false);
            c.text(LEFT - 6, y(v) + 4, number(v), 11, INK, Canvas.Anchor.END, false);
        }
        Canvas.Pen axis = new Canvas.Pen(0xb0b0b0, 1.2, new double[0]);
        if (low < 0 && high > 0) {
            c.line(x(0), TOP, x(0), TOP + SIDE, axis);
            c.line(LEFT, y(0), LEFT + SIDE, y(0), axis);
        }
        c.text(LEFT + SIDE / 2, TOP + SIDE + 36, "Re " + map.s(), 13, INK, Canvas.Anchor.MIDDLE, true);
        c.text(LEFT - 40, TOP + SIDE / 2, "Re " + map.t(), 13, INK, Canvas.Anchor.MIDDLE, true);
    }

    /** Draws the part of the line inside the plot; returns its end points {x1, y1, x2, y2} in pixels, or null. */
    private double[] segment(Canvas c, PoleMap.Line l) {
        double[] seg = clip(l.a().doubleValue(), l.b().doubleValue(), l.c().doubleValue());
        if (seg != null) {
            c.line(x(seg[0]), y(seg[1]), x(seg[2]), y(seg[3]), pen(l.channel(), l.order()));
            return new double[] {x(seg[0]), y(seg[1]), x(seg[2]), y(seg[3])};
        }
        return null;
    }

    /** The line a s + b t = c cut to the window, as {s1, t1, s2, t2}, or null when it misses it. */
    double[] clip(double a, double b, double c) {
        List<double[]> hits = new ArrayList<>();
        for (double edge : new double[] {low, high}) {
            if (b != 0) {
                double t = (c - a * edge) / b;
                if (t >= low - 1e-9 && t <= high + 1e-9) {
                    add(hits, new double[] {edge, t});
                }
            }
            if (a != 0) {
                double s = (c - b * edge) / a;
                if (s >= low - 1e-9 && s <= high + 1e-9) {
                    add(hits, new double[] {s, edge});
                }
            }
        }
        if (hits.size() < 2) {
            return null;
        }
        double[] p = hits.get(0);
        double[] q = hits.get(1);
        return new double[] {p[0], p[1], q[0], q[1]};
    }

    private static void add(List<double[]> hits, double[] p) {
        for (double[] h : hits) {
            if (Math.abs(h[0] - p[0]) < 1e-9 && Math.abs(h[1] - p[1]) < 1e-9) {
                return;
            }
        }
        hits.add(p);
    }

    /** The line's short name beside its end: above the plot for s lines, right of it for t lines. */
    private void label(Canvas c, PoleMap.Line l, double[] seg) {
        String text = l.label().replace(" ", "") + (l.residueDegree() < 0 ? "*" : "");
        int rgb = pen(l.channel(), 1).rgb();
        switch (l.channel()) {
            case S -> c.text(seg[1] < seg[3] ? seg[0] : seg[2], TOP - 5, text, 10, rgb, Canvas.Anchor.MIDDLE, true);
            case T -> c.text(LEFT + SIDE + 4, (seg[0] > seg[2] ? seg[1] : seg[3]) + 4, text, 10, rgb, Canvas.Anchor.START, true);
            default -> {
                // the end nearer the lower right, just inside the plot
                boolean first = seg[0] - seg[1] > seg[2] - seg[3];
                double px = first ? seg[0] : seg[2];
                double py = first ? seg[1] : seg[3];
                c.text(Math.min(px, LEFT + SIDE - 4) - 3, Math.min(py, TOP + SIDE - 4) - 3, text, 10, rgb, Canvas.Anchor.END, true);
            }
        }
    }

    private void legend(Canvas c) {
        double yy = TOP + 4;
        c.text(LEGEND, yy, "Legend", 13, INK, Canvas.Anchor.START, true);
        yy += 20;
        List<Object[]> keys = new ArrayList<>();
        boolean[] seen = new boolean[PoleMap.Channel.values().length];
        map.lines().forEach(l -> seen[l.channel().ordinal()] = true);
        String u = map.u() == null ? "u" : map.u();
        if (seen[PoleMap.Channel.S.ordinal()]) {
            keys.add(new Object[] {PoleMap.Channel.S, map.s() + "-channel poles of the amplitude"});
        }
        if (seen[PoleMap.Channel.T.ordinal()]) {
            keys.add(new Object[] {PoleMap.Channel.T, map.t() + "-channel poles of the amplitude"});
        }
        if (seen[PoleMap.Channel.U.ordinal()]) {
            keys.add(new Object[] {PoleMap.Channel.U, u + "-channel poles of the amplitude"});
        }
        if (seen[PoleMap.Channel.OTHER.ordinal()]) {
            keys.add(new Object[] {PoleMap.Channel.OTHER, "other linear poles"});
        }
        if (seen[PoleMap.Channel.MEASURE.ordinal()]) {
            keys.add(new Object[] {PoleMap.Channel.MEASURE, "Gamma poles of the measure"});
        }
        for (Object[] k : keys) {
            c.line(LEGEND, yy - 4, LEGEND + 34, yy - 4, pen((PoleMap.Channel) k[0], 1));
            c.text(LEGEND + 42, yy, (String) k[1], 11, INK, Canvas.Anchor.START, false);
            yy += 17;
        }
        c.text(LEGEND, yy, "wider line: higher order; * residue not polynomial", 10, INK, Canvas.Anchor.START, false);
        yy += 17;
        if (map.contour() != null) {
            c.rectangle(LEGEND, yy - 11, 34, 12, REGION, null);
            c.text(LEGEND + 42, yy, "cell the contour passes", 11, INK, Canvas.Anchor.START, false);
            yy += 17;
            c.diamond(LEGEND + 17, yy - 4, 6, 0x000000);
            Rational[] p = map.contour();
            c.text(LEGEND + 42, yy, "contour: Re " + map.s() + " = " + p[0] + ", Re " + map.t() + " = " + p[1], 11, INK, Canvas.Anchor.START, false);
            yy += 17;
        }
        yy += 10;
        List<PoleMap.Line> amp = map.amplitudeLines();
        c.text(LEGEND, yy, "amplitude line", 11, INK, Canvas.Anchor.START, true);
        c.text(LEGEND + 130, yy, "order", 11, INK, Canvas.Anchor.START, true);
        c.text(LEGEND + 178, yy, "residue deg.", 11, INK, Canvas.Anchor.START, true);
        yy += 16;
        int rows = 0;
        for (PoleMap.Line l : amp) {
            if (rows == MAX_TABLE_ROWS && amp.size() > MAX_TABLE_ROWS + 1) {
                c.text(LEGEND, yy, "... and " + (amp.size() - rows) + " more (see show)", 11, INK, Canvas.Anchor.START, false);
                break;
            }
            c.text(LEGEND, yy, shorten(l.label(), 20), 11, pen(l.channel(), 1).rgb(), Canvas.Anchor.START, true);
            c.text(LEGEND + 130, yy, String.valueOf(l.order()), 11, INK, Canvas.Anchor.START, false);
            c.text(LEGEND + 178, yy, l.residueDegree() < 0 ? "not polynomial" : String.valueOf(l.residueDegree()), 11, INK,
                    Canvas.Anchor.START, false);
            yy += 15;
            rows++;
        }
        if (amp.isEmpty()) {
            c.text(LEGEND, yy, "(none in this amplitude)", 11, INK, Canvas.Anchor.START, false);
        }
    }

    private static String shorten(String s, int n) {
        return s.length() <= n ? s : s.substring(0, n - 3) + "...";
    }

    private static double niceStep(double raw) {
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[] {1, 2, 5, 10}) {
            if (m * p >= raw) {
                return Math.max(m * p, 1);
            }
        }
        return Math.max(10 * p, 1);
    }

    private static String number(double v) {
        return Math.abs(v - Math.rint(v)) < 1e-9 ? String.valueOf((long) Math.rint(v)) : String.valueOf(v);
    }
}
