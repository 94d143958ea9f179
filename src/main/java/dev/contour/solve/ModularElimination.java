package dev.contour.solve;

import java.util.Arrays;
import java.util.List;

/**
 * Sparse Gaussian elimination modulo a word-sized prime, used to find the rank, the pivot columns
 * and whether the system is consistent.
 *
 * <p>Pivot order: the shortest active row first, and in it the column that occurs in the fewest
 * rows (a Markowitz-style choice). For the very sparse, lattice-structured systems that Mellin
 * ansatze produce, most rows have two or three entries, so eliminating a column merges it into a
 * neighbour without fill-in; picking the rarer column keeps the work close to linear.
 *
 * <p>The rank found modulo a prime never exceeds the rank over Q, so the free columns found here
 * are a valid choice only after the exact pass has verified the solution over Q
 * ({@link ExactBacksolve}); that verification is what makes the result exact.
 */
final class ModularElimination {
    /** Outcome: which columns got a pivot, the rank, and whether some row reduced to 0 = non-zero. */
    record Result(boolean[] pivotColumn, int rank, boolean consistent) { }

    private ModularElimination() { }

    static Result run(List<IntegerRow> rows, int columns, long prime, SolveProgress progress) {
        int n = rows.size();
        int[][] rc = new int[n][];
        long[][] rv = new long[n][];
        long[] rb = new long[n];
        boolean[] alive = new boolean[n];
        IntList[] colRows = new IntList[columns];
        for (int c = 0; c < columns; c++) {
            colRows[c] = new IntList();
        }
        Buckets buckets = new Buckets();
        boolean consistent = true;
        for (int r = 0; r < n; r++) {
            IntegerRow row = rows.get(r);
            int len = row.length();
            int[] cs = new int[len];
            long[] vs = new long[len];
            int k = 0;
            for (int i = 0; i < len; i++) {
                long v = row.coefficientMod(i, prime);
                if (v != 0) {
                    cs[k] = row.cols[i];
                    vs[k++] = v;
                }
            }
            rc[r] = k == len ? cs : Arrays.copyOf(cs, k);
            rv[r] = k == len ? vs : Arrays.copyOf(vs, k);
            rb[r] = row.rhsMod(prime);
            if (k == 0) {
                consistent &= rb[r] == 0;
                continue;
            }
            alive[r] = true;
            for (int c : rc[r]) {
                colRows[c].add(r);
            }
            buckets.push(k, r);
        }
        boolean[] pivotColumn = new boolean[columns];
        int rank = 0;
        int r;
        while ((r = buckets.pop(rc, alive)) >= 0) {
            int[] pc = rc[r];
            long[] pv = rv[r];
            int best = 0;
            for (int i = 1; i < pc.length; i++) {
                if (colRows[pc[i]].size < colRows[pc[best]].size) {
                    best = i;
                }
            }
            int c = pc[best];
            long inv = inverse(pv[best], prime);
            alive[r] = false;
            pivotColumn[c] = true;
            rank++;
            IntList users = colRows[c];
            colRows[c] = null;
            for (int u = 0; u < users.size; u++) {
                int i = users.data[u];
                if (!alive[i]) {
                    continue;
                }
                int pos = Arrays.binarySearch(rc[i], c);
                if (pos < 0) {
                    continue;
                }
                long factor = rv[i][pos] * inv % prime;
                eliminate(i, r, factor, prime, rc, rv, colRows);
                rb[i] = Math.floorMod(rb[i] - factor * rb[r] % prime, prime);
                if (rc[i].length == 0) {
                    alive[i] = false;
                    consistent &= rb[i] == 0;
                } else {
                    buckets.push(rc[i].length, i);
                }
            }
            progress.eliminated(rank);
        }
        return new Result(pivotColumn, rank, consistent);
    }

    /** row i -= factor * row r (merging sorted column lists); registers row i with new columns. */
    private static void eliminate(int i, int r, long factor, long prime, int[][] rc, long[][] rv, IntList[] colRows) {
        int[] ac = rc[i];
        long[] av = rv[i];
        int[] bc = rc[r];
        long[] bv = rv[r];
        int[] oc = new int[ac.length + bc.length];
        long[] ov = new long[ac.length + bc.length];
        int a = 0;
        int b = 0;
        int k = 0;
        while (a < ac.length || b < bc.length) {
            if (b == bc.length || a < ac.length && ac[a] < bc[b]) {
                oc[k] = ac[a];
                ov[k++] = av[a++];
            } else if (a == ac.length || bc[b] < ac[a]) {
                long v = prime - bv[b] * factor % prime;
                if (v != prime) {
                    oc[k] = bc[b];
                    ov[k++] = v;
                    if (colRows[bc[b]] != null) {
                        colRows[bc[b]].add(i);
                    }
                }
                b++;
            } else {
                long v = Math.floorMod(av[a] - bv[b] * factor % prime, prime);
                if (v != 0) {
                    oc[k] = ac[a];
                    ov[k++] = v;
                }
                a++;
                b++;
            }
        }
        rc[i] = Arrays.copyOf(oc, k);
        rv[i] = Arrays.copyOf(ov, k);
    }

    static long inverse(long a, long prime) {
        long result = 1;
        long base = a % prime;
        long e = prime - 2;
        while (e > 0) {
            if ((e & 1) == 1) {
                result = result * base % prime;
            }
            base = base * base % prime;
            e >>= 1;
        }
        return result;
    }

    /** A growable int array. */
    static final class IntList {
        int[] data = new int[4];
        int size;

        void add(int v) {
            if (size == data.length) {
                data = Arrays.copyOf(data, size * 2);
            }
            data[size++] = v;
        }
    }

    /** Rows by current length; entries go stale when a row changes and are skipped on pop. */
    private static final class Buckets {
        private IntList[] byLength = new IntList[8];
        private int lowest = Integer.MAX_VALUE;

        void push(int length, int row) {
            if (length >= byLength.length) {
                byLength = Arrays.copyOf(byLength, Math.max(length + 1, byLength.length * 2));
            }
            if (byLength[length] == null) {
                byLength[length] = new IntList();
            }
            byLength[length].add(row);
            lowest = Math.min(lowest, length);
        }

        int pop(int[][] rc, boolean[] alive) {
            for (int len = Math.max(lowest, 1); len < byLength.length; len++) {
                IntList list = byLength[len];
                while (list != null && list.size > 0) {
                    int row = list.data[--list.size];
                    if (alive[row] && rc[row].length == len) {
                        lowest = len;
                        return row;
                    }
                }
            }
            return -1;
        }
    }
}
