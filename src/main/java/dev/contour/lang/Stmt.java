package dev.contour.lang;

import dev.contour.Span;
import java.util.List;

/** A statement of the language; spans do not take part in equality. */
public sealed interface Stmt {
    /** Where the statement was written. */
    Span span();

    /** {@code vars s, t} (inner) or {@code vars sigma, tau collected}. */
    record Vars(List<String> names, boolean collected, Span span) implements Stmt {
        public Vars { names = List.copyOf(names); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code let name = value}. */
    record Let(String name, Expr value, String source, Span span) implements Stmt {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code def name(params) = body}; {@code source} is the statement's text, re-emitted by session saves. */
    record Def(String name, List<String> parameters, Expr body, String source, Span span) implements Stmt {
        public Def { parameters = List.copyOf(parameters); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code unknown a[i, j, k] with i + j + k = n}: a family of collected unknowns. */
    record Unknown(String name, IndexSet indices, String source, Span span) implements Stmt {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code use "file.ctr"}. */
    record Use(String path, Span span) implements Stmt {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** How {@code show} lays out a value. */
    sealed interface ShowOption { }

    /** {@code collected sigma, tau}: one line per monomial in the chosen variables. */
    record CollectedBy(List<String> variables) implements ShowOption {
        public CollectedBy { variables = List.copyOf(variables); }
    }

    /** {@code factored}: numerators split into factors too. */
    record Factored() implements ShowOption { }

    /** {@code factored whole}: the factor common to all coefficients pulled out in front of a bracket. */
    record FactoredWhole() implements ShowOption { }

    /**
     * {@code in m}: linear factors written through the named forms of a measure m (s, t and its
     * eliminated variable), or of a list of pairs {@code {{u, -s - t}}}.
     */
    record InForms(Expr forms, Span span) implements ShowOption {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code as latex} / {@code as json} / {@code as plain}. */
    record As(String format) implements ShowOption { }

    /** {@code show value options}; {@code label} is the expression's source text. */
    record Show(Expr value, String label, List<ShowOption> options, Span span) implements Stmt {
        public Show { options = List.copyOf(options); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code check left == right}; {@code label} is the source text of the comparison. */
    record Check(Expr left, Expr right, String label, Span span) implements Stmt {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code for q in 2..8 { ... }}. */
    record For(String variable, Expr range, List<Stmt> body, Span span) implements Stmt {
        public For { body = List.copyOf(body); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /**
     * {@code rule name : lhs becomes rhs when guard, ...}: parsed here, interpreted by the rewriting
     * engine (the interpreter hands it to a registered rule sink).
     */
    record Rule(String name, Expr left, Expr right, List<Expr> guards, Span span) implements Stmt {
        public Rule { guards = List.copyOf(guards); }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** One limit of a rewriting run as written, {@code 500 steps}; the engine checks the unit. */
    record RewriteLimit(long amount, String unit, Span span) {
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /**
     * {@code derive value using "gamma.ctr" within 500 steps}: shows a rewriting derivation step by
     * step; no files means the rules the session has loaded.
     */
    record Derive(Expr value, String label, List<String> ruleFiles, List<RewriteLimit> limits, Span span) implements Stmt {
        public Derive {
            ruleFiles = List.copyOf(ruleFiles);
            limits = List.copyOf(limits);
        }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }

    /** {@code check left == right by rules using ...}: a check decided by rewriting both sides, printed as a proof. */
    record CheckByRules(Expr left, Expr right, String label, List<String> ruleFiles, List<RewriteLimit> limits, Span span)
            implements Stmt {
        public CheckByRules {
            ruleFiles = List.copyOf(ruleFiles);
            limits = List.copyOf(limits);
        }
        @Override public boolean equals(Object o) { return SpanlessEquality.equals(this, o); }
        @Override public int hashCode() { return SpanlessEquality.hash(this); }
    }
}
