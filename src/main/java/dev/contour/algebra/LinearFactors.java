package dev.contour.algebra;

import dev.contour.ContourException;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

/**
 * Splitting a polynomial into its factors that are linear over Q.
 *
 * <p>Method: factors free of the first variable x are factors of the content with respect to x
 * (found by recursion on fewer variables). A factor x - r0 - sum r_i (y_i - z_i) containing x
 * leaves a rational root on every line y = const; the roots at a random point z, at z + c_i e_i and
 * at a check point z + d_i e_i give candidate slopes r_i, and every candidate is confirmed by exact
 * division. Univariate rational roots are found modulo a small prime, lifted by Newton iteration
 * and recovered by rational reconstruction, then checked exactly. Random points only steer the
 * search: the result is verified by division and does not depend on them.
 */
public final class LinearFactors {
    private LinearFactors() { }

    /**
     * p = unit * prod factor_i^multiplicity_i * cofactor, where each factor is a primitive linear
     * polynomial (total degree 1, integer coefficients, positive leading coefficient), pairwise
     * distinct, and the cofactor is primitive with no linear factor over Q.
     * Factors are sorted by {@link Polynomial#compareTo}. The zero polynomial throws
     * ContourException.
     */
    public static Split split(Polynomial p) {
        if (p.isZero()) {
            throw new ContourException("cannot split the zero polynomial into factors");
        }
        if (p.isConstant()) {
            return new Split(p.constantValue(), List.of(), Polynomial.ONE);
        }
        if (p.coeffs.length == 1) {
            // A monomial c * x^a * y^b ...: its factors are its variables, whatever the degrees.
            List<Factor> vars = new ArrayList<>();
            for (int v = 0; v < p.vars.length; v++) {
                if (p.exps[0][v] > 0) {
                    vars.add(new Factor(Polynomial.variable(p.vars[v]), p.exps[0][v]));
                }
            }
            vars.sort(Comparator.comparing(Factor::base));
            return new Split(p.coeffs[0], List.copyOf(vars), Polynomial.ONE);
        }
        Rational unit = p.content();
        Polynomial q = p.primitivePart();
        List<Factor> found = new ArrayList<>();
        Polynomial cof = findLinear(q, found);
        Rational c = cof.content();
        unit = unit.multiply(c);
        cof = cof.primitivePart();
        found.sort(Comparator.comparing(Factor::base));
        return new Split(unit, List.copyOf(found), cof);
    }

    public record Factor(Polynomial base, int multiplicity) { }

    public record Split(Rational unit, List<Factor> factors, Polynomial cofactor) { }

    /** Appends the linear factors of q to out; returns q divided by them. */
    private static Polynomial findLinear(Polynomial q, List<Factor> out) {
        if (q.isConstant()) {
            return q;
        }
        if (q.isLinear()) {
            out.add(new Factor(q.primitivePart(), 1));
            return Polynomial.constant(q.content());
        }
        String x = q.vars[0];
        Polynomial cofactor = Polynomial.ONE;
        Polynomial cont = PolynomialGcd.contentIn(q, x);
        if (!cont.isConstant()) {
            cofactor = findLinear(cont, out);
            q = q.divideOrNull(cont);
        }
        Set<Polynomial> candidates = new LinkedHashSet<>();
        if (q.vars.length == 1) {
            for (Rational root : rationalRoots(q)) {
                candidates.add(linear(x, root, Map.of(), Map.of()));
            }
        } else {
            candidates = multivariateCandidates(q, x);
        }
        for (Polynomial l : candidates) {
            int m = 0;
            Polynomial r;
            while (q.vars.length > 0 && (r = q.divideOrNull(l)) != null) {
                q = r;
                m++;
            }
            if (m > 0) {
                out.add(new Factor(l, m));
            }
        }
        return cofactor.multiply(q);
    }

    /** Primitive form of x - root - sum slope_y * (y - z_y). */
    private static Polynomial linear(String x, Rational root, Map<String, Rational> slopes, Map<String, Rational> z) {
        Polynomial l = Polynomial.variable(x).subtract(Polynomial.constant(root));
        for (Map.Entry<String, Rational> s : slopes.entrySet()) {
            Polynomial y = Polynomial.variable(s.getKey()).subtract(Polynomial.constant(z.get(s.getKey())));
            l = l.subtract(y.multiply(s.getValue()));
        }
        return l.primitivePart();
    }

