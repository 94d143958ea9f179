package dev.contour.numeric;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.mellin.GammaPower;
import java.util.ArrayList;
import java.util.List;

/**
 * Straight contours that separate the poles of a measure's Gamma factors: the point (Re s, Re t)
 * where the smallest real part of the arguments of the Gamma factors in the numerator is largest.
 * There every Gamma(a + s) has its poles to the left and every Gamma(b - s) to the right, as far
 * from the contour as a straight line allows (the Barnes contour of the integral, common practice).
 *
 * <p>The choice is exact: maximising min_i Re l_i(x, y) is a small linear programme, solved by
 * visiting the vertices of {m <= l_i(x, y)} (with |x|, |y| <= 1000 and, when the maximum is
 * unbounded, m <= 1/2, so a half-unbounded gap gets a contour half a unit from its edge, as
 * {@link MellinBarnes#separatingContour} does in one variable).
 *
 * <p>The amplitude's own poles take part (the prescription of measure and amplitude together): a
 * pole of the amplitude along a form on which the measure has Gamma poles lies on the same side as
 * those, as exchange poles and double-trace poles of one channel are both picked up when the
 * s-contour is closed for that channel's OPE (common practice for Mellin amplitudes). A pole {@code f = 0} along
 * Gamma(g) with g = lambda f + const therefore enters as one more form lambda f that must keep a
 * positive real part. A pole along no Gamma factor, or along Gamma factors with poles on both
 * sides, has no such rule and is refused by name.
 */
final class ContourChoice {
    private ContourChoice() { }

    private static final Rational BOUND = Rational.of(1000);
    private static final Rational UNBOUNDED = Rational.of(1_000_000);

    /** A constraint p x + q y + r m + c >= 0. */
    private record Row(Rational p, Rational q, Rational r, Rational c) {
        Rational at(Rational x, Rational y, Rational m) {
            return p.multiply(x).add(q.multiply(y)).add(r.multiply(m)).add(c);
        }
    }

    /** A pole of the amplitude: {@code factor = 0} (linear in the Mellin variables), and how to name it. */
    record AmplitudePole(Polynomial factor, String name) { }

    /** The contour {Re s} or {Re s, Re t} (t null for one variable); ContourException when none separates the poles. */
    static Rational[] choose(List<GammaPower> factors, String s, String t) {
        return choose(factors, List.of(), s, t);
    }

    /**
     * The contour for the measure's Gamma factors and the amplitude's poles together; a
     * ContourException naming the pole when an amplitude pole has no side by the rule above.
     */
    static Rational[] choose(List<GammaPower> factors, List<AmplitudePole> poles, String s, String t) {
        List<Row> forms = new ArrayList<>();
        List<String> described = new ArrayList<>();
        for (AmplitudePole pole : poles) {
            Polynomial f = pole.factor();
            Rational p = coefficient(f, s);
            Rational q = t == null ? Rational.ZERO : coefficient(f, t);
            if (p.signum() == 0 && q.signum() == 0) {
                continue;
            }
            Rational lambda = null;
            List<String> along = new ArrayList<>();
            boolean bothSides = false;
            for (GammaPower g : factors) {
                if (g.exponent() <= 0) {
                    continue;
                }
                Rational a = coefficient(g.argument(), s);
                Rational b = t == null ? Rational.ZERO : coefficient(g.argument(), t);
                // (a, b) = l (p, q)?
                if (a.multiply(q).compareTo(b.multiply(p)) != 0 || a.signum() == 0 && b.signum() == 0) {
                    continue;
                }
                Rational l = p.signum() != 0 ? a.divide(p) : b.divide(q);
                along.add("Gamma(" + g.argument() + ")");
                if (lambda == null) {
                    lambda = l;
                } else if (lambda.signum() != l.signum()) {
                    bothSides = true;
                }
            }
            if (lambda == null) {
                throw new ContourException("the amplitude's pole at " + pole.name() + " lies along no Gamma factor of the measure,"
                        + " so no rule says on which side of the contour it belongs; give contour: explicitly");
            }
            if (bothSides) {
                throw new ContourException("the amplitude's pole at " + pole.name() + " lies along " + String.join(" and ", along)
                        + ", whose poles lie on both sides, so no rule says on which side of the contour it belongs; give contour: explicitly");
            }
            Rational c = f.evaluate(zeros(f));
            forms.add(new Row(lambda.multiply(p), lambda.multiply(q), Rational.of(-1), lambda.multiply(c)));
            described.add("the pole at " + pole.name());
        }
        for (GammaPower g : factors) {
            if (g.exponent() <= 0) {
                continue; // a Gamma in the denominator has no poles
            }
            Polynomial a = g.argument();
            Rational p = coefficient(a, s);
            Rational q = t == null ? Rational.ZERO : coefficient(a, t);
            Rational c = a.evaluate(zeros(a));
            if (p.signum() == 0 && q.signum() == 0) {
                continue;
            }
            forms.add(new Row(p, q, Rational.of(-1), c));
            described.add("Gamma(" + a + ")");
        }
        if (forms.isEmpty()) {
            return t == null ? new Rational[] {Rational.ZERO} : new Rational[] {Rational.ZERO, Rational.ZERO};
        }
        Rational[] best = solve(forms, t != null, UNBOUNDED);
        // Unbounded: the best point sits on the cap of m or on the box |x|, |y| <= 1000 (where m could grow further).
        if (best[2].compareTo(UNBOUNDED) >= 0 || best[0].abs().compareTo(BOUND) == 0 || best[1].abs().compareTo(BOUND) == 0) {
            best = solve(forms, t != null, Rational.of(1, 2));
        }
        if (best[2].signum() <= 0) {
            throw new ContourException("no straight contour separates the poles of " + String.join(", ", described)
                    + ": the Gamma arguments (and the amplitude's poles, each on the side of the measure's along it) cannot all be placed at once"
                    + " (the best gives min Re = " + best[2] + "); give contour: explicitly or deform the integral");
        }
        return t == null ? new Rational[] {best[0]} : new Rational[] {best[0], best[1]};
    }

