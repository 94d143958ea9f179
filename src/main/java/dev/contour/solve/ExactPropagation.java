package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.algebra.LinearSystem;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.TreeMap;
import java.util.stream.IntStream;

/**
 * Exact solution by propagation: an equation with one undetermined unknown left fixes it; when no
 * such equation remains, the least constrained undetermined unknown becomes a parameter. Every
 * value is kept as an affine function of the parameters. The equations not used for propagation
 * then give a small system in the parameters, solved by exact elimination.
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

    static Outcome solve(List<IntegerRow> rows, int columns, SolveProgress progress) {
        return solve(rows, columns, progress, false);
    }

    /** As {@link #solve(List, int, SolveProgress)}; byElimination picks the reference parameter solve (tests). */
    static Outcome solve(List<IntegerRow> rows, int columns, SolveProgress progress, boolean byElimination) {
        Rational[][] val = new Rational[columns][];
        List<Integer> params = new ArrayList<>();
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
                int c = determine(rows.get(r), val, params.size());
                used[r] = true;
                known++;
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
            int c = leastConstrained(rows, open, val, byCol);
            params.add(c);
            Rational[] v = zeros(params.size() + 1);
            v[params.size()] = Rational.ONE;
            val[c] = v;
            known++;
            for (int q : byCol[c]) {
                if (--open[q] == 1) {
                    stack[top++] = q;
                }
            }
        }
        int k = params.size();
        for (int c = 0; c < columns; c++) {
            if (val[c].length < k + 1) {
                Rational[] v = zeros(k + 1);
                System.arraycopy(val[c], 0, v, 0, val[c].length);
                val[c] = v;
            }
        }
        List<Rational[]> residual = residuals(rows, used, val, k);
        if (residual.isEmpty()) {
            return new Outcome(val, params.stream().mapToInt(Integer::intValue).toArray(), true);
        }
        return byElimination ? reduceParametersByElimination(val, params, residual) : reduceParameters(val, params, residual);
    }

    /** Solves row for its one undetermined column; returns that column. */
    private static int determine(IntegerRow row, Rational[][] val, int k) {
        int at = -1;
        Rational[] acc = zeros(k + 1);
        acc[0] = Rational.of(row.rhs);
        for (int i = 0; i < row.length(); i++) {
            Rational[] v = val[row.cols[i]];
            if (v == null) {
                at = i;
            } else {
                addScaled(acc, v, row.rational(i).negate());
            }
        }
        Rational inv = row.rational(at).inverse();
        for (int j = 0; j <= k; j++) {
            if (!acc[j].isZero()) {
                acc[j] = acc[j].multiply(inv);
            }
        }
        val[row.cols[at]] = acc;
        return row.cols[at];
    }

    /**
     * The next parameter: an undetermined column in an equation with two undetermined columns left
     * (so that propagation resumes), occurring in the fewest equations; any undetermined column if
     * there is no such equation.
     */
    private static int leastConstrained(List<IntegerRow> rows, int[] open, Rational[][] val, int[][] byCol) {
        int best = -1;
        for (int r = 0; r < rows.size(); r++) {
            if (open[r] == 2) {
                for (int c : rows.get(r).cols) {
                    if (val[c] == null && (best < 0 || byCol[c].length < byCol[best].length
                            || byCol[c].length == byCol[best].length && c < best)) {
                        best = c;
                    }
                }
            }
        }
        if (best >= 0) {
            return best;
        }
        for (int c = 0; c < val.length; c++) {
            if (val[c] == null && (best < 0 || byCol[c].length < byCol[best].length)) {
                best = c;
            }
        }
        return best;
    }

    /**
     * sum a_j x_j - b for every equation not used in propagation, as affine vectors over the
     * parameters; zero vectors dropped. Each component is scaled to integers once, so this is
     * integer multiply-adds, in parallel over equations.
     */
    private static List<Rational[]> residuals(List<IntegerRow> rows, boolean[] used, Rational[][] val, int k) {
        BigInteger[] scale = new BigInteger[k + 1];
        BigInteger[][] x = new BigInteger[k + 1][];
        for (int j = 0; j <= k; j++) {
            BigInteger lcm = BigInteger.ONE;
            for (Rational[] v : val) {
                BigInteger d = v[j].denominator();
                if (!d.equals(BigInteger.ONE) && lcm.mod(d).signum() != 0) {
                    lcm = lcm.divide(lcm.gcd(d)).multiply(d);
                }
            }
            scale[j] = lcm;
            x[j] = new BigInteger[val.length];
            for (int c = 0; c < val.length; c++) {
                Rational v = val[c][j];
                x[j][c] = v.isZero() ? BigInteger.ZERO : v.numerator().multiply(lcm.divide(v.denominator()));
            }
        }
        Cancellation.Token stop = Cancellation.current();
        return IntStream.range(0, rows.size()).parallel().filter(r -> !used[r]).mapToObj(r -> {
            stop.check();
            IntegerRow row = rows.get(r);
            Rational[] res = null;
            for (int j = 0; j <= k; j++) {
                BigInteger sum = j == 0 ? row.rhs.multiply(scale[0]).negate() : BigInteger.ZERO;
                for (int i = 0; i < row.length(); i++) {
                    BigInteger xc = x[j][row.cols[i]];
                    if (xc.signum() != 0) {
                        sum = sum.add(row.small != null ? xc.multiply(BigInteger.valueOf(row.small[i])) : xc.multiply(row.big[i]));
                    }
                }
                if (sum.signum() != 0) {
                    if (res == null) {
                        res = zeros(k + 1);
                    }
                    res[j] = Rational.of(sum, scale[j]);
                }
            }
            return res;
        }).filter(v -> v != null).toList();
    }

    /**
     * Solves the residual equations res_0 + sum_q res_q p_q = 0 for the parameters exactly, then
     * rewrites every value in the parameters that stay free.
     *
     * <p>The parameter system is dense (each residual mixes many parameters), so it goes to the
     * multi-modular solver of {@link LinearSystem}, verified over Q: rational Gauss-Jordan on it grew
     * large numbers. Both give the reduced row echelon form with lowest-column pivots, which is
     * unique, so the free parameters and every value are the same as by exact elimination.
     */
    private static Outcome reduceParameters(Rational[][] val, List<Integer> params, List<Rational[]> residual) {
        int k = params.size();
        if (k == 0) {
            return new Outcome(null, null, false); // residuals are non-zero, and nothing is left to choose
        }
        LinearSystem system = new LinearSystem(k);
        for (Rational[] res : residual) {
            TreeMap<Integer, Rational> row = new TreeMap<>();
            for (int q = 1; q <= k; q++) {
                if (!res[q].isZero()) {
                    row.put(q - 1, res[q]);
                }
            }
            system.addRow(row, res[0].negate(), null);
        }
        LinearSystem.Solution solved = system.solve();
        if (solved instanceof LinearSystem.Inconsistent) {
            return new Outcome(null, null, false);
        }
        // parameter q (1-based) as affine in the free parameters: [constant, coefficient of free_1, ...]
        List<Integer> freeQ = new ArrayList<>();
        Rational[][] paramVal = new Rational[k + 1][];
        if (solved instanceof LinearSystem.Unique u) {
            for (int q = 1; q <= k; q++) {
                paramVal[q] = new Rational[] {u.values().get(q - 1)};
            }
        } else {
            LinearSystem.Family fam = (LinearSystem.Family) solved;
            for (int f : fam.freeColumns()) {
                freeQ.add(f + 1);
            }
            for (int q = 1; q <= k; q++) {
                Rational[] v = zeros(freeQ.size() + 1);
                v[0] = fam.particular().get(q - 1);
                for (int i = 0; i < freeQ.size(); i++) {
                    v[i + 1] = fam.nullBasis().get(i).get(q - 1);
                }
                paramVal[q] = v;
            }
        }
        Rational[][] out = new Rational[val.length][];
        for (int c = 0; c < val.length; c++) {
            Rational[] v = zeros(freeQ.size() + 1);
            v[0] = val[c][0];
            for (int q = 1; q <= k; q++) {
                if (!val[c][q].isZero()) {
                    addScaled(v, paramVal[q], val[c][q]);
                }
            }
            out[c] = v;
        }
        int[] free = freeQ.stream().mapToInt(q -> params.get(q - 1)).toArray();
        return new Outcome(out, free, true);
    }

    /**
     * The reference for {@link #reduceParameters} (its former body, kept for the tests): exact
     * Gauss-Jordan over Q on the parameter system, lowest-column pivots.
     */
    static Outcome reduceParametersByElimination(Rational[][] val, List<Integer> params, List<Rational[]> residual) {
        int k = params.size();
        List<TreeMap<Integer, Rational>> pivRows = new ArrayList<>();
        List<Integer> pivCols = new ArrayList<>();
        for (Rational[] res : residual) {
            TreeMap<Integer, Rational> row = new TreeMap<>();
            for (int q = 0; q <= k; q++) {
                if (!res[q].isZero()) {
                    row.put(q, res[q]);
                }
            }
            for (int i = 0; i < pivCols.size(); i++) {
                Rational a = row.get(pivCols.get(i));
                if (a != null) {
                    axpy(row, pivRows.get(i), a.negate());
                }
            }
            Integer lead = row.keySet().stream().filter(q -> q > 0).findFirst().orElse(null);
            if (lead == null) {
                if (!row.isEmpty()) {
                    return new Outcome(null, null, false);
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
        List<Integer> freeQ = new ArrayList<>();
        for (int q = 1; q <= k; q++) {
            if (!pivCols.contains(q)) {
                freeQ.add(q);
            }
        }
        Rational[][] paramVal = new Rational[k + 1][];
        for (int q = 1; q <= k; q++) {
            Rational[] v = zeros(freeQ.size() + 1);
            int i = pivCols.indexOf(q);
            if (i < 0) {
                v[freeQ.indexOf(q) + 1] = Rational.ONE;
            } else {
                for (var e : pivRows.get(i).entrySet()) {
                    int f = e.getKey();
                    if (f == 0) {
                        v[0] = e.getValue().negate();
                    } else if (f != q) {
                        v[freeQ.indexOf(f) + 1] = e.getValue().negate();
                    }
                }
            }
            paramVal[q] = v;
        }
        Rational[][] out = new Rational[val.length][];
        for (int c = 0; c < val.length; c++) {
            Rational[] v = zeros(freeQ.size() + 1);
            v[0] = val[c][0];
            for (int q = 1; q <= k; q++) {
                if (!val[c][q].isZero()) {
                    addScaled(v, paramVal[q], val[c][q]);
                }
            }
            out[c] = v;
        }
        int[] free = freeQ.stream().mapToInt(q -> params.get(q - 1)).toArray();
        return new Outcome(out, free, true);
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

    private static void addScaled(Rational[] acc, Rational[] v, Rational f) {
        for (int j = 0; j < v.length; j++) {
            if (!v[j].isZero()) {
                acc[j] = acc[j].add(v[j].multiply(f));
            }
        }
    }

    private static Rational[] zeros(int n) {
        Rational[] z = new Rational[n];
        Arrays.fill(z, Rational.ZERO);
        return z;
    }
}
