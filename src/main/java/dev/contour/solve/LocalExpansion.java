package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.BiConsumer;

/**
 * Laurent coefficients of a factored term along a line (h = the line's monic form) or along rays
 * to infinity (h = 1/scale), as factored terms in the remaining variables.
 *
 * <p>After the substitution every factor is h^offset * (L0 + h L1) with L0, L1 linear in the
 * remaining variables, so the coefficient of h^q is a short sum of products of binomial series
 * coefficients binom(e, r) L0^(e-r) L1^r: the expansion stays in factored form, no common
 * denominator is ever built.
 */
final class LocalExpansion {
    private static final String H = "\u0001h";
    private static final String G = "\u0001g";

    final List<String> from;
    final List<String> to;
    /** Per old variable: its image (over the new space), times h^-1 when ray[i]. */
    private final LinearForm[] base;
    /** Per old variable: the coefficient of h in its image (finite case only). */
    private final LinearForm[] slope;
    private final boolean[] ray;
    private final boolean anyRay;
    /** The eliminated variable of a line expansion (-1 for rays). */
    private final int pivot;

    private LocalExpansion(List<String> from, List<String> to, LinearForm[] base, LinearForm[] slope, boolean[] ray,
                           int pivot) {
        this.pivot = pivot;
        this.from = from;
        this.to = to;
        this.base = base;
        this.slope = slope;
        this.ray = ray;
        boolean any = false;
        for (boolean b : ray) {
            any |= b;
        }
        this.anyRay = any;
    }

    /** Expansion in h = line (a monic form): the line's first variable is eliminated. */
    static LocalExpansion alongLine(List<String> vars, LinearForm line) {
        int p = line.pivot();
        int n = vars.size();
        List<String> to = new ArrayList<>(vars);
        to.remove(p);
        LinearForm[] base = new LinearForm[n];
        LinearForm[] slope = new LinearForm[n];
        LinearForm[] keep = new LinearForm[n];
        for (int i = 0, j = 0; i < n; i++) {
            if (i != p) {
                keep[i] = LinearForm.variable(j++, n - 1);
            }
        }
        // v_p = h - (line - v_p)
        Rational[] rest = new Rational[n - 1];
        for (int i = 0, j = 0; i < n; i++) {
            if (i != p) {
                rest[j++] = line.coefficient(i).negate();
            }
        }
        for (int i = 0; i < n; i++) {
            if (i == p) {
                base[i] = new LinearForm(line.constant.negate(), rest);
                slope[i] = LinearForm.constant(Rational.ONE, n - 1);
            } else {
                base[i] = keep[i];
                slope[i] = LinearForm.constant(Rational.ZERO, n - 1);
            }
        }
        return new LocalExpansion(vars, to, base, slope, new boolean[n], p);
    }

    /**
     * Expansion at infinity along rays in the masked variables: the last masked variable becomes
     * 1/h, every other masked variable x/h, so the coefficient of h^-e is the degree-e part of the
     * large-scale behaviour with the last masked variable set to 1.
     */
    static LocalExpansion alongRays(List<String> vars, boolean[] mask) {
        int n = vars.size();
        int last = -1;
        for (int i = 0; i < n; i++) {
            if (mask[i]) {
                last = i;
            }
        }
        List<String> to = new ArrayList<>(vars);
        to.remove(last);
        LinearForm[] base = new LinearForm[n];
        LinearForm[] slope = new LinearForm[n];
        for (int i = 0, j = 0; i < n; i++) {
            slope[i] = LinearForm.constant(Rational.ZERO, n - 1);
            base[i] = i == last ? LinearForm.constant(Rational.ONE, n - 1) : LinearForm.variable(j++, n - 1);
        }
        return new LocalExpansion(vars, to, base, slope, mask.clone(), -1);
    }

