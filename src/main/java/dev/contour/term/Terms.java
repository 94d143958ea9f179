package dev.contour.term;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.UnaryOperator;

/**
 * The normalise step for {@link Term}s: everything rational folds into {@link Term.Leaf}s, and the
 * exact built-in reductions apply (factorials, binomials and Gamma at integers, Pochhammer symbols
 * of integer length, Gamma ratios whose arguments differ by integers).
 *
 * <p>The normal form is a sum of monomials, each a rational coefficient times powers of atoms
 * (calls that stay symbolic). Within one normalised value, all Gamma functions whose arguments
 * differ by integers are rewritten over the one with the smallest argument, so
 * {@code Gamma(x + 3)/Gamma(x)} becomes {@code x*(x + 1)*(x + 2)} and the difference of two equal
 * values normalises to zero.
 */
public final class Terms {
    /** Longest Pochhammer product or factorial expanded exactly; beyond it the step fails clearly. */
    public static final int MAX_EXACT_LENGTH = 10_000;
    /** Longest Pochhammer product of a symbolic argument expanded exactly (its degree). */
    public static final int MAX_SYMBOLIC_LENGTH = 1_000;
    /** Most monomials a normalised term may have. */
    public static final int MAX_MONOMIALS = 100_000;

    public static final String GAMMA = "Gamma";
    public static final String POCH = "poch";
    public static final String FACTORIAL = "factorial";
    public static final String BINOM = "binom";

    private Terms() { }

    /** A leaf. */
    public static Term of(Expression e) {
        return new Term.Leaf(e);
    }

    /** The normal form of {@code t}; a {@link Term.Leaf} exactly when the value is rational. */
    public static Term normalize(Term t) {
        return toTerm(reduceGammas(normalForm(t, true)));
    }

    /**
     * The same sum-of-monomials form without the built-in reductions: calls stay exactly as written
     * (with expanded arguments), so a rewrite rule decides what happens to each of them.
     */
    public static Term expand(Term t) {
        return toTerm(normalForm(t, false));
    }

    /** True when the (normalised) term is a rational value. */
    public static boolean isRational(Term t) {
        return t instanceof Term.Leaf;
    }

    /** The term with every leaf mapped, not normalised. */
    public static Term mapLeaves(Term t, UnaryOperator<Expression> f) {
        if (t instanceof Term.Leaf l) {
            return new Term.Leaf(f.apply(l.value()));
        }
        if (t instanceof Term.Apply a) {
            return new Term.Apply(a.function(), a.arguments().stream().map(x -> mapLeaves(x, f)).toList());
        }
        if (t instanceof Term.Sum s) {
            return new Term.Sum(s.terms().stream().map(x -> mapLeaves(x, f)).toList());
        }
        if (t instanceof Term.Product p) {
            return new Term.Product(p.factors().stream().map(x -> mapLeaves(x, f)).toList());
        }
        Term.Power w = (Term.Power) t;
        return new Term.Power(mapLeaves(w.base(), f), w.exponent());
    }

    /** Simultaneous substitution in every leaf, then normalisation. */
    public static Term substitute(Term t, Map<String, Expression> values) {
        return normalize(mapLeaves(t, e -> e.substitute(values)));
    }

    /** Pochhammer symbol (x)_n for an integer n (negative n: 1/((x-1)(x-2)...(x+n))). */
    public static Expression pochhammer(Expression x, int n) {
        checkLength(n);
        if (!x.isConstant() && Math.abs((long) n) > MAX_SYMBOLIC_LENGTH) {
            throw new ContourException("a symbolic Pochhammer symbol of length " + n + " is past the limit of "
                    + MAX_SYMBOLIC_LENGTH);
        }
        Expression result = Expression.ONE;
        if (n >= 0) {
            for (int k = 0; k < n; k++) {
                if ((k & 255) == 0) {
                    Cancellation.check();
                }
                result = result.multiply(x.add(Expression.constant(k)));
            }
            return result;
        }
        // 1/((x - 1)(x - 2)...(x - m)) one linear factor at a time: the denominator stays factored,
        // where dividing by the expanded product would have to factor a degree-m polynomial again
        for (int k = 1; k <= -n; k++) {
            if ((k & 255) == 0) {
                Cancellation.check();
            }
            result = result.divide(x.subtract(Expression.constant(k)));
        }
        return result;
    }

