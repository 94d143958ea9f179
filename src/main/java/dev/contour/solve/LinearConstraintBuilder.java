package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.Parallel;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReferenceArray;

/**
 * Turns constraints into the sparse linear system of their equations over Q.
 *
 * <p>Each constraint is applied to every piece independently (in chunks of a fixed size on the shared
 * pool, {@link Parallel}); a piece's contributions are keyed by equation (collected monomial plus the
 * expansion path that produced the number) and the rows are assembled sparsely by summing the
 * contributions under each key. The chunks' maps are merged in chunk order as they finish (each of
 * a fixed number of shards of the keys on its own), so the equations come out in the same order
 * whatever the number of threads, and no chunk's map is kept once merged.
 */
public final class LinearConstraintBuilder {
    private static final int CHUNK = 64;
    /** Shards of the equation map (a power of two, at most 32: see {@link #shard}). */
    private static final int SHARDS = 32;

    private final List<String> unknowns;
    private final List<Constraint> constraints = new ArrayList<>();

    public LinearConstraintBuilder(List<String> unknowns) {
        this.unknowns = List.copyOf(unknowns);
    }

    public LinearConstraintBuilder add(Constraint c) {
        constraints.add(c);
        return this;
    }

    public List<String> unknowns() {
        return unknowns;
    }

    /** The equations of all constraints. */
    public SparseSystem build(SolveProgress progress) {
        SparseSystem system = new SparseSystem(unknowns);
        for (int k = 0; k < constraints.size(); k++) {
            Constraint c = constraints.get(k);
            int tag = system.constraint(c.span, c.label);
            progress.constraint(k + 1, constraints.size());
            boolean reused = false;
            for (int later = k + 1; later < constraints.size(); later++) {
                reused |= constraints.get(later).source == c.source;
            }
            // rows in a fixed order (shard by shard, each in the order its keys were first met in
            // chunk order), so pivots and free unknowns are reproducible for any thread count
            List<Accumulator> accs = new ArrayList<>();
            for (EquationTable shard : collect(c, reused, progress)) {
                accs.addAll(shard.order);
                shard.clear();
            }
            // each accumulator is dropped once it is a row, so the two forms of an equation are not all held at once
            system.addRows(Parallel.map(accs.size(), i -> {
                Accumulator acc = accs.get(i);
                accs.set(i, null);
                return acc.toRow(tag);
            }));
        }
        return system;
    }

    /** Builds and solves. */
    public Solution solve(SolveProgress progress) {
        return build(progress).solve(progress);
    }

    /**
     * The contributions of every piece summed per equation key, in {@link #SHARDS} tables by key hash.
     * Pieces go in fixed chunks (not one per thread) to the pool; each chunk's contributions are
     * split by shard, and each shard merges the chunks in chunk order (under its own lock, by
     * whichever thread completes the next chunk in line), so the shards merge at the same time and
     * their contents and order do not depend on the number of threads. A chunk's tables are dropped
     * once merged. {@code keepPieces} false: no later constraint reads this source.
     */
    private List<EquationTable> collect(Constraint c, boolean keepPieces, SolveProgress progress) {
        Constraint.PieceSource src = c.source;
        List<String> vars = src.variables();
        Applier apply = applier(c.condition, vars);
        int n = src.count();
        AtomicLong pieces = new AtomicLong();
        int chunks = (n + CHUNK - 1) / CHUNK;
        List<EquationTable> merged = new ArrayList<>();
        Object[] locks = new Object[SHARDS];
        int[] nextChunk = new int[SHARDS];
        for (int s = 0; s < SHARDS; s++) {
            merged.add(new EquationTable(64));
            locks[s] = new Object();
        }
        AtomicReferenceArray<EquationTable[]> done = new AtomicReferenceArray<>(chunks);
        Parallel.map(chunks, k -> {
            EquationTable[] local = new EquationTable[SHARDS];
            for (int s = 0; s < SHARDS; s++) {
                local[s] = new EquationTable(16);
            }
            for (int i = k * CHUNK; i < Math.min(n, (k + 1) * CHUNK); i++) {
                Cancellation.check();
                Piece piece = src.piece(i, keepPieces);
                int col = piece.column;
                for (int j = 0; j < piece.terms.size(); j++) {
                    apply.to(piece.terms.get(j), piece.monomials.get(j), (key, value) -> {
                        int h = spread(key.hashCode());
                        local[shard(h)].get(key, h).add(col, value);
                    });
                }
            }
            progress.pieces(pieces.addAndGet(Math.min(n, (k + 1) * CHUNK) - k * CHUNK), n);
            done.set(k, local); // published before any shard is merged, so a merger holding a lock sees it or we do
            for (int s = 0; s < SHARDS; s++) {
                synchronized (locks[s]) {
                    EquationTable into = merged.get(s);
                    for (int next = nextChunk[s]; next < chunks && done.get(next) != null; next = ++nextChunk[s]) {
                        EquationTable[] ready = done.get(next);
                        into.absorb(ready[s]);
                        ready[s] = null;
                    }
                }
            }
            return null;
        });
        return merged;
    }

