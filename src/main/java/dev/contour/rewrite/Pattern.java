package dev.contour.rewrite;

import dev.contour.algebra.Expression;
import dev.contour.term.Term;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * One side of a rule: the shape of a {@link Term} with pattern variables in it. Sums and products
 * match modulo commutativity and associativity (see {@link Matcher}).
 */
public sealed interface Pattern {
    /** {@code @name}: matches any subterm; a second occurrence must match an equal subterm. */
    record Variable(String name) implements Pattern { }

    /** A rational number written in the rule. */
    record Literal(Expression value) implements Pattern { }

    /** A call of a named function. */
    record Call(String function, List<Pattern> arguments) implements Pattern {
        public Call { arguments = List.copyOf(arguments); }
    }

    /** A sum of at least two parts. */
    record Sum(List<Pattern> parts) implements Pattern {
        public Sum { parts = List.copyOf(parts); }
    }

    /** A product of at least two factors. */
    record Product(List<Pattern> factors) implements Pattern {
        public Product { factors = List.copyOf(factors); }
    }

    /** An integer power (never 0 or 1). */
    record Power(Pattern base, int exponent) implements Pattern { }

    /** The pattern variables, in order of first appearance. */
    default Set<String> variables() {
        Set<String> out = new LinkedHashSet<>();
        collect(this, out);
        return out;
    }

    private static void collect(Pattern p, Set<String> out) {
        if (p instanceof Variable v) {
            out.add(v.name());
        } else if (p instanceof Call c) {
            c.arguments().forEach(a -> collect(a, out));
        } else if (p instanceof Sum s) {
            s.parts().forEach(a -> collect(a, out));
        } else if (p instanceof Product q) {
            q.factors().forEach(a -> collect(a, out));
        } else if (p instanceof Power w) {
            collect(w.base(), out);
        }
    }

    /** The term this pattern stands for under {@code bindings} (not yet in canonical form). */
    default Term instantiate(Map<String, Term> bindings) {
        if (this instanceof Variable v) {
            Term t = bindings.get(v.name());
            if (t == null) {
                throw new IllegalStateException("unbound pattern variable @" + v.name());
            }
            return t;
        }
        if (this instanceof Literal l) {
            return new Term.Leaf(l.value());
        }
        if (this instanceof Call c) {
            return new Term.Apply(c.function(), all(c.arguments(), bindings));
        }
        if (this instanceof Sum s) {
            return new Term.Sum(all(s.parts(), bindings));
        }
        if (this instanceof Product q) {
            return new Term.Product(all(q.factors(), bindings));
        }
        Power w = (Power) this;
        return new Term.Power(w.base().instantiate(bindings), w.exponent());
    }

    private static List<Term> all(List<Pattern> ps, Map<String, Term> bindings) {
        List<Term> out = new ArrayList<>(ps.size());
        for (Pattern p : ps) {
            out.add(p.instantiate(bindings));
        }
        return out;
    }

    /** True when some call occurs in the pattern. */
    default boolean hasCall() {
        if (this instanceof Call) {
            return true;
        }
        if (this instanceof Sum s) {
            return s.parts().stream().anyMatch(Pattern::hasCall);
        }
        if (this instanceof Product q) {
            return q.factors().stream().anyMatch(Pattern::hasCall);
        }
        return this instanceof Power w && w.base().hasCall();
    }
}
