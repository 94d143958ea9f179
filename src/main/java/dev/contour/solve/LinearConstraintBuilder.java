package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.Parallel;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
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
            // rows in a fixed order (shard by shard, each in the order its keys were first met in
            // chunk order), so pivots and free unknowns are reproducible for any thread count
            List<Accumulator> accs = new ArrayList<>();
            boolean reused = false;
            for (int later = k + 1; later < constraints.size(); later++) {
                reused |= constraints.get(later).source == c.source;
            }
            for (Map<Object, Accumulator> shard : collect(c, reused, progress)) {
                accs.addAll(shard.values());
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
     * The contributions of every piece summed per equation key, in {@link #SHARDS} maps by key hash.
     * Pieces go in fixed chunks (not one per thread) to the pool; each chunk's contributions are
     * split by shard, and each shard merges the chunks in chunk order (under its own lock, by
     * whichever thread completes the next chunk in line), so the shards merge at the same time and
     * their contents and order do not depend on the number of threads. A chunk's maps are dropped
     * once merged. {@code keepPieces} false: no later constraint reads this source.
     */
    private List<Map<Object, Accumulator>> collect(Constraint c, boolean keepPieces, SolveProgress progress) {
        Constraint.PieceSource src = c.source;
        List<String> vars = src.variables();
        Applier apply = applier(c.condition, vars);
        int n = src.count();
        AtomicLong pieces = new AtomicLong();
        int chunks = (n + CHUNK - 1) / CHUNK;
        List<Map<Object, Accumulator>> merged = new ArrayList<>();
        Object[] locks = new Object[SHARDS];
        int[] nextChunk = new int[SHARDS];
        for (int s = 0; s < SHARDS; s++) {
            merged.add(new LinkedHashMap<>());
            locks[s] = new Object();
        }
        AtomicReferenceArray<Map<Object, Accumulator>[]> done = new AtomicReferenceArray<>(chunks);
        Parallel.map(chunks, k -> {
            @SuppressWarnings("unchecked")
            Map<Object, Accumulator>[] local = new Map[SHARDS];
            for (int s = 0; s < SHARDS; s++) {
                local[s] = new LinkedHashMap<>(64);
            }
            for (int i = k * CHUNK; i < Math.min(n, (k + 1) * CHUNK); i++) {
                Cancellation.check();
                Piece piece = src.piece(i, keepPieces);
                int col = piece.column;
                for (int j = 0; j < piece.terms.size(); j++) {
                    apply.to(piece.terms.get(j), piece.monomials.get(j), (key, value) ->
                            local[shard(key)].computeIfAbsent(key, x -> new Accumulator()).add(col, value));
                }
            }
            progress.pieces(pieces.addAndGet(Math.min(n, (k + 1) * CHUNK) - k * CHUNK), n);
            done.set(k, local); // published before any shard is merged, so a merger holding a lock sees it or we do
            for (int s = 0; s < SHARDS; s++) {
                synchronized (locks[s]) {
                    Map<Object, Accumulator> into = merged.get(s);
                    for (int next = nextChunk[s]; next < chunks && done.get(next) != null; next = ++nextChunk[s]) {
                        Map<Object, Accumulator>[] ready = done.get(next);
                        ready[s].forEach((key, acc) -> into.merge(key, acc, Accumulator::merge));
                        ready[s] = null;
                    }
                }
            }
            return null;
        });
        return merged;
    }

    private static int shard(Object key) {
        int h = key.hashCode();
        h ^= h >>> 16;
        return (h * 0x9E3779B9 >>> 27) & (SHARDS - 1);
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
     * Contributions to one equation: column to summed value (-1 is the part free of unknowns).
     * Compact because a p = 512 ansatz holds over a million of them at once (most with one or two
     * entries): the first entry lives in fields, the others in arrays; a value is kept as a
     * numerator and denominator pair of longs while it fits, a {@link Rational} only when not.
     */
    private static final class Accumulator {
        private int size;
        private int col0;
        private long num0;
        private long den0;
        private Rational big0;
        /** Entries 1, 2, ... at index i - 1; {@code bigs} is null until a value needs it. */
        private int[] cols;
        private long[] nums;
        private long[] dens;
        private Rational[] bigs;

        private int col(int i) {
            return i == 0 ? col0 : cols[i - 1];
        }

        private Rational value(int i) {
            if (i == 0) {
                return big0 != null ? big0 : Rational.of(num0, den0);
            }
            Rational b = bigs == null ? null : bigs[i - 1];
            return b != null ? b : Rational.of(nums[i - 1], dens[i - 1]);
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
                nums[i - 1] = v.longNum();
                dens[i - 1] = v.longDen();
                if (bigs != null) {
                    bigs[i - 1] = null;
                }
            } else {
                if (bigs == null) {
                    bigs = new Rational[cols.length];
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
                if (cols == null) {
                    cols = new int[2];
                    nums = new long[2];
                    dens = new long[2];
                } else if (k == cols.length) {
                    cols = Arrays.copyOf(cols, k * 2);
                    nums = Arrays.copyOf(nums, k * 2);
                    dens = Arrays.copyOf(dens, k * 2);
                    if (bigs != null) {
                        bigs = Arrays.copyOf(bigs, k * 2);
                    }
                }
                cols[k] = col;
            } else {
                col0 = col;
            }
            set(size++, v);
        }

        Accumulator merge(Accumulator o) {
            for (int i = 0; i < o.size; i++) {
                add(o.col(i), o.value(i));
            }
            return this;
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
