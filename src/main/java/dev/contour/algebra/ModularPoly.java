package dev.contour.algebra;

import java.util.Arrays;

/**
 * Dense univariate polynomials over Z/p (p a prime below 2^31) as coefficient arrays, lowest
 * degree first, always trimmed so that the last entry is non-zero (the zero polynomial is empty).
 */
final class ModularPoly {
    private ModularPoly() { }

    static int degree(long[] f) {
        return f.length - 1;
    }

    static long[] trim(long[] f) {
        int n = f.length;
        while (n > 0 && f[n - 1] == 0) {
            n--;
        }
        return n == f.length ? f : Arrays.copyOf(f, n);
    }

    /** The largest prime below p (p at most 2^31): shared by the modular GCD and the modular linear solver. */
    static long previousPrime(long p) {
        if (p > (1L << 31)) {
            throw new IllegalArgumentException("previousPrime is for moduli up to 2^31, got " + p);
        }
        long q = p - 1;
        while (!isPrime(q)) {
            q--;
        }
        return q;
    }

    /**
     * Primality below 2^31, exactly: Miller-Rabin with the bases 2, 7 and 61, which has no false
     * positive below 4,759,123,141 (Jaeschke, Math. Comp. 61 (1993) 915; from memory).
     */
    static boolean isPrime(long n) {
        if (n < 2) {
            return false;
        }
        for (long small : new long[] {2, 3, 5, 7, 61}) {
            if (n % small == 0) {
                return n == small;
            }
        }
        long d = n - 1;
        int r = 0;
        while ((d & 1) == 0) {
            d >>= 1;
            r++;
        }
        for (long a : new long[] {2, 7, 61}) {
            long x = powMod(a, d, n);
            if (x == 1 || x == n - 1) {
                continue;
            }
            boolean composite = true;
            for (int i = 1; i < r && composite; i++) {
                x = x * x % n;
                composite = x != n - 1;
            }
            if (composite) {
                return false;
            }
        }
        return true;
    }

    /** a^e mod n for n below 2^31 (products fit a long). */
    private static long powMod(long a, long e, long n) {
        long result = 1;
        long b = a % n;
        while (e > 0) {
            if ((e & 1) != 0) {
                result = result * b % n;
            }
            b = b * b % n;
            e >>= 1;
        }
        return result;
    }

    static long inverse(long a, long p) {
        long t = 0;
        long nt = 1;
        long r = p;
        long nr = ((a % p) + p) % p;
        while (nr != 0) {
            long q = r / nr;
            long tmp = t - q * nt;
            t = nt;
            nt = tmp;
            tmp = r - q * nr;
            r = nr;
            nr = tmp;
        }
        if (r != 1) {
            throw new ArithmeticException("not invertible modulo " + p);
        }
        return t < 0 ? t + p : t;
    }

    /** Remainder of a modulo b (b non-zero). */
    static long[] remainder(long[] a, long[] b, long p) {
        a = trim(a);
        b = trim(b);
        if (a.length < b.length) {
            return a;
        }
        long[] r = a.clone();
        int db = b.length - 1;
        long inv = inverse(b[db], p);
        for (int k = r.length - 1; k >= db; k--) {
            long c = r[k] * inv % p;
            if (c != 0) {
                int s = k - db;
                for (int j = 0; j <= db; j++) {
                    r[s + j] = (r[s + j] - c * b[j]) % p;
                    if (r[s + j] < 0) {
                        r[s + j] += p;
                    }
                }
            }
        }
        return trim(Arrays.copyOf(r, db));
    }

    /** Monic gcd. */
    static long[] gcd(long[] a, long[] b, long p) {
        a = trim(a);
        b = trim(b);
        while (b.length > 0) {
            long[] r = remainder(a, b, p);
            a = b;
            b = r;
        }
        if (a.length == 0) {
            return a;
        }
        long inv = inverse(a[a.length - 1], p);
        long[] out = new long[a.length];
        for (int i = 0; i < a.length; i++) {
            out[i] = a[i] * inv % p;
        }
        return out;
    }
}
