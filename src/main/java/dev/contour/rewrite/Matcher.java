package dev.contour.rewrite;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Matches patterns against canonical terms, modulo commutativity and associativity of + and *.
 *
 * <p>A sum (product) pattern distributes the summands (factors) of the term over its parts. A
 * rational {@link Term.Leaf} is not split into all its monomials but into a few pieces, which keeps
 * matching cheap and its results predictable:
 * <ul>
 *   <li>for +: the non-constant part, and the constant c — split further into its integer part
 *       floor(c) and the fraction c - floor(c) when c is not an integer and floor(c) is not 0. So
 *       {@code @x + @n} with {@code integer(@n)} takes {@code s/2 + 3 - p} as @x = s/2 - p, @n = 3, and
 *       {@code s + 5/2} as @x = s + 1/2, @n = 2. When the free variables of the sum outnumber these
 *       pieces, the non-constant part is split further into its terms, in the canonical order of
 *       the leaf, and every way of sharing them out (each variable taking at least one) is tried in
 *       a fixed order, earlier variables keeping earlier terms longest: {@code g(@x + @y)} matches
 *       {@code g(s + t)} first as @x = s, @y = t, then as @x = t, @y = s, and the first match the
 *       guards admit is the one used. The finer split is only a fallback, so a pattern
 *       matches every term it matched without it, with the same bindings;</li>
 *   <li>for *: the numeric coefficient of a single-term leaf and the rest.</li>
 * </ul>
 * A number written in a sum pattern takes part of the leaf's constant, of the same sign and no
 * larger (so {@code Gamma(@x + 1)} matches {@code Gamma(s + 3)} with @x = s + 2, but not
 * {@code Gamma(s)} or {@code Gamma(s - 1)}: shifting rules move constants towards 0 and stop);
 * in a product it divides the coefficient. A variable that is already bound is taken out arithmetically, which
 * is what lets {@code Gamma(@x + @n)/Gamma(@x)} match {@code Gamma(s + 3)/Gamma(s + 1)} with @n = 2.
 *
 * <p>A sum pattern that is affine in one pattern variable, c + k*@x with numbers c and k != 0 (such
 * as {@code 1 - @x}, {@code 2*@x + 1} or {@code (@x + 3)/2}), is solved against a rational leaf L
 * exactly: when @x is bound, the match holds exactly when c + k*@x equals L; when it is free and
 * k != 1, it binds @x = (L - c)/k (so {@code k(@x, 1 - @x)} matches {@code k(s + 1/2, 1/2 - s)} and
 * {@code Gamma(@x)*Gamma(1 - @x)} matches {@code Gamma(1/2 - s)*Gamma(s + 1/2)}). A free @x with
 * k = 1 ({@code @x + c}) keeps the constant convention above, so shifting rules still terminate.
 *
 * <p>No part ever matches the empty sum or product (an affine solution may be 0). At the root of a rule, the pattern may match part
 * of a sum or product, and the rest is kept beside the replacement.
 */
final class Matcher {
    /** One way the left side matches: the bindings, and what is left of the sum or product (null: nothing). */
    record Match(Map<String, Term> bindings, Term rest) { }

    /** Most partial matches explored for one node, so that a badly written pattern cannot hang the runner. */
    static final int BUDGET = 20_000;

    private int budget = BUDGET;

    private Matcher() { }

    /** Every match of a rule's left side at {@code t} (the root may leave a rest). */
    static List<Match> matches(Pattern left, Term t) {
        Matcher m = new Matcher();
        List<Match> out = new ArrayList<>();
        if (left instanceof Pattern.Sum s) {
            if (t instanceof Term.Sum) {
                m.ac(ADDITIVE, s.parts(), ADDITIVE.split(t), Map.of(), true, false, out);
            }
        } else if (left instanceof Pattern.Product q) {
            if (t instanceof Term.Product) {
                m.ac(MULTIPLICATIVE, q.factors(), MULTIPLICATIVE.split(t), Map.of(), true, false, out);
            }
        } else {
            for (Map<String, Term> b : m.match(left, t, Map.of())) {
                out.add(new Match(b, null));
            }
        }
        return out;
    }

