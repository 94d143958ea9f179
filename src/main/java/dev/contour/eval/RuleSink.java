package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.lang.Stmt;

/**
 * Receives {@code rule} statements and runs the statements that rewrite with them ({@code derive},
 * {@code check ... by rules}); the rewriting engine registers one in the {@link BuiltinRegistry}.
 */
@FunctionalInterface
public interface RuleSink {
    void accept(Stmt.Rule rule);

    /** The rules stated so far, as an immutable value {@link #restore} takes back (a session snapshot). */
    default Object state() {
        return null;
    }

    /** Puts back what {@link #state} returned, forgetting the rules stated since. */
    default void restore(Object state) {
        // a sink without state has nothing to put back
    }

    /** Runs {@code derive}: the text shows each step. */
    default RuleReport derive(Stmt.Derive statement, RuleContext context) {
        throw new ContourException("'derive' needs the rewriting engine, which is not in this build", statement.span());
    }

    /** Runs {@code check ... by rules}. */
    default RuleReport prove(Stmt.CheckByRules statement, RuleContext context) {
        throw new ContourException("'check ... by rules' needs the rewriting engine, which is not in this build", statement.span());
    }
}