    /** Hands each coefficient of h^q, qlo <= q <= qhi, to out (as factored terms over the new space). */
    void coefficients(FactoredTerm t, int qlo, int qhi, BiConsumer<Integer, FactoredTerm> out) {
        int m = to.size();
        int k = t.size();
        LinearForm[] l0 = new LinearForm[k];
        LinearForm[] l1 = new LinearForm[k];
        int nu = 0;
        for (int i = 0; i < k; i++) {
            LinearForm f = t.forms[i];
            int e = t.exps[i];
            if (anyRay && f.involvesAny(ray)) {
                l0[i] = f.composePart(base, ray, false, m);
                l1[i] = f.composePart(base, negate(ray), true, m);
                nu -= e;
            } else if (anyRay) {
                l0[i] = f.compose(base, m);
                l1[i] = LinearForm.constant(Rational.ZERO, m);
            } else {
                l0[i] = f.compose(base, m);
                l1[i] = f.composePart(slope, all(ray.length), false, m);
            }
            if (l0[i].isZero()) {
                if (l1[i].isZero()) {
                    if (e < 0) {
                        throw new ContourException("a factor vanishes identically on the expansion line");
                    }
                    return;
                }
                nu += e;
            }
        }
        Map<Integer, Polynomial> cof = null;
        if (t.cofactor != null) {
            // along a line only the orders up to qhi - nu can contribute: a short Taylor expansion
            cof = anyRay ? cofactorSeries(t.cofactor) : lineCofactorSeries(t.cofactor, qhi - nu);
            if (cof.isEmpty()) {
                return;
            }
        }
        int cofLow = 0;
        if (cof != null) {
            cofLow = cof.keySet().stream().mapToInt(Integer::intValue).min().orElse(0);
            nu += cofLow;
        }
        int maxR = qhi - nu;
        if (maxR < 0) {
            return;
        }
        if (maxR == 0 && cof == null) {
            emitLeading(t, l0, l1, nu, qlo, out);
            return;
        }
        // series.get(r): the partial products contributing to order nu + r
        List<List<Partial>> series = new ArrayList<>();
        for (int r = 0; r <= maxR; r++) {
            series.add(new ArrayList<>());
        }
        series.get(0).add(new Partial(t.coefficient, new ArrayList<>(), new ArrayList<>(), null));
        for (int i = 0; i < k; i++) {
            int e = t.exps[i];
            if (l0[i].isZero()) {
                LinearForm g = l1[i];
                for (List<Partial> list : series) {
                    list.replaceAll(p -> p.times(Rational.ONE, g, e, null, 0, null));
                }
                continue;
            }
            List<List<Partial>> next = emptySeries(maxR);
            Rational binom = Rational.ONE;
            int top = l1[i].isZero() ? 0 : maxR;
            for (int r = 0; r <= top; r++) {
                if (r > 0) {
                    binom = binom.multiply(Rational.of(e - r + 1, r));
                    if (binom.isZero()) {
                        break;
                    }
                }
                for (int a = 0; a + r <= maxR; a++) {
                    for (Partial p : series.get(a)) {
                        next.get(a + r).add(p.times(binom, l0[i], e - r, l1[i], r, null));
                    }
                }
            }
            series = next;
        }
        if (cof != null) {
            List<List<Partial>> next = emptySeries(maxR);
            for (var c : cof.entrySet()) {
                int j = c.getKey() - cofLow;
                for (int a = 0; a + j <= maxR; a++) {
                    for (Partial p : series.get(a)) {
                        next.get(a + j).add(p.times(Rational.ONE, null, 0, null, 0, c.getValue()));
                    }
                }
            }
            series = next;
        }
        for (int q = Math.max(qlo, nu); q <= qhi; q++) {
            for (Partial p : series.get(q - nu)) {
                FactoredTerm term = FactoredTerm.of(p.coefficient, p.forms, p.exps, p.cofactor);
                if (term != null) {
                    out.accept(q, term);
                }
            }
        }
    }