    private List<Map<String, Term>> match(Pattern p, Term t, Map<String, Term> b) {
        if (--budget < 0) {
            return List.of();
        }
        if (p instanceof Pattern.Variable v) {
            Term bound = b.get(v.name());
            if (bound != null) {
                return bound.equals(t) ? List.of(b) : List.of();
            }
            return List.of(bind(b, v.name(), t));
        }
        if (p instanceof Pattern.Literal l) {
            return t instanceof Term.Leaf leaf && leaf.value().equals(l.value()) ? List.of(b) : List.of();
        }
        if (p instanceof Pattern.Call c) {
            if (!(t instanceof Term.Apply a) || !a.function().equals(c.function()) || a.arguments().size() != c.arguments().size()) {
                return List.of();
            }
            List<Map<String, Term>> current = List.of(b);
            for (int i : order(c.arguments())) {
                List<Map<String, Term>> next = new ArrayList<>();
                for (Map<String, Term> x : current) {
                    next.addAll(match(c.arguments().get(i), a.arguments().get(i), x));
                }
                current = next;
                if (current.isEmpty()) {
                    break;
                }
            }
            return current;
        }
        if (p instanceof Pattern.Power w) {
            if (t instanceof Term.Power tw && tw.exponent() == w.exponent()) {
                return match(w.base(), tw.base(), b);
            }
            if (w.exponent() == -1 && t instanceof Term.Leaf leaf && !leaf.value().isZero()) {
                return match(w.base(), Terms.of(Expression.ONE.divide(leaf.value())), b);
            }
            return List.of();
        }
        if (p instanceof Pattern.Sum && t instanceof Term.Leaf leaf) {
            List<Map<String, Term>> solved = solveAffine(p, leaf.value(), b);
            if (solved != null) {
                return solved;
            }
        }
        List<Match> out = new ArrayList<>();
        if (p instanceof Pattern.Sum s) {
            ac(ADDITIVE, s.parts(), ADDITIVE.split(t), b, false, false, out);
        } else {
            ac(MULTIPLICATIVE, ((Pattern.Product) p).factors(), MULTIPLICATIVE.split(t), b, false, false, out);
        }
        return out.stream().map(Match::bindings).toList();
    }

    /** Argument order for matching: the simplest (most binding, least splitting) patterns first. */
    private static List<Integer> order(List<Pattern> ps) {
        List<Integer> idx = new ArrayList<>();
        for (int i = 0; i < ps.size(); i++) {
            idx.add(i);
        }
        idx.sort((x, y) -> Integer.compare(splits(ps.get(x)), splits(ps.get(y))));
        return idx;
    }

    /** How many sums and products (the patterns that split terms) there are in {@code p}. */
    private static int splits(Pattern p) {
        if (p instanceof Pattern.Call c) {
            return c.arguments().stream().mapToInt(Matcher::splits).sum();
        }
        if (p instanceof Pattern.Sum s) {
            return 1 + s.parts().stream().mapToInt(Matcher::splits).sum();
        }
        if (p instanceof Pattern.Product q) {
            return 1 + q.factors().stream().mapToInt(Matcher::splits).sum();
        }
        if (p instanceof Pattern.Power w) {
            return splits(w.base());
        }
        return 0;
    }

    private static Map<String, Term> bind(Map<String, Term> b, String name, Term t) {
        Map<String, Term> out = new HashMap<>(b);
        out.put(name, t);
        return out;
    }

    // ------------------------------------------------------------------ affine patterns

    /** c + k*@x: the constant, the coefficient and the one variable (null when the pattern has none). */
    private record Affine(Expression constant, Expression coefficient, String variable) { }

