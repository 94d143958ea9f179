package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalReconstruction;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The propagation of {@link ExactPropagation} carried out modulo word-size primes, its result
 * rebuilt by Chinese remaindering and rational reconstruction, and accepted only after an exact
 * check against every equation; null (so that the exact path runs) when that does not succeed.
 *
 * <p>Why: a widened ansatz leaves hundreds of parameters, whose values during propagation are
 * affine functions with coefficients of hundreds of bits, while the final values (each unknown in
 * the few free unknowns that stay) are small and sparse. Exact propagation spends its time on the
 * intermediate coefficients; modulo a prime they cost one word each.
 *
 * <p>Why an accepted result is exactly the one of the exact path. The plan (order of propagation,
 * parameters) depends only on where the rows have entries, so modulo p every step is the image of
 * the exact step, as long as p divides no coefficient a row is divided by (else the prime is
 * skipped). The residual equations in the parameters, A p = b, are then reduced modulo p to
 * reduced row echelon form with lowest-column pivots; a prime can only lower the rank of A, so
 * rank_p &lt;= rank_Q. The candidate family has the free parameters F_p (not pivots modulo p) and
 * writes each pivot parameter q through the free ones after q only. It is verified exactly: (1)
 * every equation of the system holds for its constant part and for each free direction, so the
 * family lies in the solution set; (2) the structure: a free parameter's column is its own free
 * unknown, a pivot parameter's column involves only free parameters after it. By (1) the solution
 * set has dimension at least |F_p| = k - rank_p &gt;= k - rank_Q, its dimension, so the family is
 * the whole solution set. By (1) and (2) each free parameter's column of A is a combination of
 * earlier columns, so no element of F_p is a pivot of the exact echelon form: F_p is inside the exact
 * free set and has its size, so the two are equal, and the parametrisation of the solution set by
 * the free unknowns F is unique. So the verified values are those exact elimination gives.
 * (Common practice for exact linear algebra; the same argument as in the multi-modular solver of
 * {@code dev.contour.algebra}.)
 */
final class ModularPropagation {
    /** Primes below 2^31 (products of two residues fit in a long), largest first. */
    private static final long[] PRIMES = primes(12);
    /** Primes tried at most before the exact path takes over. */
    private static final int MAX_PRIMES = PRIMES.length;

    private ModularPropagation() { }

    private static long[] primes(int n) {
        long[] ps = new long[n];
        long c = (1L << 31) - 1;
        for (int i = 0; i < n; c -= 2) {
            if (BigInteger.valueOf(c).isProbablePrime(60)) {
                ps[i++] = c;
            }
        }
        return ps;
    }

    /** The exact outcome when the modular path can prove it, else null. */
    static ExactPropagation.Outcome solve(List<IntegerRow> rows, int columns, ExactPropagation.Plan plan) {
        List<Image> images = new ArrayList<>();
        for (int i = 0; i < MAX_PRIMES; i++) {
            Cancellation.check();
            Image im = Image.of(rows, columns, plan, PRIMES[i]);
            if (im == null) {
                continue; // the prime divides a pivot coefficient
            }
            if (im.inconsistent) {
                return null; // the exact path decides and names the conflict
            }
            if (!images.isEmpty()) {
                int cmp = compareProfile(im, images.get(0));
                if (cmp < 0) {
                    continue; // an unlucky prime: a lower rank or later pivots
                }
                if (cmp > 0) {
                    images.clear();
                }
            }
            images.add(im);
            ExactPropagation.Affine[] values = reconstruct(images, columns);
            if (values != null && structured(values, plan, images.get(0))
                    && ExactPropagation.holds(rows, values)) {
                int[] free = Arrays.stream(images.get(0).freeParams).map(q -> plan.params()[q - 1]).toArray();
                return new ExactPropagation.Outcome(ExactPropagation.dense(values, free.length + 1), free, true);
            }
        }
        return null;
    }

    /** Higher rank first, then the pivot list that is lexicographically smaller (the true one is). */
    private static int compareProfile(Image a, Image b) {
        if (a.pivots.length != b.pivots.length) {
            return Integer.compare(a.pivots.length, b.pivots.length);
        }
        for (int i = 0; i < a.pivots.length; i++) {
            if (a.pivots[i] != b.pivots[i]) {
                return a.pivots[i] < b.pivots[i] ? 1 : -1;
            }
        }
        return 0;
    }

