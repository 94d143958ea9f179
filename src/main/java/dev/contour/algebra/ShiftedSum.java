package dev.contour.algebra;

import dev.contour.Cancellation;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * {@code sum_k c_k * f(v + a_k)}: a shift operator applied to an expression, held unexpanded until
 * its value is asked for.
 *
 * <p>Why: applying a difference operator to an ansatz linear in thousands of unknowns and then
 * collecting the result builds, for every unknown and every monomial, one common denominator of
 * several shifted copies; the solver then has to split those numerators into linear factors again.
 * The solver wants the opposite: each unknown times a few factored pieces (a coefficient c_k and a
 * shifted term of f, each a product of linear forms). This class keeps exactly that structure and
 * computes the collected {@link Expression} only when something else needs it, once.
 *
 * <p>The shifts move inner variables only, so no term of f can meet a division by zero under them
 * (a translated linear form is never constant); the value is therefore defined, and computing it
 * later cannot fail where computing it at once would have succeeded.
 */
public final class ShiftedSum {
    /** One term of the operator: the coefficient c and the shift amounts (inner variable to amount). */
    public record Block(SortedMap<String, Rational> shift, Expression coefficient) {
        public Block {
            shift = Collections.unmodifiableSortedMap(new TreeMap<>(shift));
        }

        /** The shift as the linear substitution v -> v + amount. */
        public Map<String, Polynomial> substitution() {
            return translation(shift);
        }
    }

    /** The linear substitution v -> v + amount for each entry, for {@code substituteLinear}. */
    public static Map<String, Polynomial> translation(Map<String, Rational> amounts) {
        Map<String, Polynomial> m = new HashMap<>();
        amounts.forEach((v, a) -> m.put(v, Polynomial.variable(v).add(Polynomial.constant(a))));
        return m;
    }

    private final List<Block> blocks;
    private final Expression argument;
    private Expression value;

    private ShiftedSum(List<Block> blocks, Expression argument) {
        this.blocks = List.copyOf(blocks);
        this.argument = argument;
    }

    /**
     * The sum of c * f(shifted) over the blocks. Null when a shift moves a collected variable of f
     * (then the general substitution rules apply and the caller should expand at once).
     */
    public static ShiftedSum of(List<Block> blocks, Expression argument) {
        SortedSet<String> collected = argument.collectedVariables();
        for (Block b : blocks) {
            for (String v : b.shift().keySet()) {
                if (collected.contains(v)) {
                    return null;
                }
            }
        }
        return new ShiftedSum(blocks, argument);
    }

    public List<Block> blocks() {
        return blocks;
    }

    /** f, the expression the operator acts on. */
    public Expression argument() {
        return argument;
    }

    /** Whether no operator coefficient mentions any of these collected names (unknowns, say). */
    public boolean coefficientsFreeOf(java.util.Collection<String> names) {
        for (Block b : blocks) {
            for (String v : b.coefficient().collectedVariables()) {
                if (names.contains(v)) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Inner variables of the value (a superset when terms cancel), without expanding it. */
    public SortedSet<String> innerVariables() {
        SortedSet<String> out = new TreeSet<>(argument.innerVariables());
        blocks.forEach(b -> out.addAll(b.coefficient().innerVariables()));
        return out;
    }

    /**
     * The collected value, computed on first use. All contributions to one collected monomial are
     * gathered first and added with {@link RationalFunction#sum}, so each common denominator is
     * built once, not once per term.
     */
    public synchronized Expression value() {
        if (value == null) {
            value = expandAt(blocks, argument);
        }
        return value;
    }

    /** The collected sum of c * f(shifted) over the blocks (any shifts, collected variables included). */
    public static Expression expandAt(List<Block> blocks, Expression argument) {
        Map<Monomial, List<RationalFunction>> parts = new HashMap<>();
        for (Block b : blocks) {
            Cancellation.check();
            Expression moved = b.shift().isEmpty() ? argument : argument.substituteLinear(b.substitution());
            for (Map.Entry<Monomial, RationalFunction> x : b.coefficient().terms().entrySet()) {
                Cancellation.check();
                for (Map.Entry<Monomial, RationalFunction> y : moved.terms().entrySet()) {
                    parts.computeIfAbsent(x.getKey().multiply(y.getKey()), k -> new ArrayList<>())
                            .add(x.getValue().multiply(y.getValue()));
                }
            }
        }
        // The monomials' sums are independent: on the common pool, each worker checking the caller's token
        Cancellation.Token stop = Cancellation.current();
        Map<Monomial, RationalFunction> out = new java.util.concurrent.ConcurrentHashMap<>();
        parts.entrySet().parallelStream().forEach(e -> {
            stop.check();
            List<RationalFunction> list = e.getValue();
            out.put(e.getKey(), list.size() == 1 ? list.get(0) : Cancellation.under(stop, () -> RationalFunction.sum(list)));
        });
        return Expression.of(out);
    }
}
