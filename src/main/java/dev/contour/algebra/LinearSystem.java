package dev.contour.algebra;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * A sparse linear system over Q, built row by row, solved exactly.
 *
 * <p>Columns are unknown indices 0..columns-1. Each row carries a caller-chosen tag (for example
 * the source line of the constraint that produced it) so that an inconsistency can be reported as
 * a small set of conflicting tags. Elimination is incremental Gauss-Jordan over exact rationals on
 * sparse rows (the pivot of a new row is its lowest remaining column); each working row records
 * which input rows it was combined from, which yields the conflicting tags, then pruned by a
 * deletion pass when the set is small. {@link #solve()} gets the same result multi-modularly.
 */
public final class LinearSystem {
    private static final int PRUNE_LIMIT = 32;

    private final int columns;
    private final List<TreeMap<Integer, Rational>> rowCoefficients = new ArrayList<>();
    private final List<Rational> rowRhs = new ArrayList<>();
    private final List<Object> rowTags = new ArrayList<>();

    public LinearSystem(int columns) {
        if (columns < 0) {
            throw new ContourException("a linear system needs a non-negative number of columns, got " + columns);
        }
        this.columns = columns;
    }

    /** Adds the equation sum coefficients[col] * x_col = rhs. */
    public void addRow(Map<Integer, Rational> coefficients, Rational rhs, Object tag) {
        TreeMap<Integer, Rational> row = new TreeMap<>();
        for (Map.Entry<Integer, Rational> e : coefficients.entrySet()) {
            int c = e.getKey();
            if (c < 0 || c >= columns) {
                throw new ContourException("column " + c + " is outside 0.." + (columns - 1) + " (row " + tag + ")");
            }
            if (!e.getValue().isZero()) {
                row.put(c, e.getValue());
            }
        }
        rowCoefficients.add(row);
        rowRhs.add(rhs);
        rowTags.add(tag);
    }

    public int rows() {
        return rowRhs.size();
    }

    public int columns() {
        return columns;
    }

    /** One row during elimination. */
    private static final class Row {
        final TreeMap<Integer, Rational> c;
        Rational rhs;
        final BitSet from;

        Row(TreeMap<Integer, Rational> c, Rational rhs, BitSet from) {
            this.c = c;
            this.rhs = rhs;
            this.from = from;
        }

        /** this -= f * o */
        void subtract(Rational f, Row o) {
            for (Map.Entry<Integer, Rational> e : o.c.entrySet()) {
                Rational v = c.getOrDefault(e.getKey(), Rational.ZERO).subtract(f.multiply(e.getValue()));
                if (v.isZero()) {
                    c.remove(e.getKey());
                } else {
                    c.put(e.getKey(), v);
                }
            }
            rhs = rhs.subtract(f.multiply(o.rhs));
            from.or(o.from);
        }
    }

    /**
     * Solves exactly. The result is the one of {@link #solveExact()} (reduced row echelon form with
     * lowest-column pivots); it is computed multi-modularly and verified over Q by
     * {@link ModularLinearSolver}. Only when a prime reports an inconsistency does the exact path run,
     * which confirms it (or, for an unlucky prime, returns the solution) and yields the conflicting tags.
     */
    public Solution solve() {
        Solution s = ModularLinearSolver.solve(columns, rowCoefficients, rowRhs);
        return s != null ? s : solveExact();
    }

    /** The reference path: incremental Gauss-Jordan elimination over Q (slow at scale: rational fill-in). */
    Solution solveExact() {
        List<Integer> all = new ArrayList<>();
        for (int i = 0; i < rows(); i++) {
            all.add(i);
        }
        Object result = eliminate(all);
        if (result instanceof BitSet conflict) {
            List<Integer> rowsInConflict = new ArrayList<>();
            conflict.stream().forEach(rowsInConflict::add);
            if (rowsInConflict.size() <= PRUNE_LIMIT) {
                for (int k = rowsInConflict.size() - 1; k >= 0; k--) {
                    List<Integer> fewer = new ArrayList<>(rowsInConflict);
                    fewer.remove(k);
                    if (eliminate(fewer) instanceof BitSet) {
                        rowsInConflict = fewer;
                    }
                }
            }
            List<Object> tags = new ArrayList<>();
            for (int r : rowsInConflict) {
                tags.add(rowTags.get(r));
            }
            return new Inconsistent(Collections.unmodifiableList(tags));
        }
        @SuppressWarnings("unchecked")
        TreeMap<Integer, Row> pivots = (TreeMap<Integer, Row>) result;
        int rank = pivots.size();
        List<Rational> particular = new ArrayList<>(Collections.nCopies(columns, Rational.ZERO));
        for (Map.Entry<Integer, Row> p : pivots.entrySet()) {
            particular.set(p.getKey(), p.getValue().rhs);
        }
        if (rank == columns) {
            return new Unique(Collections.unmodifiableList(particular));
        }
        List<Integer> free = new ArrayList<>();
        List<List<Rational>> basis = new ArrayList<>();
        for (int f = 0; f < columns; f++) {
            if (pivots.containsKey(f)) {
                continue;
            }
            free.add(f);
            List<Rational> v = new ArrayList<>(Collections.nCopies(columns, Rational.ZERO));
            v.set(f, Rational.ONE);
            for (Map.Entry<Integer, Row> p : pivots.entrySet()) {
                Rational a = p.getValue().c.get(f);
                if (a != null) {
                    v.set(p.getKey(), a.negate());
                }
            }
            basis.add(Collections.unmodifiableList(v));
        }
        return new Family(Collections.unmodifiableList(particular), Collections.unmodifiableList(free),
                Collections.unmodifiableList(basis), rank);
    }

    /** Pivot rows by pivot column (reduced: no pivot row has an entry in another pivot column), or the BitSet of a conflict. */
    private Object eliminate(List<Integer> which) {
        TreeMap<Integer, Row> pivots = new TreeMap<>();
        for (int i : which) {
            Cancellation.check();
            BitSet from = new BitSet();
            from.set(i);
            Row r = new Row(new TreeMap<>(rowCoefficients.get(i)), rowRhs.get(i), from);
            // Pivot rows carry no other pivot column, so one pass over the present pivot columns suffices.
            List<Integer> present = new ArrayList<>();
            for (Integer c : r.c.keySet()) {
                if (pivots.containsKey(c)) {
                    present.add(c);
                }
            }
            for (int c : present) {
                Rational f = r.c.get(c);
                if (f != null) {
                    r.subtract(f, pivots.get(c));
                }
            }
            if (r.c.isEmpty()) {
                if (!r.rhs.isZero()) {
                    return r.from;
                }
                continue;
            }
            int pc = r.c.firstKey();
            Rational inv = r.c.get(pc).inverse();
            if (!inv.isOne()) {
                for (Map.Entry<Integer, Rational> e : r.c.entrySet()) {
                    e.setValue(e.getValue().multiply(inv));
                }
                r.rhs = r.rhs.multiply(inv);
            }
            for (Row p : pivots.values()) {
                Rational f = p.c.get(pc);
                if (f != null) {
                    p.subtract(f, r);
                }
            }
            pivots.put(pc, r);
        }
        return pivots;
    }

    /** Outcome of a solve. */
    public sealed interface Solution permits Unique, Family, Inconsistent { }

    /** The only solution. */
    public record Unique(List<Rational> values) implements Solution { }

    /**
     * All solutions: particular + sum_k f_k * nullBasis[k], with free columns freeColumns[k]; each
     * pivot column expressed through the free ones.
     */
    public record Family(List<Rational> particular, List<Integer> freeColumns, List<List<Rational>> nullBasis, int rank)
            implements Solution { }

    /** No solution; conflictingTags is a small set of row tags whose rows already conflict. */
    public record Inconsistent(List<Object> conflictingTags) implements Solution { }
}