    /**
     * The matches of a sum pattern affine in one variable against a leaf (see the class comment),
     * or null when the pattern is not of that kind or the constant convention decides.
     */
    private static List<Map<String, Term>> solveAffine(Pattern p, Expression leaf, Map<String, Term> b) {
        Affine a = affine(p);
        if (a == null || a.variable() == null || a.coefficient().isZero()) {
            return null;
        }
        Term bound = b.get(a.variable());
        if (bound != null) {
            if (!(bound instanceof Term.Leaf value)) {
                return List.of();
            }
            Expression image = a.constant().add(a.coefficient().multiply(value.value()));
            return image.equals(leaf) ? List.of(b) : List.of();
        }
        if (a.coefficient().equals(Expression.ONE)) {
            return null;
        }
        Expression x = leaf.subtract(a.constant()).divide(a.coefficient());
        return List.of(bind(b, a.variable(), Terms.of(x)));
    }

    /** The affine form of a pattern built from numbers and one variable by +, * and 1/, or null. */
    private static Affine affine(Pattern p) {
        if (p instanceof Pattern.Literal l) {
            return new Affine(l.value(), Expression.ZERO, null);
        }
        if (p instanceof Pattern.Variable v) {
            return new Affine(Expression.ZERO, Expression.ONE, v.name());
        }
        if (p instanceof Pattern.Sum s) {
            Affine acc = new Affine(Expression.ZERO, Expression.ZERO, null);
            for (Pattern part : s.parts()) {
                Affine x = affine(part);
                if (x == null || acc.variable() != null && x.variable() != null && !acc.variable().equals(x.variable())) {
                    return null;
                }
                acc = new Affine(acc.constant().add(x.constant()), acc.coefficient().add(x.coefficient()),
                        acc.variable() != null ? acc.variable() : x.variable());
            }
            return acc;
        }
        if (p instanceof Pattern.Product q) {
            Affine acc = new Affine(Expression.ONE, Expression.ZERO, null);
            for (Pattern f : q.factors()) {
                Affine x = affine(f);
                if (x == null) {
                    return null;
                }
                if (x.variable() == null) {
                    acc = new Affine(acc.constant().multiply(x.constant()), acc.coefficient().multiply(x.constant()), acc.variable());
                } else if (acc.variable() == null) {
                    acc = new Affine(acc.constant().multiply(x.constant()), acc.constant().multiply(x.coefficient()), x.variable());
                } else {
                    return null;
                }
            }
            return acc;
        }
        if (p instanceof Pattern.Power w && w.exponent() == -1) {
            Affine x = affine(w.base());
            return x == null || x.variable() != null || x.constant().isZero() ? null
                    : new Affine(Expression.ONE.divide(x.constant()), Expression.ZERO, null);
        }
        return null;
    }

    // ------------------------------------------------------------------ AC matching

    /** A term seen as an operation's operands: the non-rational ones and the one rational leaf. */
    record Operands(List<Term> items, Expression leaf) { }

    /** + or *, seen the same way by the matcher. */
    private interface Operation {
        Expression identity();

        Operands split(Term t);

        Expression combine(Expression a, Expression b);

        Expression remove(Expression from, Expression what);

        /** The leaf without a literal written in the pattern, or null when the literal is not there. */
        Expression removeLiteral(Expression leaf, Expression literal);

        /** The pieces a leaf is split into when it is shared out among variables. */
        List<Expression> pieces(Expression leaf);

        Term build(List<Term> items, Expression leaf);
    }

