package dev.contour.solve;

import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.TreeMap;
import java.util.stream.IntStream;

/**
 * The exact pass: with the free columns fixed, every other unknown is found over Q as an affine
 * function of the free ones, and the result is checked against every equation.
 *
 * <p>Values are vectors [constant, coefficient of free_1, ..., coefficient of free_k]. First
 * propagation: an equation with one undetermined unknown left fixes it (for the lattice-structured
 * Mellin systems this determines everything, with no fill-in and no large intermediate numbers).
 * What propagation cannot reach is solved by exact Gaussian elimination on the remaining block.
 * The final check over all equations is what turns the modular rank into a proof: a verified
 * family with k free columns, together with rank mod p = columns - k, has exactly k dimensions.
 */
final class ExactBacksolve {
    private ExactBacksolve() { }

    /** Values per column, or null when the check over Q failed (an unlucky prime). */
    static Rational[][] solve(List<IntegerRow> rows, int columns, int[] free, SolveProgress progress) {
        int k = free.length;
        Rational[][] val = new Rational[columns][];
        for (int f = 0; f < k; f++) {
            Rational[] v = zeros(k + 1);
            v[f + 1] = Rational.ONE;
            val[free[f]] = v;
        }
        int[][] byCol = rowsByColumn(rows, columns);
        int[] open = new int[rows.size()];
        int[] stack = new int[rows.size()];
        int top = 0;
        for (int r = 0; r < rows.size(); r++) {
            for (int c : rows.get(r).cols) {
                if (val[c] == null) {
                    open[r]++;
                }
            }
            if (open[r] == 1) {
                stack[top++] = r;
            }
        }
        int known = k;
        while (top > 0) {
            int r = stack[--top];
            if (open[r] != 1) {
                continue;
            }
            IntegerRow row = rows.get(r);
            int at = -1;
            Rational[] acc = zeros(k + 1);
            acc[0] = Rational.of(row.rhs);
            for (int i = 0; i < row.length(); i++) {
                int c = row.cols[i];
                if (val[c] == null) {
                    at = i;
                } else {
                    addScaled(acc, val[c], Rational.of(row.coefficient(i)).negate());
                }
            }
            Rational inv = Rational.of(row.coefficient(at)).inverse();
            for (int j = 0; j <= k; j++) {
                acc[j] = acc[j].multiply(inv);
            }
            int c = row.cols[at];
            val[c] = acc;
            known++;
            progress.determined(known);
            for (int q : byCol[c]) {
                if (--open[q] == 1) {
                    stack[top++] = q;
                }
            }
        }
        if (known < columns && !eliminateRest(rows, val, k)) {
            return null;
        }
        return verify(rows, val, k) ? val : null;
    }

    /** Exact elimination on the equations that still contain undetermined unknowns. */
    private static boolean eliminateRest(List<IntegerRow> rows, Rational[][] val, int k) {
        List<TreeMap<Integer, Rational>> lhs = new ArrayList<>();
        List<Rational[]> rhs = new ArrayList<>();
        for (IntegerRow row : rows) {
            TreeMap<Integer, Rational> m = new TreeMap<>();
            Rational[] b = zeros(k + 1);
            b[0] = Rational.of(row.rhs);
            for (int i = 0; i < row.length(); i++) {
                Rational a = Rational.of(row.coefficient(i));
                if (val[row.cols[i]] == null) {
                    m.put(row.cols[i], a);
                } else {
                    addScaled(b, val[row.cols[i]], a.negate());
                }
            }
            if (!m.isEmpty()) {
                lhs.add(m);
                rhs.add(b);
            }
        }
        List<Integer> pivotCols = new ArrayList<>();
        List<TreeMap<Integer, Rational>> pivotRows = new ArrayList<>();
        List<Rational[]> pivotRhs = new ArrayList<>();
        boolean[] used = new boolean[lhs.size()];
        while (true) {
            int best = -1;
            for (int r = 0; r < lhs.size(); r++) {
                if (!used[r] && !lhs.get(r).isEmpty() && (best < 0 || lhs.get(r).size() < lhs.get(best).size())) {
                    best = r;
                }
            }
            if (best < 0) {
                break;
            }
            used[best] = true;
            TreeMap<Integer, Rational> p = lhs.get(best);
            int c = p.firstKey();
            Rational inv = p.get(c).inverse();
            for (int r = 0; r < lhs.size(); r++) {
                Rational a = used[r] ? null : lhs.get(r).get(c);
                if (a == null) {
                    continue;
                }
                Rational f = a.multiply(inv).negate();
                TreeMap<Integer, Rational> m = lhs.get(r);
                for (var e : p.entrySet()) {
                    Rational v = m.getOrDefault(e.getKey(), Rational.ZERO).add(e.getValue().multiply(f));
                    if (v.isZero()) {
                        m.remove(e.getKey());
                    } else {
                        m.put(e.getKey(), v);
                    }
                }
                addScaled(rhs.get(r), rhs.get(best), f);
            }
            pivotCols.add(c);
            pivotRows.add(p);
            pivotRhs.add(rhs.get(best));
        }
        for (int i = pivotCols.size() - 1; i >= 0; i--) {
            int c = pivotCols.get(i);
            TreeMap<Integer, Rational> p = pivotRows.get(i);
            Rational[] acc = pivotRhs.get(i).clone();
            for (var e : p.entrySet()) {
                if (e.getKey() != c) {
                    if (val[e.getKey()] == null) {
                        return false;
                    }
                    addScaled(acc, val[e.getKey()], e.getValue().negate());
                }
            }
            Rational inv = p.get(c).inverse();
            for (int j = 0; j <= k; j++) {
                acc[j] = acc[j].multiply(inv);
            }
            val[c] = acc;
        }
        for (Rational[] v : val) {
            if (v == null) {
                return false;
            }
        }
        return true;
    }

    /**
     * Checks every equation over Q. Each component of the solution is scaled to integers once, so
     * the check is integer multiply-adds (in parallel over rows).
     */
    private static boolean verify(List<IntegerRow> rows, Rational[][] val, int k) {
        for (int j = 0; j <= k; j++) {
            final int comp = j;
            BigInteger lcm = BigInteger.ONE;
            for (Rational[] v : val) {
                BigInteger d = v[comp].denominator();
                if (!d.equals(BigInteger.ONE) && !lcm.mod(d).equals(BigInteger.ZERO)) {
                    lcm = lcm.divide(lcm.gcd(d)).multiply(d);
                }
            }
            BigInteger scale = lcm;
            BigInteger[] x = new BigInteger[val.length];
            for (int c = 0; c < val.length; c++) {
                Rational v = val[c][comp];
                x[c] = v.numerator().multiply(scale.divide(v.denominator()));
            }
            boolean ok = IntStream.range(0, rows.size()).parallel().allMatch(r -> {
                IntegerRow row = rows.get(r);
                BigInteger sum = comp == 0 ? row.rhs.multiply(scale).negate() : BigInteger.ZERO;
                for (int i = 0; i < row.length(); i++) {
                    BigInteger xc = x[row.cols[i]];
                    if (xc.signum() != 0) {
                        sum = sum.add(row.small != null ? xc.multiply(BigInteger.valueOf(row.small[i])) : xc.multiply(row.big[i]));
                    }
                }
                return sum.signum() == 0;
            });
            if (!ok) {
                return false;
            }
        }
        return true;
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
        for (int j = 0; j < acc.length; j++) {
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
