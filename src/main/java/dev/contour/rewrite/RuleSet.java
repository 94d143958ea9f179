package dev.contour.rewrite;

import dev.contour.ContourException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** An ordered collection of rules with unique names; the order is the order rules are tried in. */
public final class RuleSet {
    /** No rules. */
    public static final RuleSet EMPTY = new RuleSet(List.of());

    private final List<Rule> rules;
    private final Map<String, List<Rule>> byFunction = new HashMap<>();
    private final List<Rule> others = new ArrayList<>();
    private final Set<String> functions = new java.util.TreeSet<>();

    private RuleSet(List<Rule> rules) {
        this.rules = List.copyOf(rules);
        for (Rule r : this.rules) {
            if (r.left() instanceof Pattern.Call c) {
                byFunction.computeIfAbsent(c.function(), k -> new ArrayList<>()).add(r);
            } else {
                others.add(r);
            }
            callNames(r.left(), functions);
            callNames(r.right(), functions);
        }
    }

    private static void callNames(Pattern p, Set<String> out) {
        if (p instanceof Pattern.Call c) {
            out.add(c.function());
            c.arguments().forEach(a -> callNames(a, out));
        } else if (p instanceof Pattern.Sum s) {
            s.parts().forEach(a -> callNames(a, out));
        } else if (p instanceof Pattern.Product q) {
            q.factors().forEach(a -> callNames(a, out));
        } else if (p instanceof Pattern.Power w) {
            callNames(w.base(), out);
        }
    }

    /** The rules in this order; a name used twice is an error at the second rule's span. */
    public static RuleSet of(List<Rule> rules) {
        Map<String, Rule> seen = new LinkedHashMap<>();
        for (Rule r : rules) {
            Rule earlier = seen.putIfAbsent(r.name(), r);
            if (earlier != null) {
                throw new ContourException("rule name '" + r.name() + "' is already used by the rule at " + earlier.span(), r.span());
            }
        }
        return new RuleSet(rules);
    }

    /** These rules followed by {@code more}. */
    public RuleSet plus(RuleSet more) {
        List<Rule> all = new ArrayList<>(rules);
        all.addAll(more.rules);
        return of(all);
    }

    public List<Rule> rules() {
        return rules;
    }

    public boolean isEmpty() {
        return rules.isEmpty();
    }

    /** The names of the functions the rules mention. */
    public Set<String> functions() {
        return java.util.Collections.unmodifiableSet(functions);
    }

    /** The rule with this name, or null. */
    public Rule rule(String name) {
        return rules.stream().filter(r -> r.name().equals(name)).findFirst().orElse(null);
    }

    /** The rules that could match at a call of {@code function}, in order. */
    List<Rule> forFunction(String function) {
        return byFunction.getOrDefault(function, List.of());
    }

    /** The rules whose left side is a sum, product or power, in order. */
    List<Rule> structural() {
        return others;
    }
}