    private static Set<Polynomial> multivariateCandidates(Polynomial q, String x) {
        String[] others = java.util.Arrays.copyOfRange(q.vars, 1, q.vars.length);
        int n = others.length;
        Polynomial[] cx = q.coefficientsIn(x);
        Polynomial lead = cx[cx.length - 1];
        Random rnd = new Random(0x5eed + 31L * q.hashCode());
        for (int attempt = 0; attempt < 50; attempt++) {
            int range = 20 + 10 * attempt;
            Map<String, Rational> z = new HashMap<>();
            for (String y : others) {
                z.put(y, Rational.of(rnd.nextInt(2 * range + 1) - range));
            }
            long[] c = new long[n];
            long[] d = new long[n];
            for (int i = 0; i < n; i++) {
                c[i] = 1 + rnd.nextInt(range);
                do {
                    d[i] = -range + rnd.nextInt(2 * range + 1);
                } while (d[i] == 0 || d[i] == c[i]);
            }
            if (lead.evaluate(z).isZero()) {
                continue;
            }
            boolean degenerate = false;
            List<Set<Rational>> stepRoots = new ArrayList<>();
            List<Set<Rational>> checkRoots = new ArrayList<>();
            for (int i = 0; i < n && !degenerate; i++) {
                Map<String, Rational> zc = new HashMap<>(z);
                zc.put(others[i], z.get(others[i]).add(Rational.of(c[i])));
                Map<String, Rational> zd = new HashMap<>(z);
                zd.put(others[i], z.get(others[i]).add(Rational.of(d[i])));
                if (lead.evaluate(zc).isZero() || lead.evaluate(zd).isZero()) {
                    degenerate = true;
                    break;
                }
                stepRoots.add(new HashSet<>(rationalRoots(q.evaluatePartially(zc))));
                checkRoots.add(new HashSet<>(rationalRoots(q.evaluatePartially(zd))));
            }
            if (degenerate) {
                continue;
            }
            Set<Polynomial> out = new LinkedHashSet<>();
            for (Rational alpha : rationalRoots(q.evaluatePartially(z))) {
                List<List<Rational>> slopes = new ArrayList<>();
                for (int i = 0; i < n; i++) {
                    List<Rational> si = new ArrayList<>();
                    for (Rational beta : stepRoots.get(i)) {
                        Rational r = beta.subtract(alpha).divide(Rational.of(c[i]));
                        if (checkRoots.get(i).contains(alpha.add(r.multiply(Rational.of(d[i]))))) {
                            si.add(r);
                        }
                    }
                    slopes.add(si);
                }
                combine(x, alpha, others, z, slopes, 0, new HashMap<>(), out);
            }
            return out;
        }
        // Unreachable in practice: the leading coefficient is a non-zero polynomial.
        throw new IllegalStateException("no non-degenerate evaluation point found for " + q);
    }

    private static void combine(String x, Rational alpha, String[] others, Map<String, Rational> z,
            List<List<Rational>> slopes, int i, Map<String, Rational> chosen, Set<Polynomial> out) {
        if (i == others.length) {
            out.add(linear(x, alpha, chosen, z));
            return;
        }
        for (Rational r : slopes.get(i)) {
            chosen.put(others[i], r);
            combine(x, alpha, others, z, slopes, i + 1, chosen, out);
        }
        chosen.remove(others[i]);
    }

    /** The distinct rational roots of a univariate polynomial (any variable name); none for constants. */
    static List<Rational> rationalRoots(Polynomial f) {
        List<Rational> roots = new ArrayList<>();
        if (f.isConstant()) {
            return roots;
        }
        String x = f.vars[0];
        Polynomial[] c = f.coefficientsIn(x);
        int low = 0;
        while (c[low].isZero()) {
            low++;
        }
        if (low > 0) {
            roots.add(Rational.ZERO);
            Polynomial[] shifted = java.util.Arrays.copyOfRange(c, low, c.length);
            f = Polynomial.fromCoefficientsIn(x, shifted);
            if (f.isConstant()) {
                return roots;
            }
        }
        if (f.degree(x) > 1) {
            Polynomial g = PolynomialGcd.gcd(f, f.derivative(x));
            if (!g.isConstant()) {
                f = f.divideOrNull(g);
            }
        }
        f = f.primitivePart();
        c = f.coefficientsIn(x);
        int deg = c.length - 1;
        BigInteger[] a = new BigInteger[deg + 1];
        for (int k = 0; k <= deg; k++) {
            a[k] = c[k].constantValue().numerator();
        }
        if (deg == 1) {
            roots.add(Rational.of(a[0].negate(), a[1]));
            return roots;
        }
        BigInteger bound = a[deg].abs().max(a[0].abs());
        BigInteger need = bound.multiply(bound).shiftLeft(1);
        long prime = choosePrime(a);
        BigInteger bp = BigInteger.valueOf(prime);
        long[] am = new long[deg + 1];
        for (int k = 0; k <= deg; k++) {
            am[k] = a[k].mod(bp).longValue();
        }
        for (long r = 0; r < prime; r++) {
            if (evalMod(am, r, prime) != 0) {
                continue;
            }
            dev.contour.Cancellation.check();
            BigInteger m = bp;
            BigInteger root = BigInteger.valueOf(r);
            // Try the root after every lifting step: small roots (the usual case: poch(s, 400) has
            // roots 0, -1, ..., -399 but coefficients of thousands of bits) are found long before the
            // modulus reaches the coefficient bound; a cheap modular test screens each candidate
            // before the exact one. Horner's rule runs modulo m, so numbers stay the modulus's size.
            while (true) {
                Rational cand = RationalReconstruction.of(root, m);
                if (cand != null && maybeRoot(a, cand) && isRoot(a, cand)) {
                    roots.add(cand);
                    break;
                }
                if (m.compareTo(need) > 0) {
                    break;
                }
                m = m.multiply(m);
                BigInteger fr = hornerMod(a, root, m);
                BigInteger dfr = hornerDerivativeMod(a, root, m);
                root = root.subtract(fr.multiply(dfr.modInverse(m))).mod(m);
            }
        }
        return roots;
    }

