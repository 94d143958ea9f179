package dev.contour.lang;

import dev.contour.Span;
import java.math.BigInteger;
import java.util.List;

/**
 * An expression of the language: an immutable tree whose nodes carry a source {@link Span} that
 * does not take part in equality.
 */
public sealed interface Expr {
    /** Where the expression was written. */
    Span span();

    /** An exact rational literal (decimals such as {@code 0.25} are read exactly as 1/4). */
    record Number(BigInteger numerator, BigInteger denominator, Span span) implements Expr {
        public Number {
            if (denominator.signum() <= 0) {
                throw new IllegalArgumentException("denominator must be positive");
            }
            BigInteger g = numerator.gcd(denominator);
            if (!g.equals(BigInteger.ONE) && g.signum() != 0) {
                numerator = numerator.divide(g);
                denominator = denominator.divide(g);
            }
            if (numerator.signum() == 0) {
                denominator = BigInteger.ONE;
            }
        }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** A reference to a name: variable, let binding, function, unknown family. */
    record Name(String name, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** A pattern variable of a rule, {@code @x} (the name is kept without the {@code @}). */
    record PatternVariable(String name, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** A string literal (file names, labels). */
    record Text(String value, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** Arithmetic operators. */
    enum Operator {
        ADD("+"), SUBTRACT("-"), MULTIPLY("*"), DIVIDE("/"), POWER("^");

        private final String symbol;

        Operator(String symbol) {
            this.symbol = symbol;
        }

        public String symbol() {
            return symbol;
        }
    }

    /** {@code left op right}. */
    record Binary(Operator operator, Expr left, Expr right, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** Unary minus. */
    record Negate(Expr operand, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code n!}. */
    record Factorial(Expr operand, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** How an argument was passed. */
    enum ArgumentKind { POSITIONAL, NAMED, DOMAIN }

    /**
     * One call argument: {@code value}, {@code name: value}, or {@code name in value} (a variable
     * with a domain, as in {@code s in 2..8 step 2}); {@code name} is null for positional ones.
     */
    record Argument(ArgumentKind kind, String name, Expr value, Span span) {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code callee(arguments)}: the callee is any expression whose value can be called. */
    record Call(Expr callee, List<Argument> arguments, Span span) implements Expr {
        public Call { arguments = List.copyOf(arguments); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code family[i, j, k]}: one member of an indexed unknown family. */
    record Index(Expr base, List<Expr> indices, Span span) implements Expr {
        public Index { indices = List.copyOf(indices); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code {a, b, c}}: a list; ranges inside it are spread into their members. */
    record ListOf(List<Expr> items, Span span) implements Expr {
        public ListOf { items = List.copyOf(items); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code from..to} or {@code from..to step k}: an integer range, both ends included; step may be null. */
    record Range(Expr from, Expr to, Expr step, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** A variable or unknown-family member on the left of {@code =} in a substitution. */
    record Target(String name, List<Expr> indices, Span span) {
        public Target { indices = List.copyOf(indices); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code target = value} inside {@code at (...)}. */
    record Assignment(Target target, Expr value, Span span) {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code expr at (s = t, t = s)}: simultaneous substitution. */
    record At(Expr target, List<Assignment> assignments, Span span) implements Expr {
        public At { assignments = List.copyOf(assignments); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /**
     * {@code expr with sol} or {@code expr with sol normalized a[0,0,1] = 1}: applies a solution;
     * {@code normalizedTarget} and {@code normalizedValue} are null without the clause.
     */
    record With(Expr target, Expr solution, Target normalizedTarget, Expr normalizedValue, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code sum i, j with i + j = n : body}. */
    record Sum(IndexSet indices, Expr body, Span span) implements Expr {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** One condition handed to the solver: {@code left == right}, or {@code left} alone (right null) meaning a condition value. */
    record Condition(Expr left, Expr right, Span span) {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code solve c1, c2 for a, b}: dispatched to the registered solver. */
    record Solve(List<Condition> conditions, List<String> unknowns, Span span) implements Expr {
        public Solve {
            conditions = List.copyOf(conditions);
            unknowns = List.copyOf(unknowns);
        }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }
}