    private static final Operation ADDITIVE = new Operation() {
        public Expression identity() {
            return Expression.ZERO;
        }

        public Operands split(Term t) {
            List<Term> items = new ArrayList<>();
            Expression leaf = Expression.ZERO;
            for (Term x : t instanceof Term.Sum s ? s.terms() : List.of(t)) {
                if (x instanceof Term.Leaf l) {
                    leaf = leaf.add(l.value());
                } else {
                    items.add(x);
                }
            }
            return new Operands(items, leaf);
        }

        public Expression combine(Expression a, Expression b) {
            return a.add(b);
        }

        public Expression remove(Expression from, Expression what) {
            return from.subtract(what);
        }

        public Expression removeLiteral(Expression leaf, Expression literal) {
            Expression c = constantPart(leaf);
            if (c.equals(literal)) {
                return leaf.subtract(literal);
            }
            boolean part = !c.isZero() && c.constantValue().signum() == literal.constantValue().signum()
                    && literal.constantValue().abs().compareTo(c.constantValue().abs()) < 0;
            return part ? leaf.subtract(literal) : null;
        }

        public List<Expression> pieces(Expression leaf) {
            List<Expression> out = new ArrayList<>();
            if (leaf.isZero()) {
                return out;
            }
            Expression c = constantPart(leaf);
            Expression rest = leaf.subtract(c);
            if (!rest.isZero()) {
                out.add(rest);
            }
            if (c.isZero()) {
                return out;
            }
            Rational r = c.constantValue();
            BigInteger floor = floor(r);
            if (r.isInteger() || floor.signum() == 0) {
                out.add(c);
            } else {
                Rational whole = Rational.of(floor);
                out.add(Expression.constant(whole));
                out.add(Expression.constant(r.subtract(whole)));
            }
            return out;
        }

        public Term build(List<Term> items, Expression leaf) {
            List<Term> all = new ArrayList<>(items);
            all.add(Terms.of(leaf));
            return Terms.expand(new Term.Sum(all));
        }
    };

    private static final Operation MULTIPLICATIVE = new Operation() {
        public Expression identity() {
            return Expression.ONE;
        }

        public Operands split(Term t) {
            List<Term> items = new ArrayList<>();
            Expression leaf = Expression.ONE;
            for (Term x : t instanceof Term.Product p ? p.factors() : List.of(t)) {
                if (x instanceof Term.Leaf l) {
                    leaf = leaf.multiply(l.value());
                } else {
                    items.add(x);
                }
            }
            return new Operands(items, leaf);
        }

        public Expression combine(Expression a, Expression b) {
            return a.multiply(b);
        }

        public Expression remove(Expression from, Expression what) {
            return what.isZero() ? null : from.divide(what);
        }

        public Expression removeLiteral(Expression leaf, Expression literal) {
            return leaf.equals(Expression.ONE) || literal.isZero() ? null : leaf.divide(literal);
        }

        public List<Expression> pieces(Expression leaf) {
            List<Expression> out = new ArrayList<>();
            if (leaf.equals(Expression.ONE)) {
                return out;
            }
            Expression k = numericCoefficient(leaf);
            if (k.equals(Expression.ONE) || k.equals(leaf)) {
                out.add(leaf);
            } else {
                out.add(k);
                out.add(leaf.divide(k));
            }
            return out;
        }

        public Term build(List<Term> items, Expression leaf) {
            List<Term> all = new ArrayList<>(items);
            all.add(Terms.of(leaf));
            return Terms.expand(new Term.Product(all));
        }
    };

