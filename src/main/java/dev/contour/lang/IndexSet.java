package dev.contour.lang;

import dev.contour.Span;
import java.util.List;

/**
 * A finite set of integer index tuples: named indices (non-negative unless given a range) and
 * linear constraints among them, as in {@code i, j, k with i + j + k = p - 2, i >= 1}.
 */
public record IndexSet(List<Binder> binders, List<Constraint> constraints, Span span) {
    public IndexSet {
        binders = List.copyOf(binders);
        constraints = List.copyOf(constraints);
    }

    /** One index, with an optional range ({@code i in 0..4}); {@code range} is null without one. */
    public record Binder(String name, Expr range, Span span) {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** A comparison between linear integer expressions. */
    public enum Relation {
        EQUAL("="), AT_LEAST(">="), AT_MOST("<="), GREATER(">"), LESS("<");

        private final String symbol;

        Relation(String symbol) {
            this.symbol = symbol;
        }

        public String symbol() {
            return symbol;
        }
    }

    /** {@code left relation right}. */
    public record Constraint(Expr left, Relation relation, Expr right, Span span) {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    public List<String> names() {
        return binders.stream().map(Binder::name).toList();
    }

    @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
    @Override public int hashCode() { return SpanlessEquality.hash(this); }
}
