package dev.contour.picture;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.mellin.GammaPoleLines;
import dev.contour.mellin.MellinMeasure;
import dev.contour.mellin.Pole;
import dev.contour.mellin.PoleAnalysis;
import dev.contour.mellin.Residues;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Builds a {@link PoleMap} from the analyses: the amplitude's poles from {@link PoleAnalysis},
 * residues from {@link Residues}, the measure's lines from {@link GammaPoleLines}. Nothing here
 * finds a pole by itself; it only places what the analyses report.
 */
public final class PoleMapBuilder {
    private PoleMapBuilder() { }

    /** The most measure pole lines of one Gamma factor looked at (far beyond any window in use). */
    private static final int MAX_GAMMA_INDEX = 400;

    /**
     * The pole map of {@code amplitude} with measure {@code m}.
     *
     * @param window {low, high} for both axes, or null to fit the amplitude's poles
     * @param contour {Re s, Re t} of a straight contour, or null
     */
    public static PoleMap build(String title, Expression amplitude, MellinMeasure m, Rational[] window, Rational[] contour) {
        String s = m.s();
        String t = m.t();
        PoleAnalysis.Result poles = PoleAnalysis.of(amplitude, m.poleForms(), m.variables());
        Map<Polynomial, int[]> orderAndDegree = new LinkedHashMap<>();
        Map<Polynomial, Pole> byFactor = new LinkedHashMap<>();
        for (Map.Entry<Monomial, List<Pole>> e : poles.byMonomial().entrySet()) {
            RationalFunction coefficient = amplitude.coefficient(e.getKey());
            for (Pole p : e.getValue()) {
                int degree = residueDegree(coefficient, p, s, t);
                byFactor.putIfAbsent(p.factor(), p);
                orderAndDegree.merge(p.factor(), new int[] {p.order(), degree}, (x, y) -> new int[] {
                        Math.max(x[0], y[0]), x[1] < 0 || y[1] < 0 ? -1 : Math.max(x[1], y[1])});
            }
        }
        List<PoleMap.Line> lines = new ArrayList<>();
        for (Pole p : poles.all()) {
            int[] od = orderAndDegree.get(p.factor());
            lines.add(amplitudeLine(p, m, od[0], od[1]));
        }
        Rational low;
        Rational high;
        if (window != null) {
            low = window[0];
            high = window[1];
            if (low.compareTo(high) >= 0) {
                throw new ContourException("pole_map: the window {low, high} needs low < high, got {" + low + ", " + high + "}");
            }
        } else {
            Rational[] fit = fit(lines, contour);
            low = fit[0];
            high = fit[1];
        }
        for (GammaPoleLines.Line g : GammaPoleLines.of(m, MAX_GAMMA_INDEX)) {
            if (crosses(g.a(), g.b(), g.c(), low, high)) {
                lines.add(new PoleMap.Line(PoleMap.Channel.MEASURE, g.a(), g.b(), g.c(), g.order(), 0,
                        "Gamma(" + g.argument() + ") at " + g.argument() + " = " + (-g.n())));
            }
        }
        List<double[]> region = List.of();
        if (contour != null) {
            for (PoleMap.Line l : lines) {
                if (side(l, contour) == 0) {
                    throw new ContourException("pole_map: the contour Re " + s + " = " + contour[0] + ", Re " + t + " = " + contour[1]
                            + " lies on the pole line " + l.label() + "; move it off the line");
                }
            }
            region = cell(lines, contour, low, high);
        }
        return new PoleMap(title, s, t, m.u(), low, high, lines, contour, region);
    }

    /** The degree in the other variable of the residue of one coefficient on a pole line, -1 when not polynomial. */
    static int residueDegree(RationalFunction coefficient, Pole p, String s, String t) {
        Polynomial f = p.factor();
        String along = f.degree(s) == 1 ? s : t;
        String other = along.equals(s) ? t : s;
        RationalFunction r = Residues.residueAtFactor(coefficient, along, f);
        if (!r.isPolynomial()) {
            return -1;
        }
        return r.isZero() ? 0 : r.numerator().degree(other);
    }