    /**
     * poch(x, n)^exponent. A negative exponent divides by the n linear factors one at a time, so the
     * result's denominator is the product of those factors as they are (cheap), not a degree-n
     * polynomial to be factored again (for n = 400 that took minutes).
     */
    public static Expression pochhammerPower(Expression x, int n, int exponent) {
        if (exponent >= 0) {
            return pochhammer(x, n).pow(exponent);
        }
        if (n < 0 || x.isConstant()) {
            return pochhammer(x, n).pow(exponent);
        }
        checkLength(n);
        if (Math.abs((long) n) > MAX_SYMBOLIC_LENGTH) {
            throw new ContourException("a symbolic Pochhammer symbol of length " + n + " is past the limit of "
                    + MAX_SYMBOLIC_LENGTH);
        }
        Expression inverse = Expression.ONE;
        for (int k = 0; k < n; k++) {
            if ((k & 255) == 0) {
                Cancellation.check();
            }
            inverse = inverse.divide(x.add(Expression.constant(k)));
        }
        return inverse.pow(-exponent);
    }

    /** n! for 0 <= n <= {@link #MAX_EXACT_LENGTH}. */
    public static BigInteger factorial(int n) {
        if (n < 0) {
            throw new ContourException("factorial of a negative integer (" + n + ") is undefined");
        }
        checkLength(n);
        BigInteger[] table = factorials;
        if (n < table.length) {
            return table[n];
        }
        synchronized (Terms.class) {
            table = factorials;
            if (n >= table.length) {
                // grow to at least n + 1, doubling, each entry from the one before: a sum over many
                // index tuples asks for the same factorials again and again
                BigInteger[] grown = java.util.Arrays.copyOf(table, Math.max(n + 1, Math.min(2 * table.length, MAX_EXACT_LENGTH + 1)));
                for (int k = table.length; k < grown.length; k++) {
                    if ((k & 255) == 0) {
                        Cancellation.check();
                    }
                    grown[k] = grown[k - 1].multiply(BigInteger.valueOf(k));
                }
                factorials = grown;
                table = grown;
            }
            return table[n];
        }
    }

    /** 0!, 1!, ...: computed once, shared (the array is replaced, never changed, once published). */
    private static volatile BigInteger[] factorials = {BigInteger.ONE, BigInteger.ONE};

    /** binom(n, k) for integers 0 <= k <= n <= {@link #MAX_EXACT_LENGTH}, from the shared factorials. */
    public static BigInteger binomial(int n, int k) {
        return factorial(n).divide(factorial(k).multiply(factorial(n - k)));
    }

    /** binom(x, k) = x(x-1)...(x-k+1)/k! for an integer k (zero when k < 0). */
    public static Expression binomial(Expression x, int k) {
        if (k < 0) {
            return Expression.ZERO;
        }
        Expression falling = pochhammer(x.subtract(Expression.constant(k - 1)), k);
        return falling.divide(Expression.constant(Rational.of(factorial(k))));
    }

    private static void checkLength(int n) {
        if (Math.abs((long) n) > MAX_EXACT_LENGTH) {
            throw new ContourException("a product of " + Math.abs((long) n) + " factors is past the limit of "
                    + MAX_EXACT_LENGTH);
        }
    }

    // ------------------------------------------------------------------ normal form

    /** Atom (a symbolic call or an inverted sum) to its exponent; the empty map is the rational monomial. */
    private record Key(Map<Term, Integer> atoms) {
        Key {
            atoms = Map.copyOf(atoms);
        }

        Key times(Key o) {
            Map<Term, Integer> m = new HashMap<>(atoms);
            o.atoms.forEach((a, e) -> m.merge(a, e, Terms::addExponents));
            m.values().removeIf(e -> e == 0);
            return new Key(m);
        }

        Key pow(int e) {
            Map<Term, Integer> m = new HashMap<>();
            atoms.forEach((a, x) -> m.put(a, multiplyExponents(x, e)));
            return new Key(m);
        }
    }

