package dev.contour.algebra;

import dev.contour.Cancellation;
import java.math.BigInteger;
import java.util.Arrays;
import java.util.Random;

/**
 * Brown-style modular gcd of two integer polynomials that are primitive in a main variable x.
 *
 * <p>Modulo each word-size prime p, the other variables are set to the points of a random grid
 * large enough for dense interpolation (degree bound: deg(gamma) + the smaller degree of the inputs),
 * each image gcd in x is computed by Euclid over Z/p, made monic and scaled by gamma(point), where
 * gamma is the gcd of the leading coefficients; the grid values are interpolated variable by
 * variable and the primes are combined by the Chinese remainder theorem until the result stops
 * changing. The candidate is accepted only after exact trial division of both inputs, so a bad
 * prime or an unlucky point can cost time but never correctness. Returns null to ask the caller
 * for the (slower) remainder-sequence algorithm when the grid would be too large.
 */
final class ModularGcd {
    private static final long GRID_LIMIT = 2_000_000;
    private static final int MAX_PRIMES = 200;

    private ModularGcd() { }

    /**
     * gcd of a and b (integer coefficients, both containing x, both primitive with respect to x),
     * up to a constant; gamma is the integer gcd of their leading coefficients in x. Null when the
     * dense grid is too large.
     */
    static Polynomial gcd(Polynomial a, Polynomial b, String x, Polynomial gamma) {
        String[] vars = Polynomial.unionVars(Polynomial.unionVars(a.vars, b.vars), gamma.vars);
        int xi = Arrays.binarySearch(vars, x);
        int n = vars.length;
        int[] others = new int[n - 1];
        for (int i = 0, k = 0; i < n; i++) {
            if (i != xi) {
                others[k++] = i;
            }
        }
        int[][] ea = a.expsOver(vars);
        int[][] eb = b.expsOver(vars);
        int[][] eg = gamma.expsOver(vars);
        int[] dims = new int[others.length];
        long size = 1;
        for (int k = 0; k < others.length; k++) {
            int v = others[k];
            int d = maxExp(eg, v) + Math.min(maxExp(ea, v), maxExp(eb, v));
            dims[k] = d + 1;
            size *= dims[k];
            if (size > GRID_LIMIT) {
                return null;
            }
        }
        int grid = (int) size;
        int degA = maxExp(ea, xi);
        int degB = maxExp(eb, xi);
        Random rnd = new Random(42);
        BigInteger modulus = null;
        BigInteger[] acc = null;
        Polynomial previous = null;
        int degree = Integer.MAX_VALUE;
        long p = (1L << 31) - 1;
        for (int prime = 0; prime < MAX_PRIMES; prime++) {
            Cancellation.check();
            p = ModularPoly.previousPrime(p);
            long[] ca = residues(a.coeffs, p);
            long[] cb = residues(b.coeffs, p);
            long[] cg = residues(gamma.coeffs, p);
            long[] image = null;
            int imageDegree = -1;
            for (int attempt = 0; attempt < 4 && image == null; attempt++) {
                long[][] points = new long[others.length][];
                for (int k = 0; k < others.length; k++) {
                    points[k] = distinctPoints(dims[k], p, rnd);
                }
                Object r = imageOnGrid(ea, ca, eb, cb, eg, cg, degA, degB, xi, others, dims, grid, points, p);
                if (r instanceof long[] values) {
                    imageDegree = values.length / grid - 1;
                    for (int k = 0; k < others.length; k++) {
                        interpolate(values, imageDegree + 1, dims, k, points[k], p);
                    }
                    image = values;
                }
            }
            if (image == null) {
                continue;
            }
            if (imageDegree == 0) {
                return Polynomial.ONE;
            }
            if (imageDegree > degree) {
                continue;
            }
            BigInteger bp = BigInteger.valueOf(p);
            if (imageDegree < degree) {
                degree = imageDegree;
                modulus = bp;
                acc = new BigInteger[image.length];
                for (int i = 0; i < image.length; i++) {
                    acc[i] = BigInteger.valueOf(image[i]);
                }
                previous = null;
            } else {
                BigInteger inv = modulus.mod(bp).modInverse(bp);
                for (int i = 0; i < image.length; i++) {
                    long r = acc[i].mod(bp).longValue();
                    long t = Math.floorMod(image[i] - r, p);
                    t = BigInteger.valueOf(t).multiply(inv).mod(bp).longValue();
                    if (t != 0) {
                        acc[i] = acc[i].add(modulus.multiply(BigInteger.valueOf(t)));
                    }
                }
                modulus = modulus.multiply(bp);
            }
            Polynomial h = build(acc, modulus, vars, xi, others, dims, degree + 1);
            if (h.equals(previous)) {
                Polynomial content = PolynomialGcd.contentIn(h, x);
                Polynomial cand = content.isOne() ? h : h.divideOrNull(content);
                cand = cand.primitivePart();
                if (a.divideOrNull(cand) != null && b.divideOrNull(cand) != null) {
                    return cand;
                }
            }
            previous = h;
        }
        return null;
    }

