package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The exact outcome of solving for named unknowns: one solution, a family with named free
 * unknowns, or a contradiction naming the constraints that cause it.
 */
public sealed interface Solution permits Solution.Unique, Solution.Family, Solution.Inconsistent {

    /** The unknowns solved for, in column order. */
    List<String> unknowns();

    /** "unique", "family" or "inconsistent". */
    String kind();

    /** The only solution: values.get(i) belongs to unknowns.get(i). */
    record Unique(List<String> unknowns, List<Rational> values) implements Solution {
        public Unique {
            unknowns = List.copyOf(unknowns);
            values = List.copyOf(values);
        }

        @Override
        public String kind() {
            return "unique";
        }

        public Rational value(String unknown) {
            return values.get(Solution.indexOf(unknowns, unknown));
        }
    }

    /**
     * All solutions: unknown i equals affine.get(i).get(0) + sum_f affine.get(i).get(f + 1) * free.get(f);
     * each free unknown has the identity row.
     */
    record Family(List<String> unknowns, List<String> free, List<List<Rational>> affine) implements Solution {
        public Family {
            unknowns = List.copyOf(unknowns);
            free = List.copyOf(free);
            affine = affine.stream().map(List::copyOf).toList();
        }

        @Override
        public String kind() {
            return "family";
        }

        /** The family with every free unknown not in {@code keep} set to 0. */
        public Solution keeping(List<String> keep) {
            List<Integer> cols = new ArrayList<>();
            for (int f = 0; f < free.size(); f++) {
                if (keep.contains(free.get(f))) {
                    cols.add(f);
                }
            }
            List<List<Rational>> rows = new ArrayList<>();
            for (List<Rational> r : affine) {
                List<Rational> n = new ArrayList<>();
                n.add(r.get(0));
                cols.forEach(c -> n.add(r.get(c + 1)));
                rows.add(n);
            }
            if (cols.isEmpty()) {
                return new Unique(unknowns, rows.stream().map(r -> r.get(0)).toList());
            }
            return new Family(unknowns, cols.stream().map(free::get).toList(), rows);
        }

        /** How many unknowns stay free. */
        public int dimension() {
            return free.size();
        }
    }

    /** No solution: the constraints at these places already conflict among themselves. */
    record Inconsistent(List<String> unknowns, List<Span> conflicting, List<String> labels) implements Solution {
        public Inconsistent {
            unknowns = List.copyOf(unknowns);
            conflicting = List.copyOf(conflicting);
            labels = List.copyOf(labels);
        }

        @Override
        public String kind() {
            return "inconsistent";
        }
    }

    /**
     * Fixes one unknown to a value (a normalisation such as a[0,0,1] = 1). On a family the unknown
     * must depend on some free unknown; one of those is eliminated, so the dimension drops by one.
     * A unique solution must already agree with the value.
     */
    default Solution normalized(String unknown, Rational value, Span where) {
        int i = indexOf(unknowns(), unknown);
        if (this instanceof Inconsistent) {
            throw new ContourException("cannot normalise: the constraints are inconsistent", where);
        }
        if (this instanceof Unique u) {
            if (!u.values().get(i).equals(value)) {
                throw new ContourException("cannot normalise " + unknown + " = " + value
                        + ": the solution is unique with " + unknown + " = " + u.values().get(i), where);
            }
            return u;
        }
        Family fam = (Family) this;
        List<Rational> row = fam.affine().get(i);
        int pick = -1;
        for (int f = fam.free().size() - 1; f >= 0; f--) {
            if (!row.get(f + 1).isZero()) {
                pick = f;
                break;
            }
        }
        if (pick < 0) {
            if (!row.get(0).equals(value)) {
                throw new ContourException("cannot normalise " + unknown + " = " + value
                        + ": every solution has " + unknown + " = " + row.get(0), where);
            }
            return fam;
        }
        // free[pick] = (value - row_0 - sum_{f != pick} row_f free_f) / row_pick
        Rational inv = row.get(pick + 1).inverse();
        int k = fam.free().size();
        List<Rational> sub = new ArrayList<>();
        sub.add(value.subtract(row.get(0)).multiply(inv));
        for (int f = 0; f < k; f++) {
            if (f != pick) {
                sub.add(row.get(f + 1).negate().multiply(inv));
            }
        }
        List<List<Rational>> next = new ArrayList<>();
        for (List<Rational> r : fam.affine()) {
            Rational c = r.get(pick + 1);
            List<Rational> n = new ArrayList<>();
            n.add(r.get(0).add(c.multiply(sub.get(0))));
            int s = 1;
            for (int f = 0; f < k; f++) {
                if (f != pick) {
                    n.add(r.get(f + 1).add(c.multiply(sub.get(s++))));
                }
            }
            next.add(n);
        }
        List<String> free = new ArrayList<>(fam.free());
        free.remove(pick);
        if (free.isEmpty()) {
            return new Unique(fam.unknowns(), next.stream().map(r -> r.get(0)).toList());
        }
        return new Family(fam.unknowns(), free, next);
    }

    /** Each unknown as an Expression: a number, or an affine expression in the free unknowns. */
    default Map<String, Expression> assignments() {
        Map<String, Expression> out = new LinkedHashMap<>();
        if (this instanceof Unique u) {
            for (int i = 0; i < u.unknowns().size(); i++) {
                out.put(u.unknowns().get(i), Expression.constant(u.values().get(i)));
            }
        } else if (this instanceof Family f) {
            List<Expression> freeVars = f.free().stream().map(Expression::collectedVariable).toList();
            for (int i = 0; i < f.unknowns().size(); i++) {
                List<Rational> row = f.affine().get(i);
                Expression e = Expression.constant(row.get(0));
                for (int j = 0; j < freeVars.size(); j++) {
                    if (!row.get(j + 1).isZero()) {
                        e = e.add(freeVars.get(j).multiply(Expression.constant(row.get(j + 1))));
                    }
                }
                out.put(f.unknowns().get(i), e);
            }
        } else {
            throw new ContourException("the constraints are inconsistent: no values to substitute");
        }
        return out;
    }

    /** The expression with every solved unknown replaced by its value (free unknowns stay). */
    default Expression substituteInto(Expression e) {
        Map<String, Expression> all = assignments();
        Map<String, Expression> used = new HashMap<>();
        for (String v : e.collectedVariables()) {
            Expression val = all.get(v);
            if (val != null) {
                used.put(v, val);
            }
        }
        return used.isEmpty() ? e : e.substitute(used);
    }

    private static int indexOf(List<String> unknowns, String name) {
        int i = unknowns.indexOf(name);
        if (i < 0) {
            throw new ContourException("not an unknown of this solve: " + name);
        }
        return i;
    }
}
