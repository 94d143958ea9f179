package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * A sparse linear system over Q in named unknowns, whose equations are grouped by the constraint
 * (and source span) that produced them, solved exactly.
 *
 * <p>Why not {@link dev.contour.algebra.LinearSystem}: ansatz systems reach 10^5 unknowns and 10^6
 * equations with two to five entries each, in a lattice pattern. General pivoting elimination fills
 * them in; exact propagation along the lattice ({@link ExactPropagation}) does not, and the
 * conflict analysis by constraint is specific to solving constraints.
 */
public final class SparseSystem {

    private final List<String> unknowns;
    private final List<Span> spans = new ArrayList<>();
    private final List<String> labels = new ArrayList<>();
    private final List<IntegerRow> rows = new ArrayList<>();

    public SparseSystem(List<String> unknowns) {
        this.unknowns = List.copyOf(unknowns);
        if (new LinkedHashSet<>(unknowns).size() != unknowns.size()) {
            throw new ContourException("an unknown is listed twice: " + unknowns);
        }
    }

    public List<String> unknowns() {
        return unknowns;
    }

    /** Registers a constraint (where it was written and a short description); returns its tag. */
    public int constraint(Span span, String label) {
        spans.add(span == null ? Span.NONE : span);
        labels.add(label);
        return spans.size() - 1;
    }

    /** Adds sum coefficients[col] x_col = rhs for the constraint with the given tag (0 = 0 is skipped). */
    public void addEquation(int tag, Map<Integer, Rational> coefficients, Rational rhs) {
        TreeMap<Integer, Rational> sorted = new TreeMap<>();
        coefficients.forEach((c, v) -> {
            if (c < 0 || c >= unknowns.size()) {
                throw new ContourException("column " + c + " is not an unknown of this system");
            }
            if (!v.isZero()) {
                sorted.put(c, v);
            }
        });
        int[] cols = sorted.keySet().stream().mapToInt(Integer::intValue).toArray();
        addSorted(tag, cols, sorted.values().toArray(new Rational[0]), rhs);
    }

    /** Adds an equation whose columns are sorted, distinct and whose values are non-zero. */
    void addSorted(int tag, int[] cols, Rational[] vals, Rational rhs) {
        if (tag < 0 || tag >= spans.size()) {
            throw new ContourException("unknown constraint tag " + tag);
        }
        IntegerRow row = IntegerRow.of(cols, vals, rhs, tag);
        if (row != null) {
            rows.add(row);
        }
    }

    /** Adds prepared rows in order (nulls, the trivial equations, are skipped). */
    void addRows(List<IntegerRow> prepared) {
        for (IntegerRow r : prepared) {
            if (r != null) {
                if (r.tag < 0 || r.tag >= spans.size()) {
                    throw new ContourException("unknown constraint tag " + r.tag);
                }
                rows.add(r);
            }
        }
    }

    public int equations() {
        return rows.size();
    }

    public Solution solve() {
        return solve(SolveProgress.silent());
    }

    public Solution solve(SolveProgress progress) {
        List<IntegerRow> distinct = distinct(rows);
        progress.generated(distinct.size());
        ExactPropagation.Outcome out = ExactPropagation.solve(distinct, unknowns.size(), progress);
        if (!out.consistent()) {
            return conflict();
        }
        return toSolution(out.values(), out.free());
    }

    private Solution toSolution(Rational[][] val, int[] free) {
        if (free.length == 0) {
            return new Solution.Unique(unknowns, Arrays.stream(val).map(v -> v[0]).toList());
        }
        List<String> names = Arrays.stream(free).mapToObj(unknowns::get).toList();
        return new Solution.Family(unknowns, names, Arrays.stream(val).map(Arrays::asList).toList());
    }

    private static int[] freeColumns(boolean[] pivot) {
        int n = 0;
        for (boolean b : pivot) {
            n += b ? 0 : 1;
        }
        int[] free = new int[n];
        for (int c = 0, k = 0; c < pivot.length; c++) {
            if (!pivot[c]) {
                free[k++] = c;
            }
        }
        return free;
    }

    /**
     * Shrinks the set of constraints to one that is still inconsistent but becomes consistent when
     * any member is dropped (a deletion filter; every check is exact).
     */
    private Solution conflict() {
        Set<Integer> keep = new LinkedHashSet<>();
        for (IntegerRow r : rows) {
            keep.add(r.tag);
        }
        for (Integer tag : List.copyOf(keep)) {
            keep.remove(tag);
            if (ExactPropagation.solve(rowsOf(keep), unknowns.size(), SolveProgress.silent()).consistent()) {
                keep.add(tag);
            }
        }
        List<Integer> tags = keep.stream().sorted().toList();
        return new Solution.Inconsistent(unknowns, tags.stream().map(spans::get).toList(),
                tags.stream().map(labels::get).toList());
    }

    private List<IntegerRow> rowsOf(Set<Integer> tags) {
        return distinct(rows.stream().filter(r -> tags.contains(r.tag)).toList());
    }

    /** Drops repeated equations (pieces of a large ansatz produce many identical rows). */
    private static List<IntegerRow> distinct(List<IntegerRow> all) {
        java.util.HashSet<Equation> seen = new java.util.HashSet<>(all.size() * 2);
        List<IntegerRow> out = new ArrayList<>();
        for (IntegerRow r : all) {
            if (seen.add(new Equation(r))) {
                out.add(r);
            }
        }
        return out;
    }

    /** A row compared as an equation: coefficients and right side, not the constraint it came from. */
    private record Equation(IntegerRow row) {
        @Override
        public boolean equals(Object o) {
            return o instanceof Equation e && row.sameEquation(e.row);
        }

        @Override
        public int hashCode() {
            return row.equationHash();
        }
    }
}