    /** The key hash with its high bits folded in (the tables index by the low bits). */
    private static int spread(int h) {
        return h ^ h >>> 16;
    }

    private static int shard(int spread) {
        return (spread * 0x9E3779B9 >>> 27) & (SHARDS - 1);
    }

    /**
     * Accumulators by key, chained through the accumulators themselves (no entry objects: a p = 512
     * build holds over a million equations, and every object is traced by each collection), and in
     * the order their keys were first met.
     */
    private static final class EquationTable {
        private Accumulator[] buckets;
        final ArrayList<Accumulator> order;

        EquationTable(int capacity) {
            buckets = new Accumulator[capacity];
            order = new ArrayList<>(capacity);
        }

        /** The accumulator of a key, new (and last in order) if the key was not met before. */
        Accumulator get(Object key, int hash) {
            Accumulator a = find(key, hash);
            if (a == null) {
                a = new Accumulator(key, hash);
                insert(a);
            }
            return a;
        }

        private Accumulator find(Object key, int hash) {
            for (Accumulator a = buckets[hash & (buckets.length - 1)]; a != null; a = a.next) {
                if (a.hash == hash && (a.key == key || a.key.equals(key))) {
                    return a;
                }
            }
            return null;
        }

        private void insert(Accumulator a) {
            if (order.size() >= buckets.length - (buckets.length >> 2)) {
                grow();
            }
            int b = a.hash & (buckets.length - 1);
            a.next = buckets[b];
            buckets[b] = a;
            order.add(a);
        }

        private void grow() {
            Accumulator[] old = buckets;
            buckets = new Accumulator[old.length * 2];
            for (Accumulator a : order) {
                int b = a.hash & (buckets.length - 1);
                a.next = buckets[b];
                buckets[b] = a;
            }
        }

        /** Adds another table's sums, its new keys after this one's in their order; the other is spent. */
        void absorb(EquationTable other) {
            for (Accumulator a : other.order) {
                Accumulator mine = find(a.key, a.hash);
                if (mine == null) {
                    insert(a); // the other table is dropped, so its accumulator moves here whole
                } else {
                    mine.merge(a);
                }
            }
        }

        void clear() {
            buckets = new Accumulator[1];
            order.clear();
            order.trimToSize();
        }
    }

    /** Applies a condition to one factored term under a root key. */
    private interface Applier {
        void to(FactoredTerm t, Object root, TermConditions.Sink sink);
    }

    private static Applier applier(Constraint.Condition cond, List<String> vars) {
        if (cond instanceof Constraint.Vanishes) {
            return (t, root, sink) -> TermConditions.vanish(vars, t, root, sink);
        }
        if (cond instanceof Constraint.PolynomialIn p) {
            boolean[] mask = mask(vars, p.variables());
            return (t, root, sink) -> TermConditions.polynomialIn(vars, mask, t, root, sink);
        }
        if (cond instanceof Constraint.ResiduesPolynomial r) {
            List<TermConditions.PoleFamily> fams = r.poles().stream().map(p -> family(p, vars)).toList();
            return (t, root, sink) -> TermConditions.residuesPolynomial(vars, fams, r.simple(), t, root, sink);
        }
        if (cond instanceof Constraint.PolesOnlyAt p) {
            TermConditions.PoleFamily fam = family(p.poles(), vars);
            return (t, root, sink) -> TermConditions.polesOnlyAt(vars, fam, t, root, sink);
        }
        Constraint.GrowthAtMost g = (Constraint.GrowthAtMost) cond;
        boolean[] mask = mask(vars, g.variables());
        return (t, root, sink) -> TermConditions.growthAtMost(vars, mask, g.degree(), t, root, sink);
    }

