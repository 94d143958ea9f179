package dev.contour.picture;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.util.List;

/** A {@link Canvas} that paints into an image with java.awt (headless: no display is needed). */
final class PngCanvas implements Canvas {
    private final BufferedImage image;
    private final Graphics2D g;

    PngCanvas(int width, int height, double scale) {
        image = new BufferedImage((int) Math.round(width * scale), (int) Math.round(height * scale), BufferedImage.TYPE_INT_RGB);
        g = image.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
        g.scale(scale, scale);
    }

    @Override
    public void line(double x1, double y1, double x2, double y2, Pen pen) {
        apply(pen);
        g.draw(new Line2D.Double(x1, y1, x2, y2));
    }

    @Override
    public void polygon(List<double[]> corners, int rgb, double opacity, Pen outline) {
        if (corners.size() < 3) {
            return;
        }
        Path2D.Double path = new Path2D.Double();
        path.moveTo(corners.get(0)[0], corners.get(0)[1]);
        for (int i = 1; i < corners.size(); i++) {
            path.lineTo(corners.get(i)[0], corners.get(i)[1]);
        }
        path.closePath();
        g.setColor(new Color((rgb >> 16) & 0xff, (rgb >> 8) & 0xff, rgb & 0xff, (int) Math.round(255 * opacity)));
        g.fill(path);
        if (outline != null) {
            apply(outline);
            g.draw(path);
        }
    }

    @Override
    public void rectangle(double x, double y, double w, double h, int fillRgb, Pen outline) {
        Rectangle2D.Double r = new Rectangle2D.Double(x, y, w, h);
        if (fillRgb >= 0) {
            g.setColor(new Color(fillRgb));
            g.fill(r);
        }
        if (outline != null) {
            apply(outline);
            g.draw(r);
        }
    }

    @Override
    public void text(double x, double y, String text, double size, int rgb, Anchor anchor, boolean bold) {
        g.setFont(new Font(Font.SANS_SERIF, bold ? Font.BOLD : Font.PLAIN, 1).deriveFont((float) size));
        double w = g.getFontMetrics().getStringBounds(text, g).getWidth();
        double at = anchor == Anchor.START ? x : anchor == Anchor.MIDDLE ? x - w / 2 : x - w;
        g.setColor(new Color(rgb));
        g.drawString(text, (float) at, (float) y);
    }

    @Override
    public void diamond(double x, double y, double r, int rgb) {
        Path2D.Double path = new Path2D.Double();
        path.moveTo(x, y - r);
        path.lineTo(x + r, y);
        path.lineTo(x, y + r);
        path.lineTo(x - r, y);
        path.closePath();
        g.setColor(new Color(rgb));
        g.fill(path);
        apply(new Pen(0xffffff, 1.5, new double[0]));
        g.draw(path);
    }

    private void apply(Pen pen) {
        g.setColor(new Color(pen.rgb()));
        float[] dashes = new float[pen.dashes().length];
        for (int i = 0; i < dashes.length; i++) {
            dashes[i] = (float) pen.dashes()[i];
        }
        g.setStroke(dashes.length == 0 ? new BasicStroke((float) pen.width(), BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER)
                : new BasicStroke((float) pen.width(), BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, dashes, 0f));
    }

    BufferedImage finish() {
        g.dispose();
        return image;
    }
}
