package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.Parallel;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.TreeMap;
import java.util.stream.IntStream;

/**
 * Exact solution by propagation: an equation with one undetermined unknown left fixes it; when no
 * such equation remains, the least constrained undetermined unknown becomes a parameter. Every
 * value is kept as a sparse affine function of the parameters. The equations not used for
 * propagation then give a small system in the parameters, solved by exact elimination.
 *
 * <p>The order of propagation ({@link Plan}) depends only on where rows have entries, so
 * {@link ModularPropagation} first carries it out modulo primes and returns a result only when an
 * exact check proves it equal to this class's; otherwise the plan is carried out here exactly.
 *
 * <p>Why this works well here: Mellin ansatz systems are lattice-structured recurrences. Along the
 * boundary of the lattice equations have two terms, inside they have four, so after one parameter
 * on a corner the whole lattice propagates with no fill-in, and the check of the remaining
 * equations is integer multiply-adds. The result is exact and complete by construction: every value
 * was forced by an equation, and every equation holds (or is part of the parameter system).
 */
final class ExactPropagation {
    /** Values per column as [constant, coefficient of free_1, ...], the free columns; or inconsistent. */
    record Outcome(Rational[][] values, int[] free, boolean consistent) { }

    private ExactPropagation() { }

    /**
     * The order of propagation, which depends only on where the rows have entries, not on their
     * values: steps[i] &gt;= 0 is a row that fixes its one undetermined column, steps[i] &lt; 0 the
     * column -1 - steps[i] made a parameter; used marks the rows that fixed a column, params lists
     * the parameter columns in order (parameter q is params[q - 1]).
     */
    record Plan(int[] steps, boolean[] used, int[] params) {
        boolean allUsed() {
            for (boolean u : used) {
                if (!u) {
                    return false;
                }
            }
            return true;
        }
    }

    /** The fewest parameters for which the modular replay is tried first. */
    static final int MODULAR_MIN_PARAMETERS = 4;

    static Outcome solve(List<IntegerRow> rows, int columns, SolveProgress progress) {
        Plan plan = plan(rows, columns, progress);
        // Modular replay pays for itself when parameters are many (a widened ansatz leaves 10 to 150,
        // whose exact intermediate values grow to hundreds of bits); with a few, as in the
        // equal-weight ansatz (one parameter, a million leftover rows), the exact path is twice as
        // fast (p = 512: 3.5 s against 7.6 s, measured 2026-12-05). Both give the same answer.
        if (!plan.allUsed() && plan.params().length >= MODULAR_MIN_PARAMETERS) {
            Outcome modular = ModularPropagation.solve(rows, columns, plan);
            if (modular != null) {
                return modular;
            }
        }
        return exact(rows, columns, plan);
    }

    static Plan plan(List<IntegerRow> rows, int columns, SolveProgress progress) {
        boolean[] det = new boolean[columns];
        List<Integer> params = new ArrayList<>();
        int[] steps = new int[columns];
        int[][] byCol = rowsByColumn(rows, columns);
        int[] open = new int[rows.size()];
        boolean[] used = new boolean[rows.size()];
        int[] stack = new int[Math.max(1, rows.size())];
        int top = 0;
        for (int r = 0; r < rows.size(); r++) {
            open[r] = rows.get(r).length();
            if (open[r] == 1) {
                stack[top++] = r;
            }
        }
        int known = 0;
        while (known < columns) {
            while (top > 0) {
                if ((known & 1023) == 0) {
                    Cancellation.check();
                }
                int r = stack[--top];
                if (open[r] != 1) {
                    continue;
                }
                int c = -1;
                for (int col : rows.get(r).cols) {
                    if (!det[col]) {
                        c = col;
                    }
                }
                det[c] = true;
                used[r] = true;
                steps[known++] = r;
                progress.determined(known);
                for (int q : byCol[c]) {
                    if (--open[q] == 1) {
                        stack[top++] = q;
                    }
                }
            }
            if (known == columns) {
                break;
            }
            Cancellation.check();
            int c = leastConstrained(rows, open, det, byCol);
            params.add(c);
            det[c] = true;
            steps[known++] = -1 - c;
            for (int q : byCol[c]) {
                if (--open[q] == 1) {
                    stack[top++] = q;
                }
            }
        }
        return new Plan(steps, used, params.stream().mapToInt(Integer::intValue).toArray());
    }

