package dev.contour.solve;

import dev.contour.algebra.Rational;
import java.util.List;
import java.util.Map;

/** Rank by plain dense Gaussian elimination over Q: an independent check for the sparse solver. */
final class DenseRank {
    private DenseRank() { }

    static int of(List<Map<Integer, Rational>> rows, int n) {
        Rational[][] a = new Rational[rows.size()][n];
        for (int r = 0; r < rows.size(); r++) {
            for (int c = 0; c < n; c++) {
                a[r][c] = rows.get(r).getOrDefault(c, Rational.ZERO);
            }
        }
        int rank = 0;
        for (int c = 0; c < n && rank < a.length; c++) {
            int p = rank;
            while (p < a.length && a[p][c].isZero()) {
                p++;
            }
            if (p == a.length) {
                continue;
            }
            Rational[] t = a[p];
            a[p] = a[rank];
            a[rank] = t;
            for (int r = 0; r < a.length; r++) {
                if (r != rank && !a[r][c].isZero()) {
                    Rational f = a[r][c].divide(a[rank][c]);
                    for (int k = c; k < n; k++) {
                        a[r][k] = a[r][k].subtract(f.multiply(a[rank][k]));
                    }
                }
            }
            rank++;
        }
        return rank;
    }
}