    private static int maxExp(int[][] e, int v) {
        int d = 0;
        for (int[] t : e) {
            d = Math.max(d, t[v]);
        }
        return d;
    }

    private static long[] residues(Rational[] c, long p) {
        long[] out = new long[c.length];
        BigInteger bp = BigInteger.valueOf(p);
        for (int i = 0; i < c.length; i++) {
            out[i] = c[i].isSmall() ? Math.floorMod(c[i].longNum(), p) : c[i].numerator().mod(bp).longValue();
        }
        return out;
    }

    private static long[] distinctPoints(int n, long p, Random rnd) {
        long[] pts = new long[n];
        java.util.HashSet<Long> seen = new java.util.HashSet<>();
        for (int i = 0; i < n; i++) {
            long v;
            do {
                v = 1 + Math.floorMod(rnd.nextLong(), p - 1);
            } while (!seen.add(v));
            pts[i] = v;
        }
        return pts;
    }

    /**
     * Values of gamma * monic gcd at each grid point, laid out as [j * grid + g] for x^j, or null
     * when a point is unlucky (a leading coefficient vanishes or the degree differs).
     */
    private static Object imageOnGrid(int[][] ea, long[] ca, int[][] eb, long[] cb, int[][] eg, long[] cg, int degA, int degB,
            int xi, int[] others, int[] dims, int grid, long[][] points, long p) {
        long[][][] pow = new long[others.length][][];
        int maxDeg = 0;
        for (int[][] e : new int[][][] {ea, eb, eg}) {
            for (int[] t : e) {
                for (int v : others) {
                    maxDeg = Math.max(maxDeg, t[v]);
                }
            }
        }
        for (int k = 0; k < others.length; k++) {
            pow[k] = new long[dims[k]][maxDeg + 1];
            for (int q = 0; q < dims[k]; q++) {
                long[] row = pow[k][q];
                row[0] = 1;
                for (int e = 1; e <= maxDeg; e++) {
                    row[e] = row[e - 1] * points[k][q] % p;
                }
            }
        }
        long[][] images = new long[grid][];
        int[] idx = new int[others.length];
        int degree = Integer.MAX_VALUE;
        for (int g = 0; g < grid; g++) {
            if ((g & 255) == 0) {
                Cancellation.check();
            }
            long[] ua = evaluate(ea, ca, degA, xi, others, pow, idx, p);
            long[] ub = evaluate(eb, cb, degB, xi, others, pow, idx, p);
            long gv = evaluate(eg, cg, 0, xi, others, pow, idx, p)[0];
            if (ua[degA] == 0 || ub[degB] == 0 || gv == 0) {
                return null;
            }
            long[] h = ModularPoly.gcd(ua, ub, p);
            if (g > 0 && h.length - 1 != degree) {
                return null;
            }
            degree = h.length - 1;
            for (int j = 0; j < h.length; j++) {
                h[j] = h[j] * gv % p;
            }
            images[g] = h;
            for (int k = others.length - 1; k >= 0; k--) {
                if (++idx[k] < dims[k]) {
                    break;
                }
                idx[k] = 0;
            }
        }
        long[] values = new long[(degree + 1) * grid];
        for (int g = 0; g < grid; g++) {
            for (int j = 0; j <= degree; j++) {
                values[j * grid + g] = images[g][j];
            }
        }
        return values;
    }