    /** The plan carried out in exact arithmetic, then the parameters reduced by exact elimination. */
    static Outcome exact(List<IntegerRow> rows, int columns, Plan plan) {
        Affine[] val = new Affine[columns];
        int k = 0;
        for (int i = 0; i < plan.steps().length; i++) {
            if ((i & 1023) == 0) {
                Cancellation.check();
            }
            int step = plan.steps()[i];
            if (step < 0) {
                val[-1 - step] = Affine.unit(++k);
            } else {
                determine(rows.get(step), val);
            }
        }
        List<Integer> params = Arrays.stream(plan.params()).boxed().toList();
        List<Affine> residual = residuals(rows, plan.used(), val);
        if (residual.isEmpty()) {
            return new Outcome(dense(val, k + 1), plan.params(), true);
        }
        Expressed exact = eliminateAndExpress(val, params, residual);
        return exact != null ? exact.outcome() : new Outcome(null, null, false);
    }

    /** Solves row for its one undetermined column; returns that column. */
    private static int determine(IntegerRow row, Affine[] val) {
        int at = -1;
        Affine[] known = new Affine[row.length()];
        Rational[] coef = new Rational[row.length()];
        int n = 0;
        for (int i = 0; i < row.length(); i++) {
            Affine v = val[row.cols[i]];
            if (v == null) {
                at = i;
            } else {
                known[n] = v;
                coef[n++] = row.rational(i).negate();
            }
        }
        Rational inv = row.rational(at).inverse();
        val[row.cols[at]] = Affine.combine(known, coef, n, Rational.of(row.rhs)).times(inv);
        return row.cols[at];
    }

    /**
     * The next parameter: an undetermined column in an equation with two undetermined columns left
     * (so that propagation resumes), occurring in the fewest equations; any undetermined column if
     * there is no such equation.
     */
    private static int leastConstrained(List<IntegerRow> rows, int[] open, boolean[] det, int[][] byCol) {
        int best = -1;
        for (int r = 0; r < rows.size(); r++) {
            if (open[r] == 2) {
                for (int c : rows.get(r).cols) {
                    if (!det[c] && (best < 0 || byCol[c].length < byCol[best].length
                            || byCol[c].length == byCol[best].length && c < best)) {
                        best = c;
                    }
                }
            }
        }
        if (best >= 0) {
            return best;
        }
        for (int c = 0; c < det.length; c++) {
            if (!det[c] && (best < 0 || byCol[c].length < byCol[best].length)) {
                best = c;
            }
        }
        return best;
    }

    /**
     * sum a_j x_j - b for every equation not used in propagation, as affine functions of the
     * parameters; zero ones dropped. The values are sparse (a parameter reaches few unknowns), so
     * each row costs the sizes of its few values, over equations on the shared pool (in equation order).
     */
    private static List<Affine> residuals(List<IntegerRow> rows, boolean[] used, Affine[] val) {
        int[] unused = IntStream.range(0, rows.size()).filter(r -> !used[r]).toArray();
        List<Affine> out = new ArrayList<>();
        for (Affine res : Parallel.map(unused.length, u -> apply(rows.get(unused[u]), val))) {
            if (!res.isZero()) {
                out.add(res);
            }
        }
        return out;
    }

    /** sum a_j x_j - b of one equation, the x_j affine functions over the same coordinates. */
    private static Affine apply(IntegerRow row, Affine[] x) {
        Affine[] vs = new Affine[row.length()];
        Rational[] coef = new Rational[row.length()];
        for (int i = 0; i < row.length(); i++) {
            vs[i] = x[row.cols[i]];
            coef[i] = row.rational(i);
        }
        return Affine.combine(vs, coef, vs.length, Rational.of(row.rhs).negate());
    }

    /** Every value as a sparse affine function of the free parameters (the columns in free). */
    private record Expressed(Affine[] values, int[] free) {
        Outcome outcome() {
            return new Outcome(dense(values, free.length + 1), free, true);
        }
    }

