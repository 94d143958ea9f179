package dev.contour.eval;

import dev.contour.lang.Stmt;

/** Receives {@code rule} statements; the rewriting engine registers one in the {@link BuiltinRegistry}. */
@FunctionalInterface
public interface RuleSink {
    void accept(Stmt.Rule rule);
}