    /** A prime not dividing the leading coefficient, modulo which f stays square-free. */
    private static long choosePrime(BigInteger[] a) {
        int deg = a.length - 1;
        BigInteger p = BigInteger.valueOf(Math.max(1009, 4L * deg + 1));
        while (true) {
            p = p.nextProbablePrime();
            long prime = p.longValue();
            if (a[deg].mod(p).signum() == 0) {
                continue;
            }
            long[] f = new long[deg + 1];
            long[] df = new long[deg];
            for (int k = 0; k <= deg; k++) {
                f[k] = a[k].mod(p).longValue();
                if (k > 0) {
                    df[k - 1] = f[k] * k % prime;
                }
            }
            if (ModularPoly.degree(ModularPoly.gcd(f, df, prime)) == 0) {
                return prime;
            }
        }
    }

    private static long evalMod(long[] a, long x, long p) {
        long v = 0;
        for (int k = a.length - 1; k >= 0; k--) {
            v = (v * x + a[k]) % p;
        }
        return v;
    }

    /** A prime below 2^31 (common practice: the largest such prime is 2^31 - 1; any prime works here). */
    private static final long SCREEN_PRIME = 2_147_483_647L;

    /** False when u/v is certainly not a root (its value modulo a large prime is not zero). */
    private static boolean maybeRoot(BigInteger[] a, Rational r) {
        BigInteger p = BigInteger.valueOf(SCREEN_PRIME);
        BigInteger v = r.denominator().mod(p);
        if (v.signum() == 0) {
            return true;
        }
        long x = r.numerator().mod(p).multiply(v.modInverse(p)).mod(p).longValue();
        long acc = 0;
        for (int k = a.length - 1; k >= 0; k--) {
            acc = (acc * x % SCREEN_PRIME + a[k].mod(p).longValue()) % SCREEN_PRIME; // operands below 2^31
        }
        return acc == 0;
    }

    private static BigInteger hornerMod(BigInteger[] a, BigInteger x, BigInteger m) {
        BigInteger v = BigInteger.ZERO;
        for (int k = a.length - 1; k >= 0; k--) {
            v = v.multiply(x).add(a[k]).mod(m);
        }
        return v;
    }

    private static BigInteger hornerDerivativeMod(BigInteger[] a, BigInteger x, BigInteger m) {
        BigInteger v = BigInteger.ZERO;
        for (int k = a.length - 1; k >= 1; k--) {
            v = v.multiply(x).add(a[k].multiply(BigInteger.valueOf(k))).mod(m);
        }
        return v;
    }

    /** Exact test: sum a_k u^k v^(n-k) == 0. */
    private static boolean isRoot(BigInteger[] a, Rational r) {
        BigInteger u = r.numerator();
        BigInteger v = r.denominator();
        BigInteger s = BigInteger.ZERO;
        BigInteger vp = BigInteger.ONE;
        for (int k = a.length - 1; k >= 0; k--) {
            s = s.multiply(u).add(a[k].multiply(vp));
            vp = vp.multiply(v);
        }
        // Horner with homogenising powers: s = sum a_k u^k v^(n-k) * v^0 after the loop.
        return s.signum() == 0;
    }
}
