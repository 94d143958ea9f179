package dev.contour.algebra;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * A sparse multivariate polynomial over Q in named variables, in a fixed monomial order that does
 * not depend on the order in which variables were first seen (so printed output is reproducible).
 *
 * <p>Monomial order: graded lexicographic with variables ranked by name ({@link String#compareTo}).
 * A monomial is larger when its total degree is larger; on equal total degree, the exponents are
 * compared variable by variable in name order and the larger exponent wins. Terms are stored
 * leading (largest) term first. Only variables that occur with a positive exponent are recorded,
 * and no zero coefficient is stored, so equal polynomials have identical representations.
 * Immutable.
 */
public final class Polynomial implements Comparable<Polynomial> {
    private static final String[] NO_VARS = new String[0];
    private static final int[][] NO_TERMS = new int[0][];

    public static final Polynomial ZERO = new Polynomial(NO_VARS, NO_TERMS, new Rational[0]);
    public static final Polynomial ONE = constant(Rational.ONE);

    /** Sorted by name; each occurs in some term. */
    final String[] vars;
    /** Per term, exponents aligned with {@link #vars}; terms in descending monomial order. */
    final int[][] exps;
    /** Non-zero coefficients aligned with {@link #exps}. */
    final Rational[] coeffs;
    private int hash;

    Polynomial(String[] vars, int[][] exps, Rational[] coeffs) {
        this.vars = vars;
        this.exps = exps;
        this.coeffs = coeffs;
    }

    public static Polynomial constant(Rational c) {
        return c.isZero() ? ZERO : new Polynomial(NO_VARS, new int[][] {new int[0]}, new Rational[] {c});
    }

    public static Polynomial constant(long c) {
        return constant(Rational.of(c));
    }

    public static Polynomial variable(String name) {
        return new Polynomial(new String[] {name}, new int[][] {{1}}, new Rational[] {Rational.ONE});
    }

    /** c * prod vars^exps; exponents non-negative. */
    public static Polynomial monomial(Rational c, Map<String, Integer> exponents) {
        if (c.isZero()) {
            return ZERO;
        }
        TreeMap<String, Integer> sorted = new TreeMap<>();
        for (Map.Entry<String, Integer> e : exponents.entrySet()) {
            if (e.getValue() < 0) {
                throw new ContourException("negative exponent in a polynomial monomial: " + e.getKey() + "^" + e.getValue());
            }
            if (e.getValue() > 0) {
                sorted.put(e.getKey(), e.getValue());
            }
        }
        String[] v = sorted.keySet().toArray(NO_VARS);
        int[] ex = new int[v.length];
        for (int i = 0; i < v.length; i++) {
            ex[i] = sorted.get(v[i]);
        }
        return new Polynomial(v, new int[][] {ex}, new Rational[] {c});
    }

    // ---------------------------------------------------------------- order and construction

    /** Graded lexicographic comparison of two exponent vectors over the same variables. */
    static int compareExponents(int[] a, int[] b) {
        int da = 0;
        int db = 0;
        for (int i = 0; i < a.length; i++) {
            da += a[i];
            db += b[i];
        }
        if (da != db) {
            return Integer.compare(da, db);
        }
        for (int i = 0; i < a.length; i++) {
            if (a[i] != b[i]) {
                return Integer.compare(a[i], b[i]);
            }
        }
        return 0;
    }

    /**
     * {@link #compareExponents(int[], int[])} of two exponent vectors over different sorted variable
     * lists, as if both were re-expressed over their union (without building it).
     */
    static int compareExponents(String[] va, int[] a, String[] vb, int[] b) {
        int da = 0;
        int db = 0;
        for (int x : a) {
            da += x;
        }
        for (int x : b) {
            db += x;
        }
        if (da != db) {
            return Integer.compare(da, db);
        }
        int i = 0;
        int j = 0;
        while (i < va.length || j < vb.length) {
            int c = i == va.length ? 1 : j == vb.length ? -1 : va[i].compareTo(vb[j]);
            int x;
            int y;
            if (c < 0) {
                x = a[i++];
                y = 0;
            } else if (c > 0) {
                x = 0;
                y = b[j++];
            } else {
                x = a[i++];
                y = b[j++];
            }
            if (x != y) {
                return Integer.compare(x, y);
            }
        }
        return 0;
    }

    /** Hashable wrapper of an exponent vector for accumulation. */
    record Key(int[] e) {
        @Override
        public boolean equals(Object o) {
            return o instanceof Key k && Arrays.equals(e, k.e);
        }

        @Override
        public int hashCode() {
            return Arrays.hashCode(e);
        }
    }

    /** Canonical polynomial from accumulated terms over {@code vars} (zeros dropped, unused variables removed, sorted). */
    static Polynomial fromMap(String[] vars, Map<Key, Rational> terms) {
        int n = 0;
        int[][] ex = new int[terms.size()][];
        Rational[] co = new Rational[terms.size()];
        for (Map.Entry<Key, Rational> t : terms.entrySet()) {
            if (!t.getValue().isZero()) {
                ex[n] = t.getKey().e;
                co[n] = t.getValue();
                n++;
            }
        }
        return fromArrays(vars, Arrays.copyOf(ex, n), Arrays.copyOf(co, n), false);
    }

    /**
     * Canonical polynomial from distinct terms with non-zero coefficients; sorts unless told they
     * are sorted, and drops variables that no longer occur.
     */
    static Polynomial fromArrays(String[] vars, int[][] ex, Rational[] co, boolean sorted) {
        int n = ex.length;
        if (n == 0) {
            return ZERO;
        }
        if (!sorted && n > 1) {
            Integer[] idx = new Integer[n];
            for (int i = 0; i < n; i++) {
                idx[i] = i;
            }
            final int[][] fe = ex;
            Arrays.sort(idx, (i, j) -> compareExponents(fe[j], fe[i]));
            int[][] ex2 = new int[n][];
            Rational[] co2 = new Rational[n];
            for (int i = 0; i < n; i++) {
                ex2[i] = ex[idx[i]];
                co2[i] = co[idx[i]];
            }
            ex = ex2;
            co = co2;
        }
        boolean[] used = new boolean[vars.length];
        int usedCount = 0;
        for (int[] e : ex) {
            for (int v = 0; v < vars.length; v++) {
                if (e[v] != 0 && !used[v]) {
                    used[v] = true;
                    usedCount++;
                }
            }
        }
        if (usedCount == vars.length) {
            return new Polynomial(vars, ex, co);
        }
        String[] nv = new String[usedCount];
        int[] map = new int[usedCount];
        for (int v = 0, k = 0; v < vars.length; v++) {
            if (used[v]) {
                nv[k] = vars[v];
                map[k++] = v;
            }
        }
        int[][] nex = new int[n][];
        for (int i = 0; i < n; i++) {
            int[] e = new int[usedCount];
            for (int k = 0; k < usedCount; k++) {
                e[k] = ex[i][map[k]];
            }
            nex[i] = e;
        }
        return new Polynomial(nv, nex, co);
    }

    /** Sorted union of two sorted variable arrays. */
    static String[] unionVars(String[] a, String[] b) {
        if (Arrays.equals(a, b)) {
            return a;
        }
        // Linear merge of the two sorted arrays (this runs inside every add and compare).
        String[] out = new String[a.length + b.length];
        int i = 0;
        int j = 0;
        int n = 0;
        while (i < a.length || j < b.length) {
            int c = i == a.length ? 1 : j == b.length ? -1 : a[i].compareTo(b[j]);
            if (c < 0) {
                out[n++] = a[i++];
            } else if (c > 0) {
                out[n++] = b[j++];
            } else {
                out[n++] = a[i++];
                j++;
            }
        }
        if (n == a.length) {
            return a;
        }
        if (n == b.length) {
            return b;
        }
        return Arrays.copyOf(out, n);
    }

    /** The exponent vectors of this polynomial re-expressed over the (super)set {@code target}. */
    int[][] expsOver(String[] target) {
        if (target == vars || Arrays.equals(target, vars)) {
            return exps;
        }
        int[] pos = new int[vars.length];
        for (int i = 0; i < vars.length; i++) {
            pos[i] = Arrays.binarySearch(target, vars[i]);
        }
        int[][] out = new int[exps.length][];
        for (int t = 0; t < exps.length; t++) {
            int[] e = new int[target.length];
            for (int i = 0; i < vars.length; i++) {
                e[pos[i]] = exps[t][i];
            }
            out[t] = e;
        }
        return out;
    }

    int indexOf(String variable) {
        return Arrays.binarySearch(vars, variable);
    }

    // ---------------------------------------------------------------- arithmetic

    public Polynomial add(Polynomial o) {
        if (o.isZero()) {
            return this;
        }
        if (isZero()) {
            return o;
        }
        if (o.isConstant() != isConstant()) {
            return isConstant() ? o.plusConstant(coeffs[0]) : plusConstant(o.coeffs[0]);
        }
        String[] u = unionVars(vars, o.vars);
        int[][] a = expsOver(u);
        int[][] b = o.expsOver(u);
        int[][] ex = new int[a.length + b.length][];
        Rational[] co = new Rational[a.length + b.length];
        int i = 0;
        int j = 0;
        int n = 0;
        while (i < a.length || j < b.length) {
            int c = i == a.length ? -1 : j == b.length ? 1 : compareExponents(a[i], b[j]);
            if (c > 0) {
                ex[n] = a[i];
                co[n++] = coeffs[i++];
            } else if (c < 0) {
                ex[n] = b[j];
                co[n++] = o.coeffs[j++];
            } else {
                Rational s = coeffs[i].add(o.coeffs[j]);
                if (!s.isZero()) {
                    ex[n] = a[i];
                    co[n++] = s;
                }
                i++;
                j++;
            }
        }
        return fromArrays(u, Arrays.copyOf(ex, n), Arrays.copyOf(co, n), true);
    }

    /**
     * This non-constant polynomial plus a non-zero constant (index arithmetic such as s - 2*p + 2 +
     * 2*k): only the constant term, last in the order, changes.
     */
    private Polynomial plusConstant(Rational c) {
        int n = exps.length;
        boolean hasConstant = degreeOf(exps[n - 1]) == 0;
        if (!hasConstant) {
            int[][] ex = Arrays.copyOf(exps, n + 1);
            Rational[] co = Arrays.copyOf(coeffs, n + 1);
            ex[n] = new int[vars.length];
            co[n] = c;
            return new Polynomial(vars, ex, co);
        }
        Rational s = coeffs[n - 1].add(c);
        if (s.isZero()) {
            return new Polynomial(vars, Arrays.copyOf(exps, n - 1), Arrays.copyOf(coeffs, n - 1));
        }
        Rational[] co = coeffs.clone();
        co[n - 1] = s;
        return new Polynomial(vars, exps, co);
    }

    public Polynomial subtract(Polynomial o) {
        if (o.isConstant() && !o.isZero() && !isConstant()) {
            return plusConstant(o.coeffs[0].negate());
        }
        return add(o.negate());
    }

    public Polynomial multiply(Polynomial o) {
        if (isZero() || o.isZero()) {
            return ZERO;
        }
        if (o.isConstant()) {
            return multiply(o.coeffs[0]);
        }
        if (isConstant()) {
            return o.multiply(coeffs[0]);
        }
        Cancellation.check(); // a chain of products (a power, a big expansion) stops between factors
        String[] u = unionVars(vars, o.vars);
        int[][] a = expsOver(u);
        int[][] b = o.expsOver(u);
        if (a.length == 1 || b.length == 1) {
            // A monomial factor keeps the order: no sorting or hashing needed.
            boolean single = b.length == 1;
            int[][] many = single ? a : b;
            Rational[] manyC = single ? coeffs : o.coeffs;
            int[] m = single ? b[0] : a[0];
            Rational mc = single ? o.coeffs[0] : coeffs[0];
            int[][] ex = new int[many.length][];
            Rational[] co = new Rational[many.length];
            for (int t = 0; t < many.length; t++) {
                int[] e = new int[u.length];
                for (int v = 0; v < u.length; v++) {
                    e[v] = exponentSum(many[t][v], m[v]);
                }
                ex[t] = e;
                co[t] = manyC[t].multiply(mc);
            }
            return new Polynomial(u, ex, co);
        }
        if (b.length <= MERGE_LIMIT || a.length <= MERGE_LIMIT) {
            return a.length >= b.length ? mergeProduct(u, a, coeffs, b, o.coeffs) : mergeProduct(u, b, o.coeffs, a, coeffs);
        }
        Polynomial packed;
        if (KroneckerProduct.worthwhile(a, b, u.length) && KroneckerProduct.cheaperThanTerms(a, coeffs, b, o.coeffs, u.length)
                && (packed = KroneckerProduct.multiply(u, a, coeffs, b, o.coeffs)) != null) {
            return packed;
        }
        return packedProduct(u, a, coeffs, b, o.coeffs);
    }

    /** Up to this many terms in the smaller factor, products are formed by merging shifted copies. */
    private static final int MERGE_LIMIT = 8;

    /**
     * Product with a short polynomial: each term of the short one shifts the long one without
     * changing its order (the monomial order is compatible with multiplication), so the result is a
     * k-way merge of sorted streams, with no hashing or sorting.
     */
    private static Polynomial mergeProduct(String[] u, int[][] a, Rational[] ca, int[][] b, Rational[] cb) {
        int k = b.length;
        int n = u.length;
        int[] pos = new int[k];
        int[][] head = new int[k][];
        for (int j = 0; j < k; j++) {
            head[j] = shifted(a[0], b[j], n);
        }
        List<int[]> ex = new ArrayList<>(a.length * k);
        List<Rational> co = new ArrayList<>(a.length * k);
        while (true) {
            int best = -1;
            for (int j = 0; j < k; j++) {
                if (head[j] != null && (best < 0 || compareExponents(head[j], head[best]) > 0)) {
                    best = j;
                }
            }
            if (best < 0) {
                break;
            }
            int[] e = head[best];
            if ((ex.size() & 4095) == 0) {
                dev.contour.Cancellation.check();
            }
            Rational c = Rational.ZERO;
            for (int j = best; j < k; j++) {
                if (head[j] != null && (j == best || Arrays.equals(head[j], e))) {
                    c = c.add(ca[pos[j]].multiply(cb[j]));
                    pos[j]++;
                    head[j] = pos[j] < a.length ? shifted(a[pos[j]], b[j], n) : null;
                }
            }
            if (!c.isZero()) {
                ex.add(e);
                co.add(c);
            }
        }
        return fromArrays(u, ex.toArray(new int[0][]), co.toArray(new Rational[0]), true);
    }

    /** Above this degree (and far above the number of terms) dense coefficient arrays are refused, not attempted. */
    static final int DENSE_DEGREE_LIMIT = 1 << 22;

    /** a + b for exponents; a power beyond the int range is an error, never a wrapped exponent. */
    static int exponentSum(int a, int b) {
        int r = a + b;
        if (((a ^ r) & (b ^ r)) < 0) {
            throw new ContourException("exponent overflow: a power beyond " + Integer.MAX_VALUE);
        }
        return r;
    }

    private static int[] shifted(int[] e, int[] m, int n) {
        int[] out = new int[n];
        for (int v = 0; v < n; v++) {
            out[v] = exponentSum(e[v], m[v]);
        }
        return out;
    }

    /**
     * General product: exponent vectors packed into one long (total degree in the top bits, so the
     * numeric order of keys is the graded-lex order), accumulated in an open-addressing table, then
     * sorted. Falls back to hashing exponent arrays when the degrees do not fit.
     */
    private static Polynomial packedProduct(String[] u, int[][] a, Rational[] ca, int[][] b, Rational[] cb) {
        int n = u.length;
        int maxDeg = 0;
        for (int[] e : a) {
            maxDeg = Math.max(maxDeg, degreeOf(e));
        }
        int maxB = 0;
        for (int[] e : b) {
            maxB = Math.max(maxB, degreeOf(e));
        }
        maxDeg += maxB;
        int bits = 63 / (n + 1);
        if (bits < 1 || maxDeg >= (1L << bits)) {
            HashMap<Key, Rational> acc = new HashMap<>(a.length * b.length * 2);
            for (int i = 0; i < a.length; i++) {
                Cancellation.check();
                for (int j = 0; j < b.length; j++) {
                    if ((j & 1023) == 0) {
                        dev.contour.Cancellation.check();
                    }
                    acc.merge(new Key(shifted(a[i], b[j], n)), ca[i].multiply(cb[j]), Rational::add);
                }
            }
            return fromMap(u, acc);
        }
        long[] pa = pack(a, bits);
        long[] pb = pack(b, bits);
        int cap = Integer.highestOneBit(Math.max(4, a.length * b.length)) * 4;
        if (cap < 0 || cap > (1 << 26)) {
            cap = 1 << 26;
        }
        long[] keys = new long[cap];
        Rational[] vals = new Rational[cap];
        boolean[] used = new boolean[cap];
        int mask = cap - 1;
        int shift = 64 - Integer.numberOfTrailingZeros(cap);
        int count = 0;
        for (int i = 0; i < a.length; i++) {
            Cancellation.check();
            for (int j = 0; j < b.length; j++) {
                long key = pa[i] + pb[j];
                int h = (int) ((key * 0x9E3779B97F4A7C15L) >>> shift);
                while (used[h] && keys[h] != key) {
                    h = (h + 1) & mask;
                }
                Rational c = ca[i].multiply(cb[j]);
                if (used[h]) {
                    vals[h] = vals[h].add(c);
                } else {
                    used[h] = true;
                    keys[h] = key;
                    vals[h] = c;
                    count++;
                }
            }
        }
        long[] k2 = new long[count];
        int m = 0;
        for (int h = 0; h < cap; h++) {
            if (used[h] && !vals[h].isZero()) {
                k2[m++] = keys[h];
            }
        }
        k2 = Arrays.copyOf(k2, m);
        Arrays.sort(k2);
        int[][] ex = new int[m][];
        Rational[] co = new Rational[m];
        for (int t = 0; t < m; t++) {
            long key = k2[m - 1 - t];
            int h = (int) ((key * 0x9E3779B97F4A7C15L) >>> shift);
            while (keys[h] != key) {
                h = (h + 1) & mask;
            }
            co[t] = vals[h];
            ex[t] = unpack(key, n, bits);
        }
        return fromArrays(u, ex, co, true);
    }

    private static int degreeOf(int[] e) {
        int d = 0;
        for (int x : e) {
            d += x;
        }
        return d;
    }

    private static long[] pack(int[][] ex, int bits) {
        long[] out = new long[ex.length];
        for (int t = 0; t < ex.length; t++) {
            long key = degreeOf(ex[t]);
            for (int x : ex[t]) {
                key = (key << bits) | x;
            }
            out[t] = key;
        }
        return out;
    }

    private static int[] unpack(long key, int n, int bits) {
        int[] e = new int[n];
        long mask = (1L << bits) - 1;
        for (int v = n - 1; v >= 0; v--) {
            e[v] = (int) (key & mask);
            key >>>= bits;
        }
        return e;
    }

    public Polynomial multiply(Rational c) {
        if (c.isZero() || isZero()) {
            return ZERO;
        }
        if (c.isOne()) {
            return this;
        }
        Rational[] co = new Rational[coeffs.length];
        for (int i = 0; i < co.length; i++) {
            co[i] = coeffs[i].multiply(c);
        }
        return new Polynomial(vars, exps, co);
    }

    public Polynomial negate() {
        return multiply(Rational.MINUS_ONE);
    }

    public Polynomial pow(int exponent) {
        if (exponent < 0) {
            throw new ContourException("negative power of a polynomial: (" + this + ")^" + exponent);
        }
        return Powers.bySquaring(ONE, this, exponent, Polynomial::multiply);
    }

    /** this / d when d divides exactly; ContourException otherwise (and for d = 0). */
    public Polynomial divideExact(Polynomial d) {
        if (d.isZero()) {
            throw new ContourException("division by zero: polynomial (" + this + ") / 0");
        }
        return tryDivide(d).orElseThrow(
                () -> new ContourException("polynomial division is not exact: (" + this + ") / (" + d + ")"));
    }

    /** this / d when d divides exactly, else empty. */
    public Optional<Polynomial> tryDivide(Polynomial d) {
        if (d.isZero()) {
            throw new ContourException("division by zero: polynomial (" + this + ") / 0");
        }
        return Optional.ofNullable(divideOrNull(d));
    }

    /**
     * Exact division or null. Uses the monomial-order division algorithm: if d divides this, the
     * leading term of every remainder is divisible by the leading term of d, and the last
     * remainder is zero.
     */
    Polynomial divideOrNull(Polynomial d) {
        if (isZero()) {
            return ZERO;
        }
        if (d.isConstant()) {
            return multiply(d.coeffs[0].inverse());
        }
        for (String v : d.vars) {
            if (indexOf(v) < 0) {
                return null;
            }
        }
        for (int i = 0; i < d.vars.length; i++) {
            if (degree(d.vars[i]) < d.degree(d.vars[i])) {
                return null;
            }
        }
        if (d.isLinear() && !mayVanishOn(d)) {
            return null;
        }
        if (d.isLinear()) {
            return divideLinearOrNull(d);
        }
        String[] u = vars;
        int[][] dex = d.expsOver(u);
        TreeMap<Key, Rational> rem = new TreeMap<>((x, y) -> compareExponents(y.e, x.e));
        for (int i = 0; i < exps.length; i++) {
            rem.put(new Key(exps[i]), coeffs[i]);
        }
        int[] dl = dex[0];
        Rational dlc = d.coeffs[0].inverse();
        HashMap<Key, Rational> quot = new HashMap<>();
        while (!rem.isEmpty()) {
            Map.Entry<Key, Rational> lt = rem.firstEntry();
            int[] e = lt.getKey().e;
            int[] qe = new int[u.length];
            for (int v = 0; v < u.length; v++) {
                qe[v] = e[v] - dl[v];
                if (qe[v] < 0) {
                    return null;
                }
            }
            Rational qc = lt.getValue().multiply(dlc);
            quot.put(new Key(qe), qc);
            for (int t = 0; t < dex.length; t++) {
                int[] me = new int[u.length];
                for (int v = 0; v < u.length; v++) {
                    me[v] = exponentSum(dex[t][v], qe[v]);
                }
                Key k = new Key(me);
                Rational c = rem.getOrDefault(k, Rational.ZERO).subtract(qc.multiply(d.coeffs[t]));
                if (c.isZero()) {
                    rem.remove(k);
                } else {
                    rem.put(k, c);
                }
            }
        }
        return fromMap(u, quot);
    }

    private static final long HYPERPLANE_PRIME = 2147483629L;

    /**
     * False only when this polynomial certainly is not a multiple of the linear form l: it does not
     * vanish at a pseudo-random point of the hyperplane l = 0 over Z/p. (A multiple of l vanishes at
     * every such point, so "false" is always right; "true" means "maybe".) Cancellation mostly asks
     * about factors that do not divide, and this rejects them in one pass over the terms.
     */
    boolean mayVanishOn(Polynomial l) {
        final long p = HYPERPLANE_PRIME;
        String[] u = unionVars(vars, l.vars);
        int[][] le = l.expsOver(u);
        // l = a*x + rest, x its leading variable
        int xi = -1;
        for (int v = 0; v < u.length && xi < 0; v++) {
            if (le[0][v] == 1) {
                xi = v;
            }
        }
        long[] val = new long[u.length];
        long seed = 0x9E3779B97F4A7C15L ^ l.hashCode();
        for (int v = 0; v < u.length; v++) {
            seed = seed * 6364136223846793005L + 1442695040888963407L;
            val[v] = 1 + Math.floorMod(seed >>> 17, p - 1);
        }
        long a = 0;
        long rest = 0;
        for (int t = 0; t < le.length; t++) {
            long c = modP(l.coeffs[t], p);
            if (c < 0) {
                return true;
            }
            if (le[t][xi] == 1) {
                a = c;
            } else {
                long m = c;
                for (int v = 0; v < u.length; v++) {
                    if (le[t][v] == 1) {
                        m = m * val[v] % p;
                    }
                }
                rest = (rest + m) % p;
            }
        }
        if (a == 0) {
            return true;
        }
        val[xi] = Math.floorMod(-rest, p) * ModularPoly.inverse(a, p) % p;
        int[][] me = expsOver(u);
        long[][] pow = new long[u.length][];
        for (int v = 0; v < u.length; v++) {
            int d = 0;
            for (int[] e : me) {
                d = Math.max(d, e[v]);
            }
            if (d > 4 * me.length + 64) {
                return modularValueBySquaring(me, val, p) == 0;
            }
            pow[v] = new long[d + 1];
            pow[v][0] = 1;
            for (int k = 1; k <= d; k++) {
                pow[v][k] = pow[v][k - 1] * val[v] % p;
            }
        }
        long sum = 0;
        for (int t = 0; t < me.length; t++) {
            long c = modP(coeffs[t], p);
            if (c < 0) {
                return true;
            }
            for (int v = 0; v < u.length && c != 0; v++) {
                c = c * pow[v][me[t][v]] % p;
            }
            sum = (sum + c) % p;
        }
        return sum == 0;
    }

    /** This polynomial's value mod p at val (over the exponent rows me), powers by squaring: for sparse high degrees. */
    private long modularValueBySquaring(int[][] me, long[] val, long p) {
        long sum = 0;
        for (int t = 0; t < me.length; t++) {
            long c = modP(coeffs[t], p);
            if (c < 0) {
                return 0;
            }
            for (int v = 0; v < val.length && c != 0; v++) {
                c = c * java.math.BigInteger.valueOf(val[v]).modPow(java.math.BigInteger.valueOf(me[t][v]),
                        java.math.BigInteger.valueOf(p)).longValue() % p;
            }
            sum = (sum + c) % p;
        }
        return sum;
    }

    /** The largest k with x^k dividing this polynomial (x a variable; 0 when x does not occur or this is zero). */
    int powerOfVariableDividing(String x) {
        int v = indexOf(x);
        if (v < 0 || exps.length == 0) {
            return 0;
        }
        int k = Integer.MAX_VALUE;
        for (int[] e : exps) {
            k = Math.min(k, e[v]);
        }
        return k;
    }

    /** This polynomial divided by x^k, which must divide it. */
    Polynomial divideByVariablePower(String x, int k) {
        if (k == 0) {
            return this;
        }
        int v = indexOf(x);
        int[][] ex = new int[exps.length][];
        for (int t = 0; t < exps.length; t++) {
            ex[t] = exps[t].clone();
            ex[t][v] -= k;
        }
        // Lowering one variable's exponent by the same k in every term keeps graded-lex order.
        return fromArrays(vars, ex, coeffs.clone(), true);
    }

    /** c mod p, or -1 when the denominator is divisible by p. */
    private static long modP(Rational c, long p) {
        if (c.isSmall()) {
            long d = Math.floorMod(c.longDen(), p);
            if (d == 0) {
                return -1;
            }
            long n = Math.floorMod(c.longNum(), p);
            return d == 1 ? n : n * ModularPoly.inverse(d, p) % p;
        }
        java.math.BigInteger bp = java.math.BigInteger.valueOf(p);
        long d = c.denominator().mod(bp).longValue();
        if (d == 0) {
            return -1;
        }
        return c.numerator().mod(bp).longValue() * ModularPoly.inverse(d, p) % p;
    }

    /**
     * Synthetic division by a linear form a*x + m (x its leading variable, m free of x): the
     * quotient's coefficients in x follow from the top down, q[k-1] = (c[k] - m*q[k]) / a, and the
     * remainder c[0] - m*q[0] must vanish.
     */
    Polynomial divideLinearOrNull(Polynomial d) {
        String x = null;
        for (int v = 0; v < d.vars.length && x == null; v++) {
            if (d.exps[0][v] == 1) {
                x = d.vars[v];
            }
        }
        Rational a = d.coeffs[0];
        Polynomial m = d.subtract(variable(x).multiply(a));
        Polynomial[] c = coefficientsIn(x);
        int n = c.length - 1;
        if (n < 1) {
            return null;
        }
        Polynomial[] q = new Polynomial[n];
        Rational ainv = a.inverse();
        Polynomial carry = ZERO;
        for (int k = n; k >= 1; k--) {
            carry = c[k].subtract(carry.multiply(m)).multiply(ainv);
            q[k - 1] = carry;
        }
        if (!c[0].subtract(carry.multiply(m)).isZero()) {
            return null;
        }
        return fromCoefficientsIn(x, q);
    }

    // ---------------------------------------------------------------- substitution and evaluation

    /** Simultaneous substitution of polynomials for variables. */
    public Polynomial substitute(Map<String, Polynomial> values) {
        boolean any = false;
        for (String v : vars) {
            any |= values.containsKey(v);
        }
        if (!any) {
            return this;
        }
        if (values.size() == 1 || countSubstituted(values) == 1) {
            for (String v : vars) {
                Polynomial val = values.get(v);
                if (val != null && val.totalDegree() <= 1) {
                    return substituteAffine(v, val);
                }
            }
        }
        List<Map<Integer, Polynomial>> powers = new ArrayList<>();
        Polynomial[] base = new Polynomial[vars.length];
        for (int v = 0; v < vars.length; v++) {
            Polynomial val = values.get(vars[v]);
            base[v] = val == null ? variable(vars[v]) : val;
            powers.add(new HashMap<>());
        }
        Polynomial[] parts = new Polynomial[exps.length];
        for (int t = 0; t < exps.length; t++) {
            Polynomial term = constant(coeffs[t]);
            for (int v = 0; v < vars.length; v++) {
                int e = exps[t][v];
                if (e > 0) {
                    final int fv = v;
                    term = term.multiply(powers.get(v).computeIfAbsent(e, k -> base[fv].pow(k)));
                }
            }
            parts[t] = term;
        }
        return sum(parts, 0, parts.length);
    }

    private int countSubstituted(Map<String, Polynomial> values) {
        int n = 0;
        for (String v : vars) {
            if (values.containsKey(v)) {
                n++;
            }
        }
        return n;
    }

    /**
     * One variable replaced by a constant or a linear polynomial (the residue and crossing case):
     * partial evaluation for a constant, Horner's scheme in x otherwise, so that no power of the
     * value is ever expanded term by term.
     */
    private Polynomial substituteAffine(String x, Polynomial value) {
        if (value.isConstant()) {
            return evaluatePartially(Map.of(x, value.constantValue()));
        }
        Polynomial[] c = coefficientsIn(x);
        Polynomial acc = c[c.length - 1];
        for (int k = c.length - 2; k >= 0; k--) {
            acc = acc.multiply(value).add(c[k]);
        }
        return acc;
    }

    /** Balanced sum, so that n parts cost O(total size * log n) rather than O(n * total size). */
    static Polynomial sum(Polynomial[] parts, int from, int to) {
        if (to - from == 0) {
            return ZERO;
        }
        if (to - from == 1) {
            return parts[from];
        }
        int mid = (from + to) >>> 1;
        return sum(parts, from, mid).add(sum(parts, mid, to));
    }

    /** Value at a point; every variable of this polynomial must be given. */
    public Rational evaluate(Map<String, Rational> point) {
        for (String v : vars) {
            if (!point.containsKey(v)) {
                throw new ContourException("cannot evaluate: no value given for variable '" + v + "'");
            }
        }
        return evaluatePartially(point).constantValue();
    }

    /** Partial evaluation: the given variables replaced by numbers, the rest kept. */
    public Polynomial evaluatePartially(Map<String, Rational> point) {
        Rational[] val = new Rational[vars.length];
        boolean any = false;
        for (int v = 0; v < vars.length; v++) {
            val[v] = point.get(vars[v]);
            any |= val[v] != null;
        }
        if (!any) {
            return this;
        }
        HashMap<Key, Rational> acc = new HashMap<>();
        List<Map<Integer, Rational>> powers = new ArrayList<>();
        for (int v = 0; v < vars.length; v++) {
            powers.add(new HashMap<>());
        }
        for (int t = 0; t < exps.length; t++) {
            Rational c = coeffs[t];
            int[] e = exps[t].clone();
            for (int v = 0; v < vars.length && !c.isZero(); v++) {
                if (val[v] != null && e[v] > 0) {
                    final Rational b = val[v];
                    c = c.multiply(powers.get(v).computeIfAbsent(e[v], b::pow));
                    e[v] = 0;
                }
            }
            if (!c.isZero()) {
                acc.merge(new Key(e), c, Rational::add);
            }
        }
        return fromMap(vars, acc);
    }

    public Polynomial derivative(String variable) {
        int v = indexOf(variable);
        if (v < 0) {
            return ZERO;
        }
        HashMap<Key, Rational> acc = new HashMap<>();
        for (int t = 0; t < exps.length; t++) {
            if (exps[t][v] > 0) {
                int[] e = exps[t].clone();
                Rational c = coeffs[t].multiply(Rational.of(e[v]));
                e[v]--;
                acc.put(new Key(e), c);
            }
        }
        return fromMap(vars, acc);
    }

    // ---------------------------------------------------------------- structure

    public int degree(String variable) {
        int v = indexOf(variable);
        if (v < 0) {
            return isZero() ? -1 : 0;
        }
        int d = 0;
        for (int[] e : exps) {
            d = Math.max(d, e[v]);
        }
        return d;
    }

    /** Total degree; -1 for the zero polynomial. */
    public int totalDegree() {
        if (isZero()) {
            return -1;
        }
        // The leading term has the largest total degree in a graded order.
        int d = 0;
        for (int x : exps[0]) {
            d += x;
        }
        return d;
    }

    public SortedSet<String> variables() {
        return Collections.unmodifiableSortedSet(new TreeSet<>(Arrays.asList(vars)));
    }

    public int termCount() {
        return coeffs.length;
    }

    /** Terms in the canonical monomial order, leading term first. */
    public List<Term> terms() {
        List<Term> out = new ArrayList<>(coeffs.length);
        for (int t = 0; t < coeffs.length; t++) {
            out.add(new Term(coeffs[t], exponentMap(exps[t])));
        }
        return Collections.unmodifiableList(out);
    }

    private Map<String, Integer> exponentMap(int[] e) {
        Map<String, Integer> m = new LinkedHashMap<>();
        for (int v = 0; v < vars.length; v++) {
            if (e[v] != 0) {
                m.put(vars[v], e[v]);
            }
        }
        return Collections.unmodifiableMap(m);
    }

    /** Coefficients with respect to the chosen variables: exponent list (same order as vars) to coefficient polynomial. */
    public Map<List<Integer>, Polynomial> coefficients(List<String> chosen) {
        int[] pos = new int[chosen.size()];
        for (int i = 0; i < pos.length; i++) {
            pos[i] = indexOf(chosen.get(i));
        }
        Map<List<Integer>, HashMap<Key, Rational>> acc = new LinkedHashMap<>();
        for (int t = 0; t < exps.length; t++) {
            List<Integer> key = new ArrayList<>(pos.length);
            int[] rest = exps[t].clone();
            for (int p : pos) {
                key.add(p < 0 ? 0 : exps[t][p]);
                if (p >= 0) {
                    rest[p] = 0;
                }
            }
            acc.computeIfAbsent(List.copyOf(key), k -> new HashMap<>()).put(new Key(rest), coeffs[t]);
        }
        Map<List<Integer>, Polynomial> out = new LinkedHashMap<>();
        for (Map.Entry<List<Integer>, HashMap<Key, Rational>> e : acc.entrySet()) {
            out.put(e.getKey(), fromMap(vars, e.getValue()));
        }
        return Collections.unmodifiableMap(out);
    }

    /** Coefficient of variable^power, a polynomial in the other variables. */
    public Polynomial coefficient(String variable, int power) {
        int v = indexOf(variable);
        if (v < 0) {
            return power == 0 ? this : ZERO;
        }
        // One pass over the terms: no dense array of every power's coefficient.
        int n = 0;
        for (int[] e : exps) {
            if (e[v] == power) {
                n++;
            }
        }
        if (n == 0) {
            return ZERO;
        }
        int[][] ex = new int[n][];
        Rational[] co = new Rational[n];
        int k = 0;
        for (int t = 0; t < exps.length; t++) {
            if (exps[t][v] == power) {
                int[] e = exps[t].clone();
                e[v] = 0;
                ex[k] = e;
                co[k++] = coeffs[t];
            }
        }
        // Removing one variable keeps graded-lex order among terms of equal degree in it.
        return fromArrays(vars, ex, co, true);
    }

    /** Dense coefficient array in {@code x}: index k holds the coefficient of x^k (length degree+1; empty for zero). */
    Polynomial[] coefficientsIn(String x) {
        int v = indexOf(x);
        if (v < 0) {
            return isZero() ? new Polynomial[0] : new Polynomial[] {this};
        }
        int deg = degree(x);
        if (deg > DENSE_DEGREE_LIMIT && deg > 64 * exps.length) {
            throw new ContourException("degree " + deg + " in " + x + " is too high for this operation (it needs every power's"
                    + " coefficient, and the polynomial has " + exps.length + " terms)");
        }
        int[] count = new int[deg + 1];
        for (int[] e : exps) {
            count[e[v]]++;
        }
        int[][][] ex = new int[deg + 1][][];
        Rational[][] co = new Rational[deg + 1][];
        for (int k = 0; k <= deg; k++) {
            ex[k] = new int[count[k]][];
            co[k] = new Rational[count[k]];
        }
        int[] fill = new int[deg + 1];
        for (int t = 0; t < exps.length; t++) {
            int k = exps[t][v];
            int[] e = exps[t].clone();
            e[v] = 0;
            ex[k][fill[k]] = e;
            co[k][fill[k]++] = coeffs[t];
        }
        Polynomial[] out = new Polynomial[deg + 1];
        for (int k = 0; k <= deg; k++) {
            // Removing one variable keeps graded-lex order among terms of equal x-degree.
            out[k] = fromArrays(vars, ex[k], co[k], true);
        }
        return out;
    }

    /** Inverse of {@link #coefficientsIn}: sum c[k] * x^k, where the c[k] are free of x. */
    static Polynomial fromCoefficientsIn(String x, Polynomial[] c) {
        Polynomial[] parts = new Polynomial[c.length];
        for (int k = 0; k < c.length; k++) {
            parts[k] = k == 0 || c[k].isZero() ? c[k] : c[k].multiply(monomial(Rational.ONE, Map.of(x, k)));
        }
        return sum(parts, 0, parts.length);
    }

    /** True when the total degree is exactly 1. */
    boolean isLinear() {
        return totalDegree() == 1;
    }

    /** Positive rational content: gcd of numerators over lcm of denominators, sign of the leading term. */
    public Rational content() {
        if (isZero()) {
            return Rational.ZERO;
        }
        java.math.BigInteger g = java.math.BigInteger.ZERO;
        java.math.BigInteger l = java.math.BigInteger.ONE;
        boolean small = true;
        long gs = 0;
        long ls = 1;
        for (Rational c : coeffs) {
            if (small && c.isSmall()) {
                gs = Rational.gcd(gs, Math.abs(c.longNum()));
                long d = c.longDen();
                long q = ls / Rational.gcd(ls, d);
                try {
                    ls = Math.multiplyExact(q, d);
                    continue;
                } catch (ArithmeticException overflow) {
                    small = false;
                    g = java.math.BigInteger.valueOf(gs);
                    l = java.math.BigInteger.valueOf(q).multiply(java.math.BigInteger.valueOf(d));
                    continue;
                }
            }
            if (small) {
                small = false;
                g = java.math.BigInteger.valueOf(gs);
                l = java.math.BigInteger.valueOf(ls);
            }
            g = g.gcd(c.numerator());
            java.math.BigInteger d = c.denominator();
            l = l.divide(l.gcd(d)).multiply(d);
        }
        Rational r = small ? Rational.of(gs, ls) : Rational.of(g, l);
        return coeffs[0].signum() < 0 ? r.negate() : r;
    }

    /** this / content(): integer coefficients with gcd 1 and positive leading coefficient. */
    public Polynomial primitivePart() {
        if (isZero()) {
            return ZERO;
        }
        Rational c = content();
        return c.isOne() ? this : multiply(c.inverse());
    }

    /** Coefficient of the leading term in the monomial order; zero for the zero polynomial. */
    public Rational leadingCoefficient() {
        return isZero() ? Rational.ZERO : coeffs[0];
    }

    public boolean isZero() {
        return coeffs.length == 0;
    }

    public boolean isConstant() {
        return vars.length == 0;
    }

    public boolean isOne() {
        return vars.length == 0 && coeffs.length == 1 && coeffs[0].isOne();
    }

    /** The constant value; ContourException when not constant. */
    public Rational constantValue() {
        if (!isConstant()) {
            throw new ContourException("not a constant: " + this);
        }
        return isZero() ? Rational.ZERO : coeffs[0];
    }

    /** A total order consistent with equals: term by term in the monomial order, then coefficients. */
    @Override
    public int compareTo(Polynomial o) {
        boolean same = vars == o.vars || Arrays.equals(vars, o.vars);
        int[][] a = exps;
        int[][] b = o.exps;
        for (int i = 0; i < Math.min(a.length, b.length); i++) {
            int c = same ? compareExponents(a[i], b[i]) : compareExponents(vars, a[i], o.vars, b[i]);
            if (c != 0) {
                return c;
            }
            c = coeffs[i].compareTo(o.coeffs[i]);
            if (c != 0) {
                return c;
            }
        }
        return Integer.compare(a.length, b.length);
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof Polynomial p) || p.coeffs.length != coeffs.length || hashCode() != p.hashCode()) {
            return false;
        }
        return Arrays.equals(vars, p.vars) && Arrays.deepEquals(exps, p.exps) && Arrays.equals(coeffs, p.coeffs);
    }

    @Override
    public int hashCode() {
        int h = hash;
        if (h == 0) {
            h = Arrays.hashCode(vars) * 31 * 31 + Arrays.deepHashCode(exps) * 31 + Arrays.hashCode(coeffs);
            hash = h == 0 ? 1 : h;
        }
        return hash;
    }

    /** A debugging form such as {@code 3*s^2*t - 1/2}; user-facing printing lives in print/. */
    @Override
    public String toString() {
        if (isZero()) {
            return "0";
        }
        StringBuilder sb = new StringBuilder();
        for (int t = 0; t < coeffs.length; t++) {
            Rational c = coeffs[t];
            if (t == 0) {
                if (c.signum() < 0) {
                    sb.append('-');
                }
            } else {
                sb.append(c.signum() < 0 ? " - " : " + ");
            }
            Rational a = c.abs();
            boolean mono = false;
            StringBuilder m = new StringBuilder();
            for (int v = 0; v < vars.length; v++) {
                int e = exps[t][v];
                if (e > 0) {
                    if (mono) {
                        m.append('*');
                    }
                    m.append(vars[v]);
                    if (e > 1) {
                        m.append('^').append(e);
                    }
                    mono = true;
                }
            }
            if (!mono) {
                sb.append(a);
            } else if (a.isOne()) {
                sb.append(m);
            } else {
                sb.append(a).append('*').append(m);
            }
        }
        return sb.toString();
    }

    /** One term: coefficient times prod variable^exponent (exponents > 0 only). */
    public record Term(Rational coefficient, Map<String, Integer> exponents) { }
}