    private static PoleMap.Line amplitudeLine(Pole p, MellinMeasure m, int order, int degree) {
        Polynomial f = p.factor();
        Rational a = linear(f, m.s());
        Rational b = linear(f, m.t());
        Polynomial rest = f.substitute(Map.of(m.s(), Polynomial.ZERO, m.t(), Polynomial.ZERO));
        if (!rest.isConstant()) {
            throw new ContourException("pole_map: the pole " + p.describe() + " depends on " + rest.variables()
                    + "; give numbers for every parameter to draw it");
        }
        Rational c = rest.isZero() ? Rational.ZERO : rest.constantValue().negate();
        PoleMap.Channel channel = p.form() == null ? PoleMap.Channel.OTHER
                : p.form().equals(m.s()) ? PoleMap.Channel.S
                : p.form().equals(m.t()) ? PoleMap.Channel.T : PoleMap.Channel.U;
        return new PoleMap.Line(channel, a, b, c, order, degree, p.describe());
    }

    private static Rational linear(Polynomial p, String v) {
        Polynomial c = p.coefficient(v, 1);
        return c.isZero() ? Rational.ZERO : c.constantValue();
    }

    /** A window holding every amplitude line's crossing with the axes and the contour, with a margin of 2. */
    private static Rational[] fit(List<PoleMap.Line> lines, Rational[] contour) {
        Rational low = Rational.ZERO;
        Rational high = Rational.of(4);
        List<Rational> marks = new ArrayList<>();
        for (PoleMap.Line l : lines) {
            if (!l.a().isZero()) {
                marks.add(l.c().divide(l.a()));
            }
            if (!l.b().isZero()) {
                marks.add(l.c().divide(l.b()));
            }
        }
        if (contour != null) {
            marks.add(contour[0]);
            marks.add(contour[1]);
        }
        for (Rational x : marks) {
            low = x.compareTo(low) < 0 ? x : low;
            high = x.compareTo(high) > 0 ? x : high;
        }
        Rational two = Rational.of(2);
        return new Rational[] {floor(low.subtract(two)), floor(high.add(two)).add(Rational.ONE)};
    }

    private static Rational floor(Rational x) {
        return Rational.of(new java.math.BigDecimal(x.numerator()).divide(new java.math.BigDecimal(x.denominator()),
                0, java.math.RoundingMode.FLOOR).longValueExact());
    }

    /** Whether {@code a s + b t = c} meets the square [low, high]^2 (corners on both sides, or on it). */
    private static boolean crosses(Rational a, Rational b, Rational c, Rational low, Rational high) {
        int above = 0;
        int below = 0;
        for (Rational x : new Rational[] {low, high}) {
            for (Rational y : new Rational[] {low, high}) {
                int sign = a.multiply(x).add(b.multiply(y)).subtract(c).signum();
                if (sign >= 0) {
                    above++;
                }
                if (sign <= 0) {
                    below++;
                }
            }
        }
        return above > 0 && below > 0;
    }

    /** The sign of {@code a s + b t - c} at the point. */
    static int side(PoleMap.Line l, Rational[] point) {
        return l.a().multiply(point[0]).add(l.b().multiply(point[1])).subtract(l.c()).signum();
    }

    /** The convex cell of the arrangement that holds the point: the window clipped by each line's half-plane. */
    private static List<double[]> cell(List<PoleMap.Line> lines, Rational[] point, Rational low, Rational high) {
        double lo = low.doubleValue();
        double hi = high.doubleValue();
        List<double[]> polygon = new ArrayList<>(List.of(new double[] {lo, lo}, new double[] {hi, lo},
                new double[] {hi, hi}, new double[] {lo, hi}));
        for (PoleMap.Line l : lines) {
            int keep = side(l, point);
            double a = l.a().doubleValue();
            double b = l.b().doubleValue();
            double c = l.c().doubleValue();
            List<double[]> next = new ArrayList<>();
            for (int i = 0; i < polygon.size(); i++) {
                double[] p = polygon.get(i);
                double[] q = polygon.get((i + 1) % polygon.size());
                double fp = keep * (a * p[0] + b * p[1] - c);
                double fq = keep * (a * q[0] + b * q[1] - c);
                if (fp >= 0) {
                    next.add(p);
                }
                if ((fp > 0 && fq < 0) || (fp < 0 && fq > 0)) {
                    double r = fp / (fp - fq);
                    next.add(new double[] {p[0] + r * (q[0] - p[0]), p[1] + r * (q[1] - p[1])});
                }
            }
            polygon = next;
        }
        return polygon;
    }
}
