package dev.contour.algebra;

import java.util.List;
import java.util.Map;

/**
 * A sparse linear system over Q, built row by row, solved exactly (API CONTRACT skeleton).
 *
 * <p>Columns are unknown indices 0..columns-1. Each row carries a caller-chosen tag (for example
 * the source line of the constraint that produced it) so that an inconsistency can be reported as
 * a small set of conflicting tags.
 */
public final class LinearSystem {
    public LinearSystem(int columns) { throw Rational.todo(); }

    /** Adds the equation sum coefficients[col] * x_col = rhs. */
    public void addRow(Map<Integer, Rational> coefficients, Rational rhs, Object tag) { throw Rational.todo(); }
    public int rows() { throw Rational.todo(); }
    public int columns() { throw Rational.todo(); }

    /** Solves exactly (fraction-free or modular elimination). */
    public Solution solve() { throw Rational.todo(); }

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