    private static final Key RATIONAL = new Key(Map.of());

    /** x + y for two exponents, failing clearly past the int range exponents are kept in. */
    private static int addExponents(int x, int y) {
        long r = (long) x + y;
        if (r != (int) r) {
            throw tooLarge(x + " + " + y);
        }
        return (int) r;
    }

    private static int multiplyExponents(int x, int y) {
        long r = (long) x * y;
        if (r != (int) r) {
            throw tooLarge(x + "*" + y);
        }
        return (int) r;
    }

    private static ContourException tooLarge(String exponent) {
        return new ContourException("the exponent " + exponent + " is too large (exponents are at most " + Integer.MAX_VALUE + ")");
    }

    private static Map<Key, Expression> normalForm(Term t, boolean reduce) {
        if (t instanceof Term.Leaf l) {
            return single(RATIONAL, l.value());
        }
        if (t instanceof Term.Sum s) {
            Map<Key, Expression> acc = new HashMap<>();
            for (Term x : s.terms()) {
                addInto(acc, normalForm(x, reduce));
            }
            return acc;
        }
        if (t instanceof Term.Product p) {
            Map<Key, Expression> acc = single(RATIONAL, Expression.ONE);
            for (Term x : p.factors()) {
                acc = multiply(acc, normalForm(x, reduce));
            }
            return acc;
        }
        if (t instanceof Term.Power w) {
            if (reduce && w.exponent() < 0 && w.base() instanceof Term.Apply a && a.function().equals(POCH)
                    && a.arguments().size() == 2) {
                // 1/poch(x, n) with a whole n: built from its linear factors, never factored back
                Term x = normalize(a.arguments().get(0));
                Term n = normalize(a.arguments().get(1));
                Integer length = n instanceof Term.Leaf nl ? integerValue(nl.value()) : null;
                if (length != null && x instanceof Term.Leaf xl) {
                    return single(RATIONAL, pochhammerPower(xl.value(), length, w.exponent()));
                }
            }
            Map<Key, Expression> base = normalForm(w.base(), reduce);
            return power(reduce ? reduceGammas(base) : base, w.exponent());
        }
        if (t instanceof Term.Apply a) {
            return reduce ? apply(a) : single(new Key(Map.of(new Term.Apply(a.function(),
                    a.arguments().stream().map(Terms::expand).toList()), 1)), Expression.ONE);
        }
        throw new IllegalStateException("unhandled term kind " + t.getClass().getSimpleName());
    }

    private static Map<Key, Expression> power(Map<Key, Expression> base, int e) {
        if (e == 0) {
            return single(RATIONAL, Expression.ONE);
        }
        if (base.isEmpty()) {
            if (e < 0) {
                throw new ContourException("division by zero");
            }
            return base;
        }
        if (base.size() == 1) {
            Map.Entry<Key, Expression> only = base.entrySet().iterator().next();
            return single(only.getKey().pow(e), only.getValue().pow(e));
        }
        if (e > 0) {
            Map<Key, Expression> acc = base;
            for (int i = 1; i < e; i++) {
                acc = multiply(acc, base);
            }
            return acc;
        }
        return single(new Key(Map.of(toTerm(base), 1)).pow(e), Expression.ONE);
    }