    /** Column of a free parameter: its own coordinate; of a pivot parameter q: constant and free parameters after q only. */
    private static boolean structured(ExactPropagation.Affine[] values, ExactPropagation.Plan plan, Image im) {
        int[] freeCoordinate = new int[plan.params().length + 1];
        for (int i = 0; i < im.freeParams.length; i++) {
            freeCoordinate[im.freeParams[i]] = i + 1;
        }
        for (int q = 1; q <= plan.params().length; q++) {
            ExactPropagation.Affine v = values[plan.params()[q - 1]];
            if (freeCoordinate[q] > 0) {
                if (v.idx.length != 1 || v.idx[0] != freeCoordinate[q] || !v.val[0].isOne()) {
                    return false;
                }
                continue;
            }
            for (int j : v.idx) {
                if (j != 0 && im.freeParams[j - 1] <= q) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Chinese remaindering of the images' values and rational reconstruction; null when an entry does not reconstruct yet. */
    private static ExactPropagation.Affine[] reconstruct(List<Image> images, int columns) {
        int n = images.size();
        long[] ps = new long[n];
        for (int i = 0; i < n; i++) {
            ps[i] = images.get(i).prime;
        }
        BigInteger modulus = BigInteger.ONE;
        for (long p : ps) {
            modulus = modulus.multiply(BigInteger.valueOf(p));
        }
        BigInteger bound = modulus.shiftRight(1).sqrt();
        // Garner's mixed-radix constants: inverse of p_0 ... p_{i-1} modulo p_i
        long[] inv = new long[n];
        for (int i = 1; i < n; i++) {
            long prod = 1;
            for (int j = 0; j < i; j++) {
                prod = prod * (ps[j] % ps[i]) % ps[i];
            }
            inv[i] = BigInteger.valueOf(prod).modInverse(BigInteger.valueOf(ps[i])).longValue();
        }
        ExactPropagation.Affine[] out = new ExactPropagation.Affine[columns];
        long[] residues = new long[n];
        int[] at = new int[n];
        for (int c = 0; c < columns; c++) {
            if ((c & 255) == 0) {
                Cancellation.check();
            }
            ModVec[] vs = new ModVec[n];
            int total = 0;
            for (int i = 0; i < n; i++) {
                vs[i] = images.get(i).values[c];
                total += vs[i].idx.length;
                at[i] = 0;
            }
            int[] idx = new int[total];
            Rational[] val = new Rational[total];
            int m = 0;
            while (true) {
                int next = Integer.MAX_VALUE;
                for (int i = 0; i < n; i++) {
                    if (at[i] < vs[i].idx.length) {
                        next = Math.min(next, vs[i].idx[at[i]]);
                    }
                }
                if (next == Integer.MAX_VALUE) {
                    break;
                }
                for (int i = 0; i < n; i++) {
                    if (at[i] < vs[i].idx.length && vs[i].idx[at[i]] == next) {
                        residues[i] = vs[i].val[at[i]++];
                    } else {
                        residues[i] = 0;
                    }
                }
                Rational r = RationalReconstruction.of(garner(ps, inv, residues), modulus, bound);
                if (r == null) {
                    return null;
                }
                if (!r.isZero()) {
                    idx[m] = next;
                    val[m++] = r;
                }
            }
            out[c] = new ExactPropagation.Affine(Arrays.copyOf(idx, m), Arrays.copyOf(val, m));
        }
        return out;
    }

    /** The integer in [0, p_0 ... p_{n-1}) with the given residues (Garner's algorithm). */
    private static BigInteger garner(long[] ps, long[] inv, long[] residues) {
        int n = ps.length;
        long[] digits = new long[n];
        for (int i = 0; i < n; i++) {
            long p = ps[i];
            // value of the mixed-radix prefix modulo p
            long v = 0;
            for (int j = i - 1; j >= 0; j--) {
                v = (v * (ps[j] % p) + digits[j]) % p;
            }
            digits[i] = i == 0 ? residues[0] : Math.floorMod(residues[i] - v, p) * inv[i] % p;
        }
        BigInteger x = BigInteger.valueOf(digits[n - 1]);
        for (int j = n - 2; j >= 0; j--) {
            x = x.multiply(BigInteger.valueOf(ps[j])).add(BigInteger.valueOf(digits[j]));
        }
        return x;
    }

    /** A sparse vector modulo a prime: val[i] in (0, p) at coordinate idx[i], idx increasing. */
    private record ModVec(int[] idx, long[] val) {
        static final ModVec ZERO = new ModVec(new int[0], new long[0]);

        static ModVec unit(int q) {
            return new ModVec(new int[] {q}, new long[] {1});
        }
    }

    /** A dense scratch accumulator over coordinates 0..size-1 that remembers which it touched. */
    private static final class Accumulator {
        private final long p;
        private final long[] v;
        private final boolean[] mark;
        private final int[] touched;
        private int n;

        Accumulator(int size, long p) {
            this.p = p;
            v = new long[size];
            mark = new boolean[size];
            touched = new int[size];
        }

        void add(int i, long x) {
            if (!mark[i]) {
                mark[i] = true;
                touched[n++] = i;
                v[i] = x;
            } else {
                v[i] = (v[i] + x) % p;
            }
        }

        /** f times x, x a vector. */
        void addScaled(ModVec x, long f) {
            for (int j = 0; j < x.idx.length; j++) {
                add(x.idx[j], x.val[j] * f % p);
            }
        }

        /** The sum times scale, and the accumulator emptied. */
        ModVec take(long scale) {
            Arrays.sort(touched, 0, n);
            int[] idx = new int[n];
            long[] val = new long[n];
            int m = 0;
            for (int i = 0; i < n; i++) {
                int j = touched[i];
                long x = v[j] * scale % p;
                if (x != 0) {
                    idx[m] = j;
                    val[m++] = x;
                }
                mark[j] = false;
            }
            n = 0;
            return m == 0 ? ModVec.ZERO : new ModVec(Arrays.copyOf(idx, m), Arrays.copyOf(val, m));
        }
    }

    /** The whole computation modulo one prime. */
    private static final class Image {
        long prime;
        boolean inconsistent;
        /** Pivot parameters (1-based) in increasing order, and the free ones. */
        int[] pivots;
        int[] freeParams;
        /** Each column's value in coordinates 0 (constant) and 1.. (the free parameters, in order). */
        ModVec[] values;

        static Image of(List<IntegerRow> rows, int columns, ExactPropagation.Plan plan, long p) {
            int k = plan.params().length;
            Accumulator acc = new Accumulator(k + 1, p);
            ModVec[] val = new ModVec[columns];
            int q = 0;
            for (int s = 0; s < plan.steps().length; s++) {
                if ((s & 1023) == 0) {
                    Cancellation.check();
                }
                int step = plan.steps()[s];
                if (step < 0) {
                    val[-1 - step] = ModVec.unit(++q);
                    continue;
                }
                IntegerRow row = rows.get(step);
                int at = -1;
                long rhs = row.rhsMod(p);
                if (rhs != 0) {
                    acc.add(0, rhs);
                }
                for (int i = 0; i < row.length(); i++) {
                    ModVec v = val[row.cols[i]];
                    if (v == null) {
                        at = i;
                    } else {
                        acc.addScaled(v, p - row.coefficientMod(i, p));
                    }
                }
                long a = row.coefficientMod(at, p);
                if (a == 0) {
                    acc.take(0);
                    return null;
                }
                val[row.cols[at]] = acc.take(inverse(a, p));
            }
            Image im = new Image();
            im.prime = p;
            // residual equations, reduced to echelon form modulo p (Gauss-Jordan, lowest parameter first);
            // each pivot row is dense with the list of its non-zero places, as the rank is small
            long[][] pivotRow = new long[k + 1][];
            int[][] pivotPlaces = new int[k + 1][];
            List<Integer> pivotList = new ArrayList<>();
            int rank = 0;
            long[] row = new long[k + 1];
            for (int r = 0; r < rows.size(); r++) {
                if (plan.used()[r]) {
                    continue;
                }
                if ((r & 255) == 0) {
                    Cancellation.check();
                }
                IntegerRow eq = rows.get(r);
                long rhs = eq.rhsMod(p);
                if (rhs != 0) {
                    acc.add(0, p - rhs);
                }
                for (int i = 0; i < eq.length(); i++) {
                    acc.addScaled(val[eq.cols[i]], eq.coefficientMod(i, p));
                }
                ModVec res = acc.take(1);
                if (res.idx.length == 0) {
                    continue;
                }
                Arrays.fill(row, 0);
                for (int i = 0; i < res.idx.length; i++) {
                    row[res.idx[i]] = res.val[i];
                }
                // pivot rows carry no other pivot column, so one pass over the pivots suffices
                for (int j : pivotList) {
                    if (row[j] != 0) {
                        subtract(row, pivotRow[j], pivotPlaces[j], row[j], p);
                    }
                }
                int lead = 0;
                for (int j = 1; j <= k && lead == 0; j++) {
                    if (row[j] != 0) {
                        lead = j;
                    }
                }
                if (lead == 0) {
                    if (row[0] != 0) {
                        im.inconsistent = true;
                        return im;
                    }
                    continue;
                }
                long inv = inverse(row[lead], p);
                long[] piv = new long[k + 1];
                for (int j = 0; j <= k; j++) {
                    piv[j] = row[j] * inv % p;
                }
                int[] places = places(piv);
                for (int j : pivotList) {
                    if (pivotRow[j][lead] != 0) {
                        subtract(pivotRow[j], piv, places, pivotRow[j][lead], p);
                        pivotPlaces[j] = places(pivotRow[j]);
                    }
                }
                pivotRow[lead] = piv;
                pivotPlaces[lead] = places;
                pivotList.add(lead);
                rank++;
            }
            im.pivots = new int[rank];
            im.freeParams = new int[k - rank];
            int[] freeCoordinate = new int[k + 1];
            for (int j = 1, a = 0, b = 0; j <= k; j++) {
                if (pivotRow[j] != null) {
                    im.pivots[a++] = j;
                } else {
                    im.freeParams[b] = j;
                    freeCoordinate[j] = ++b;
                }
            }
            // each parameter in the free ones: p_q = -row_0 - sum_{free f} row_f p_f
            ModVec[] paramVal = new ModVec[k + 1];
            for (int j = 1; j <= k; j++) {
                if (pivotRow[j] == null) {
                    paramVal[j] = ModVec.unit(freeCoordinate[j]);
                    continue;
                }
                long[] pr = pivotRow[j];
                if (pr[0] != 0) {
                    acc.add(0, p - pr[0]);
                }
                for (int f = j + 1; f <= k; f++) {
                    if (pr[f] != 0 && freeCoordinate[f] > 0) {
                        acc.add(freeCoordinate[f], p - pr[f]);
                    }
                }
                paramVal[j] = acc.take(1);
            }
            im.values = new ModVec[columns];
            for (int c = 0; c < columns; c++) {
                if ((c & 255) == 0) {
                    Cancellation.check();
                }
                ModVec v = val[c];
                for (int i = 0; i < v.idx.length; i++) {
                    if (v.idx[i] == 0) {
                        acc.add(0, v.val[i]);
                    } else {
                        acc.addScaled(paramVal[v.idx[i]], v.val[i]);
                    }
                }
                im.values[c] = acc.take(1);
            }
            return im;
        }

        /** row -= f * piv, modulo p; places lists where piv is not zero. */
        private static void subtract(long[] row, long[] piv, int[] places, long f, long p) {
            long g = p - f;
            for (int j : places) {
                row[j] = (row[j] + g * piv[j]) % p;
            }
        }

        private static int[] places(long[] v) {
            int n = 0;
            for (long x : v) {
                n += x != 0 ? 1 : 0;
            }
            int[] out = new int[n];
            for (int j = 0, i = 0; j < v.length; j++) {
                if (v[j] != 0) {
                    out[i++] = j;
                }
            }
            return out;
        }
    }

    private static long inverse(long a, long p) {
        return BigInteger.valueOf(a).modInverse(BigInteger.valueOf(p)).longValue();
    }
}