    /**
     * Solves the residual equations res_0 + sum_q res_q p_q = 0 for the parameters by exact
     * Gauss-Jordan elimination of the rows in order (lowest parameter as pivot), then rewrites every
     * value in the parameters that stay free; null when the equations contradict each other.
     */
    private static Expressed eliminateAndExpress(Affine[] val, List<Integer> params, List<Affine> residual) {
        int k = params.size();
        List<TreeMap<Integer, Rational>> pivRows = new ArrayList<>();
        List<Integer> pivCols = new ArrayList<>();
        for (Affine res : residual) {
            Cancellation.check();
            TreeMap<Integer, Rational> row = res.toMap();
            for (int i = 0; i < pivCols.size(); i++) {
                Rational a = row.get(pivCols.get(i));
                if (a != null) {
                    axpy(row, pivRows.get(i), a.negate());
                }
            }
            Integer lead = row.keySet().stream().filter(q -> q > 0).findFirst().orElse(null);
            if (lead == null) {
                if (!row.isEmpty()) {
                    return null;
                }
                continue;
            }
            Rational inv = row.get(lead).inverse();
            row.replaceAll((q, v) -> v.multiply(inv));
            for (TreeMap<Integer, Rational> other : pivRows) {
                Rational a = other.get(lead);
                if (a != null) {
                    axpy(other, row, a.negate());
                }
            }
            pivRows.add(row);
            pivCols.add(lead);
        }
        // parameter q (1-based) as affine in the free parameters: p_q = -row_0 - sum_{free f} row_f p_f
        int[] freeIndex = new int[k + 1];
        Arrays.fill(freeIndex, -1);
        int[] pivotOf = new int[k + 1];
        Arrays.fill(pivotOf, -1);
        for (int i = 0; i < pivCols.size(); i++) {
            pivotOf[pivCols.get(i)] = i;
        }
        List<Integer> freeQ = new ArrayList<>();
        for (int q = 1; q <= k; q++) {
            if (pivotOf[q] < 0) {
                freeQ.add(q);
                freeIndex[q] = freeQ.size();
            }
        }
        Affine[] paramVal = new Affine[k + 1];
        for (int q = 1; q <= k; q++) {
            if (pivotOf[q] < 0) {
                paramVal[q] = Affine.unit(freeIndex[q]);
            } else {
                TreeMap<Integer, Rational> v = new TreeMap<>();
                for (var e : pivRows.get(pivotOf[q]).entrySet()) {
                    int f = e.getKey();
                    if (f == 0) {
                        v.put(0, e.getValue().negate());
                    } else if (f != q) {
                        v.put(freeIndex[f], e.getValue().negate());
                    }
                }
                paramVal[q] = Affine.of(v);
            }
        }
        Affine[] out = new Affine[val.length];
        for (int c = 0; c < val.length; c++) {
            if ((c & 255) == 0) {
                Cancellation.check();
            }
            out[c] = val[c].substitute(paramVal);
        }
        int[] free = freeQ.stream().mapToInt(q -> params.get(q - 1)).toArray();
        return new Expressed(out, free);
    }

    /** Whether every equation holds for the constant part and for each free direction of the values. */
    static boolean holds(List<IntegerRow> rows, Affine[] x) {
        int chunk = 256;
        int chunks = (rows.size() + chunk - 1) / chunk;
        for (boolean ok : Parallel.map(chunks, c -> {
            for (int r = c * chunk; r < Math.min(rows.size(), (c + 1) * chunk); r++) {
                if (!apply(rows.get(r), x).isZero()) {
                    return false;
                }
            }
            return true;
        })) {
            if (!ok) {
                return false;
            }
        }
        return true;
    }

    private static void axpy(TreeMap<Integer, Rational> row, TreeMap<Integer, Rational> piv, Rational f) {
        for (var e : piv.entrySet()) {
            Rational v = row.getOrDefault(e.getKey(), Rational.ZERO).add(e.getValue().multiply(f));
            if (v.isZero()) {
                row.remove(e.getKey());
            } else {
                row.put(e.getKey(), v);
            }
        }
    }

    private static int[][] rowsByColumn(List<IntegerRow> rows, int columns) {
        int[] count = new int[columns];
        for (IntegerRow row : rows) {
            for (int c : row.cols) {
                count[c]++;
            }
        }
        int[][] byCol = new int[columns][];
        for (int c = 0; c < columns; c++) {
            byCol[c] = new int[count[c]];
        }
        Arrays.fill(count, 0);
        for (int r = 0; r < rows.size(); r++) {
            for (int c : rows.get(r).cols) {
                byCol[c][count[c]++] = r;
            }
        }
        return byCol;
    }

    static Rational[][] dense(Affine[] val, int width) {
        Rational[][] out = new Rational[val.length][];
        for (int c = 0; c < val.length; c++) {
            Rational[] v = new Rational[width];
            Arrays.fill(v, Rational.ZERO);
            Affine a = val[c];
            for (int i = 0; i < a.idx.length; i++) {
                v[a.idx[i]] = a.val[i];
            }
            out[c] = v;
        }
        return out;
    }

