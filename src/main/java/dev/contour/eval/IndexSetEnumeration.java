package dev.contour.eval;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Rational;
import dev.contour.lang.IndexSet;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Lists the integer tuples of a finite index set: each index is non-negative (or ranges over a
 * given domain), and constraints are linear with integer coefficients. Bounds propagate through
 * the constraints before and during the search, so an equality such as {@code i + j + k = n}
 * costs one step per solution rather than a scan of the box; an unbounded index is an error.
 */
final class IndexSetEnumeration {
    /** Stands for an absent bound; far beyond any index that could be enumerated. */
    private static final long INF = 1L << 40;

    /** Evaluates one side of a constraint with the indices bound to the given integers. */
    interface Probe {
        Rational at(long[] point);
    }

    /** A constraint as {@code sum coefficients[i] * x_i + constant (= or <=) 0}. */
    private record Linear(long[] coefficients, long[] negatedCoefficients, long constant, boolean equality, Span span) {
        Linear(long[] coefficients, long constant, boolean equality, Span span) {
            this(coefficients, negated(coefficients), constant, equality, span);
        }
    }

    private final List<String> names;
    private final long[] lo;
    private final long[] hi;
    private final List<List<Long>> domains;
    private final List<Linear> constraints = new ArrayList<>();
    private final long maxSize;

    /**
     * @param domains for each index its allowed values in increasing order, or null for 0, 1, 2, ...
     * @param sides   for each constraint of {@code set}, probes of its left and right sides
     */
    IndexSetEnumeration(IndexSet set, List<List<Long>> domains, List<Probe[]> sides, long maxSize) {
        this.names = set.names();
        this.domains = domains;
        this.maxSize = maxSize;
        int n = names.size();
        lo = new long[n];
        hi = new long[n];
        for (int i = 0; i < n; i++) {
            List<Long> d = domains.get(i);
            if (d == null) {
                lo[i] = 0;
                hi[i] = INF;
            } else if (d.isEmpty()) {
                lo[i] = 1;
                hi[i] = 0;
            } else {
                lo[i] = d.get(0);
                hi[i] = d.get(d.size() - 1);
            }
        }
        for (int c = 0; c < set.constraints().size(); c++) {
            IndexSet.Constraint k = set.constraints().get(c);
            Linear form = linearize(sides.get(c), k, n);
            constraints.add(form);
        }
    }

    /** The tuples in lexicographic order of the indices as written. */
    List<long[]> enumerate() {
        try {
            return enumerateChecked();
        } catch (ArithmeticException e) {
            throw new ContourException("index bounds are too large to enumerate", null);
        }
    }

    private List<long[]> enumerateChecked() {
        for (int i = 0; i < names.size(); i++) {
            if (names.subList(0, i).contains(names.get(i))) {
                throw new ContourException("index '" + names.get(i) + "' is named twice", null);
            }
        }
        long[] l = lo.clone();
        long[] h = hi.clone();
        List<long[]> out = new ArrayList<>();
        if (!propagate(l, h)) {
            return out;
        }
        for (int i = 0; i < names.size(); i++) {
            if (h[i] >= INF || l[i] <= -INF) {
                throw new ContourException("the index set is infinite: nothing bounds '" + names.get(i)
                        + "' (give it a range, as in '" + names.get(i) + " in 0..10', or a constraint)", null);
            }
        }
        search(0, l, h, out, new long[] {0});
        return out;
    }

    private void search(int depth, long[] l, long[] h, List<long[]> out, long[] work) {
        if (depth == names.size()) {
            if (satisfied(l)) {
                if (out.size() >= maxSize) {
                    throw new ContourException("the index set has more than " + maxSize + " members", null);
                }
                out.add(l.clone());
            }
            return;
        }
        List<Long> domain = domains.get(depth);
        for (long v = l[depth]; v <= h[depth]; v++) {
            if ((work[0] & 4095) == 0) {
                Cancellation.check();
            }
            if (++work[0] > 20 * maxSize + 1_000) {
                throw new ContourException("the index set is too large to list (past " + maxSize + " members)", null);
            }
            if (domain != null && !contains(domain, v)) {
                continue;
            }
            if (depth == names.size() - 1) {
                // Every index is now fixed: propagation could only reject what the final check rejects.
                long saved = l[depth];
                l[depth] = v;
                if (satisfied(l)) {
                    if (out.size() >= maxSize) {
                        throw new ContourException("the index set has more than " + maxSize + " members", null);
                    }
                    out.add(l.clone());
                }
                l[depth] = saved;
                continue;
            }
            long[] l2 = l.clone();
            long[] h2 = h.clone();
            l2[depth] = v;
            h2[depth] = v;
            if (propagate(l2, h2)) {
                search(depth + 1, l2, h2, out, work);
            }
        }
    }

    private static boolean contains(List<Long> sorted, long v) {
        int lo = 0;
        int hi = sorted.size() - 1;
        while (lo <= hi) {
            int mid = (lo + hi) >>> 1;
            long m = sorted.get(mid);
            if (m == v) {
                return true;
            }
            if (m < v) {
                lo = mid + 1;
            } else {
                hi = mid - 1;
            }
        }
        return false;
    }