    private static TermConditions.PoleFamily family(Constraint.Poles p, List<String> vars) {
        LinearForm f = LinearForm.of(p.form(), vars);
        if (f.isConstant()) {
            throw new dev.contour.ContourException("the pole variable " + p.name() + " = " + p.form() + " is constant");
        }
        return new TermConditions.PoleFamily(f, p.allowed());
    }

    private static boolean[] mask(List<String> vars, List<String> chosen) {
        boolean[] m = new boolean[vars.size()];
        for (String v : chosen) {
            int i = vars.indexOf(v);
            if (i >= 0) {
                m[i] = true;
            }
        }
        return m;
    }

    /**
     * Contributions to one equation, under its key: column to summed value (-1 is the part free of
     * unknowns). Compact because a p = 512 ansatz holds over a million of them at once (most with one
     * or two entries): the first entry lives in fields, the others in one array of (column,
     * numerator, denominator) triples; a value is kept as a pair of longs while it fits, a
     * {@link Rational} (in {@code bigs}) only when not.
     */
    private static final class Accumulator {
        final Object key;
        final int hash;
        /** The next accumulator in the same bucket of its table. */
        Accumulator next;
        private int size;
        private int col0;
        private long num0;
        private long den0;
        private Rational big0;
        /** Entry i >= 1 at 3 (i - 1): column, numerator, denominator. */
        private long[] rest;
        /** Entry i >= 1 at i - 1 when its value does not fit in longs; null until one needs it. */
        private Rational[] bigs;

        Accumulator(Object key, int hash) {
            this.key = key;
            this.hash = hash;
        }

        private int col(int i) {
            return i == 0 ? col0 : (int) rest[3 * (i - 1)];
        }

        private Rational value(int i) {
            if (i == 0) {
                return big0 != null ? big0 : Rational.of(num0, den0);
            }
            Rational b = bigs == null ? null : bigs[i - 1];
            return b != null ? b : Rational.of(rest[3 * i - 2], rest[3 * i - 1]);
        }

        private void set(int i, Rational v) {
            boolean small = v.isSmall();
            if (i == 0) {
                big0 = small ? null : v;
                num0 = small ? v.longNum() : 0;
                den0 = small ? v.longDen() : 0;
                return;
            }
            if (small) {
                rest[3 * i - 2] = v.longNum();
                rest[3 * i - 1] = v.longDen();
                if (bigs != null) {
                    bigs[i - 1] = null;
                }
            } else {
                if (bigs == null) {
                    bigs = new Rational[rest.length / 3];
                }
                bigs[i - 1] = v;
            }
        }

        void add(int col, Rational v) {
            for (int i = 0; i < size; i++) {
                if (col(i) == col) {
                    set(i, value(i).add(v));
                    return;
                }
            }
            if (size > 0) {
                int k = size - 1;
                if (rest == null) {
                    rest = new long[3];
                } else if (3 * k == rest.length) {
                    rest = Arrays.copyOf(rest, 6 * k);
                    if (bigs != null) {
                        bigs = Arrays.copyOf(bigs, 2 * k);
                    }
                }
                rest[3 * k] = col;
            } else {
                col0 = col;
            }
            set(size++, v);
        }

        void merge(Accumulator o) {
            for (int i = 0; i < o.size; i++) {
                add(o.col(i), o.value(i));
            }
        }

        IntegerRow toRow(int tag) {
            int[] cs = new int[size];
            Rational[] vs = new Rational[size];
            int n = 0;
            Rational rhs = Rational.ZERO;
            for (int i = 0; i < size; i++) {
                Rational v = value(i);
                if (v.isZero()) {
                    continue;
                }
                if (col(i) < 0) {
                    rhs = v.negate();
                } else {
                    // insertion by column: accumulators are short
                    int j = n++;
                    for (; j > 0 && cs[j - 1] > col(i); j--) {
                        cs[j] = cs[j - 1];
                        vs[j] = vs[j - 1];
                    }
                    cs[j] = col(i);
                    vs[j] = v;
                }
            }
            if (n == 0 && rhs.isZero()) {
                return null;
            }
            return IntegerRow.of(n == size ? cs : Arrays.copyOf(cs, n), n == size ? vs : Arrays.copyOf(vs, n), rhs, tag);
        }
    }
}
