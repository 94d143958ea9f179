package dev.contour.rewrite;

import dev.contour.print.JsonPrinter;
import dev.contour.print.PlainPrinter;
import dev.contour.term.Term;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;

/**
 * Lays out derivations and proofs: each step's term, the rule that fired (name and file:line:col)
 * and where; and for a check, the first place where two normal forms differ.
 */
public final class Proofs {
    private static final int LONGEST_REDEX = 60;

    private Proofs() { }

    /** Where two terms first differ: a position (1-based child indices) and the two subterms there. */
    public record Difference(List<Integer> position, Term left, Term right) {
        public Difference {
            position = List.copyOf(position);
        }
    }

    /** The first place, in reading order, where the terms differ; null when they are equal. */
    public static Difference firstDifference(Term a, Term b) {
        return firstDifference(a, b, new ArrayList<>());
    }

    private static Difference firstDifference(Term a, Term b, List<Integer> path) {
        if (a.equals(b)) {
            return null;
        }
        boolean sameShape = a.getClass() == b.getClass()
                && Rewriter.children(a).size() == Rewriter.children(b).size()
                && !(a instanceof Term.Leaf)
                && (!(a instanceof Term.Apply x) || x.function().equals(((Term.Apply) b).function()))
                && (!(a instanceof Term.Power p) || p.exponent() == ((Term.Power) b).exponent());
        if (sameShape) {
            List<Term> ca = Rewriter.children(a);
            List<Term> cb = Rewriter.children(b);
            for (int i = 0; i < ca.size(); i++) {
                path.add(i + 1);
                Difference d = firstDifference(ca.get(i), cb.get(i), path);
                path.remove(path.size() - 1);
                if (d != null) {
                    return d;
                }
            }
        }
        return new Difference(path, a, b);
    }

    /** {@code the top} or {@code 2.1}. */
    public static String position(List<Integer> position) {
        return position.isEmpty() ? "the top" : position.stream().map(String::valueOf).collect(Collectors.joining("."));
    }

    /** The derivation, one term per line with the rule that produced it underneath, indented by {@code indent}. */
    public static String steps(Rewriter.Result r, String indent) {
        StringBuilder out = new StringBuilder();
        Term first = r.trace().isEmpty() ? r.term() : r.trace().get(0).before();
        out.append(indent).append("    ").append(text(first)).append('\n');
        for (Rewriter.Step s : r.trace()) {
            out.append(indent).append("  = ").append(text(s.after())).append('\n');
            out.append(indent).append("        by ").append(s.rule().name()).append(" (").append(s.rule().shortLocation())
                    .append(") at ").append(position(s.position()));
            if (!s.position().isEmpty()) {
                String redex = text(s.redex());
                out.append(": ").append(redex.length() > LONGEST_REDEX ? redex.substring(0, LONGEST_REDEX - 3) + "..." : redex);
            }
            out.append('\n');
        }
        return out.toString();
    }

    /** The whole derivation of a {@code derive} statement. */
    public static String derivation(String label, Rewriter.Result r) {
        return "derive " + label + "\n" + steps(r, "") + "  normal form after " + count(r.steps()) + "\n";
    }

    /** The derivation as one JSON object. */
    public static String derivationJson(String label, Rewriter.Result r) {
        List<String> steps = new ArrayList<>();
        for (Rewriter.Step s : r.trace()) {
            steps.add("{\"rule\":" + JsonPrinter.string(s.rule().name()) + ",\"at\":" + JsonPrinter.string(s.rule().span().toString())
                    + ",\"position\":[" + s.position().stream().map(String::valueOf).collect(Collectors.joining(",")) + "]"
                    + ",\"term\":" + JsonPrinter.string(text(s.after())) + "}");
        }
        return "{\"derive\":" + JsonPrinter.string(label) + ",\"steps\":[" + String.join(",", steps) + "],\"normalForm\":"
                + JsonPrinter.string(text(r.term())) + "}\n";
    }

    static String count(int steps) {
        return steps + (steps == 1 ? " step" : " steps");
    }

    static String text(Term t) {
        return PlainPrinter.term(t, false);
    }
}