    private static Map<Key, Expression> apply(Term.Apply a) {
        List<Term> args = a.arguments().stream().map(Terms::normalize).toList();
        String f = a.function();
        if (f.equals(GAMMA) && args.size() == 1 && args.get(0) instanceof Term.Leaf x) {
            Integer n = integerValue(x.value());
            if (n != null) {
                if (n <= 0) {
                    throw new ContourException("Gamma has a pole at " + n);
                }
                return constant(Rational.of(factorial(n - 1)));
            }
        } else if (f.equals(POCH) && args.size() == 2 && args.get(0) instanceof Term.Leaf x
                && args.get(1) instanceof Term.Leaf n) {
            Integer length = integerValue(n.value());
            if (length != null) {
                return single(RATIONAL, pochhammer(x.value(), length));
            }
            return normalForm(gammaRatio(x.value().add(n.value()), x.value()), true);
        } else if (f.equals(FACTORIAL) && args.size() == 1 && args.get(0) instanceof Term.Leaf x) {
            Integer n = integerValue(x.value());
            if (n != null) {
                return constant(Rational.of(factorial(n)));
            }
            return normalForm(gamma(x.value().add(Expression.ONE)), true);
        } else if (f.equals(BINOM) && args.size() == 2 && args.get(0) instanceof Term.Leaf x
                && args.get(1) instanceof Term.Leaf k) {
            Integer kk = integerValue(k.value());
            if (kk != null) {
                return single(RATIONAL, binomial(x.value(), kk));
            }
            Expression n1 = x.value().add(Expression.ONE);
            return normalForm(new Term.Product(List.of(gamma(n1),
                    new Term.Power(gamma(k.value().add(Expression.ONE)), -1),
                    new Term.Power(gamma(n1.subtract(k.value())), -1))), true);
        }
        return single(new Key(Map.of(new Term.Apply(f, args), 1)), Expression.ONE);
    }

    private static Term gamma(Expression x) {
        return new Term.Apply(GAMMA, List.of(new Term.Leaf(x)));
    }

    private static Term gammaRatio(Expression top, Expression bottom) {
        return new Term.Product(List.of(gamma(top), new Term.Power(gamma(bottom), -1)));
    }

    /** The integer value of a constant expression, or null. */
    private static Integer integerValue(Expression e) {
        if (!e.isConstant()) {
            return null;
        }
        Rational r = e.constantValue();
        if (!r.isInteger()) {
            return null;
        }
        if (r.numerator().bitLength() > 31) {
            throw new ContourException("integer argument " + r + " is too large");
        }
        return r.intValueExact();
    }

    /**
     * Rewrites every Gamma atom over the member of its integer-shift class with the smallest
     * argument, multiplying coefficients by the (rational) Pochhammer factor in between.
     */
    private static Map<Key, Expression> reduceGammas(Map<Key, Expression> nf) {
        Map<Term, Expression> argumentOf = new HashMap<>();
        for (Key k : nf.keySet()) {
            for (Term atom : k.atoms().keySet()) {
                if (atom instanceof Term.Apply a && a.function().equals(GAMMA) && a.arguments().size() == 1
                        && a.arguments().get(0) instanceof Term.Leaf x) {
                    argumentOf.put(atom, x.value());
                }
            }
        }
        if (argumentOf.size() < 2) {
            return nf;
        }
        // Each Gamma atom maps to (base atom, shift) with argument = base argument + shift, shift >= 0.
        List<Term> atoms = new ArrayList<>(argumentOf.keySet());
        atoms.sort(Comparator.comparing(Terms::sortKey));
        Map<Term, Term> baseOf = new HashMap<>();
        Map<Term, Integer> shiftOf = new HashMap<>();
        List<Term> bases = new ArrayList<>();
        for (Term atom : atoms) {
            Expression x = argumentOf.get(atom);
            boolean placed = false;
            for (int b = 0; b < bases.size() && !placed; b++) {
                Term base = bases.get(b);
                Integer d = integerValue(x.subtract(argumentOf.get(base)));
                if (d == null) {
                    continue;
                }
                placed = true;
                if (d >= 0) {
                    baseOf.put(atom, base);
                    shiftOf.put(atom, d);
                } else {
                    // The new atom has the smaller argument: it becomes the base of the class.
                    bases.set(b, atom);
                    baseOf.put(atom, atom);
                    shiftOf.put(atom, 0);
                    for (Map.Entry<Term, Term> e : baseOf.entrySet()) {
                        if (e.getValue().equals(base) && !e.getKey().equals(atom)) {
                            e.setValue(atom);
                            shiftOf.put(e.getKey(), shiftOf.get(e.getKey()) - d);
                        }
                    }
                }
            }
            if (!placed) {
                bases.add(atom);
                baseOf.put(atom, atom);
                shiftOf.put(atom, 0);
            }
        }
        if (bases.size() == argumentOf.size()) {
            return nf;
        }
        Map<Key, Expression> out = new HashMap<>();
        for (Map.Entry<Key, Expression> term : nf.entrySet()) {
            Map<Term, Integer> atomsOut = new HashMap<>();
            Expression coefficient = term.getValue();
            for (Map.Entry<Term, Integer> a : term.getKey().atoms().entrySet()) {
                Term base = baseOf.get(a.getKey());
                if (base == null) {
                    atomsOut.merge(a.getKey(), a.getValue(), Terms::addExponents);
                    continue;
                }
                int shift = shiftOf.get(a.getKey());
                if (shift != 0) {
                    coefficient = coefficient.multiply(pochhammerPower(argumentOf.get(base), shift, a.getValue()));
                }
                atomsOut.merge(base, a.getValue(), Terms::addExponents);
            }
            atomsOut.values().removeIf(e -> e == 0);
            addInto(out, single(new Key(atomsOut), coefficient));
        }
        return out;
    }