    /** {x, y, m} maximising m; among equal maxima the one nearest the origin, then the first found. */
    private static Rational[] solve(List<Row> forms, boolean two, Rational cap) {
        List<Row> rows = new ArrayList<>(forms);
        Rational zero = Rational.ZERO;
        Rational one = Rational.ONE;
        rows.add(new Row(zero, zero, one.negate(), cap));
        rows.add(new Row(one, zero, zero, BOUND));
        rows.add(new Row(one.negate(), zero, zero, BOUND));
        if (two) {
            rows.add(new Row(zero, one, zero, BOUND));
            rows.add(new Row(zero, one.negate(), zero, BOUND));
        }
        Rational[] best = null;
        int n = rows.size();
        if (two) {
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    for (int k = j + 1; k < n; k++) {
                        best = better(best, vertex3(rows.get(i), rows.get(j), rows.get(k)), rows);
                    }
                }
            }
        } else {
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    best = better(best, vertex2(rows.get(i), rows.get(j)), rows);
                }
            }
        }
        return best;
    }

    private static Rational[] better(Rational[] best, Rational[] v, List<Row> rows) {
        if (v == null) {
            return best;
        }
        for (Row r : rows) {
            if (r.at(v[0], v[1], v[2]).signum() < 0) {
                return best;
            }
        }
        if (best == null) {
            return v;
        }
        int c = v[2].compareTo(best[2]);
        if (c > 0 || c == 0 && norm(v).compareTo(norm(best)) < 0) {
            return v;
        }
        return best;
    }

    private static Rational norm(Rational[] v) {
        return v[0].abs().add(v[1].abs());
    }

    /** Where two constraints of (x, m) are active (y = 0). */
    private static Rational[] vertex2(Row a, Row b) {
        Rational det = a.p.multiply(b.r).subtract(a.r.multiply(b.p));
        if (det.signum() == 0) {
            return null;
        }
        Rational x = a.c.negate().multiply(b.r).subtract(a.r.multiply(b.c.negate())).divide(det);
        Rational m = a.p.multiply(b.c.negate()).subtract(a.c.negate().multiply(b.p)).divide(det);
        return new Rational[] {x, Rational.ZERO, m};
    }

    /** Where three constraints of (x, y, m) are active (Cramer's rule). */
    private static Rational[] vertex3(Row a, Row b, Row c) {
        Rational[][] m = {{a.p, a.q, a.r}, {b.p, b.q, b.r}, {c.p, c.q, c.r}};
        Rational[] rhs = {a.c.negate(), b.c.negate(), c.c.negate()};
        Rational det = det(m);
        if (det.signum() == 0) {
            return null;
        }
        Rational[] out = new Rational[3];
        for (int col = 0; col < 3; col++) {
            Rational[][] k = new Rational[3][];
            for (int row = 0; row < 3; row++) {
                k[row] = m[row].clone();
                k[row][col] = rhs[row];
            }
            out[col] = det(k).divide(det);
        }
        return out;
    }

    private static Rational det(Rational[][] m) {
        return m[0][0].multiply(m[1][1].multiply(m[2][2]).subtract(m[1][2].multiply(m[2][1])))
                .subtract(m[0][1].multiply(m[1][0].multiply(m[2][2]).subtract(m[1][2].multiply(m[2][0]))))
                .add(m[0][2].multiply(m[1][0].multiply(m[2][1]).subtract(m[1][1].multiply(m[2][0]))));
    }

    private static Rational coefficient(Polynomial p, String variable) {
        Polynomial c = p.coefficient(variable, 1);
        return c.isZero() ? Rational.ZERO : c.constantValue();
    }

    private static java.util.Map<String, Rational> zeros(Polynomial p) {
        java.util.Map<String, Rational> z = new java.util.HashMap<>();
        for (String v : p.variables()) {
            z.put(v, Rational.ZERO);
        }
        return z;
    }
}