    /** Univariate image in x (coefficients mod p, dense up to deg) at the grid point idx. */
    private static long[] evaluate(int[][] e, long[] c, int deg, int xi, int[] others, long[][][] pow, int[] idx, long p) {
        long[] out = new long[Math.max(deg, maxExp(e, xi)) + 1];
        for (int t = 0; t < e.length; t++) {
            long v = c[t];
            for (int k = 0; k < others.length && v != 0; k++) {
                v = v * pow[k][idx[k]][e[t][others[k]]] % p;
            }
            int j = e[t][xi];
            out[j] = (out[j] + v) % p;
        }
        return out;
    }

    /**
     * Replaces values on the grid along dimension k by coefficients in that variable (Newton
     * divided differences, then expansion to the monomial basis), for each of the {@code blocks}
     * coefficient blocks.
     */
    private static void interpolate(long[] values, int blocks, int[] dims, int k, long[] pts, long p) {
        int grid = values.length / blocks;
        int n = dims[k];
        int stride = 1;
        for (int q = k + 1; q < dims.length; q++) {
            stride *= dims[q];
        }
        long[][] invDiff = new long[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                invDiff[i][j] = ModularPoly.inverse(Math.floorMod(pts[i] - pts[j], p), p);
            }
        }
        long[] f = new long[n];
        long[] poly = new long[n];
        for (int base = 0; base < values.length; base++) {
            int g = base % grid;
            if ((g / stride) % n != 0) {
                continue;
            }
            for (int i = 0; i < n; i++) {
                f[i] = values[base + i * stride];
            }
            for (int level = 1; level < n; level++) {
                for (int i = n - 1; i >= level; i--) {
                    f[i] = Math.floorMod(f[i] - f[i - 1], p) * invDiff[i][i - level] % p;
                }
            }
            Arrays.fill(poly, 0);
            poly[0] = f[n - 1];
            for (int i = n - 2; i >= 0; i--) {
                // poly = poly * (y - pts[i]) + f[i]
                for (int d = n - 1; d >= 1; d--) {
                    poly[d] = Math.floorMod(poly[d - 1] - poly[d] * pts[i] % p, p);
                }
                poly[0] = Math.floorMod(f[i] - poly[0] * pts[i] % p, p);
            }
            for (int i = 0; i < n; i++) {
                values[base + i * stride] = poly[i];
            }
        }
    }

    /** The polynomial with symmetric-range integer coefficients acc mod m on the interpolated layout. */
    private static Polynomial build(BigInteger[] acc, BigInteger m, String[] vars, int xi, int[] others, int[] dims, int blocks) {
        int grid = acc.length / blocks;
        BigInteger half = m.shiftRight(1);
        java.util.List<int[]> ex = new java.util.ArrayList<>();
        java.util.List<Rational> co = new java.util.ArrayList<>();
        for (int j = 0; j < blocks; j++) {
            for (int g = 0; g < grid; g++) {
                BigInteger v = acc[j * grid + g];
                if (v.signum() == 0) {
                    continue;
                }
                if (v.compareTo(half) > 0) {
                    v = v.subtract(m);
                }
                int[] e = new int[vars.length];
                e[xi] = j;
                int rest = g;
                for (int k = others.length - 1; k >= 0; k--) {
                    e[others[k]] = rest % dims[k];
                    rest /= dims[k];
                }
                ex.add(e);
                co.add(Rational.of(v));
            }
        }
        return Polynomial.fromArrays(vars, ex.toArray(new int[0][]), co.toArray(new Rational[0]), false);
    }
}
