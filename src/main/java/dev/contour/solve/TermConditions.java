package dev.contour.solve;

import dev.contour.algebra.Hashing;
import dev.contour.algebra.Rational;
import java.util.Arrays;
import java.util.List;

/**
 * The linear conditions one factored term contributes to: each condition is a linear functional,
 * so the equations of a sum are the sums of the terms' contributions under the same keys.
 *
 * <p>The central fact: a sum of factored terms in n variables vanishes identically exactly when
 * (a) along every line where some term has a pole, each coefficient of the principal part (a sum of
 * factored terms in n - 1 variables) vanishes identically, and (b) then the sum is a polynomial,
 * which vanishes when each homogeneous part of its expansion at infinity vanishes. Recursing down
 * to constants gives exact equations over Q with no sampling and no common denominator.
 */
final class TermConditions {
    /** Receives one contribution: the equation's key and this term's coefficient in it. */
    interface Sink {
        void add(Object key, Rational value);
    }

    /**
     * A key step: kind of expansion, where (a monic line, or null for rays), order of h. A plain
     * class with a cached hash: keys are hashed millions of times on large ansatze.
     */
    static final class Step {
        private final Object parent;
        private final String kind;
        private final LinearForm where;
        private final int order;
        private final int hash;

        Step(Object parent, String kind, LinearForm where, int order) {
            this.parent = parent;
            this.kind = kind;
            this.where = where;
            this.order = order;
            this.hash = Hashing.combine(Hashing.combine(Hashing.combine(parent.hashCode(), kind.hashCode()),
                    where == null ? 0 : where.hashCode()), order);
        }

        @Override
        public int hashCode() {
            return hash;
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Step k && hash == k.hash && order == k.order && kind.equals(k.kind)
                    && java.util.Objects.equals(where, k.where) && parent.equals(k.parent);
        }

        @Override
        public String toString() {
            return parent + "/" + kind + (where == null ? "" : "(" + where + ")") + "^" + order;
        }
    }

    /** A family of pole lines form = c (for example s, t or u = 4p - s - t) and the allowed levels c. */
    record PoleFamily(LinearForm form, java.util.Set<Rational> allowed) { }

    private TermConditions() { }

    static void vanish(List<String> vars, FactoredTerm t, Object key, Sink sink) {
        if (vars.isEmpty()) {
            sink.add(key, t.coefficient);
            return;
        }
        if (vars.size() == 1 && UnivariateConditions.vanish(vars.get(0), t, key, sink)) {
            return;
        }
        vanishByExpansion(vars, t, key, sink);
    }

    /** The general path of {@link #vanish} (also the reference its one-variable fast path is tested against). */
    static void vanishByExpansion(List<String> vars, FactoredTerm t, Object key, Sink sink) {
        for (int i = 0; i < t.size(); i++) {
            if (t.exps[i] < 0) {
                LinearForm line = t.forms[i];
                LocalExpansion ex = LocalExpansion.alongLine(vars, line);
                ex.coefficients(t, t.exps[i], -1, (q, c) -> vanish(ex.to, c, new Step(key, "line", line, q), sink));
            }
        }
        int deg = t.degree();
        if (deg >= 0) {
            boolean[] all = new boolean[vars.size()];
            Arrays.fill(all, true);
            LocalExpansion ex = LocalExpansion.alongRays(vars, all);
            ex.coefficients(t, -deg, 0, (q, c) -> vanish(ex.to, c, new Step(key, "ray", null, q), sink));
        }
    }

    /** Principal parts along every pole line that involves a masked variable vanish. */
    static void polynomialIn(List<String> vars, boolean[] mask, FactoredTerm t, Object key, Sink sink) {
        for (int i = 0; i < t.size(); i++) {
            if (t.exps[i] < 0 && t.forms[i].involvesAny(mask)) {
                LinearForm line = t.forms[i];
                LocalExpansion ex = LocalExpansion.alongLine(vars, line);
                ex.coefficients(t, t.exps[i], -1, (q, c) -> vanish(ex.to, c, new Step(key, "line", line, q), sink));
            }
        }
    }

    /**
     * At every pole line of an allowed level, the residue is polynomial in the remaining variables
     * (and, when simple, the higher principal coefficients vanish).
     */
    static void residuesPolynomial(List<String> vars, List<PoleFamily> families, boolean simple, FactoredTerm t,
                                   Object key, Sink sink) {
        for (int i = 0; i < t.size(); i++) {
            if (t.exps[i] >= 0 || !allowedLevel(t.forms[i], families)) {
                continue;
            }
            if (t.exps[i] == -1 && DoubleResidues.tryLine(t, i, key, sink)) {
                continue;
            }
            LinearForm line = t.forms[i];
            LocalExpansion ex = LocalExpansion.alongLine(vars, line);
            boolean[] rest = new boolean[ex.to.size()];
            Arrays.fill(rest, true);
            ex.coefficients(t, simple ? t.exps[i] : -1, -1, (q, c) -> {
                Step at = new Step(key, "residue", line, q);
                if (q == -1) {
                    polynomialIn(ex.to, rest, c, at, sink);
                } else {
                    vanish(ex.to, c, at, sink);
                }
            });
        }
    }