    /**
     * Shares the operands out among the parts: numbers and bound variables are taken out first,
     * then each remaining non-variable part takes one operand (or one piece of the leaf), and the
     * free variables share what is left, each taking at least one piece. The one exception: when a
     * number written in a product took the whole leaf, a lone variable is 1 ({@code -@n} matches -1).
     */
    private void ac(Operation op, List<Pattern> parts, Operands operands, Map<String, Term> b, boolean allowRest,
                    boolean literalTaken, List<Match> out) {
        if (--budget < 0) {
            return;
        }
        if (parts.isEmpty()) {
            boolean empty = operands.items().isEmpty() && operands.leaf().equals(op.identity());
            if (empty) {
                out.add(new Match(b, null));
            } else if (allowRest) {
                out.add(new Match(b, op.build(operands.items(), operands.leaf())));
            }
            return;
        }
        int fixed = -1;
        int rigid = -1;
        for (int i = 0; i < parts.size(); i++) {
            Pattern p = parts.get(i);
            if (p instanceof Pattern.Literal || p instanceof Pattern.Variable v && b.containsKey(v.name())) {
                fixed = i;
                break;
            }
            if (!(p instanceof Pattern.Variable) && (rigid < 0 || splits(p) < splits(parts.get(rigid)))) {
                rigid = i;
            }
        }
        if (fixed >= 0) {
            Operands rest = takeOut(op, parts.get(fixed), operands, b);
            if (rest != null) {
                ac(op, without(parts, fixed), rest, b, allowRest, literalTaken || parts.get(fixed) instanceof Pattern.Literal, out);
            }
            return;
        }
        if (rigid >= 0) {
            List<Pattern> others = without(parts, rigid);
            Pattern p = parts.get(rigid);
            for (int i = 0; i < operands.items().size(); i++) {
                List<Term> left = new ArrayList<>(operands.items());
                left.remove(i);
                for (Map<String, Term> x : match(p, operands.items().get(i), b)) {
                    ac(op, others, new Operands(left, operands.leaf()), x, allowRest, literalTaken, out);
                }
            }
            if (!canMatchLeaf(p)) {
                return;
            }
            List<Expression> candidates = new ArrayList<>(op.pieces(operands.leaf()));
            if (candidates.size() > 1) {
                candidates.add(operands.leaf());
            }
            for (Expression piece : candidates) {
                List<Map<String, Term>> found = match(p, Terms.of(piece), b);
                if (found.isEmpty()) {
                    continue;
                }
                Operands left = new Operands(operands.items(), op.remove(operands.leaf(), piece));
                for (Map<String, Term> x : found) {
                    ac(op, others, left, x, allowRest, literalTaken, out);
                }
            }
            return;
        }
        if (literalTaken && op == MULTIPLICATIVE && parts.size() == 1 && operands.items().isEmpty()
                && operands.leaf().equals(Expression.ONE)) {
            out.add(new Match(bind(b, ((Pattern.Variable) parts.get(0)).name(), Terms.of(Expression.ONE)), null));
            return;
        }
        distribute(op, parts, operands, b, allowRest, out);
    }

    /** Whether {@code p} could match a rational leaf (calls never do), so that leaves are split only when useful. */
    private static boolean canMatchLeaf(Pattern p) {
        if (p instanceof Pattern.Variable || p instanceof Pattern.Literal) {
            return true;
        }
        if (p instanceof Pattern.Sum s) {
            return s.parts().stream().allMatch(Matcher::canMatchLeaf);
        }
        if (p instanceof Pattern.Product q) {
            return q.factors().stream().allMatch(Matcher::canMatchLeaf);
        }
        return p instanceof Pattern.Power w && w.exponent() == -1 && canMatchLeaf(w.base());
    }

    /** The operands without a number or a bound variable's value, or null when it is not there. */
    private static Operands takeOut(Operation op, Pattern p, Operands operands, Map<String, Term> b) {
        if (p instanceof Pattern.Literal l) {
            Expression leaf = op.removeLiteral(operands.leaf(), l.value());
            return leaf == null ? null : new Operands(operands.items(), leaf);
        }
        Operands value = op.split(b.get(((Pattern.Variable) p).name()));
        List<Term> items = new ArrayList<>(operands.items());
        for (Term x : value.items()) {
            if (!items.remove(x)) {
                return null;
            }
        }
        Expression leaf = op.remove(operands.leaf(), value.leaf());
        return leaf == null ? null : new Operands(items, leaf);
    }

