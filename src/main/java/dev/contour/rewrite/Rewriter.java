package dev.contour.rewrite;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.algebra.RationalFunction;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Rewrites a term to normal form with a rule set, one rule application at a time, within explicit
 * limits, recording a trace.
 *
 * <p>The term is kept in the canonical sum-of-monomials form of {@link Terms#expand} (calls are
 * never evaluated by it, so every change is a rule's). Each step takes the outermost, leftmost
 * position where some rule applies, trying the rules in their set's order, and re-canonicalises
 * the whole term. A match whose rewrite leaves the term unchanged does not count.
 */
public final class Rewriter {
    private Rewriter() { }

    /** One step of a run: which rule fired, where (1-based child indices from the root), and the whole term before and after. */
    public record Step(Rule rule, List<Integer> position, Term redex, Term before, Term after) {
        public Step {
            position = List.copyOf(position);
        }
    }

    /** The outcome of a run: the last term, why the run stopped, and every step taken. */
    public record Result(Term term, StopReason stopReason, List<Step> trace, Limits limits) {
        public Result {
            trace = List.copyOf(trace);
        }

        public int steps() {
            return trace.size();
        }

        public boolean saturated() {
            return stopReason == StopReason.SATURATED;
        }

        /**
         * Why the run did not finish, naming the limit and the rule that fired most (a runaway rule
         * is almost always that one); null when it saturated.
         */
        public String stopMessage() {
            if (saturated()) {
                return null;
            }
            String limit = switch (stopReason) {
                case STEP_LIMIT -> limits.maxSteps() + " steps";
                case SIZE_LIMIT -> "terms of " + limits.maxSize() + " nodes";
                default -> limits.timeLimit().toMillis() + " ms";
            };
            StringBuilder out = new StringBuilder("rewriting stopped at " + stopReason.description() + " (" + limit + ") after "
                    + steps() + (steps() == 1 ? " step" : " steps"));
            if (stopReason == StopReason.SIZE_LIMIT) {
                out.append(", with a term of ").append(size(term)).append(" nodes");
            }
            Map<Rule, Integer> counts = new HashMap<>();
            Rule most = null;
            for (Step s : trace) {
                int c = counts.merge(s.rule(), 1, Integer::sum);
                if (most == null || c > counts.get(most)) {
                    most = s.rule();
                }
            }
            if (most != null) {
                out.append("; rule '").append(most.name()).append("' (").append(most.span()).append(") fired ")
                        .append(counts.get(most)).append(counts.get(most) == 1 ? " time" : " times");
                Rule last = trace.get(trace.size() - 1).rule();
                if (last != most) {
                    out.append(", the last was '").append(last.name()).append("'");
                }
                out.append(stopReason == StopReason.TIME_LIMIT
                        ? ": the rules may not terminate, or the rewrite may simply be long; raise the limit with 'within N seconds'"
                        : ": the rules may not terminate");
            }
            return out.toString();
        }
    }

    /** Rewrites {@code t} with {@code rules} until no rule applies or a limit is reached. */
    public static Result normalize(Term t, RuleSet rules, Limits limits) {
        long deadline = limits.timeLimit().isZero() ? Long.MAX_VALUE : System.nanoTime() + limits.timeLimit().toNanos();
        Term current = Terms.expand(t);
        List<Step> trace = new ArrayList<>();
        if (size(current) > limits.maxSize()) {
            return new Result(current, StopReason.SIZE_LIMIT, trace, limits);
        }
        while (true) {
            Cancellation.check();
            if (System.nanoTime() > deadline) {
                return new Result(current, StopReason.TIME_LIMIT, trace, limits);
            }
            if (trace.size() >= limits.maxSteps()) {
                return new Result(current, StopReason.STEP_LIMIT, trace, limits);
            }
            Step step = firstStep(current, rules, deadline);
            if (step == null) {
                return new Result(current, System.nanoTime() > deadline ? StopReason.TIME_LIMIT : StopReason.SATURATED,
                        trace, limits);
            }
            trace.add(step);
            current = step.after();
            if (size(current) > limits.maxSize()) {
                return new Result(current, StopReason.SIZE_LIMIT, trace, limits);
            }
        }
    }

    /** A node of the term with its position. */
    private record Node(Term term, List<Integer> position) { }

    private static Step firstStep(Term current, RuleSet rules, long deadline) {
        List<Node> nodes = new ArrayList<>();
        outermostFirst(current, new ArrayList<>(), nodes);
        for (Node n : nodes) {
            Cancellation.check();
            if (System.nanoTime() > deadline) {
                return null;
            }
            List<Rule> candidates = n.term() instanceof Term.Apply a ? rules.forFunction(a.function())
                    : n.term() instanceof Term.Leaf ? List.of() : rules.structural();
            for (Rule r : candidates) {
                for (Matcher.Match m : Matcher.matches(r.left(), n.term())) {
                    Term after;
                    try {
                        if (!r.admits(m.bindings())) {
                            continue;
                        }
                        Term replacement = r.right().instantiate(m.bindings());
                        if (m.rest() != null) {
                            replacement = r.left() instanceof Pattern.Sum ? new Term.Sum(List.of(replacement, m.rest()))
                                    : new Term.Product(List.of(replacement, m.rest()));
                        }
                        after = Terms.expand(replaceAt(current, n.position(), 0, replacement));
                    } catch (ContourException | ArithmeticException e) {
                        throw failure(e, r);
                    }
                    if (!after.equals(current)) {
                        return new Step(r, n.position(), n.term(), current, after);
                    }
                }
            }
        }
        return null;
    }

    /** An error raised while applying {@code r}, naming the rule and where it is written. */
    private static ContourException failure(RuntimeException e, Rule r) {
        String what = e instanceof ArithmeticException ? "an exact integer overflowed (" + e.getMessage() + ")" : e.getMessage();
        return new ContourException(what + " while rewriting with rule '" + r.name() + "' (" + r.span() + ")", null, e);
    }

    /**
     * Parents before children, left to right (so a ratio rule sees the whole ratio before a rule
     * for one of its factors does); leaves are values, not places to rewrite.
     */
    private static void outermostFirst(Term t, List<Integer> path, List<Node> out) {
        if (t instanceof Term.Leaf) {
            return;
        }
        out.add(new Node(t, List.copyOf(path)));
        List<Term> children = children(t);
        for (int i = 0; i < children.size(); i++) {
            path.add(i + 1);
            outermostFirst(children.get(i), path, out);
            path.remove(path.size() - 1);
        }
    }

    /** The subterms of {@code t}, in order (a power's only child is its base). */
    static List<Term> children(Term t) {
        if (t instanceof Term.Apply a) {
            return a.arguments();
        }
        if (t instanceof Term.Sum s) {
            return s.terms();
        }
        if (t instanceof Term.Product p) {
            return p.factors();
        }
        if (t instanceof Term.Power w) {
            return List.of(w.base());
        }
        return List.of();
    }

    private static Term replaceAt(Term t, List<Integer> path, int depth, Term replacement) {
        if (depth == path.size()) {
            return replacement;
        }
        int i = path.get(depth) - 1;
        if (t instanceof Term.Power w) {
            return new Term.Power(replaceAt(w.base(), path, depth + 1, replacement), w.exponent());
        }
        List<Term> children = new ArrayList<>(children(t));
        children.set(i, replaceAt(children.get(i), path, depth + 1, replacement));
        if (t instanceof Term.Apply a) {
            return new Term.Apply(a.function(), children);
        }
        if (t instanceof Term.Sum) {
            return new Term.Sum(children);
        }
        return new Term.Product(children);
    }

    /** The subterm at a position. */
    static Term at(Term t, List<Integer> position) {
        Term x = t;
        for (int i : position) {
            x = children(x).get(i - 1);
        }
        return x;
    }

    /**
     * The size a limit measures: one per node, and for a leaf one per monomial of its numerators and
     * denominators (so that growing coefficients count too).
     */
    public static long size(Term t) {
        if (t instanceof Term.Leaf l) {
            long n = 1;
            for (RationalFunction f : l.value().terms().values()) {
                n += f.numerator().termCount() + f.denominator().termCount() - 1;
            }
            return n;
        }
        long n = 1;
        for (Term c : children(t)) {
            n += size(c);
        }
        return n;
    }
}
