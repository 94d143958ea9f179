package dev.contour.solve;

import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * The equal-weight AdS5xS5 reduced-amplitude ansatz as pieces, built by hand: for each unknown
 * a[i,j,k] (i + j + k = p - 2) the function R-hat(sigma^i tau^j / ((s-2p+2+2k)(t-2p+2+2j)(u~-2p+2+2i)))
 * it multiplies in M = R-hat M~, written directly in factored form from the six terms of R
 * (physics reference section 4).
 *
 * <p>Test scope on purpose: it is a second, independent construction of what a script builds with
 * the rule library's ward(p) (the dictionary of dev.contour.mellin, then the solver's reading of an
 * uncollected operator application), so the two can be compared equation for equation.
 */
public final class SupergravityAnsatz implements Constraint.PieceSource {
    /** (m, n, coefficient of U^m V^n in R as {sigma exponent, tau exponent, coefficient} triples). */
    private static final int[][][] R = {
        {{0, 0}, {0, 1, 1}},
        {{0, 1}, {0, 0, 1}, {1, 0, -1}, {0, 1, -1}},
        {{1, 0}, {0, 2, 1}, {0, 1, -1}, {1, 1, -1}},
        {{1, 1}, {2, 0, 1}, {1, 0, -1}, {1, 1, -1}},
        {{0, 2}, {1, 0, 1}},
        {{2, 0}, {1, 1, 1}},
    };
    private static final List<String> VARS = List.of("s", "t");

    private final int p;
    private final List<int[]> ijk = new ArrayList<>();
    /** sigma^a tau^b for a + b <= p, shared by all pieces. */
    private final Monomial[][] monomials;

    public SupergravityAnsatz(int p) {
        if (p < 2) {
            throw new dev.contour.ContourException("the weight must be at least 2, got " + p);
        }
        this.p = p;
        for (int i = 0; i <= p - 2; i++) {
            for (int j = 0; i + j <= p - 2; j++) {
                ijk.add(new int[] {i, j, p - 2 - i - j});
            }
        }
        monomials = new Monomial[p + 1][];
        for (int a = 0; a <= p; a++) {
            monomials[a] = new Monomial[p + 1 - a];
            for (int b = 0; a + b <= p; b++) {
                monomials[a][b] = monomial(a, b);
            }
        }
    }

    public int weight() {
        return p;
    }

    /** Unknown names a[i,j,k], in column order. */
    public List<String> unknowns() {
        return ijk.stream().map(a -> "a[" + a[0] + "," + a[1] + "," + a[2] + "]").toList();
    }

    @Override
    public List<String> variables() {
        return VARS;
    }

    @Override
    public int count() {
        return ijk.size();
    }

    @Override
    public Piece piece(int index) {
        int i = ijk.get(index)[0];
        int j = ijk.get(index)[1];
        int k = ijk.get(index)[2];
        List<Monomial> ms = new ArrayList<>();
        List<FactoredTerm> ts = new ArrayList<>();
        for (int[][] entry : R) {
            int m = entry[0][0];
            int n = entry[0][1];
            List<LinearForm> forms = new ArrayList<>();
            List<Integer> exps = new ArrayList<>();
            // ((2p - s)/2)_m^2 ((2p - t)/2)_n^2 ((2p - u)/2)_{2-m-n}^2 with u = 4p - s - t
            // (2p + 2l - s)^2 = (s - 2p - 2l)^2: written monic, so no rescaling is needed later
            for (int l = 0; l < m; l++) {
                forms.add(form(1, 0, -2 * p - 2 * l));
                exps.add(2);
            }
            for (int l = 0; l < n; l++) {
                forms.add(form(0, 1, -2 * p - 2 * l));
                exps.add(2);
            }
            for (int l = 0; l < 2 - m - n; l++) {
                forms.add(form(1, 1, -2 * p + 2 * l));
                exps.add(2);
            }
            // M~(s - 2m, t - 2n): poles s = 2p-2-2k+2m, t = 2p-2-2j+2n, s + t = 2p-2+2i+2m+2n
            forms.add(form(1, 0, -(2 * p - 2 - 2 * k + 2 * m)));
            exps.add(-1);
            forms.add(form(0, 1, -(2 * p - 2 - 2 * j + 2 * n)));
            exps.add(-1);
            // 2p - 2 + 2i + 2m + 2n - s - t = -(s + t - ...): monic, with the sign in the coefficient
            forms.add(form(1, 1, -(2 * p - 2 + 2 * i + 2 * m + 2 * n)));
            exps.add(-1);
            // 2^-2 per Pochhammer factor pair (each form is 2x the Pochhammer factor), and -1 from the u pole
            Rational scale = Rational.of(-1, 1L << (2 * 2));
            for (int c = 1; c < entry.length; c++) {
                FactoredTerm t = FactoredTerm.of(scale.multiply(Rational.of(entry[c][2])), forms, exps, null);
                if (t != null) {
                    ms.add(monomials[i + entry[c][0]][j + entry[c][1]]);
                    ts.add(t);
                }
            }
        }
        return new Piece(index, ms, ts);
    }

    /** Residues at s, t, u = 2, 4, ..., 2p - 2 polynomial, simple poles only (physics reference section 4). */
    public Constraint residueConstraint(dev.contour.Span span) {
        Set<Rational> allowed = new HashSet<>();
        for (int c = 2; c <= 2 * p - 2; c += 2) {
            allowed.add(Rational.of(c));
        }
        var s = dev.contour.algebra.Polynomial.variable("s");
        var t = dev.contour.algebra.Polynomial.variable("t");
        var u = dev.contour.algebra.Polynomial.constant(4L * p).subtract(s).subtract(t);
        List<Constraint.Poles> poles = List.of(new Constraint.Poles("s", s, allowed),
                new Constraint.Poles("t", t, allowed), new Constraint.Poles("u", u, allowed));
        return Constraint.onPieces(this, new Constraint.ResiduesPolynomial(poles, true), span,
                "residues of M polynomial at p = " + p);
    }

    /** Forms shared by all pieces, so equation keys compare by identity first. */
    private final java.util.concurrent.ConcurrentHashMap<java.util.List<Long>, LinearForm> forms =
            new java.util.concurrent.ConcurrentHashMap<>();

    private LinearForm form(long a, long b, long c) {
        return forms.computeIfAbsent(java.util.List.of(a, b, c), k -> LinearForm.ofIntegers(c, a, b));
    }

    private static Monomial monomial(int sigma, int tau) {
        Map<String, Integer> e = new TreeMap<>();
        if (sigma != 0) {
            e.put("sigma", sigma);
        }
        if (tau != 0) {
            e.put("tau", tau);
        }
        return Monomial.of(e);
    }
}