    /**
     * A sparse affine function of the parameters: coefficient val[i] at coordinate idx[i] (0 the
     * constant, q the q-th parameter), idx increasing, no zero coefficients. Parameters reach few
     * unknowns each, so dense vectors of length k + 1 would be mostly zeros.
     */
    static final class Affine {
        private static final Affine ZERO = new Affine(new int[0], new Rational[0]);
        final int[] idx;
        final Rational[] val;

        Affine(int[] idx, Rational[] val) {
            this.idx = idx;
            this.val = val;
        }

        static Affine unit(int q) {
            return new Affine(new int[] {q}, new Rational[] {Rational.ONE});
        }

        static Affine of(TreeMap<Integer, Rational> entries) {
            int[] idx = new int[entries.size()];
            Rational[] val = new Rational[entries.size()];
            int n = 0;
            for (var e : entries.entrySet()) {
                if (!e.getValue().isZero()) {
                    idx[n] = e.getKey();
                    val[n++] = e.getValue();
                }
            }
            return new Affine(Arrays.copyOf(idx, n), Arrays.copyOf(val, n));
        }

        boolean isZero() {
            return idx.length == 0;
        }

        TreeMap<Integer, Rational> toMap() {
            TreeMap<Integer, Rational> m = new TreeMap<>();
            for (int i = 0; i < idx.length; i++) {
                m.put(idx[i], val[i]);
            }
            return m;
        }

        Affine times(Rational f) {
            if (f.isOne()) {
                return this;
            }
            Rational[] v = new Rational[val.length];
            for (int i = 0; i < v.length; i++) {
                v[i] = val[i].multiply(f);
            }
            return new Affine(idx, v);
        }

        /** constant + sum_i coef[i] * vs[i] over the first n terms. */
        static Affine combine(Affine[] vs, Rational[] coef, int n, Rational constant) {
            int total = constant.isZero() ? 0 : 1;
            for (int i = 0; i < n; i++) {
                total += vs[i].idx.length;
            }
            long[] keys = new long[total];
            Rational[] terms = new Rational[total];
            int m = 0;
            if (!constant.isZero()) {
                keys[m] = m;
                terms[m++] = constant;
            }
            for (int i = 0; i < n; i++) {
                Affine v = vs[i];
                for (int j = 0; j < v.idx.length; j++) {
                    keys[m] = ((long) v.idx[j] << 32) | m;
                    terms[m++] = v.val[j].multiply(coef[i]);
                }
            }
            return collect(keys, terms);
        }

        /** This function with parameter q replaced by sub[q] (an affine function of new coordinates). */
        Affine substitute(Affine[] sub) {
            int total = 0;
            for (int i = 0; i < idx.length; i++) {
                total += idx[i] == 0 ? 1 : sub[idx[i]].idx.length;
            }
            long[] keys = new long[total];
            Rational[] terms = new Rational[total];
            int m = 0;
            for (int i = 0; i < idx.length; i++) {
                if (idx[i] == 0) {
                    keys[m] = m;
                    terms[m++] = val[i];
                    continue;
                }
                Affine s = sub[idx[i]];
                for (int j = 0; j < s.idx.length; j++) {
                    keys[m] = ((long) s.idx[j] << 32) | m;
                    terms[m++] = s.val[j].multiply(val[i]);
                }
            }
            return collect(keys, terms);
        }

        /** Sums the terms by coordinate (the high half of each key; the low half is the term's position). */
        private static Affine collect(long[] keys, Rational[] terms) {
            if (keys.length == 0) {
                return ZERO;
            }
            Arrays.sort(keys);
            int[] idx = new int[keys.length];
            Rational[] val = new Rational[keys.length];
            int n = 0;
            for (int a = 0; a < keys.length; ) {
                int coordinate = (int) (keys[a] >>> 32);
                Rational sum = terms[(int) keys[a]];
                int b = a + 1;
                while (b < keys.length && (int) (keys[b] >>> 32) == coordinate) {
                    sum = sum.add(terms[(int) keys[b]]);
                    b++;
                }
                if (!sum.isZero()) {
                    idx[n] = coordinate;
                    val[n++] = sum;
                }
                a = b;
            }
            return n == keys.length ? new Affine(idx, val) : new Affine(Arrays.copyOf(idx, n), Arrays.copyOf(val, n));
        }
    }
}
