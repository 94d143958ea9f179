package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.Parallel;
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

    /** The prime that picks the independent rows of the parameter system (below 2^31, so products fit a long). */
    static final long PARAMETER_PRIME = 2147483629L;

    static Outcome solve(List<IntegerRow> rows, int columns, SolveProgress progress) {
        return solve(rows, columns, progress, PARAMETER_PRIME);
    }

    /**
     * As {@link #solve(List, int, SolveProgress)}, choosing the parameter system's rows modulo the
     * given prime; 0 runs the reference elimination on all of them (the tests use both, and small
     * primes to reach the fallback).
     */
    static Outcome solve(List<IntegerRow> rows, int columns, SolveProgress progress, long prime) {
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
        return prime <= 0 ? reduceParametersByElimination(val, params, residual) : reduceParameters(val, params, residual, prime);
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
     * integer multiply-adds, over equations on the shared pool (in equation order).
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
        int[] unused = IntStream.range(0, rows.size()).filter(r -> !used[r]).toArray();
        List<Rational[]> out = new ArrayList<>();
        for (Rational[] v : Parallel.map(unused.length, u -> {
            IntegerRow row = rows.get(unused[u]);
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
        })) {
            if (v != null) {
                out.add(v);
            }
        }
        return out;
    }

    /**
     * Solves the residual equations res_0 + sum_q res_q p_q = 0 for the parameters exactly, then
     * rewrites every value in the parameters that stay free.
     *
     * <p>The residual rows are many, dense in the parameters and carry large numbers, while their
     * rank is at most the number of parameters. So the rows independent modulo one word-size prime
     * are chosen first, and their reduced row echelon form is found modulo further primes and
     * rebuilt by rational reconstruction; the candidate is checked exactly against every residual
     * row. When all hold, it is the reduced row echelon form (lowest-column pivots) of the whole
     * system, which is unique: the free parameters and values are those of elimination on all rows.
     * Otherwise (an unlucky prime, no candidate within the prime budget, an inconsistency) exact
     * elimination runs on all rows.
     */
    private static Outcome reduceParameters(Rational[][] val, List<Integer> params, List<Rational[]> residual, long prime) {
        int k = params.size();
        List<Rational[]> chosen = independentModulo(residual, k, prime);
        if (chosen != null && chosen.size() < residual.size()) {
            ParameterValues pv = reconstructed(k, chosen, residual);
            if (pv != null) {
                return apply(val, params, pv);
            }
        }
        return reduceParametersByElimination(val, params, residual);
    }

    /**
     * The reference for {@link #reduceParameters} (its former path, kept for the tests and as the
     * fallback): exact Gauss-Jordan over Q on every residual row, lowest-column pivots.
     */
    static Outcome reduceParametersByElimination(Rational[][] val, List<Integer> params, List<Rational[]> residual) {
        ParameterValues pv = eliminate(params.size(), residual);
        return pv == null ? new Outcome(null, null, false) : apply(val, params, pv);
    }

    /** Parameter q (1-based) as [constant, coefficient of each free parameter]; the free ones (1-based, ascending). */
    private record ParameterValues(Rational[][] values, List<Integer> freeQ) { }

    /**
     * The rows (with their right sides) independent modulo p, in input order, found by incremental
     * elimination; null when a denominator vanishes modulo p.
     */
    private static List<Rational[]> independentModulo(List<Rational[]> residual, int k, long p) {
        // positions 0..k-1 are the parameters 1..k, position k the right side
        long[][] pivot = new long[k + 1][];
        List<Rational[]> chosen = new ArrayList<>();
        BigInteger bp = BigInteger.valueOf(p);
        for (Rational[] res : residual) {
            long[] row = new long[k + 1];
            for (int q = 0; q <= k; q++) {
                if (!res[q].isZero()) {
                    long den = res[q].denominator().mod(bp).longValue();
                    if (den == 0) {
                        return null;
                    }
                    long num = res[q].numerator().mod(bp).longValue();
                    row[q == 0 ? k : q - 1] = num * inverseModulo(den, p) % p;
                }
            }
            for (int c = 0; c <= k; c++) {
                if (row[c] == 0) {
                    continue;
                }
                if (pivot[c] == null) {
                    long inv = inverseModulo(row[c], p);
                    for (int j = c; j <= k; j++) {
                        row[j] = row[j] * inv % p;
                    }
                    pivot[c] = row;
                    chosen.add(res);
                    break;
                }
                long f = p - row[c];
                long[] pr = pivot[c];
                for (int j = c; j <= k; j++) {
                    row[j] = (row[j] + f * pr[j]) % p;
                }
            }
        }
        return chosen;
    }

    /** Whether every residual row vanishes on the parameter values (exactly). */
    private static boolean satisfiesAll(ParameterValues pv, List<Rational[]> residual) {
        int width = pv.freeQ().size() + 1;
        for (Rational[] res : residual) {
            for (int j = 0; j < width; j++) {
                Rational sum = j == 0 ? res[0] : Rational.ZERO;
                for (int q = 1; q < res.length; q++) {
                    if (!res[q].isZero() && !pv.values()[q][j].isZero()) {
                        sum = sum.add(res[q].multiply(pv.values()[q][j]));
                    }
                }
                if (!sum.isZero()) {
                    return false;
                }
            }
        }
        return true;
    }

    /**
     * The reduced row echelon form of the rows (lowest-column pivots) from their images modulo
     * word-size primes, each entry recovered by rational reconstruction from the CRT residues, then
     * checked exactly against every residual row; null when no candidate passes within the prime
     * budget (or a prime finds the rows inconsistent), and the caller eliminates exactly.
     *
     * <p>Why it is exact (the argument of {@code ModularLinearSolver}, common practice): the
     * candidate's pivot columns are independent over Q because they are modulo a prime; each null
     * vector is 1 at its free column and otherwise supported on pivot columns below it, so when the
     * exact check shows it annihilates every row, that free column is no pivot over Q; hence the pivot
     * sets agree, and given them the particular solution and the null vectors are unique. Unlike
     * the determinant-scaled reconstruction of that solver, the number of primes needed follows the
     * size of the answer, not of the rows' numbers (hundreds of bits here, while the answer is small).
     */
    private static ParameterValues reconstructed(int k, List<Rational[]> rows, List<Rational[]> residual) {
        int m = rows.size();
        long p = 2147483587L; // below 2^31 - 1 and the prime that chose the rows
        int[] bestPivots = null;
        BigInteger modulus = BigInteger.ONE;
        BigInteger[][] crt = null;  // per pivot index, per position (free columns..., rhs) the CRT value
        int primes = 0;
        int nextTry = 1;
        for (int attempt = 0; attempt < 400; attempt++) {
            p = previousPrime(p - 1);
            long[][] red = reduce(k, rows, p);
            if (red == null) {
                continue;
            }
            // Gauss-Jordan modulo p, lowest-column pivots, rows in order
            long[][] piv = new long[k][];
            for (long[] row : red) {
                for (int c = 0; c <= k; c++) {
                    if (row[c] == 0) {
                        continue;
                    }
                    if (c == k) {
                        return null; // inconsistent modulo p: leave it to exact elimination
                    }
                    if (piv[c] == null) {
                        // clear the later pivot columns too (pivot rows carry no other pivot column)
                        for (int d = c + 1; d < k; d++) {
                            if (piv[d] != null && row[d] != 0) {
                                long f = p - row[d];
                                long[] pd = piv[d];
                                for (int j = d; j <= k; j++) {
                                    row[j] = (row[j] + f * pd[j]) % p;
                                }
                            }
                        }
                        long inv = inverseModulo(row[c], p);
                        for (int j = c; j <= k; j++) {
                            row[j] = row[j] * inv % p;
                        }
                        for (long[] other : piv) {
                            if (other != null && other[c] != 0) {
                                long f = p - other[c];
                                for (int j = c; j <= k; j++) {
                                    other[j] = (other[j] + f * row[j]) % p;
                                }
                            }
                        }
                        piv[c] = row;
                        break;
                    }
                    long f = p - row[c];
                    long[] pr = piv[c];
                    for (int j = c; j <= k; j++) {
                        row[j] = (row[j] + f * pr[j]) % p;
                    }
                }
            }
            int[] pivots = java.util.stream.IntStream.range(0, k).filter(c -> piv[c] != null).toArray();
            int cmp = bestPivots == null ? -1 : comparePivots(pivots, bestPivots);
            if (cmp > 0) {
                continue; // an unlucky prime
            }
            if (cmp < 0) {
                bestPivots = pivots;
                modulus = BigInteger.ONE;
                crt = new BigInteger[pivots.length][k + 1];
                for (BigInteger[] r : crt) {
                    Arrays.fill(r, BigInteger.ZERO);
                }
                primes = 0;
                nextTry = 1;
            }
            BigInteger bp = BigInteger.valueOf(p);
            BigInteger mInv = modulus.mod(bp).modInverse(bp);
            for (int i = 0; i < pivots.length; i++) {
                long[] row = piv[pivots[i]];
                for (int j = 0; j <= k; j++) {
                    BigInteger x = crt[i][j];
                    long diff = Math.floorMod(row[j] - x.mod(bp).longValue(), p);
                    if (diff != 0) {
                        crt[i][j] = x.add(modulus.multiply(BigInteger.valueOf(diff).multiply(mInv).mod(bp)));
                    }
                }
            }
            modulus = modulus.multiply(bp);
            primes++;
            if (primes < nextTry) {
                continue;
            }
            nextTry = primes * 2;
            ParameterValues candidate = candidate(k, bestPivots, crt, modulus);
            if (candidate != null && satisfiesAll(candidate, residual)) {
                return candidate;
            }
        }
        return null;
    }

    /** The rows modulo p as [parameters 1..k | right side], or null when a denominator vanishes modulo p. */
    private static long[][] reduce(int k, List<Rational[]> rows, long p) {
        BigInteger bp = BigInteger.valueOf(p);
        long[][] out = new long[rows.size()][];
        for (int r = 0; r < rows.size(); r++) {
            Rational[] res = rows.get(r);
            long[] row = new long[k + 1];
            for (int q = 0; q <= k; q++) {
                if (!res[q].isZero()) {
                    long den = res[q].denominator().mod(bp).longValue();
                    if (den == 0) {
                        return null;
                    }
                    long num = res[q].numerator().mod(bp).longValue();
                    long v = num * inverseModulo(den, p) % p;
                    // the right side of sum res_q p_q = -res_0
                    row[q == 0 ? k : q - 1] = q == 0 ? (p - v) % p : v;
                }
            }
            out[r] = row;
        }
        return out;
    }

    /** Higher rank first, then the lexicographically smaller pivot columns. Negative: a better than b. */
    private static int comparePivots(int[] a, int[] b) {
        if (a.length != b.length) {
            return a.length > b.length ? -1 : 1;
        }
        return Arrays.compare(a, b);
    }

    /** The parameter values whose RREF entries reconstruct from the CRT values; null if one does not. */
    private static ParameterValues candidate(int k, int[] pivots, BigInteger[][] crt, BigInteger modulus) {
        boolean[] isPivot = new boolean[k];
        for (int c : pivots) {
            isPivot[c] = true;
        }
        List<Integer> freeQ = new ArrayList<>();
        for (int c = 0; c < k; c++) {
            if (!isPivot[c]) {
                freeQ.add(c + 1);
            }
        }
        Rational[][] paramVal = new Rational[k + 1][];
        for (int q = 1; q <= k; q++) {
            paramVal[q] = zeros(freeQ.size() + 1);
        }
        for (int i = 0; i < freeQ.size(); i++) {
            paramVal[freeQ.get(i)][i + 1] = Rational.ONE;
        }
        BigInteger bound = modulus.shiftRight(1).sqrt();
        for (int i = 0; i < pivots.length; i++) {
            int q = pivots[i] + 1;
            Rational rhs = rationalReconstruction(crt[i][k], modulus, bound);
            if (rhs == null) {
                return null;
            }
            paramVal[q][0] = rhs;
            for (int f = 0; f < freeQ.size(); f++) {
                int col = freeQ.get(f) - 1;
                if (col < pivots[i]) {
                    continue;
                }
                Rational e = rationalReconstruction(crt[i][col], modulus, bound);
                if (e == null) {
                    return null;
                }
                paramVal[q][f + 1] = e.negate();
            }
        }
        return new ParameterValues(paramVal, freeQ);
    }

    /** a/b with a = b x mod m, |a|, b <= bound (Wang's algorithm, common practice); null if none. */
    static Rational rationalReconstruction(BigInteger x, BigInteger m, BigInteger bound) {
        BigInteger r0 = m;
        BigInteger r1 = x.mod(m);
        BigInteger t0 = BigInteger.ZERO;
        BigInteger t1 = BigInteger.ONE;
        while (r1.compareTo(bound) > 0) {
            BigInteger[] qr = r0.divideAndRemainder(r1);
            r0 = r1;
            r1 = qr[1];
            BigInteger t = t0.subtract(qr[0].multiply(t1));
            t0 = t1;
            t1 = t;
        }
        if (t1.signum() == 0 || t1.abs().compareTo(bound) > 0 || !r1.gcd(t1).equals(BigInteger.ONE)) {
            return null;
        }
        return Rational.of(r1, t1);
    }

    /** The largest prime below n (n small enough for a long). */
    private static long previousPrime(long n) {
        long c = n;
        while (!BigInteger.valueOf(c).isProbablePrime(40)) {
            c--;
        }
        return c;
    }

    /** Exact Gauss-Jordan on the rows (lowest-column pivots); null when they are inconsistent. */
    private static ParameterValues eliminate(int k, List<Rational[]> residual) {
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
        return new ParameterValues(paramVal, freeQ);
    }

    /** Every column's value rewritten in the free parameters. */
    private static Outcome apply(Rational[][] val, List<Integer> params, ParameterValues pv) {
        List<Integer> freeQ = pv.freeQ();
        Rational[][] out = new Rational[val.length][];
        for (int c = 0; c < val.length; c++) {
            Rational[] v = zeros(freeQ.size() + 1);
            v[0] = val[c][0];
            for (int q = 1; q < val[c].length; q++) {
                if (!val[c][q].isZero()) {
                    addScaled(v, pv.values()[q], val[c][q]);
                }
            }
            out[c] = v;
        }
        int[] free = freeQ.stream().mapToInt(q -> params.get(q - 1)).toArray();
        return new Outcome(out, free, true);
    }

    /** a^-1 mod p for 0 < a < p, p prime (extended Euclid). */
    private static long inverseModulo(long a, long p) {
        long r0 = p;
        long r1 = a;
        long t0 = 0;
        long t1 = 1;
        while (r1 != 0) {
            long q = r0 / r1;
            long r = r0 - q * r1;
            r0 = r1;
            r1 = r;
            long t = t0 - q * t1;
            t0 = t1;
            t1 = t;
        }
        return t0 < 0 ? t0 + p : t0;
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