    private boolean satisfied(long[] x) {
        for (Linear c : constraints) {
            long sum = c.constant();
            for (int i = 0; i < x.length; i++) {
                sum = Math.addExact(sum, Math.multiplyExact(c.coefficients()[i], x[i]));
            }
            if (c.equality() ? sum != 0 : sum > 0) {
                return false;
            }
        }
        return true;
    }

    /** Narrows the bounds to a fixed point; false when some index has no value left. */
    private boolean propagate(long[] l, long[] h) {
        for (int round = 0; round < 64; round++) {
            boolean changed = false;
            for (Linear c : constraints) {
                changed |= narrow(c.coefficients(), c.constant(), l, h);
                if (c.equality()) {
                    changed |= narrow(c.negatedCoefficients(), -c.constant(), l, h);
                }
            }
            for (int i = 0; i < l.length; i++) {
                if (l[i] > h[i]) {
                    return false;
                }
            }
            if (!changed) {
                return true;
            }
        }
        return true;
    }

    private static long[] negated(long[] a) {
        long[] b = new long[a.length];
        for (int i = 0; i < a.length; i++) {
            b[i] = -a[i];
        }
        return b;
    }

    /** Applies {@code sum a_i x_i + c <= 0} to each index's bounds. */
    private static boolean narrow(long[] a, long c, long[] l, long[] h) {
        boolean changed = false;
        for (int i = 0; i < a.length; i++) {
            if (a[i] == 0) {
                continue;
            }
            // a_i x_i <= -c - sum_{j != i} min(a_j x_j)
            long rest = c;
            boolean bounded = true;
            for (int j = 0; j < a.length && bounded; j++) {
                if (j == i || a[j] == 0) {
                    continue;
                }
                long m = a[j] > 0 ? l[j] : h[j];
                if (Math.abs(m) >= INF) {
                    bounded = false;
                } else {
                    rest = Math.addExact(rest, Math.multiplyExact(a[j], m));
                }
            }
            if (!bounded) {
                continue;
            }
            long rhs = -rest;
            if (a[i] > 0) {
                long bound = Math.floorDiv(rhs, a[i]);
                if (bound < h[i]) {
                    h[i] = bound;
                    changed = true;
                }
            } else {
                long bound = -Math.floorDiv(rhs, -a[i]);
                if (bound > l[i]) {
                    l[i] = bound;
                    changed = true;
                }
            }
        }
        return changed;
    }

    /**
     * Reads off the linear form of {@code left - right} by probing at the origin and the unit
     * points, then confirms linearity at further points (squares and pairwise cross terms would
     * show there), scaling to integer coefficients.
     */
    private static Linear linearize(Probe[] sides, IndexSet.Constraint k, int n) {
        long[] origin = new long[n];
        Rational c0 = difference(sides, origin);
        Rational[] c = new Rational[n];
        for (int i = 0; i < n; i++) {
            long[] e = new long[n];
            e[i] = 1;
            c[i] = difference(sides, e).subtract(c0);
        }
        List<long[]> checks = new ArrayList<>();
        long[] ones = new long[n];
        Arrays.fill(ones, 1);
        checks.add(ones);
        for (int i = 0; i < n; i++) {
            long[] e = new long[n];
            e[i] = 2;
            checks.add(e);
            for (int j = i + 1; j < n; j++) {
                long[] f = new long[n];
                f[i] = 1;
                f[j] = 1;
                checks.add(f);
            }
        }
        for (long[] point : checks) {
            Rational predicted = c0;
            for (int i = 0; i < n; i++) {
                predicted = predicted.add(c[i].multiply(Rational.of(point[i])));
            }
            if (!predicted.equals(difference(sides, point))) {
                throw new ContourException("index constraints must be linear in the indices", k.span());
            }
        }
        BigInteger lcm = c0.denominator();
        for (Rational r : c) {
            lcm = lcm.divide(lcm.gcd(r.denominator())).multiply(r.denominator());
        }
        Rational scale = Rational.of(lcm);
        long[] coefficients = new long[n];
        for (int i = 0; i < n; i++) {
            coefficients[i] = toLong(c[i].multiply(scale), k.span());
        }
        long constant = toLong(c0.multiply(scale), k.span());
        return switch (k.relation()) {
            case EQUAL -> new Linear(coefficients, constant, true, k.span());
            case AT_MOST -> new Linear(coefficients, constant, false, k.span());
            case LESS -> new Linear(coefficients, constant + 1, false, k.span());
            case AT_LEAST -> new Linear(negated(coefficients), -constant, false, k.span());
            case GREATER -> new Linear(negated(coefficients), -constant + 1, false, k.span());
        };
    }

    private static Rational difference(Probe[] sides, long[] point) {
        return sides[0].at(point).subtract(sides[1].at(point));
    }

    private static long toLong(Rational r, Span span) {
        if (r.numerator().bitLength() > 20) {
            throw new ContourException("index constraint coefficient " + r + " is too large", span);
        }
        return r.numerator().longValueExact();
    }
}