    /** Poles on lines of the family at levels outside the allowed set cancel. */
    static void polesOnlyAt(List<String> vars, PoleFamily family, FactoredTerm t, Object key, Sink sink) {
        for (int i = 0; i < t.size(); i++) {
            if (t.exps[i] >= 0) {
                continue;
            }
            Rational c = t.forms[i].levelOf(family.form());
            if (c != null && !family.allowed().contains(c)) {
                LinearForm line = t.forms[i];
                LocalExpansion ex = LocalExpansion.alongLine(vars, line);
                ex.coefficients(t, t.exps[i], -1, (q, co) -> vanish(ex.to, co, new Step(key, "line", line, q), sink));
            }
        }
    }

    /** Scaling the masked variables by beta, the coefficients of beta^e for e > degree vanish. */
    static void growthAtMost(List<String> vars, boolean[] mask, int degree, FactoredTerm t, Object key, Sink sink) {
        LocalExpansion ex = LocalExpansion.alongRays(vars, mask);
        ex.coefficients(t, Integer.MIN_VALUE / 2, -degree - 1,
                (q, c) -> vanish(ex.to, c, new Step(key, "growth", null, q), sink));
    }

    private static boolean allowedLevel(LinearForm line, List<PoleFamily> families) {
        for (PoleFamily f : families) {
            Rational c = line.levelOf(f.form());
            if (c != null && f.allowed().contains(c)) {
                return true;
            }
        }
        return false;
    }

    /**
     * The fast path for two variables and simple poles with integer forms: the residue along line
     * l has a simple pole where another pole factor G meets l at a point P, with coefficient
     * c * gamma_G^-1 * prod_(F != l, G) F(P)^e_F (gamma_G: the slope of G along l). This is exactly
     * what the general expansion computes, under the same keys, with word arithmetic; any term that
     * does not fit (a third factor vanishing at P, higher poles, large numbers) takes the general path.
     */
    static final class DoubleResidues {
        /** The univariate forms w - w0 for small integer w0, shared (keys then compare by identity). */
        private static final LinearForm[] POINTS = new LinearForm[4096];

        private DoubleResidues() { }

        static LinearForm pointForm(long c) {
            if (c < -2048 || c >= 2048) {
                return new LinearForm(Rational.of(c), new Rational[] {Rational.ONE});
            }
            LinearForm f = POINTS[(int) c + 2048];
            if (f == null) {
                f = new LinearForm(Rational.of(c), new Rational[] {Rational.ONE});
                POINTS[(int) c + 2048] = f;
            }
            return f;
        }

        static boolean tryLine(FactoredTerm t, int li, Object key, Sink sink) {
            if (t.cofactor != null || t.forms[li].size() != 2) {
                return false;
            }
            int k = t.size();
            long[][] f = new long[k][];
            for (int i = 0; i < k; i++) {
                f[i] = t.forms[i].integral();
                if (f[i] == null) {
                    return false;
                }
            }
            long[] l = f[li];
            int p = l[1] != 0 ? 0 : 1;
            int q = 1 - p;
            // on the line: v_p = -(l0 + lq w), with l_p = 1 (monic); F restricted = beta + gamma w
            long[] beta = new long[k];
            long[] gamma = new long[k];
            for (int i = 0; i < k; i++) {
                if (i != li) {
                    beta[i] = f[i][0] - f[i][1 + p] * l[0];
                    gamma[i] = f[i][1 + q] - f[i][1 + p] * l[1 + q];
                }
            }
            for (int g = 0; g < k; g++) {
                if (g == li || t.exps[g] >= 0 || gamma[g] == 0) {
                    continue;
                }
                if (t.exps[g] != -1 || beta[g] % gamma[g] != 0) {
                    return false;
                }
            }
            Step at = new Step(key, "residue", t.forms[li], -1);
            List<Object> keys = new java.util.ArrayList<>(2);
            List<Rational> values = new java.util.ArrayList<>(2);
            for (int g = 0; g < k; g++) {
                if (g == li || t.exps[g] >= 0 || gamma[g] == 0) {
                    continue;
                }
                long w0 = -beta[g] / gamma[g];
                long acc = 1;
                long den = gamma[g];
                for (int i = 0; i < k; i++) {
                    if (i == li || i == g) {
                        continue;
                    }
                    long v = beta[i] + gamma[i] * w0;
                    if (v == 0) {
                        return false;
                    }
                    try {
                        for (int e = 0; e < Math.abs(t.exps[i]); e++) {
                            if (t.exps[i] > 0) {
                                acc = Math.multiplyExact(acc, v);
                            } else {
                                den = Math.multiplyExact(den, v);
                            }
                        }
                    } catch (ArithmeticException overflow) {
                        return false;
                    }
                }
                LinearForm restricted = pointForm(-w0);
                keys.add(new Step(at, "line", restricted, -1));
                values.add(t.coefficient.multiply(Rational.of(acc, den)));
            }
            for (int i = 0; i < keys.size(); i++) {
                sink.add(keys.get(i), values.get(i));
            }
            return true;
        }
    }
}
