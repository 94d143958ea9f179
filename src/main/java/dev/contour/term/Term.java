package dev.contour.term;

import dev.contour.algebra.Expression;
import java.util.List;

/**
 * An inert symbolic tree over exact {@link Expression} leaves: Gamma functions, Pochhammer
 * symbols, unevaluated calls, sums, products and integer powers.
 *
 * <p>Constructors never simplify (so rewrite rules see exactly what was written); all folding
 * happens in the explicit {@link Terms#normalize} step.
 */
public sealed interface Term {
    /** A rational value: a Laurent polynomial in collected variables with rational-function coefficients. */
    record Leaf(Expression value) implements Term { }

    /** A call of a named function (Gamma, poch, factorial, binom, or one the rule library knows). */
    record Apply(String function, List<Term> arguments) implements Term {
        public Apply { arguments = List.copyOf(arguments); }
    }

    /** A sum of terms. */
    record Sum(List<Term> terms) implements Term {
        public Sum { terms = List.copyOf(terms); }
    }

    /** A product of factors. */
    record Product(List<Term> factors) implements Term {
        public Product { factors = List.copyOf(factors); }
    }

    /** An integer power; negative exponents are quotients. */
    record Power(Term base, int exponent) implements Term { }
}