    /** The common case: only the leading coefficient h^nu is wanted, a single product. */
    private void emitLeading(FactoredTerm t, LinearForm[] l0, LinearForm[] l1, int nu, int qlo,
                             BiConsumer<Integer, FactoredTerm> out) {
        if (nu < qlo) {
            return;
        }
        int k = t.size();
        if (to.isEmpty()) {
            Rational v = t.coefficient;
            for (int i = 0; i < k; i++) {
                LinearForm f = l0[i].isZero() ? l1[i] : l0[i];
                v = v.multiply(f.constant.pow(t.exps[i]));
            }
            out.accept(nu, FactoredTerm.of(v, List.of(), List.of(), null));
            return;
        }
        List<LinearForm> fs = new ArrayList<>(k);
        List<Integer> es = new ArrayList<>(k);
        for (int i = 0; i < k; i++) {
            fs.add(l0[i].isZero() ? l1[i] : l0[i]);
            es.add(t.exps[i]);
        }
        FactoredTerm term = FactoredTerm.of(t.coefficient, fs, es, null);
        if (term != null) {
            out.accept(nu, term);
        }
    }

    private static List<List<Partial>> emptySeries(int maxR) {
        List<List<Partial>> s = new ArrayList<>();
        for (int r = 0; r <= maxR; r++) {
            s.add(new ArrayList<>());
        }
        return s;
    }

    /**
     * The Taylor coefficients of the cofactor in h along the line (the pivot variable replaced by
     * its value on the line plus h, the others unchanged), from the lowest non-zero order up to
     * order limit; empty when every order up to limit vanishes.
     */
    private Map<Integer, Polynomial> lineCofactorSeries(Polynomial cofactor, int limit) {
        Map<Integer, Polynomial> out = new HashMap<>();
        if (limit < 0) {
            return out;
        }
        String x = from.get(pivot);
        Polynomial b = base[pivot].toPolynomial(to);
        int d = cofactor.degree(x);
        Polynomial[] c = new Polynomial[d + 1];
        for (int m = 0; m <= d; m++) {
            c[m] = cofactor.coefficient(x, m);
        }
        boolean bZero = b.isZero();
        for (int j = 0; j <= Math.min(d, limit); j++) {
            // after this pass c[j] is the j-th Taylor coefficient at x = b (repeated synthetic division)
            if (!bZero) {
                for (int m = d - 1; m >= j; m--) {
                    c[m] = c[m].add(c[m + 1].multiply(b));
                }
            }
            if (!c[j].isZero()) {
                out.put(j, c[j]);
            }
        }
        return out;
    }

    private Map<Integer, Polynomial> cofactorSeries(Polynomial cofactor) {
        Map<String, Polynomial> sub = new HashMap<>();
        Polynomial h = Polynomial.variable(H);
        Polynomial g = Polynomial.variable(G);
        for (int i = 0; i < from.size(); i++) {
            Polynomial img = base[i].toPolynomial(to);
            sub.put(from.get(i), ray[i] ? img.multiply(g) : img.add(h.multiply(slope[i].toPolynomial(to))));
        }
        Map<Integer, Polynomial> out = new HashMap<>();
        cofactor.substitute(sub).coefficients(List.of(H, G)).forEach((exps, c) ->
                out.merge(exps.get(0) - exps.get(1), c, Polynomial::add));
        out.values().removeIf(Polynomial::isZero);
        return out;
    }

    private static boolean[] negate(boolean[] m) {
        boolean[] out = new boolean[m.length];
        for (int i = 0; i < m.length; i++) {
            out[i] = !m[i];
        }
        return out;
    }

    private static boolean[] all(int n) {
        boolean[] out = new boolean[n];
        java.util.Arrays.fill(out, true);
        return out;
    }

    /** A product under construction: coefficient, factor powers and the cofactor (null = 1). */
    private record Partial(Rational coefficient, List<LinearForm> forms, List<Integer> exps, Polynomial cofactor) {
        Partial times(Rational c, LinearForm f, int e, LinearForm g, int eg, Polynomial cof) {
            List<LinearForm> fs = new ArrayList<>(forms.size() + 2);
            fs.addAll(forms);
            List<Integer> es = new ArrayList<>(exps.size() + 2);
            es.addAll(exps);
            if (f != null && e != 0) {
                fs.add(f);
                es.add(e);
            }
            if (g != null && eg != 0) {
                fs.add(g);
                es.add(eg);
            }
            Polynomial nc = cof == null ? cofactor : cofactor == null ? cof : cofactor.multiply(cof);
            return new Partial(c.isOne() ? coefficient : coefficient.multiply(c), fs, es, nc);
        }
    }
}
