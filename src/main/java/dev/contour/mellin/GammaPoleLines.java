package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.List;

/**
 * The pole lines of a measure's Gamma functions: {@code Gamma(a s + b t + c)^k} with k > 0 has
 * poles of order k on the lines {@code a s + b t + c = -n}, n = 0, 1, 2, ... (the double-trace
 * positions when the powers are squares). Lines of equal position from different factors merge,
 * their orders adding.
 */
public final class GammaPoleLines {
    private GammaPoleLines() { }

    /**
     * One pole line {@code a s + b t = c} of the measure, of the given order; {@code factor} is the
     * Gamma argument it comes from and {@code n} the pole's index (argument = -n).
     */
    public record Line(Rational a, Rational b, Rational c, int order, Polynomial argument, int n) { }

    /**
     * The lines with n = 0 .. maxIndex of every Gamma factor with a positive power. Each argument
     * must be a number plus numeric multiples of s and t (a weight still symbolic cannot be drawn).
     */
    public static List<Line> of(MellinMeasure m, int maxIndex) {
        List<Line> out = new ArrayList<>();
        for (GammaPower g : m.factors()) {
            if (g.exponent() <= 0) {
                continue;
            }
            Polynomial x = g.argument();
            for (String v : x.variables()) {
                if (!v.equals(m.s()) && !v.equals(m.t())) {
                    throw new ContourException("the Gamma argument " + x + " mentions '" + v
                            + "', which is not a number: give the measure numeric weights to place its poles");
                }
            }
            Rational a = coefficient(x, m.s());
            Rational b = coefficient(x, m.t());
            if (a.isZero() && b.isZero()) {
                continue; // a constant Gamma factor has no pole line
            }
            Rational c0 = x.substitute(java.util.Map.of(m.s(), Polynomial.ZERO, m.t(), Polynomial.ZERO)).constantValue();
            for (int n = 0; n <= maxIndex; n++) {
                // a s + b t + c0 = -n
                Rational c = Rational.of(-n).subtract(c0);
                merge(out, new Line(a, b, c, g.exponent(), x, n));
            }
        }
        return List.copyOf(out);
    }

    private static void merge(List<Line> lines, Line l) {
        for (int i = 0; i < lines.size(); i++) {
            Line k = lines.get(i);
            // the same line when (a, b, c) are proportional
            Rational r = !k.a().isZero() ? l.a().divide(k.a()) : l.b().divide(k.b());
            if (!r.isZero() && k.a().multiply(r).equals(l.a()) && k.b().multiply(r).equals(l.b()) && k.c().multiply(r).equals(l.c())) {
                lines.set(i, new Line(k.a(), k.b(), k.c(), k.order() + l.order(), k.argument(), k.n()));
                return;
            }
        }
        lines.add(l);
    }

    private static Rational coefficient(Polynomial p, String v) {
        Polynomial c = p.coefficient(v, 1);
        return c.isZero() ? Rational.ZERO : c.constantValue();
    }
}