    private static Map<Key, Expression> single(Key k, Expression c) {
        Map<Key, Expression> m = new HashMap<>();
        if (!c.isZero()) {
            m.put(k, c);
        }
        return m;
    }

    private static Map<Key, Expression> constant(Rational r) {
        return single(RATIONAL, Expression.constant(r));
    }

    private static void addInto(Map<Key, Expression> acc, Map<Key, Expression> more) {
        for (Map.Entry<Key, Expression> e : more.entrySet()) {
            Expression sum = acc.containsKey(e.getKey()) ? acc.get(e.getKey()).add(e.getValue()) : e.getValue();
            if (sum.isZero()) {
                acc.remove(e.getKey());
            } else {
                acc.put(e.getKey(), sum);
            }
        }
        if (acc.size() > MAX_MONOMIALS) {
            throw new ContourException("a symbolic term grew past " + MAX_MONOMIALS + " monomials");
        }
    }

    private static Map<Key, Expression> multiply(Map<Key, Expression> a, Map<Key, Expression> b) {
        if ((long) a.size() * b.size() > MAX_MONOMIALS) {
            throw new ContourException("a symbolic product would have more than " + MAX_MONOMIALS + " monomials");
        }
        Map<Key, Expression> acc = new HashMap<>();
        for (Map.Entry<Key, Expression> x : a.entrySet()) {
            for (Map.Entry<Key, Expression> y : b.entrySet()) {
                addInto(acc, single(x.getKey().times(y.getKey()), x.getValue().multiply(y.getValue())));
            }
        }
        return acc;
    }

    private static Term toTerm(Map<Key, Expression> nf) {
        if (nf.isEmpty()) {
            return new Term.Leaf(Expression.ZERO);
        }
        List<Map.Entry<Key, Expression>> entries = new ArrayList<>(nf.entrySet());
        entries.sort(Comparator.comparing(e -> keyOrder(e.getKey())));
        List<Term> terms = new ArrayList<>();
        for (Map.Entry<Key, Expression> e : entries) {
            if (e.getKey().atoms().isEmpty()) {
                terms.add(new Term.Leaf(e.getValue()));
                continue;
            }
            List<Term> factors = new ArrayList<>();
            if (!e.getValue().equals(Expression.ONE)) {
                factors.add(new Term.Leaf(e.getValue()));
            }
            List<Map.Entry<Term, Integer>> atoms = new ArrayList<>(e.getKey().atoms().entrySet());
            atoms.sort(Comparator.comparing(a -> sortKey(a.getKey())));
            for (Map.Entry<Term, Integer> a : atoms) {
                factors.add(a.getValue() == 1 ? a.getKey() : new Term.Power(a.getKey(), a.getValue()));
            }
            terms.add(factors.size() == 1 ? factors.get(0) : new Term.Product(factors));
        }
        return terms.size() == 1 ? terms.get(0) : new Term.Sum(terms);
    }

    private static String keyOrder(Key k) {
        List<String> parts = new ArrayList<>();
        k.atoms().forEach((a, e) -> parts.add(sortKey(a) + "^" + e));
        parts.sort(Comparator.naturalOrder());
        return parts.size() + ":" + String.join("*", parts);
    }

    /** A deterministic ordering key for atoms (structural text). */
    static String sortKey(Term t) {
        return t.toString();
    }
}