    /** All ways to share the pieces among the free variables (and the rest, at the root). */
    private void distribute(Operation op, List<Pattern> vars, Operands operands, Map<String, Term> b, boolean allowRest,
                            List<Match> out) {
        List<Term> pieces = new ArrayList<>(operands.items());
        for (Expression e : op.pieces(operands.leaf())) {
            pieces.add(Terms.of(e));
        }
        int k = vars.size();
        int slots = allowRest ? k + 1 : k;
        if (pieces.size() < k && op == ADDITIVE) {
            // The fallback of the class comment: the non-constant part of the leaf in its terms.
            pieces = new ArrayList<>(operands.items());
            Expression c = constantPart(operands.leaf());
            for (Expression e : summands(operands.leaf().subtract(c))) {
                pieces.add(Terms.of(e));
            }
            for (Expression e : op.pieces(c)) {
                pieces.add(Terms.of(e));
            }
        }
        if (pieces.size() < k) {
            return;
        }
        int[] choice = new int[pieces.size()];
        while (true) {
            if (--budget < 0) {
                return;
            }
            List<List<Term>> groups = new ArrayList<>();
            for (int i = 0; i < slots; i++) {
                groups.add(new ArrayList<>());
            }
            for (int i = 0; i < choice.length; i++) {
                groups.get(choice[i]).add(pieces.get(i));
            }
            boolean complete = true;
            for (int i = 0; i < k && complete; i++) {
                complete = !groups.get(i).isEmpty();
            }
            if (complete) {
                Map<String, Term> x = new HashMap<>(b);
                for (int i = 0; i < k; i++) {
                    x.put(((Pattern.Variable) vars.get(i)).name(), combine(op, groups.get(i)));
                }
                Term rest = allowRest && !groups.get(k).isEmpty() ? combine(op, groups.get(k)) : null;
                out.add(new Match(x, rest));
            }
            // The last piece's choice moves fastest, so earlier variables keep the earlier pieces longest.
            int i = choice.length - 1;
            while (i >= 0 && ++choice[i] == slots) {
                choice[i--] = 0;
            }
            if (i < 0) {
                return;
            }
        }
    }

    private static Term combine(Operation op, List<Term> group) {
        if (group.size() == 1) {
            return group.get(0);
        }
        Expression leaf = op.identity();
        List<Term> items = new ArrayList<>();
        for (Term t : group) {
            if (t instanceof Term.Leaf l) {
                leaf = op.combine(leaf, l.value());
            } else {
                items.add(t);
            }
        }
        return op.build(items, leaf);
    }

    private static List<Pattern> without(List<Pattern> ps, int i) {
        List<Pattern> out = new ArrayList<>(ps);
        out.remove(i);
        return out;
    }

    // ------------------------------------------------------------------ leaf pieces

    /**
     * The terms of a leaf in its canonical order: one per monomial of a polynomial coefficient, and
     * a coefficient that is not a polynomial as one term.
     */
    static List<Expression> summands(Expression e) {
        List<Expression> out = new ArrayList<>();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            RationalFunction f = t.getValue();
            if (!f.isPolynomial()) {
                out.add(Expression.of(Map.of(t.getKey(), f)));
                continue;
            }
            for (Polynomial.Term m : f.numerator().terms()) {
                Polynomial one = Polynomial.monomial(m.coefficient(), m.exponents());
                out.add(Expression.of(Map.of(t.getKey(), RationalFunction.of(one))));
            }
        }
        return out;
    }

    /** The constant term of a leaf whose value is a polynomial; zero for anything else. */
    static Expression constantPart(Expression e) {
        if (e.isConstant()) {
            return e;
        }
        RationalFunction f = e.terms().get(Monomial.ONE);
        if (f == null || !f.isPolynomial()) {
            return Expression.ZERO;
        }
        Map<String, Rational> zero = new HashMap<>();
        for (String v : f.variables()) {
            zero.put(v, Rational.ZERO);
        }
        return Expression.constant(f.evaluate(zero));
    }

    /** The number in front of a single-term polynomial leaf ({@code -3/2} for {@code -3/2*s*t}); else 1. */
    static Expression numericCoefficient(Expression e) {
        if (e.isConstant()) {
            return e;
        }
        if (e.terms().size() != 1) {
            return Expression.ONE;
        }
        RationalFunction f = e.terms().values().iterator().next();
        if (!f.isPolynomial() || f.numerator().termCount() != 1) {
            return Expression.ONE;
        }
        Map<String, Rational> one = new HashMap<>();
        for (String v : f.variables()) {
            one.put(v, Rational.ONE);
        }
        return Expression.constant(f.evaluate(one));
    }

    private static BigInteger floor(Rational r) {
        BigInteger[] qr = r.numerator().divideAndRemainder(r.denominator());
        return qr[1].signum() < 0 ? qr[0].subtract(BigInteger.ONE) : qr[0];
    }
}
