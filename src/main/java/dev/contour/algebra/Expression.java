package dev.contour.algebra;

import dev.contour.ContourException;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * The exact value of the language: a Laurent polynomial in <em>collected</em> variables whose
 * coefficients are canonical rational functions in the other (<em>inner</em>) variables.
 *
 * <p>Why: Mellin amplitudes are polynomials in the R-symmetry cross ratios sigma, tau (and linear in
 * unknown ansatz coefficients a[i,j,k]) whose coefficients are rational functions of s, t with small
 * factored denominators. Over one common denominator they explode (p = 128 has ~8000 sigma-tau
 * monomials each with its own denominator); collected, each coefficient stays small.
 *
 * <p>Whether a variable is collected is fixed when it is made: {@link #collectedVariable} versus
 * {@link #variable}. When an operation meets a name that is collected in one operand and inner in
 * the other, the inner occurrence is expanded as a polynomial in it (a ContourException if it sits
 * in a denominator). Division by an expression with collected variables is allowed only when it is a
 * single monomial (Laurent). No zero coefficients are stored; equal values have identical
 * representations. Terms are ordered by {@link Monomial#compareTo}.
 */
public final class Expression {
    public static final Expression ZERO = new Expression(new TreeMap<>());
    public static final Expression ONE = of(RationalFunction.ONE);

    /** Non-zero canonical coefficients whose variables are disjoint from the collected names. */
    private final TreeMap<Monomial, RationalFunction> terms;
    /** The collected names once asked for (unmodifiable, so safely published through the wrapper's final field). */
    private SortedSet<String> collected;

    /** The coefficient when no collected variable occurs (ZERO for zero), else null; fixed at construction. */
    private final RationalFunction rational;

    /** The map must be complete: it is never changed afterwards. */
    private Expression(TreeMap<Monomial, RationalFunction> terms) {
        this.terms = terms;
        this.rational = terms.isEmpty() ? RationalFunction.ZERO
                : terms.size() == 1 && terms.firstKey().isOne() ? terms.get(Monomial.ONE) : null;
    }

    public static Expression constant(Rational c) {
        return of(RationalFunction.constant(c));
    }

    public static Expression constant(long c) {
        return constant(Rational.of(c));
    }

    public static Expression of(RationalFunction f) {
        TreeMap<Monomial, RationalFunction> m = new TreeMap<>();
        if (!f.isZero()) {
            m.put(Monomial.ONE, f);
        }
        return new Expression(m);
    }

    /** An inner variable: may appear in denominators. */
    public static Expression variable(String name) {
        return of(RationalFunction.variable(name));
    }

    /** A collected variable: kept as a Laurent monomial (sigma, tau, unknowns). */
    public static Expression collectedVariable(String name) {
        TreeMap<Monomial, RationalFunction> m = new TreeMap<>();
        m.put(Monomial.of(name, 1), RationalFunction.ONE);
        return new Expression(m);
    }

    /** The sum of coefficient * monomial over the map's entries (zero coefficients dropped). */
    public static Expression of(Map<Monomial, RationalFunction> terms) {
        // Sorting an array and building the tree from it in one pass is much cheaper than inserting
        // term by term (a sum's accumulator hands over its terms in the order they were summed, which
        // already has long sorted runs).
        @SuppressWarnings("unchecked")
        Map.Entry<Monomial, RationalFunction>[] es = new Map.Entry[terms.size()];
        int n = 0;
        for (Map.Entry<Monomial, RationalFunction> e : terms.entrySet()) {
            if (!e.getValue().isZero()) {
                es[n++] = Map.entry(e.getKey(), e.getValue());
            }
        }
        java.util.Arrays.sort(es, 0, n, Map.Entry.comparingByKey());
        return normalised(new TreeMap<>(new SortedEntries(es, n)));
    }

    /**
     * Distinct entries sorted by key, seen as a sorted map only so that {@link TreeMap}'s copy
     * constructor builds its tree from them in linear time; nothing else is supported.
     */
    private static final class SortedEntries extends java.util.AbstractMap<Monomial, RationalFunction>
            implements SortedMap<Monomial, RationalFunction> {
        private final Map.Entry<Monomial, RationalFunction>[] entries;
        private final int size;

        SortedEntries(Map.Entry<Monomial, RationalFunction>[] entries, int size) {
            for (int i = 1; i < size; i++) {
                if (entries[i - 1].getKey().compareTo(entries[i].getKey()) >= 0) {
                    throw new IllegalArgumentException("entries must be distinct and sorted");
                }
            }
            this.entries = entries;
            this.size = size;
        }

        @Override
        public java.util.Comparator<? super Monomial> comparator() {
            return null;
        }

        @Override
        public int size() {
            return size;
        }

        @Override
        public Set<Map.Entry<Monomial, RationalFunction>> entrySet() {
            return new java.util.AbstractSet<>() {
                @Override
                public java.util.Iterator<Map.Entry<Monomial, RationalFunction>> iterator() {
                    return java.util.Arrays.asList(entries).subList(0, size).iterator();
                }

                @Override
                public int size() {
                    return size;
                }
            };
        }

        @Override
        public SortedMap<Monomial, RationalFunction> subMap(Monomial from, Monomial to) {
            throw new UnsupportedOperationException();
        }

        @Override
        public SortedMap<Monomial, RationalFunction> headMap(Monomial to) {
            throw new UnsupportedOperationException();
        }

        @Override
        public SortedMap<Monomial, RationalFunction> tailMap(Monomial from) {
            throw new UnsupportedOperationException();
        }

        @Override
        public Monomial firstKey() {
            return entries[0].getKey();
        }

        @Override
        public Monomial lastKey() {
            return entries[size - 1].getKey();
        }
    }

    /** Makes the coefficients free of collected names by expanding them (the one conflict rule). */
    private static Expression normalised(TreeMap<Monomial, RationalFunction> m) {
        // Usually no coefficient mentions a collected name: test that against the (few) inner names first.
        Set<String> inner = new java.util.HashSet<>();
        for (RationalFunction c : m.values()) {
            c.addVariablesTo(inner);
        }
        Expression e = new Expression(m);
        if (inner.isEmpty() || !e.mentionsCollected(inner)) {
            return e;
        }
        TreeSet<String> collected = new TreeSet<>();
        for (Monomial k : m.keySet()) {
            Collections.addAll(collected, k.names());
        }
        return new Expression(m).expandedFor(collected);
    }

    /** This value with every occurrence of the given names inside coefficients moved into monomials. */
    private Expression expandedFor(Set<String> names) {
        if (names.isEmpty() || names == collected) {
            return this;
        }
        // Coefficients are free of the own collected names (the invariant), so only other names can conflict.
        SortedSet<String> own = collectedVariables();
        if (own.size() >= names.size() && own.containsAll(names)) {
            return this;
        }
        boolean conflict = false;
        for (RationalFunction c : terms.values()) {
            if (intersects(c.variables(), names)) {
                conflict = true;
                break;
            }
        }
        if (!conflict) {
            return this;
        }
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : terms.entrySet()) {
            RationalFunction c = t.getValue();
            List<String> hit = c.variables().stream().filter(names::contains).toList();
            if (hit.isEmpty()) {
                accumulate(out, t.getKey(), c);
                continue;
            }
            for (LinearFactors.Factor f : c.denominatorFactors()) {
                for (String v : hit) {
                    if (f.base().variables().contains(v)) {
                        throw new ContourException("variable '" + v + "' is collected but occurs in a denominator: " + c);
                    }
                }
            }
            for (Map.Entry<List<Integer>, Polynomial> part : c.numerator().coefficients(hit).entrySet()) {
                Map<String, Integer> ex = new HashMap<>();
                for (int i = 0; i < hit.size(); i++) {
                    ex.put(hit.get(i), part.getKey().get(i));
                }
                accumulate(out, t.getKey().multiply(Monomial.of(ex)), c.withNumerator(part.getValue()));
            }
        }
        return new Expression(out);
    }

    /** Whether the coefficient c has a variable that the monomial m collects. */
    private static boolean mentions(RationalFunction c, Monomial m) {
        if (c.isConstant() || m.isOne()) {
            return false;
        }
        return c.mentionsAny(v -> m.exponent(v) != 0);
    }

    /** Whether a monomial of this value has the collected variable {@code name}. */
    public boolean collects(String name) {
        for (Monomial m : terms.keySet()) {
            if (m.exponent(name) != 0) {
                return true;
            }
        }
        return false;
    }

    private static boolean intersects(Set<String> a, Set<String> b) {
        for (String s : a) {
            if (b.contains(s)) {
                return true;
            }
        }
        return false;
    }

    private static void accumulate(TreeMap<Monomial, RationalFunction> m, Monomial k, RationalFunction c) {
        if (c.isZero()) {
            return;
        }
        RationalFunction old = m.get(k);
        if (old == null) {
            m.put(k, c);
            return;
        }
        RationalFunction s = old.add(c);
        if (s.isZero()) {
            m.remove(k);
        } else {
            m.put(k, s);
        }
    }

    private Set<String> collectedUnion(Expression o) {
        SortedSet<String> a = collectedVariables();
        SortedSet<String> b = o.collectedVariables();
        if (b.isEmpty() || a.size() >= b.size() && a.containsAll(b)) {
            return a;
        }
        if (a.isEmpty() || b.containsAll(a)) {
            return b;
        }
        TreeSet<String> s = new TreeSet<>(a);
        s.addAll(b);
        return s;
    }

    /** The coefficient of a value free of collected variables (ZERO for zero). */
    private RationalFunction rational() {
        return rational;
    }

    /** This value with every coefficient multiplied by a non-zero c (collected structure unchanged). */
    private Expression scaled(RationalFunction c, boolean inverse) {
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>(terms);
        out.replaceAll((m, x) -> inverse ? x.divide(c) : x.multiply(c));
        return new Expression(out);
    }

    // ---------------------------------------------------------------- arithmetic

    public Expression add(Expression o) {
        if (o.isZero()) {
            return this;
        }
        if (isZero()) {
            return o;
        }
        if (isRational() && o.isRational()) {
            return of(rational().add(o.rational()));
        }
        Set<String> names = collectedUnion(o);
        Expression a = expandedFor(names);
        Expression b = o.expandedFor(names);
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>(a.terms);
        for (Map.Entry<Monomial, RationalFunction> t : b.terms.entrySet()) {
            accumulate(out, t.getKey(), t.getValue());
        }
        return new Expression(out);
    }

    public Expression subtract(Expression o) {
        if (isRational() && o.isRational() && !o.isZero()) {
            return of(rational().subtract(o.rational()));
        }
        return add(o.negate());
    }

    public Expression multiply(Expression o) {
        if (isZero() || o.isZero()) {
            return ZERO;
        }
        if (isRational() && o.isRational()) {
            return of(rational().multiply(o.rational()));
        }
        if (terms.size() == 1 && o.terms.size() == 1) {
            // One term times one term (a[i,j,k] * sigma^i): without a name conflict, no sets of names are needed.
            Map.Entry<Monomial, RationalFunction> x = terms.firstEntry();
            Map.Entry<Monomial, RationalFunction> y = o.terms.firstEntry();
            if (!mentions(x.getValue(), y.getKey()) && !mentions(y.getValue(), x.getKey())) {
                TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
                out.put(x.getKey().multiply(y.getKey()), x.getValue().multiply(y.getValue()));
                return new Expression(out);
            }
        }
        Set<String> names = collectedUnion(o);
        Expression a = expandedFor(names);
        Expression b = o.expandedFor(names);
        // A factor free of collected variables scales each coefficient: no products of monomials, no merging.
        if (b.isRational()) {
            return a.scaled(b.rational(), false);
        }
        if (a.isRational()) {
            return b.scaled(a.rational(), false);
        }
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
        for (Map.Entry<Monomial, RationalFunction> x : a.terms.entrySet()) {
            dev.contour.Interrupts.check();
            for (Map.Entry<Monomial, RationalFunction> y : b.terms.entrySet()) {
                accumulate(out, x.getKey().multiply(y.getKey()), x.getValue().multiply(y.getValue()));
            }
        }
        return new Expression(out);
    }

    public Expression multiply(RationalFunction c) {
        return multiply(of(c));
    }

    public Expression negate() {
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : terms.entrySet()) {
            out.put(t.getKey(), t.getValue().negate());
        }
        return new Expression(out);
    }

    /** Division; the divisor must be free of collected variables or a single monomial. */
    public Expression divide(Expression o) {
        if (o.isZero()) {
            throw new ContourException("division by zero: (" + this + ") / 0");
        }
        if (isRational() && o.isRational()) {
            return isZero() ? ZERO : of(rational().divide(o.rational()));
        }
        Set<String> names = collectedUnion(o);
        Expression a = expandedFor(names);
        Expression b = o.expandedFor(names);
        if (b.isRational() && !a.isZero()) {
            return a.scaled(b.rational(), true);
        }
        return a.multiply(b.inverseOfSingleTerm());
    }

    private Expression inverseOfSingleTerm() {
        if (terms.size() != 1) {
            throw new ContourException("cannot divide by a sum of several monomials in collected variables: " + this);
        }
        Map.Entry<Monomial, RationalFunction> t = terms.firstEntry();
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
        out.put(t.getKey().inverse(), t.getValue().inverse());
        return new Expression(out);
    }

    public Expression pow(int exponent) {
        if (exponent < 0) {
            if (isZero()) {
                throw new ContourException("division by zero: 0^" + exponent);
            }
            return inverseOfSingleTerm().pow(-exponent);
        }
        if (terms.size() == 1) {
            Map.Entry<Monomial, RationalFunction> t = terms.firstEntry();
            TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
            out.put(t.getKey().pow(exponent), t.getValue().pow(exponent));
            return new Expression(out);
        }
        return Powers.bySquaring(ONE, this, exponent, Expression::multiply);
    }

    // ---------------------------------------------------------------- substitution

    /** Simultaneous substitution for inner and collected variables. */
    public Expression substitute(Map<String, Expression> values) {
        // One accumulator for all terms (repeated add would copy the map once per term), normalised at the end.
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
        Map<String, Map<Integer, Expression>> powers = new HashMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : terms.entrySet()) {
            Expression term = substituteCoefficient(t.getValue(), values);
            for (Map.Entry<String, Integer> v : t.getKey().exponents().entrySet()) {
                Expression base = values.get(v.getKey());
                if (base == null) {
                    base = collectedVariable(v.getKey());
                }
                final Expression b = base;
                term = term.multiply(powers.computeIfAbsent(v.getKey(), k -> new HashMap<>())
                        .computeIfAbsent(v.getValue(), b::pow));
            }
            for (Map.Entry<Monomial, RationalFunction> r : term.terms.entrySet()) {
                accumulate(out, r.getKey(), r.getValue());
            }
        }
        return normalised(out);
    }

    private static Expression substituteCoefficient(RationalFunction c, Map<String, Expression> values) {
        Map<String, RationalFunction> rational = new HashMap<>();
        boolean allRational = true;
        for (String v : c.variables()) {
            Expression val = values.get(v);
            if (val != null) {
                if (val.isRational()) {
                    rational.put(v, val.asRationalFunction());
                } else {
                    allRational = false;
                }
            }
        }
        if (allRational) {
            return of(c.substitute(rational));
        }
        Expression result = polynomialWith(c.numerator(), values);
        for (LinearFactors.Factor f : c.denominatorFactors()) {
            result = result.divide(polynomialWith(f.base(), values).pow(f.multiplicity()));
        }
        return result;
    }

    private static Expression polynomialWith(Polynomial p, Map<String, Expression> values) {
        Expression result = ZERO;
        for (Polynomial.Term t : p.terms()) {
            Expression term = constant(t.coefficient());
            for (Map.Entry<String, Integer> v : t.exponents().entrySet()) {
                Expression base = values.get(v.getKey());
                term = term.multiply((base == null ? variable(v.getKey()) : base).pow(v.getValue()));
            }
            result = result.add(term);
        }
        return result;
    }

    /** Linear substitution of inner variables (shifts, swaps, t -> 4p - s - t): the fast path. */
    public Expression substituteLinear(Map<String, Polynomial> values) {
        if (mentionsCollected(values.keySet())) {
            Map<String, Expression> general = new HashMap<>();
            for (Map.Entry<String, Polynomial> e : values.entrySet()) {
                general.put(e.getKey(), of(RationalFunction.of(e.getValue())));
            }
            return substitute(general);
        }
        // Monomials are unchanged, so the result keeps this order: copy the map, replace the coefficients.
        Map<Polynomial, RationalFunction.FactorImage> images = new HashMap<>();
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>(terms);
        out.replaceAll((m, c) -> c.substituteLinear(values, images));
        out.values().removeIf(RationalFunction::isZero);
        return normalised(out);
    }

    /** Whether a monomial of this value has one of the names (without building the set of all names). */
    private boolean mentionsCollected(Set<String> names) {
        for (Monomial m : terms.keySet()) {
            for (String v : m.names()) {
                if (names.contains(v)) {
                    return true;
                }
            }
        }
        return false;
    }

    /**
     * Inner variables replaced by numbers; collected structure kept. A collected variable named in
     * the point is replaced too (its power is multiplied into the coefficient).
     */
    public Expression evaluatePartially(Map<String, Rational> point) {
        TreeMap<Monomial, RationalFunction> out = new TreeMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : terms.entrySet()) {
            Rational factor = Rational.ONE;
            Map<String, Integer> rest = new HashMap<>();
            for (Map.Entry<String, Integer> v : t.getKey().exponents().entrySet()) {
                Rational x = point.get(v.getKey());
                if (x == null) {
                    rest.put(v.getKey(), v.getValue());
                } else {
                    factor = factor.multiply(x.pow(v.getValue()));
                }
            }
            accumulate(out, Monomial.of(rest), t.getValue().evaluatePartially(point).multiply(factor));
        }
        return new Expression(out);
    }

    // ---------------------------------------------------------------- structure

    /** Terms in canonical order: monomial in collected variables to its coefficient. */
    public SortedMap<Monomial, RationalFunction> terms() {
        return Collections.unmodifiableSortedMap(terms);
    }

    public RationalFunction coefficient(Monomial m) {
        return terms.getOrDefault(m, RationalFunction.ZERO);
    }

    public SortedSet<String> collectedVariables() {
        SortedSet<String> c = collected;
        if (c == null) {
            TreeSet<String> s = new TreeSet<>();
            for (Monomial m : terms.keySet()) {
                Collections.addAll(s, m.names());
            }
            c = Collections.unmodifiableSortedSet(s);
            collected = c;
        }
        return c;
    }

    public SortedSet<String> innerVariables() {
        TreeSet<String> s = new TreeSet<>();
        for (RationalFunction c : terms.values()) {
            s.addAll(c.variables());
        }
        return Collections.unmodifiableSortedSet(s);
    }

    public boolean isZero() {
        return terms.isEmpty();
    }

    /** True when no collected variable occurs. */
    public boolean isRational() {
        return rational != null;
    }

    /** The value as one rational function; ContourException if a collected variable occurs. */
    public RationalFunction asRationalFunction() {
        if (rational == null) {
            throw new ContourException("expected a value free of collected variables, got " + this);
        }
        return rational;
    }

    public boolean isConstant() {
        return rational != null && rational.isConstant();
    }

    public Rational constantValue() {
        if (!isConstant()) {
            throw new ContourException("not a constant: " + this);
        }
        return asRationalFunction().constantValue();
    }

    public boolean isCanonical() {
        Set<String> collected = collectedVariables();
        for (Map.Entry<Monomial, RationalFunction> t : terms.entrySet()) {
            RationalFunction c = t.getValue();
            if (c.isZero() || !c.isCanonical() || intersects(c.variables(), collected)) {
                return false;
            }
        }
        return true;
    }

    @Override
    public boolean equals(Object o) {
        return this == o || o instanceof Expression e && terms.equals(e.terms);
    }

    @Override
    public int hashCode() {
        return terms.hashCode();
    }

    /** A debugging form such as {@code (s)/((t - 1))*sigma + 2}; user-facing printing lives in print/. */
    @Override
    public String toString() {
        if (terms.isEmpty()) {
            return "0";
        }
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<Monomial, RationalFunction> t : terms.descendingMap().entrySet()) {
            if (sb.length() > 0) {
                sb.append(" + ");
            }
            if (t.getKey().isOne()) {
                sb.append('(').append(t.getValue()).append(')');
            } else if (t.getValue().isOne()) {
                sb.append(t.getKey());
            } else {
                sb.append('(').append(t.getValue()).append(")*").append(t.getKey());
            }
        }
        return sb.toString();
    }
}
