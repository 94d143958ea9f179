package dev.contour.algebra;

import dev.contour.Cancellation;
import dev.contour.Parallel;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Multi-modular solver behind {@link LinearSystem#solve()}: the exact reduced row echelon form of
 * [A | b] (lowest-column pivots), computed from its images modulo word-size primes and then
 * verified over Q.
 *
 * <p>Method (common practice for exact sparse linear algebra):
 * <ol>
 * <li>Each row is scaled by the lcm of its denominators, so A and b are integer; a prime then never
 *     divides a denominator, and scaling a row changes neither the solution set nor the RREF.
 * <li>Modulo each prime p &lt; 2^28, sparse incremental elimination in input row order with the
 *     lowest remaining column as pivot gives the pivot columns P (the RREF pivot set mod p), the rows
 *     R that were independent, the product of the pivots (which is, up to a sign fixed by (P, R),
 *     det B for the integer square matrix B = A[R, P]), and the RREF entries: particular solution
 *     and, for each pivot k and free column f &gt; P[k], the pivot row's entry at f. Products of two
 *     residues are below 2^56, so up to 120 of them are added in a long before reducing.
 * <li>A prime whose (rank, P, R) is worse than the best seen is discarded; a better one discards
 *     all earlier primes (an unlucky prime can only lower the rank of a prefix of columns or rows,
 *     never raise it, so the true profile is the best one).
 * <li>By Cramer's rule every wanted RREF entry times D = det B is an r x r minor of the integer
 *     matrix [A_R | b_R], so it is an integer bounded by the Hadamard bound of those rows. We CRT
 *     the images of D and of D * entry (Garner) to symmetric integers; that is the rational
 *     reconstruction with the denominator known, and it needs only as many bits as the entries
 *     have. We reconstruct when a sample (D and a spread of entries) is unchanged by an added prime.
 * <li>The candidate is VERIFIED exactly over Q against every original row (below); on failure more
 *     primes are added.
 * </ol>
 *
 * <p>Why the verified answer is exactly the one of exact Gauss-Jordan (lowest-column pivots): let
 * P be the candidate pivot set and F its complement. (i) The columns of A in P are independent over
 * Q, because they are independent modulo a prime (a non-zero |P| x |P| minor mod p is a non-zero
 * integer). (ii) Verification checks A v_f = 0 for each free f, where by construction v_f is 1 at
 * f and supported otherwise only on pivot columns below f: so column f is a combination of earlier
 * columns and f is not a pivot of the RREF over Q. Hence the RREF pivot set P* is a subset of P,
 * and by (i) and (ii) rank A = |P|, so P* = P. (iii) Given P, the null vector with identity on F
 * and the solution of A x = b with x_F = 0 are unique (two of them differ by a combination of the
 * independent columns P that vanishes). Verification checks A x = b and A v_f = 0, so the candidate
 * is exactly the Gauss-Jordan result. A prime can also claim inconsistency falsely (when the true
 * solution has p in a denominator); the caller then runs the exact path, so no false inconsistency
 * is ever reported.
 */
final class ModularLinearSolver {
    private static final int PRIME_BOUND = 1 << 28;
    private static final int LAZY = 120;
    private static final int SAMPLE = 32;

    private final int n;
    private final int m;
    private final int[][] cols;
    private final BigInteger[][] vals;
    private final BigInteger[] rhs;
    /** Long copies when an integer row fits in a long (the usual case), else null. */
    private final long[][] smallVals;
    private final long[] smallRhs;
    private final boolean[] rhsSmall;
    private final double hadamardBits;

    private ModularLinearSolver(int n, List<TreeMap<Integer, Rational>> rows, List<Rational> b) {
        this.n = n;
        this.m = rows.size();
        cols = new int[m][];
        vals = new BigInteger[m][];
        rhs = new BigInteger[m];
        smallVals = new long[m][];
        smallRhs = new long[m];
        rhsSmall = new boolean[m];
        double bits = 0;
        for (int i = 0; i < m; i++) {
            TreeMap<Integer, Rational> row = rows.get(i);
            BigInteger l = b.get(i).denominator();
            for (Rational v : row.values()) {
                BigInteger d = v.denominator();
                if (!d.equals(BigInteger.ONE)) {
                    l = l.divide(l.gcd(d)).multiply(d);
                }
            }
            int[] c = new int[row.size()];
            BigInteger[] v = new BigInteger[row.size()];
            int k = 0;
            BigInteger norm2 = BigInteger.ZERO;
            boolean small = true;
            for (Map.Entry<Integer, Rational> e : row.entrySet()) {
                c[k] = e.getKey();
                Rational r = e.getValue();
                v[k] = r.numerator().multiply(l.divide(r.denominator()));
                small &= v[k].bitLength() < 63;
                norm2 = norm2.add(v[k].multiply(v[k]));
                k++;
            }
            Rational bi = b.get(i);
            rhs[i] = bi.numerator().multiply(l.divide(bi.denominator()));
            rhsSmall[i] = rhs[i].bitLength() < 63;
            if (rhsSmall[i]) {
                smallRhs[i] = rhs[i].longValue();
            }
            norm2 = norm2.add(rhs[i].multiply(rhs[i]));
            cols[i] = c;
            vals[i] = v;
            if (small) {
                long[] s = new long[v.length];
                for (int j = 0; j < v.length; j++) {
                    s[j] = v[j].longValue();
                }
                smallVals[i] = s;
            }
            // Hadamard: |any minor of [A | b]| <= product of the rows' Euclidean norms.
            if (norm2.signum() > 0) {
                bits += 0.5 * log2(norm2);
            }
        }
        hadamardBits = bits;
    }

    private static double log2(BigInteger x) {
        if (x.signum() == 0) {
            return -1e9;
        }
        int shift = Math.max(0, x.bitLength() - 60);
        return Math.log(Math.abs(x.shiftRight(shift).doubleValue())) / Math.log(2) + shift;
    }

    /** The exact solution, or null when a prime finds the system inconsistent (the caller then runs the exact path). */
    static LinearSystem.Solution solve(int n, List<TreeMap<Integer, Rational>> rows, List<Rational> b) {
        return new ModularLinearSolver(n, rows, b).run();
    }

    /** The image of the system modulo one prime. */
    private static final class Image {
        int[] pivots;
        int[] indepRows;
        int[] residues;
    }

    /** Stands for an image whose prime found the rows inconsistent (deques hold no nulls). */
    private static final Image INCONSISTENT = new Image();

    private LinearSystem.Solution run() {
        List<Long> primes = new ArrayList<>();
        List<int[]> residues = new ArrayList<>();
        Image ref = null;
        int[] free = null;
        int[] sample = null;
        BigInteger[] lastSample = null;
        int nextAttempt = 2;
        // Beyond this many bits of modulus a correct profile is certain to reconstruct (Hadamard bound);
        // the cap only guards against an unforeseen failure by handing over to the exact path.
        double capBits = 2 * hadamardBits + 31 * 40;
        double modBits = 0;
        long p = PRIME_BOUND;
        // Images for the next primes are computed a batch at a time on the shared pool and then
        // taken one by one in descending prime order, exactly as a single thread takes them, so
        // the primes used and the answer do not depend on the number of threads (a batch may
        // compute a few images that are not needed).
        java.util.ArrayDeque<Long> nextPrimes = new java.util.ArrayDeque<>();
        java.util.ArrayDeque<Image> nextImages = new java.util.ArrayDeque<>();
        while (true) {
            Cancellation.check();
            if (nextImages.isEmpty()) {
                long[] batch = new long[Math.max(1, Math.min(Parallel.threads(), 8))];
                for (int i = 0; i < batch.length; i++) {
                    p = ModularPoly.previousPrime(p);
                    batch[i] = p;
                    nextPrimes.add(p);
                }
                // an image is null when the rows are inconsistent modulo its prime: kept as a marker
                for (Image img : Parallel.map(batch.length, i -> image(batch[i]))) {
                    nextImages.add(img == null ? INCONSISTENT : img);
                }
            }
            p = nextPrimes.poll();
            Image img = nextImages.poll();
            if (img == INCONSISTENT) {
                return null;
            }
            int cmp = ref == null ? -1 : compareProfile(img, ref);
            if (cmp > 0) {
                continue;
            }
            if (cmp < 0) {
                ref = img;
                primes.clear();
                residues.clear();
                modBits = 0;
                lastSample = null;
                nextAttempt = 2;
                free = freeColumns(img.pivots);
                sample = sampleIndices(img.residues.length);
            }
            primes.add(p);
            residues.add(img.residues);
            modBits += Math.log(p) / Math.log(2);
            if (modBits > capBits) {
                return null;
            }
            long[] ps = primes.stream().mapToLong(Long::longValue).toArray();
            BigInteger[] now = new BigInteger[sample.length];
            for (int s = 0; s < sample.length; s++) {
                now[s] = garner(ps, residues, sample[s], ps.length);
            }
            boolean stable = lastSample != null && Arrays.equals(now, lastSample);
            lastSample = now;
            if (!stable || primes.size() < nextAttempt) {
                continue;
            }
            LinearSystem.Solution s = reconstructAndVerify(ps, residues, ref, free);
            if (s != null) {
                return s;
            }
            nextAttempt = primes.size() + Math.max(2, primes.size() / 4);
        }
    }

    private int[] freeColumns(int[] pivots) {
        int[] free = new int[n - pivots.length];
        int k = 0;
        int t = 0;
        for (int c = 0; c < n; c++) {
            if (k < pivots.length && pivots[k] == c) {
                k++;
            } else {
                free[t++] = c;
            }
        }
        return free;
    }

    private static int[] sampleIndices(int size) {
        if (size <= SAMPLE + 1) {
            int[] all = new int[size];
            for (int i = 0; i < size; i++) {
                all[i] = i;
            }
            return all;
        }
        int[] s = new int[SAMPLE + 1];
        for (int i = 0; i <= SAMPLE; i++) {
            s[i] = (int) ((long) i * (size - 1) / SAMPLE);
        }
        return s;
    }

    /** Higher rank first, then the lexicographically smaller pivot columns, then independent rows. Negative: a better than b. */
    private static int compareProfile(Image a, Image b) {
        if (a.pivots.length != b.pivots.length) {
            return a.pivots.length > b.pivots.length ? -1 : 1;
        }
        int c = Arrays.compare(a.pivots, b.pivots);
        return c != 0 ? c : Arrays.compare(a.indepRows, b.indepRows);
    }

    /** Symmetric CRT value of entry e from the first k primes (Garner's mixed radix). */
    private static BigInteger garner(long[] ps, List<int[]> residues, int e, int k) {
        long[] d = new long[k];
        for (int j = 0; j < k; j++) {
            long pj = ps[j];
            long t = 0;
            long radix = 1;
            for (int i = 0; i < j; i++) {
                t = (t + d[i] * radix) % pj;
                radix = radix * (ps[i] % pj) % pj;
            }
            long diff = (residues.get(j)[e] - t) % pj;
            if (diff < 0) {
                diff += pj;
            }
            d[j] = diff * ModularPoly.inverse(radix, pj) % pj;
        }
        BigInteger x = BigInteger.valueOf(d[k - 1]);
        BigInteger mod = BigInteger.ONE;
        for (int i = k - 2; i >= 0; i--) {
            x = x.multiply(BigInteger.valueOf(ps[i])).add(BigInteger.valueOf(d[i]));
        }
        for (int i = 0; i < k; i++) {
            mod = mod.multiply(BigInteger.valueOf(ps[i]));
        }
        return x.shiftLeft(1).compareTo(mod) > 0 ? x.subtract(mod) : x;
    }

    /** All entries at once: Garner with the radix inverses shared between entries. */
    private static BigInteger[] garnerAll(long[] ps, List<int[]> residues, int size) {
        int k = ps.length;
        // radixMod[j][i] = p_0 * ... * p_{i-1} mod p_j; inv[j] = (p_0 * ... * p_{j-1})^-1 mod p_j.
        long[][] radixMod = new long[k][];
        long[] inv = new long[k];
        for (int j = 0; j < k; j++) {
            long pj = ps[j];
            radixMod[j] = new long[j + 1];
            long r = 1;
            for (int i = 0; i <= j; i++) {
                radixMod[j][i] = r;
                if (i < j) {
                    r = r * (ps[i] % pj) % pj;
                }
            }
            inv[j] = ModularPoly.inverse(radixMod[j][j], pj);
        }
        BigInteger mod = BigInteger.ONE;
        BigInteger[] bigP = new BigInteger[k];
        for (int i = 0; i < k; i++) {
            bigP[i] = BigInteger.valueOf(ps[i]);
            mod = mod.multiply(bigP[i]);
        }
        BigInteger[] out = new BigInteger[size];
        long[] d = new long[k];
        for (int e = 0; e < size; e++) {
            for (int j = 0; j < k; j++) {
                long pj = ps[j];
                long[] rm = radixMod[j];
                // Residues and radices are below 2^28: up to LAZY products are summed before reducing.
                long t = 0;
                for (int i = 0; i < j; i++) {
                    t += d[i] * rm[i];
                    if (i % LAZY == LAZY - 1) {
                        t %= pj;
                    }
                }
                t %= pj;
                long diff = residues.get(j)[e] - t;
                if (diff < 0) {
                    diff += pj;
                }
                d[j] = diff * inv[j] % pj;
            }
            int top = k - 1;
            while (top > 0 && d[top] == 0) {
                top--;
            }
            BigInteger x = BigInteger.valueOf(d[top]);
            for (int i = top - 1; i >= 0; i--) {
                x = x.multiply(bigP[i]).add(BigInteger.valueOf(d[i]));
            }
            out[e] = x.shiftLeft(1).compareTo(mod) > 0 ? x.subtract(mod) : x;
        }
        return out;
    }

    private LinearSystem.Solution reconstructAndVerify(long[] ps, List<int[]> residues, Image ref, int[] free) {
        int[] piv = ref.pivots;
        int r = piv.length;
        int nf = free.length;
        BigInteger[] x = garnerAll(ps, residues, ref.residues.length);
        BigInteger det = x[0];
        if (det.signum() == 0) {
            return null;
        }
        int[] pivIdx = new int[n];
        Arrays.fill(pivIdx, -1);
        for (int k = 0; k < r; k++) {
            pivIdx[piv[k]] = k;
        }
        int[] freeIdx = new int[n];
        Arrays.fill(freeIdx, -1);
        for (int t = 0; t < nf; t++) {
            freeIdx[free[t]] = t;
        }
        // Integer candidate: D * particular, and D * v_f for each free f (entries at pivots below f).
        BigInteger[] part = new BigInteger[n];
        Arrays.fill(part, BigInteger.ZERO);
        for (int k = 0; k < r; k++) {
            part[piv[k]] = x[1 + k];
        }
        BigInteger[][] nul = new BigInteger[r][];
        int off = 1 + r;
        for (int k = 0; k < r; k++) {
            int start = piv[k] - k;
            nul[k] = new BigInteger[nf];
            Arrays.fill(nul[k], 0, start, BigInteger.ZERO);
            for (int t = start; t < nf; t++) {
                nul[k][t] = x[off++];
            }
        }
        // VERIFY over Q (in integers, times D != 0): A (D x) = D b and A (D v_f) = 0 for every original row.
        BigInteger[] acc = new BigInteger[nf];
        for (int i = 0; i < m; i++) {
            if ((i & 63) == 0) {
                Cancellation.check();
            }
            BigInteger s = rhs[i].multiply(det).negate();
            Arrays.fill(acc, BigInteger.ZERO);
            for (int j = 0; j < cols[i].length; j++) {
                int c = cols[i][j];
                BigInteger a = vals[i][j];
                int k = pivIdx[c];
                if (k >= 0) {
                    s = s.add(a.multiply(part[c]));
                    BigInteger[] row = nul[k];
                    for (int t = c - k; t < nf; t++) {
                        if (row[t].signum() != 0) {
                            acc[t] = acc[t].add(a.multiply(row[t]));
                        }
                    }
                } else {
                    int t = freeIdx[c];
                    acc[t] = acc[t].add(a.multiply(det));
                }
            }
            if (s.signum() != 0) {
                return null;
            }
            for (int t = 0; t < nf; t++) {
                if (acc[t].signum() != 0) {
                    return null;
                }
            }
        }
        List<Rational> particular = new ArrayList<>(n);
        for (int c = 0; c < n; c++) {
            particular.add(part[c].signum() == 0 ? Rational.ZERO : Rational.of(part[c], det));
        }
        if (nf == 0) {
            return new LinearSystem.Unique(Collections.unmodifiableList(particular));
        }
        List<List<Rational>> basis = new ArrayList<>(nf);
        List<Integer> freeList = new ArrayList<>(nf);
        for (int t = 0; t < nf; t++) {
            int f = free[t];
            freeList.add(f);
            List<Rational> v = new ArrayList<>(Collections.nCopies(n, Rational.ZERO));
            v.set(f, Rational.ONE);
            for (int k = 0; k < r && piv[k] < f; k++) {
                BigInteger e = nul[k][t];
                if (e.signum() != 0) {
                    v.set(piv[k], Rational.of(e, det));
                }
            }
            basis.add(Collections.unmodifiableList(v));
        }
        return new LinearSystem.Family(Collections.unmodifiableList(particular), Collections.unmodifiableList(freeList),
                Collections.unmodifiableList(basis), r);
    }

    private long residue(int i, int j, long p) {
        long[] s = smallVals[i];
        long v = s != null ? s[j] % p : vals[i][j].mod(BigInteger.valueOf(p)).longValue();
        return v < 0 ? v + p : v;
    }

    private long rhsResidue(int i, long p) {
        long v = rhsSmall[i] ? smallRhs[i] % p : rhs[i].mod(BigInteger.valueOf(p)).longValue();
        return v < 0 ? v + p : v;
    }

    /** Elimination modulo p, or null when the rows are inconsistent modulo p. */
    private Image image(long p) {
        int[][] prow = new int[n][];
        long[] prhs = new long[n];
        long[] acc = new long[n];
        int[] indep = new int[Math.min(m, n)];
        int rank = 0;
        long det = 1;
        for (int i = 0; i < m; i++) {
            if ((i & 63) == 0) {
                Cancellation.check();
            }
            int[] c = cols[i];
            if (c.length == 0) {
                if (rhsResidue(i, p) != 0) {
                    return null;
                }
                continue;
            }
            for (int j = 0; j < c.length; j++) {
                acc[c[j]] = residue(i, j, p);
            }
            int hi = c[c.length - 1];
            long racc = rhsResidue(i, p);
            int hits = 0;
            boolean pivoted = false;
            for (int col = c[0]; col <= hi; col++) {
                long v = acc[col] % p;
                acc[col] = 0;
                if (v == 0) {
                    continue;
                }
                int[] pr = prow[col];
                if (pr != null) {
                    long f = p - v;
                    for (int j = 1; j < pr.length; j++) {
                        acc[col + j] += f * pr[j];
                    }
                    racc = (racc + f * prhs[col]) % p;
                    hi = Math.max(hi, col + pr.length - 1);
                    if (++hits % LAZY == 0) {
                        for (int j = col + 1; j <= hi; j++) {
                            acc[j] %= p;
                        }
                    }
                    continue;
                }
                long inv = ModularPoly.inverse(v, p);
                int last = hi;
                while (last > col && acc[last] % p == 0) {
                    acc[last] = 0;
                    last--;
                }
                int[] row = new int[last - col + 1];
                row[0] = 1;
                for (int j = col + 1; j <= last; j++) {
                    row[j - col] = (int) (acc[j] % p * inv % p);
                    acc[j] = 0;
                }
                prow[col] = row;
                prhs[col] = racc % p * inv % p;
                det = det * v % p;
                indep[rank++] = i;
                pivoted = true;
                break;
            }
            if (!pivoted && racc % p != 0) {
                return null;
            }
        }
        int[] piv = new int[rank];
        int k = 0;
        for (int col = 0; col < n; col++) {
            if (prow[col] != null) {
                piv[k++] = col;
            }
        }
        int nf = n - rank;
        int[] pivPos = new int[n];
        for (int q = 0; q < rank; q++) {
            pivPos[piv[q]] = q;
        }
        int[] freeIdx = new int[n];
        Arrays.fill(freeIdx, -1);
        for (int col = 0, t = 0; col < n; col++) {
            if (prow[col] == null) {
                freeIdx[col] = t++;
            }
        }
        // Back substitution to the RREF, pivots from the highest column down; reduced rows hold only
        // free-column entries (dense over the free columns) and the right-hand side.
        long[][] red = new long[n][];
        long[] redRhs = new long[n];
        long[] accF = new long[nf];
        for (int q = rank - 1; q >= 0; q--) {
            int col = piv[q];
            int[] pr = prow[col];
            int firstFree = col - q; // free columns below col number col - q
            Arrays.fill(accF, firstFree, nf, 0);
            long racc = prhs[col];
            int hits = 0;
            for (int j = 1; j < pr.length; j++) {
                long v = pr[j];
                if (v == 0) {
                    continue;
                }
                int cj = col + j;
                int t = freeIdx[cj];
                if (t >= 0) {
                    accF[t] += v;
                    continue;
                }
                long f = p - v;
                long[] rq = red[cj];
                int qStart = cj - pivPos[cj]; // reduced row of pivot cj is zero on free columns below cj
                for (int u = qStart; u < nf; u++) {
                    accF[u] += f * rq[u];
                }
                racc = (racc + f * redRhs[cj]) % p;
                if (++hits % LAZY == 0) {
                    for (int u = firstFree; u < nf; u++) {
                        accF[u] %= p;
                    }
                }
            }
            long[] out = new long[nf];
            for (int u = firstFree; u < nf; u++) {
                out[u] = accF[u] % p;
            }
            red[col] = out;
            redRhs[col] = racc % p;
        }
        // Residues of D, D * particular, D * (-rref[k][f]) for free f above pivot k.
        int size = 1 + rank;
        for (int q = 0; q < rank; q++) {
            size += nf - (piv[q] - q);
        }
        int[] res = new int[size];
        res[0] = (int) det;
        for (int q = 0; q < rank; q++) {
            res[1 + q] = (int) (redRhs[piv[q]] * det % p);
        }
        int off = 1 + rank;
        for (int q = 0; q < rank; q++) {
            long[] row = red[piv[q]];
            for (int u = piv[q] - q; u < nf; u++) {
                long v = row[u] == 0 ? 0 : (p - row[u]) * det % p;
                res[off++] = (int) v;
            }
        }
        Image img = new Image();
        img.pivots = piv;
        img.indepRows = Arrays.copyOf(indep, rank);
        img.residues = res;
        return img;
    }
}
