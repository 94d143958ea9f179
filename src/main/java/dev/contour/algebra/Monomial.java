package dev.contour.algebra;

import dev.contour.ContourException;
import java.util.Arrays;
import java.util.Collections;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A Laurent monomial in collected variables: variable name to a non-zero integer exponent.
 *
 * <p>Immutable. Order (Comparable), independent of creation order: first by total degree (sum of
 * exponents, ascending), then variable by variable in name order, the larger exponent of the
 * first differing variable being the larger monomial. {@link #ONE} is the smallest monomial of
 * total degree 0.
 */
public final class Monomial implements Comparable<Monomial> {
    private static final String[] NO_VARS = new String[0];

    public static final Monomial ONE = new Monomial(NO_VARS, new int[0]);

    /** Sorted names; exponents aligned and non-zero. */
    private final String[] vars;
    private final int[] exps;
    private final int degree;
    private final int hash;

    private Monomial(String[] vars, int[] exps) {
        this.vars = vars;
        this.exps = exps;
        int d = 0;
        for (int e : exps) {
            d = Math.addExact(d, e);
        }
        this.degree = d;
        int h = Arrays.hashCode(vars);
        for (int e : exps) {
            h = Hashing.combine(h, e);
        }
        this.hash = h;
    }

    public static Monomial of(String variable, int exponent) {
        return exponent == 0 ? ONE : new Monomial(new String[] {variable}, new int[] {exponent});
    }

    public static Monomial of(Map<String, Integer> exponents) {
        TreeMap<String, Integer> m = new TreeMap<>();
        for (Map.Entry<String, Integer> e : exponents.entrySet()) {
            if (e.getValue() != 0) {
                m.put(e.getKey(), e.getValue());
            }
        }
        return fromSorted(m);
    }

    private static Monomial fromSorted(SortedMap<String, Integer> m) {
        if (m.isEmpty()) {
            return ONE;
        }
        String[] v = m.keySet().toArray(NO_VARS);
        int[] e = new int[v.length];
        for (int i = 0; i < v.length; i++) {
            e[i] = m.get(v[i]);
        }
        return new Monomial(v, e);
    }

    public Monomial multiply(Monomial o) {
        if (o.isOne()) {
            return this;
        }
        if (isOne()) {
            return o;
        }
        // Merge of the two sorted name lists; exponents summing to zero drop out.
        String[] v = new String[vars.length + o.vars.length];
        int[] x = new int[v.length];
        int i = 0;
        int j = 0;
        int n = 0;
        while (i < vars.length || j < o.vars.length) {
            int c = i == vars.length ? 1 : j == o.vars.length ? -1 : vars[i].compareTo(o.vars[j]);
            int e;
            String name;
            if (c < 0) {
                name = vars[i];
                e = exps[i++];
            } else if (c > 0) {
                name = o.vars[j];
                e = o.exps[j++];
            } else {
                name = vars[i];
                e = Math.addExact(exps[i++], o.exps[j++]);
            }
            if (e != 0) {
                v[n] = name;
                x[n++] = e;
            }
        }
        if (n == 0) {
            return ONE;
        }
        // the product usually has the names of a factor (sigma^i tau^j times sigma^k tau^l): share that
        // factor's array, since a large operator application holds millions of monomials at once
        String[] names = sameNames(v, n, vars) ? vars : sameNames(v, n, o.vars) ? o.vars : n == v.length ? v : Arrays.copyOf(v, n);
        return new Monomial(names, n == x.length ? x : Arrays.copyOf(x, n));
    }

    private static boolean sameNames(String[] v, int n, String[] names) {
        if (n != names.length) {
            return false;
        }
        for (int k = 0; k < n; k++) {
            if (v[k] != names[k]) {
                return false;
            }
        }
        return true;
    }

    public Monomial pow(int e) {
        if (e == 0 || isOne()) {
            return ONE;
        }
        int[] x = new int[exps.length];
        for (int i = 0; i < x.length; i++) {
            try {
                x[i] = Math.multiplyExact(exps[i], e);
            } catch (ArithmeticException overflow) {
                throw new ContourException("exponent overflow in monomial power: (" + this + ")^" + e);
            }
        }
        return new Monomial(vars, x);
    }

    public Monomial inverse() {
        return pow(-1);
    }

    public int exponent(String variable) {
        int i = Arrays.binarySearch(vars, variable);
        return i < 0 ? 0 : exps[i];
    }

    public SortedMap<String, Integer> exponents() {
        TreeMap<String, Integer> m = new TreeMap<>();
        for (int i = 0; i < vars.length; i++) {
            m.put(vars[i], exps[i]);
        }
        return Collections.unmodifiableSortedMap(m);
    }

    /** The variable names with non-zero exponent, sorted (no copy; do not modify). */
    String[] names() {
        return vars;
    }

    public int totalDegree() {
        return degree;
    }

    public boolean isOne() {
        return vars.length == 0;
    }

    @Override
    public int compareTo(Monomial o) {
        if (degree != o.degree) {
            return Integer.compare(degree, o.degree);
        }
        int i = 0;
        int j = 0;
        while (i < vars.length || j < o.vars.length) {
            int c = i == vars.length ? 1 : j == o.vars.length ? -1 : vars[i].compareTo(o.vars[j]);
            if (c < 0) {
                // this has vars[i] with a non-zero exponent where o has 0
                return exps[i] > 0 ? 1 : -1;
            }
            if (c > 0) {
                return o.exps[j] > 0 ? -1 : 1;
            }
            if (exps[i] != o.exps[j]) {
                return Integer.compare(exps[i], o.exps[j]);
            }
            i++;
            j++;
        }
        return 0;
    }

    @Override
    public boolean equals(Object o) {
        return this == o || o instanceof Monomial m && hash == m.hash && Arrays.equals(vars, m.vars) && Arrays.equals(exps, m.exps);
    }

    @Override
    public int hashCode() {
        return hash;
    }

    /** {@code sigma^2*tau^-1}, or {@code 1}. */
    @Override
    public String toString() {
        if (isOne()) {
            return "1";
        }
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < vars.length; i++) {
            if (i > 0) {
                sb.append('*');
            }
            sb.append(vars[i]);
            if (exps[i] != 1) {
                sb.append('^').append(exps[i]);
            }
        }
        return sb.toString();
    }
}
