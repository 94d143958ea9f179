package dev.contour.picture;

import dev.contour.algebra.Rational;

import java.util.List;

/**
 * What a pole map shows: the real (s, t) plane in a square window, the amplitude's pole lines by
 * channel with their orders and residue degrees, the measure's Gamma pole lines, and optionally
 * the point where a chosen straight contour crosses the real plane with the cell of the line
 * arrangement it lies in. Built by {@link PoleMapBuilder} from the analyses; drawn by
 * {@link PoleMapDrawing}. All positions are exact; only the drawing turns them into pixels.
 *
 * @param title a caption (the amplitude's source text, say)
 * @param s the first Mellin variable's name (horizontal axis)
 * @param t the second Mellin variable's name (vertical axis)
 * @param u the eliminated variable's name, or null when the measure has none
 * @param low the window's lower end, on both axes
 * @param high the window's upper end, on both axes
 * @param lines every line, amplitude lines first
 * @param contour the contour's real parts (Re s, Re t), or null
 * @param region the corners of the cell holding the contour point, counter-clockwise; empty when no contour
 */
public record PoleMap(String title, String s, String t, String u, Rational low, Rational high, List<Line> lines,
                      Rational[] contour, List<double[]> region) {
    public PoleMap {
        lines = List.copyOf(lines);
        region = List.copyOf(region);
        contour = contour == null ? null : contour.clone();
    }

    @Override
    public Rational[] contour() {
        return contour == null ? null : contour.clone();
    }

    /** Which family a line belongs to; each family has its own colour and dash pattern. */
    public enum Channel { S, T, U, OTHER, MEASURE }

    /**
     * The line {@code a s + b t = c}.
     *
     * @param label how the line is named: {@code s = 2}, {@code u = 4}, or the Gamma argument's pole
     * @param order the pole's order (for measure lines: the power of the Gamma function, summed over coinciding factors)
     * @param residueDegree the largest degree of a residue on the line in the other variable,
     *                      -1 when some residue is not polynomial, 0 for measure lines (not computed)
     */
    public record Line(Channel channel, Rational a, Rational b, Rational c, int order, int residueDegree, String label) { }

    /** The amplitude's lines (every channel but the measure's). */
    public List<Line> amplitudeLines() {
        return lines.stream().filter(l -> l.channel() != Channel.MEASURE).toList();
    }

    /** The measure's Gamma pole lines. */
    public List<Line> measureLines() {
        return lines.stream().filter(l -> l.channel() == Channel.MEASURE).toList();
    }

    /** A text summary, one amplitude line per row (what {@code show} prints for a pole map). */
    public String summary() {
        StringBuilder b = new StringBuilder("pole map of " + title + " on " + low + " <= " + s + ", " + t + " <= " + high + ": ");
        List<Line> amp = amplitudeLines();
        b.append(amp.size()).append(amp.size() == 1 ? " amplitude pole line, " : " amplitude pole lines, ")
                .append(measureLines().size()).append(" measure pole lines");
        if (contour != null) {
            b.append(", contour at Re ").append(s).append(" = ").append(contour[0]).append(", Re ").append(t).append(" = ").append(contour[1]);
        }
        for (Line l : amp) {
            b.append("\n    ").append(l.label()).append("  order ").append(l.order()).append(", residue ")
                    .append(l.residueDegree() < 0 ? "not polynomial" : "degree " + l.residueDegree());
        }
        return b.toString();
    }
}
