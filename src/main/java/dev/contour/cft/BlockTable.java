package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Exact data indexed by twist and spin (block coefficients, anomalous dimensions), with an optional
 * residual series (what a decomposition left over) and a row labelling: row n is twist
 * {@code lowestTwist + 2n} when {@code lowestTwist} is set, else rows are labelled by the twist.
 * An entry may be missing (a quotient by zero).
 */
public record BlockTable(String title, List<Integer> twists, List<Integer> spins, Map<List<Integer>, Rational> entries,
                         DoubleSeries residual, Integer lowestTwist) {
    public BlockTable {
        twists = List.copyOf(twists);
        spins = List.copyOf(spins);
        entries = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(entries));
    }

    public static BlockTable of(BlockDecomposition.Result r) {
        Map<List<Integer>, Rational> e = new LinkedHashMap<>();
        List<Integer> ts = new ArrayList<>();
        List<Integer> ls = new ArrayList<>();
        for (BlockDecomposition.Coefficient c : r.coefficients()) {
            e.put(List.of(c.twist(), c.spin()), c.value());
            if (!ts.contains(c.twist())) {
                ts.add(c.twist());
            }
            if (!ls.contains(c.spin())) {
                ls.add(c.spin());
            }
        }
        return new BlockTable("block coefficients (d = " + r.dimension() + ")", ts, ls, e, r.residual(), null);
    }

    /** The entry; null when missing. ContourException when the twist or spin is not in the table. */
    public Rational entry(int twist, int spin) {
        if (!twists.contains(twist) || !spins.contains(spin)) {
            throw new ContourException("the table has no entry for twist " + twist + " and spin " + spin
                    + " (twists " + twists + ", spins " + spins + ")");
        }
        return entries.get(List.of(twist, spin));
    }

    /** Row label of a twist. */
    public String rowLabel(int twist) {
        return lowestTwist == null ? String.valueOf(twist) : String.valueOf((twist - lowestTwist) / 2);
    }

    public String rowName() {
        return lowestTwist == null ? "twist" : "n";
    }

    /** Entry-wise combination with another table (on the twists and spins both have) or a number. */
    public BlockTable combine(BlockTable o, char op) {
        List<Integer> ts = twists.stream().filter(o.twists::contains).toList();
        List<Integer> ls = spins.stream().filter(o.spins::contains).toList();
        Map<List<Integer>, Rational> e = new LinkedHashMap<>();
        for (int t : ts) {
            for (int l : ls) {
                Rational x = entries.get(List.of(t, l));
                Rational y = o.entries.get(List.of(t, l));
                Rational v = apply(x, y, op);
                if (v != null) {
                    e.put(List.of(t, l), v);
                }
            }
        }
        return new BlockTable(title, ts, ls, e, null, lowestTwist != null ? lowestTwist : o.lowestTwist);
    }

    public BlockTable combine(Rational k, char op, boolean tableOnLeft) {
        Map<List<Integer>, Rational> e = new LinkedHashMap<>();
        entries.forEach((key, x) -> {
            Rational v = tableOnLeft ? apply(x, k, op) : apply(k, x, op);
            if (v != null) {
                e.put(key, v);
            }
        });
        return new BlockTable(title, twists, spins, e, null, lowestTwist);
    }

    private static Rational apply(Rational x, Rational y, char op) {
        if (x == null || y == null) {
            return null;
        }
        return switch (op) {
            case '+' -> x.add(y);
            case '-' -> x.subtract(y);
            case '*' -> x.multiply(y);
            case '/' -> y.isZero() ? null : x.divide(y);
            default -> throw new IllegalArgumentException("operator " + op);
        };
    }

    /** The same data with another title, rows n = (twist - lowest)/2 (lower twists left out) and a subset of the spins. */
    public BlockTable relabel(String newTitle, Integer lowest, List<Integer> keepSpins, List<Integer> keepRows) {
        List<Integer> ls = keepSpins == null ? spins : keepSpins;
        for (int l : ls) {
            if (!spins.contains(l)) {
                throw new ContourException("the table has no spin " + l + " (spins " + spins + ")");
            }
        }
        List<Integer> ts = twists;
        if (lowest != null) {
            // Rows below the lowest twist (protected sectors, for instance) are left out.
            ts = twists.stream().filter(t -> t >= lowest && (t - lowest) % 2 == 0).toList();
            if (ts.isEmpty()) {
                throw new ContourException("no twist of the table is lowest_twist + 2n with n >= 0 (lowest_twist " + lowest
                        + ", twists " + twists + ")");
            }
        }
        if (keepRows != null) {
            if (lowest == null) {
                throw new ContourException("rows: needs lowest_twist: (row n is twist lowest_twist + 2n)");
            }
            List<Integer> kept = new java.util.ArrayList<>();
            for (int n : keepRows) {
                int t = lowest + 2 * n;
                if (!ts.contains(t)) {
                    throw new ContourException("the table has no row n = " + n + " (twist " + t + "; twists " + twists + ")");
                }
                kept.add(t);
            }
            ts = kept;
        }
        return new BlockTable(newTitle == null ? title : newTitle, ts, ls, entries, residual, lowest);
    }
}
