package dev.contour.rewrite;

import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.function.BiPredicate;

/**
 * A condition after {@code when}: one of a small fixed registry of named tests applied to pattern
 * expressions, so that rule files stay data and hold no code.
 *
 * @param variable the variable name of {@code without_variable(@x, s)}; null for the other tests
 */
public record Guard(Test test, Pattern argument, String variable, Span span) {

    /** A named test on the canonical term an argument instantiates to. */
    public record Test(String name, boolean takesVariable, String summary, BiPredicate<Term, String> predicate) { }

    private static final Map<String, Test> REGISTRY = new TreeMap<>();

    static {
        add("integer", false, "an integer", (t, v) -> integer(t).isPresent());
        add("positive_integer", false, "an integer >= 1", (t, v) -> integer(t).filter(r -> r.signum() > 0).isPresent());
        add("negative_integer", false, "an integer <= -1", (t, v) -> integer(t).filter(r -> r.signum() < 0).isPresent());
        add("not_integer", false, "anything but an integer (a symbol or a fraction)", (t, v) -> integer(t).isEmpty());
        add("rational_number", false, "a rational number", (t, v) -> t instanceof Term.Leaf l && l.value().isConstant());
        add("nonzero", false, "not zero", (t, v) -> !(t instanceof Term.Leaf l && l.value().isZero()));
        add("without_variable", true, "free of the named variable, as in without_variable(@x, s)", (t, v) -> freeOf(t, v));
    }

    /** Guard names given up for names of our own that say what they test: old name to new name. */
    private static final Map<String, String> RETIRED = Map.of("numeric", "rational_number", "free_of", "without_variable");

    /** The name that replaced a retired guard name, if {@code name} is one. */
    public static Optional<String> replacementOf(String name) {
        return Optional.ofNullable(RETIRED.get(name));
    }

    private static void add(String name, boolean takesVariable, String summary, BiPredicate<Term, String> p) {
        REGISTRY.put(name, new Test(name, takesVariable, summary, p));
    }

    /** The test called {@code name}, if there is one. */
    public static Optional<Test> lookup(String name) {
        return Optional.ofNullable(REGISTRY.get(name));
    }

    /** Every guard name, sorted. */
    public static List<String> names() {
        return List.copyOf(REGISTRY.keySet());
    }

    /** Whether the guard holds for these bindings. */
    public boolean holds(Map<String, Term> bindings) {
        return test.predicate().test(Terms.expand(argument.instantiate(bindings)), variable);
    }

    private static Optional<Rational> integer(Term t) {
        if (t instanceof Term.Leaf l && l.value().isConstant() && l.value().constantValue().isInteger()) {
            return Optional.of(l.value().constantValue());
        }
        return Optional.empty();
    }

    private static boolean freeOf(Term t, String variable) {
        if (t instanceof Term.Leaf l) {
            Expression e = l.value();
            return !e.innerVariables().contains(variable) && !e.collectedVariables().contains(variable);
        }
        if (t instanceof Term.Apply a) {
            return a.arguments().stream().allMatch(x -> freeOf(x, variable));
        }
        if (t instanceof Term.Sum s) {
            return s.terms().stream().allMatch(x -> freeOf(x, variable));
        }
        if (t instanceof Term.Product p) {
            return p.factors().stream().allMatch(x -> freeOf(x, variable));
        }
        return freeOf(((Term.Power) t).base(), variable);
    }
}
