package dev.contour.algebra;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * A canonical rational function num/den over Q.
 *
 * <p>Canonical form: numerator and denominator coprime; the denominator is kept as a product of
 * powers of pairwise coprime factors: primitive linear factors (integer coefficients, positive
 * leading coefficient, sorted by {@link Polynomial#compareTo}) and at most one cofactor (primitive,
 * positive leading coefficient, exponent one, with no linear factor over Q; {@link Polynomial#ONE}
 * when absent); all rational constants live in the numerator. Zero is 0/1. Equal values have
 * identical representations, so equals/hashCode are structural. Every public operation returns a
 * canonical value.
 *
 * <p>Why factored: the denominators met in Mellin amplitudes are products of linear forms, so a sum
 * needs only the merge of factor lists (lcm by maximal exponent) and cancellation is a trial
 * division by each known linear factor; a general gcd is used only against the cofactor.
 */
public final class RationalFunction {
    private static final Polynomial[] NO_FACTORS = new Polynomial[0];
    private static final int[] NO_MULT = new int[0];

    public static final RationalFunction ZERO = new RationalFunction(Polynomial.ZERO, NO_FACTORS, NO_MULT, Polynomial.ONE);
    public static final RationalFunction ONE = new RationalFunction(Polynomial.ONE, NO_FACTORS, NO_MULT, Polynomial.ONE);

    private final Polynomial num;
    /** Sorted, distinct, primitive linear factors of the denominator. */
    private final Polynomial[] lin;
    /** Their exponents, each at least 1. */
    private final int[] mult;
    /** The non-linear rest of the denominator, primitive; ONE when absent. */
    private final Polynomial cof;
    private int hash;
    /** The expanded denominator once computed (benign race: any thread computes the same value). */
    private Polynomial expanded;
    /** The variables once asked for (unmodifiable, so safely published through the wrapper's final field). */
    private SortedSet<String> variables;

    private RationalFunction(Polynomial num, Polynomial[] lin, int[] mult, Polynomial cof) {
        this.num = num;
        this.lin = lin;
        this.mult = mult;
        this.cof = cof;
    }

    public static RationalFunction of(Polynomial p) {
        return p.isZero() ? ZERO : new RationalFunction(p, NO_FACTORS, NO_MULT, Polynomial.ONE);
    }

    /** num/den, cancelled and normalised; den = 0 throws ContourException. */
    public static RationalFunction of(Polynomial num, Polynomial den) {
        if (den.isZero()) {
            throw new ContourException("division by zero: (" + num + ") / 0");
        }
        if (num.isZero()) {
            return ZERO;
        }
        if (den.isConstant()) {
            return of(num.multiply(den.constantValue().inverse()));
        }
        LinearFactors.Split s = LinearFactors.split(den);
        Builder b = new Builder(num.multiply(s.unit().inverse()), s.cofactor());
        for (LinearFactors.Factor f : s.factors()) {
            b.factors.put(f.base(), f.multiplicity());
        }
        b.cancel();
        return b.build();
    }

    public static RationalFunction constant(Rational c) {
        return of(Polynomial.constant(c));
    }

    public static RationalFunction constant(long c) {
        return constant(Rational.of(c));
    }

    public static RationalFunction variable(String name) {
        return of(Polynomial.variable(name));
    }

    /** Mutable assembly of a result inside one operation. */
    private static final class Builder {
        Polynomial num;
        final TreeMap<Polynomial, Integer> factors = new TreeMap<>();
        Polynomial cof;
        /** Linear factors (with repetition) cancelled from the denominator. */
        final List<Polynomial> removed = new ArrayList<>();
        /** Set when a cancelled power was too high to list in {@link #removed} (which is then incomplete). */
        boolean removedOverflow;

        Builder(Polynomial num, Polynomial cof) {
            this.num = num;
            this.cof = cof;
        }

        /** Removes common factors of the numerator and the denominator. */
        void cancel() {
            cancel(factors.keySet(), cof);
        }

        /**
         * Removes common factors of the numerator and the denominator, knowing that only the given
         * linear factors and divisors of {@code cofPart} (a divisor of the cofactor) can be common.
         */
        void cancel(java.util.Collection<Polynomial> candidates, Polynomial cofPart) {
            if (num.isZero()) {
                return;
            }
            for (Polynomial l : candidates) {
                int e = factors.get(l);
                Polynomial q;
                if (l.coeffs.length == 1 && e > 1) {
                    // A bare variable: its power in the numerator is read off, not found by repeated division.
                    int k = Math.min(e, num.powerOfVariableDividing(l.vars[0]));
                    num = num.divideByVariablePower(l.vars[0], k);
                    e -= k;
                    for (int i = 0; i < k && i < 64; i++) {
                        removed.add(l);
                    }
                    if (k > 64) {
                        removedOverflow = true;
                    }
                }
                while (e > 0 && !num.isConstant() && (q = num.divideOrNull(l)) != null) {
                    num = q;
                    e--;
                    removed.add(l);
                }
                factors.put(l, e);
            }
            factors.values().removeIf(e -> e == 0);
            if (!cofPart.isConstant() && !num.isConstant()) {
                Polynomial g = PolynomialGcd.gcd(num, cofPart);
                if (!g.isConstant()) {
                    num = num.divideOrNull(g);
                    cof = cof.divideOrNull(g);
                }
            }
        }

        RationalFunction build() {
            if (num.isZero()) {
                return ZERO;
            }
            Rational c = cof.content();
            if (!c.isOne()) {
                cof = cof.multiply(c.inverse());
                num = num.multiply(c.inverse());
            }
            factors.values().removeIf(e -> e == 0);
            Polynomial[] l = factors.keySet().toArray(NO_FACTORS);
            int[] m = new int[l.length];
            int i = 0;
            for (int e : factors.values()) {
                m[i++] = e;
            }
            return new RationalFunction(num, l, m, cof);
        }

        /** Divides by a linear or constant polynomial raised to e, normalising it first. */
        void divideByLinear(Polynomial l, int e, String why) {
            if (l.isZero()) {
                throw new ContourException("division by zero: " + why);
            }
            Rational c = l.content();
            num = num.multiply(c.pow(-e));
            if (!l.isConstant()) {
                factors.merge(l.multiply(c.inverse()), e, Integer::sum);
            }
        }
    }

    // ---------------------------------------------------------------- arithmetic

    public RationalFunction add(RationalFunction o) {
        if (o.isZero()) {
            return this;
        }
        if (isZero()) {
            return o;
        }
        if (isPolynomial() && o.isPolynomial()) {
            return of(num.add(o.num));
        }
        if (sameDenominator(o)) {
            Builder b = new Builder(num.add(o.num), cof);
            for (int i = 0; i < lin.length; i++) {
                b.factors.put(lin[i], mult[i]);
            }
            b.cancel();
            return b.build();
        }
        // Common denominator: factor lists merged by maximal exponent, cofactors by their lcm.
        Polynomial ma = Polynomial.ONE;
        Polynomial mb = Polynomial.ONE;
        Polynomial lcmCof;
        Polynomial commonCof = Polynomial.ONE;
        if (cof.equals(o.cof)) {
            lcmCof = cof;
            commonCof = cof;
        } else if (cof.isOne()) {
            lcmCof = o.cof;
            ma = o.cof;
        } else if (o.cof.isOne()) {
            lcmCof = cof;
            mb = cof;
        } else {
            Polynomial g = PolynomialGcd.gcd(cof, o.cof);
            commonCof = g;
            Polynomial cb = o.cof.divideOrNull(g);
            Polynomial ca = cof.divideOrNull(g);
            lcmCof = cof.multiply(cb);
            ma = cb;
            mb = ca;
        }
        Builder b = new Builder(null, lcmCof);
        // Only factors with equal exponents on both sides can cancel from the new numerator: where one
        // side has the higher power, the other side's term carries that factor and the first does not.
        List<Polynomial> shared = new ArrayList<>();
        // Factor powers making up ma = L/den_a and mb = L/den_b, and the common powers min(ea, eb).
        List<Polynomial> upA = new ArrayList<>();
        List<Polynomial> upB = new ArrayList<>();
        List<Polynomial> common = new ArrayList<>();
        int i = 0;
        int j = 0;
        while (i < lin.length || j < o.lin.length) {
            int c = i == lin.length ? 1 : j == o.lin.length ? -1 : lin[i].compareTo(o.lin[j]);
            if (c < 0) {
                b.factors.put(lin[i], mult[i]);
                addPowers(upB, lin[i], mult[i]);
                i++;
            } else if (c > 0) {
                b.factors.put(o.lin[j], o.mult[j]);
                addPowers(upA, o.lin[j], o.mult[j]);
                j++;
            } else {
                int e = Math.max(mult[i], o.mult[j]);
                b.factors.put(lin[i], e);
                addPowers(upA, lin[i], e - mult[i]);
                addPowers(upB, lin[i], e - o.mult[j]);
                addPowers(common, lin[i], Math.min(mult[i], o.mult[j]));
                if (mult[i] == o.mult[j]) {
                    shared.add(lin[i]);
                }
                i++;
                j++;
            }
        }
        // L/den_a is also den_b divided by the common powers: with a cached expansion of den_b that is
        // cheaper when few factors are common (a long sum gaining one small term at a time).
        boolean plain = cof.isOne() && o.cof.isOne();
        if (plain) {
            // Expanding a short denominator is cheap, and lets the result carry its own expansion.
            if (expanded == null && lin.length <= 4) {
                denominator();
            }
            if (o.expanded == null && o.lin.length <= 4) {
                o.denominator();
            }
        }
        Polynomial lcmExpanded = null;
        if (plain && o.expanded != null && common.size() < upA.size()) {
            ma = divideAll(o.expanded, common);
        } else {
            ma = ma.multiply(productOf(upA));
        }
        if (plain && expanded != null && common.size() < upB.size()) {
            mb = divideAll(expanded, common);
        } else {
            mb = mb.multiply(productOf(upB));
        }
        if (plain && (expanded != null || o.expanded != null)) {
            lcmExpanded = expanded != null ? expanded.multiply(ma) : o.expanded.multiply(mb);
        }
        b.num = num.multiply(ma).add(o.num.multiply(mb));
        b.cancel(shared, commonCof);
        RationalFunction r = b.build();
        if (lcmExpanded != null && !r.isZero() && !b.removedOverflow) {
            r.expanded = divideAll(lcmExpanded, b.removed);
        }
        return r;
    }

    private static void addPowers(List<Polynomial> out, Polynomial l, int e) {
        for (int k = 0; k < e; k++) {
            out.add(l);
        }
    }

    /** Product of linear factors, as a balanced tree (sizes stay even, merges stay short). */
    private static Polynomial productOf(List<Polynomial> fs) {
        return productOf(fs, 0, fs.size());
    }

    private static Polynomial productOf(List<Polynomial> fs, int from, int to) {
        if (to - from == 0) {
            return Polynomial.ONE;
        }
        if (to - from == 1) {
            return fs.get(from);
        }
        int mid = (from + to) >>> 1;
        return productOf(fs, from, mid).multiply(productOf(fs, mid, to));
    }

    /** p divided by linear factors known to divide it (no divisibility pre-test). */
    private static Polynomial divideAll(Polynomial p, List<Polynomial> fs) {
        for (Polynomial f : fs) {
            p = p.divideLinearOrNull(f);
        }
        return p;
    }

    /**
     * The sum of many functions, added as a balanced tree so that the large common denominators are
     * built only near the root (much cheaper than a left-to-right fold).
     */
    public static RationalFunction sum(java.util.Collection<RationalFunction> terms) {
        RationalFunction[] a = terms.toArray(new RationalFunction[0]);
        return a.length == 0 ? ZERO : sum(a, 0, a.length);
    }

    private static RationalFunction sum(RationalFunction[] a, int from, int to) {
        if (to - from == 1) {
            return a[from];
        }
        Cancellation.check();
        int mid = (from + to) >>> 1;
        return sum(a, from, mid).add(sum(a, mid, to));
    }

    private boolean sameDenominator(RationalFunction o) {
        return cof.equals(o.cof) && Arrays.equals(mult, o.mult) && Arrays.equals(lin, o.lin);
    }

    public RationalFunction subtract(RationalFunction o) {
        if (isPolynomial() && o.isPolynomial()) {
            return of(num.subtract(o.num));
        }
        return add(o.negate());
    }

    public RationalFunction multiply(RationalFunction o) {
        if (isZero() || o.isZero()) {
            return ZERO;
        }
        if (o.isConstant()) {
            return multiply(o.num.constantValue());
        }
        if (isConstant()) {
            return o.multiply(num.constantValue());
        }
        // Each numerator is already coprime to its own denominator: cancel it only against the other's.
        Builder x = o.builder(num);
        x.cancel();
        Builder y = builder(o.num);
        y.cancel();
        Builder b = new Builder(x.num.multiply(y.num), x.cof.multiply(y.cof));
        b.factors.putAll(x.factors);
        for (Map.Entry<Polynomial, Integer> f : y.factors.entrySet()) {
            b.factors.merge(f.getKey(), f.getValue(), Integer::sum);
        }
        return b.build();
    }

    /** A builder holding this denominator over the given numerator. */
    private Builder builder(Polynomial numerator) {
        Builder b = new Builder(numerator, cof);
        for (int i = 0; i < lin.length; i++) {
            b.factors.put(lin[i], mult[i]);
        }
        return b;
    }

    /** p over this function's denominator, cancelled (package-private: used to expand numerators). */
    RationalFunction withNumerator(Polynomial p) {
        if (p.isZero()) {
            return ZERO;
        }
        Builder b = builder(p);
        b.cancel();
        return b.build();
    }

    public RationalFunction multiply(Rational c) {
        if (c.isZero() || isZero()) {
            return ZERO;
        }
        return c.isOne() ? this : new RationalFunction(num.multiply(c), lin, mult, cof);
    }

    public RationalFunction divide(RationalFunction o) {
        if (o.isZero()) {
            throw new ContourException("division by zero: (" + this + ") / 0");
        }
        if (o.isPolynomial() && o.num.isLinear()) {
            return divideByLinear(o.num);
        }
        return multiply(o.inverse());
    }

    /**
     * This divided by a polynomial of total degree one: the factor goes straight into the factored
     * denominator (ansatz terms divide by one linear form after another), with no product expanded
     * and nothing re-split. Same canonical value as {@code multiply(of(l).inverse())}.
     */
    private RationalFunction divideByLinear(Polynomial l) {
        if (isZero()) {
            return ZERO;
        }
        Rational c = l.content();
        Polynomial base = c.isOne() ? l : l.multiply(c.inverse());
        Rational scale = c.inverse();
        int at = Arrays.binarySearch(lin, base);
        if (at < 0 && !num.isConstant()) {
            // The numerator is coprime to the denominator, so only a new factor can cancel, and once.
            Polynomial q = num.divideOrNull(base);
            if (q != null) {
                return new RationalFunction(q.multiply(scale), lin, mult, cof);
            }
        }
        Polynomial[] l2;
        int[] m2;
        if (at >= 0) {
            l2 = lin;
            m2 = mult.clone();
            m2[at] = Math.addExact(m2[at], 1);
        } else {
            int ins = -at - 1;
            l2 = new Polynomial[lin.length + 1];
            m2 = new int[lin.length + 1];
            System.arraycopy(lin, 0, l2, 0, ins);
            System.arraycopy(mult, 0, m2, 0, ins);
            l2[ins] = base;
            m2[ins] = 1;
            System.arraycopy(lin, ins, l2, ins + 1, lin.length - ins);
            System.arraycopy(mult, ins, m2, ins + 1, lin.length - ins);
        }
        return new RationalFunction(num.multiply(scale), l2, m2, cof);
    }

    public RationalFunction negate() {
        return multiply(Rational.MINUS_ONE);
    }

    public RationalFunction inverse() {
        if (isZero()) {
            throw new ContourException("division by zero: inverse of 0");
        }
        if (num.isConstant()) {
            return new RationalFunction(denominator().multiply(num.constantValue().inverse()), NO_FACTORS, NO_MULT, Polynomial.ONE);
        }
        LinearFactors.Split s = LinearFactors.split(num);
        Builder b = new Builder(denominator().multiply(s.unit().inverse()), s.cofactor());
        for (LinearFactors.Factor f : s.factors()) {
            b.factors.put(f.base(), f.multiplicity());
        }
        return b.build();
    }

    /** Integer power, negative allowed (0^negative throws). */
    public RationalFunction pow(int exponent) {
        if (exponent < 0) {
            if (isZero()) {
                throw new ContourException("division by zero: 0^" + exponent);
            }
            return inverse().pow(-exponent);
        }
        if (exponent == 0) {
            return ONE;
        }
        if (exponent == 1 || isOne()) {
            return this;
        }
        int[] m = new int[mult.length];
        for (int i = 0; i < m.length; i++) {
            m[i] = Math.multiplyExact(mult[i], exponent);
        }
        return new RationalFunction(num.pow(exponent), lin, m, cof.pow(exponent));
    }

    // ---------------------------------------------------------------- substitution and evaluation

    /** Simultaneous substitution of rational functions for variables. */
    public RationalFunction substitute(Map<String, RationalFunction> values) {
        Map<String, Polynomial> linear = new HashMap<>();
        boolean allLinear = true;
        for (String v : variables()) {
            RationalFunction f = values.get(v);
            if (f != null) {
                if (f.isPolynomial() && f.num.totalDegree() <= 1) {
                    linear.put(v, f.num);
                } else {
                    allLinear = false;
                }
            }
        }
        if (allLinear) {
            return substituteLinear(linear);
        }
        RationalFunction result = evaluateWith(num, values);
        for (int i = 0; i < lin.length; i++) {
            result = result.divide(nonZero(evaluateWith(lin[i], values), lin[i]).pow(mult[i]));
        }
        if (!cof.isOne()) {
            result = result.divide(nonZero(evaluateWith(cof, values), cof));
        }
        return result;
    }

    private static RationalFunction nonZero(RationalFunction f, Polynomial factor) {
        if (f.isZero()) {
            throw new ContourException("division by zero: the denominator factor (" + factor + ") vanishes after substitution");
        }
        return f;
    }

    /** p with rational-function values put in for its variables. */
    private static RationalFunction evaluateWith(Polynomial p, Map<String, RationalFunction> values) {
        RationalFunction result = ZERO;
        List<Map<Integer, RationalFunction>> cache = new ArrayList<>();
        RationalFunction[] base = new RationalFunction[p.vars.length];
        for (int v = 0; v < p.vars.length; v++) {
            RationalFunction val = values.get(p.vars[v]);
            base[v] = val == null ? variable(p.vars[v]) : val;
            cache.add(new HashMap<>());
        }
        for (int t = 0; t < p.coeffs.length; t++) {
            RationalFunction term = constant(p.coeffs[t]);
            for (int v = 0; v < p.vars.length; v++) {
                int e = p.exps[t][v];
                if (e > 0) {
                    RationalFunction bv = base[v];
                    term = term.multiply(cache.get(v).computeIfAbsent(e, bv::pow));
                }
            }
            result = result.add(term);
        }
        return result;
    }

    /**
     * Simultaneous substitution of polynomials of total degree at most 1 (shifts s -> s - 2,
     * swaps s <-> t, t -> 4p - s - t). Linear denominator factors stay linear, so this path needs
     * no GCD in the common case: when the substitution is an invertible affine change of the
     * variables involved, coprimality and irreducibility are preserved and only renormalisation of
     * the factors is needed.
     */
    public RationalFunction substituteLinear(Map<String, Polynomial> values) {
        return substituteLinear(values, null);
    }

    /**
     * {@link #substituteLinear(Map)} with a memo of linear denominator factors to their images under
     * these values (null for none), shared by the coefficients of one expression: an ansatz's many
     * terms repeat few factors.
     */
    RationalFunction substituteLinear(Map<String, Polynomial> values, Map<Polynomial, FactorImage> images) {
        if (cof.isOne() && !isZero()) {
            return substituteLinearFactored(values, images);
        }
        Map<String, Polynomial> used = new HashMap<>();
        for (String v : variables()) {
            Polynomial p = values.get(v);
            if (p != null) {
                if (p.totalDegree() > 1) {
                    throw new ContourException("substituteLinear needs values of degree at most 1, got " + v + " = " + p);
                }
                used.put(v, p);
            }
        }
        if (used.isEmpty()) {
            return this;
        }
        Builder b = new Builder(num.substitute(used), Polynomial.ONE);
        for (int i = 0; i < lin.length; i++) {
            Polynomial l = lin[i];
            b.divideByLinear(l.substitute(used), mult[i], "the denominator factor (" + l + ") vanishes after substitution");
        }
        Polynomial newCof = cof.substitute(used);
        if (newCof.isZero()) {
            throw new ContourException("division by zero: the denominator factor (" + cof + ") vanishes after substitution");
        }
        boolean invertible = isInvertible(used);
        if (invertible) {
            Rational c = newCof.content();
            b.num = b.num.multiply(c.inverse());
            b.cof = newCof.multiply(c.inverse());
            return b.build();
        }
        // A degenerate map can merge factors, create linear factors in the cofactor, or common factors.
        LinearFactors.Split s = LinearFactors.split(newCof);
        b.num = b.num.multiply(s.unit().inverse());
        b.cof = s.cofactor();
        for (LinearFactors.Factor f : s.factors()) {
            b.factors.merge(f.base(), f.multiplicity(), Integer::sum);
        }
        b.cancel();
        return b.build();
    }

    /**
     * Linear substitution when the denominator is a product of linear factors: each factor's image
     * is linear or constant, so the new denominator is the images normalised and merged (equal
     * images add their exponents); the only possible cancellation is of the new numerator against
     * those factors, found by trial division. No rank test and no factor splitting.
     */
    private RationalFunction substituteLinearFactored(Map<String, Polynomial> values, Map<Polynomial, FactorImage> images) {
        boolean any = usesLinear(num, values);
        for (Polynomial l : lin) {
            any |= usesLinear(l, values);
        }
        if (!any) {
            return this;
        }
        Polynomial n = num.substitute(values);
        if (n.isZero()) {
            // Denominator factors are still checked: a vanishing one is an error even over a zero numerator.
            for (Polynomial l : lin) {
                imageOf(l, values, images);
            }
            return ZERO;
        }
        Rational scale = Rational.ONE;
        Polynomial[] bases = new Polynomial[lin.length];
        int[] exps = new int[lin.length];
        int k = 0;
        for (int i = 0; i < lin.length; i++) {
            FactorImage img = imageOf(lin[i], values, images);
            scale = scale.multiply(img.content().pow(-mult[i]));
            if (img.base() != null) {
                bases[k] = img.base();
                exps[k++] = mult[i];
            }
        }
        n = n.multiply(scale);
        // Sort the images (insertion sort: k is a handful of factors) and merge equal ones.
        Polynomial[] l2 = new Polynomial[k];
        int[] m2 = new int[k];
        int r = 0;
        for (int i = 0; i < k; i++) {
            Polynomial b = bases[i];
            int e = exps[i];
            int at = r;
            int c = 1;
            while (at > 0 && (c = l2[at - 1].compareTo(b)) > 0) {
                at--;
            }
            if (at > 0 && c == 0) {
                m2[at - 1] = Math.addExact(m2[at - 1], e);
                continue;
            }
            System.arraycopy(l2, at, l2, at + 1, r - at);
            System.arraycopy(m2, at, m2, at + 1, r - at);
            l2[at] = b;
            m2[at] = e;
            r++;
        }
        // Cancellation: the new numerator against each factor, by trial division.
        if (!n.isConstant()) {
            for (int i = 0; i < r; i++) {
                Polynomial q;
                while (m2[i] > 0 && !n.isConstant() && (q = n.divideOrNull(l2[i])) != null) {
                    n = q;
                    m2[i]--;
                }
            }
        }
        int live = 0;
        for (int i = 0; i < r; i++) {
            if (m2[i] > 0) {
                l2[live] = l2[i];
                m2[live++] = m2[i];
            }
        }
        if (live == 0) {
            return of(n);
        }
        return new RationalFunction(n, live == l2.length ? l2 : Arrays.copyOf(l2, live),
                live == m2.length ? m2 : Arrays.copyOf(m2, live), Polynomial.ONE);
    }

    /**
     * Where the residue at a simple pole still has a pole, without building the residue: for the
     * simple pole of this function on its linear denominator factor {@code factor} (solved as
     * {@code x = at}, {@code at} free of x), the first factor (in canonical order) of the residue's
     * fully cancelled denominator that passes {@code relevant}, or null when there is none (also when
     * the residue is zero). Stops at the first such factor: the images of the other denominator
     * factors are tested against the numerator's image one at a time, by a modular screen and then
     * exact division, and a factor that survives ends the search.
     */
    public Polynomial firstResiduePole(String x, Polynomial factor, Polynomial at, java.util.function.Predicate<Polynomial> relevant) {
        int own = Arrays.asList(lin).indexOf(factor);
        if (own < 0 || mult[own] != 1) {
            throw new ContourException("internal: " + factor + " is not a simple pole of " + this);
        }
        Map<String, Polynomial> onPole = Map.of(x, at);
        if (!cof.isOne()) {
            RationalFunction r = multiply(of(factor)).substituteLinear(onPole);
            for (LinearFactors.Factor d : r.denominatorFactors()) {
                if (relevant.test(d.base())) {
                    return d.base();
                }
            }
            return null;
        }
        Polynomial n = num.substitute(onPole);
        if (n.isZero()) {
            return null;
        }
        TreeMap<Polynomial, Integer> images = new TreeMap<>();
        for (int i = 0; i < lin.length; i++) {
            if (i == own) {
                continue;
            }
            FactorImage img = imageOf(lin[i], onPole, null);
            if (img.base() != null) {
                images.merge(img.base(), mult[i], Integer::sum);
            }
        }
        for (Map.Entry<Polynomial, Integer> e : images.entrySet()) {
            Polynomial base = e.getKey();
            if (!relevant.test(base)) {
                continue;
            }
            int m = e.getValue();
            Polynomial q;
            while (m > 0 && !n.isConstant() && (q = n.divideOrNull(base)) != null) {
                n = q;
                m--;
            }
            if (m > 0) {
                return base;
            }
        }
        return null;
    }

    /** Whether p has a variable given a value; a value of degree above one throws. */
    private static boolean usesLinear(Polynomial p, Map<String, Polynomial> values) {
        boolean any = false;
        for (String v : p.vars) {
            Polynomial val = values.get(v);
            if (val != null) {
                if (val.totalDegree() > 1) {
                    throw new ContourException("substituteLinear needs values of degree at most 1, got " + v + " = " + val);
                }
                any = true;
            }
        }
        return any;
    }

    /** Whether some variable of this function satisfies the test (without building {@link #variables()}). */
    public boolean mentionsAny(java.util.function.Predicate<String> test) {
        for (String v : num.vars) {
            if (test.test(v)) {
                return true;
            }
        }
        for (Polynomial l : lin) {
            for (String v : l.vars) {
                if (test.test(v)) {
                    return true;
                }
            }
        }
        for (String v : cof.vars) {
            if (test.test(v)) {
                return true;
            }
        }
        return false;
    }

    /** Adds the variables to out without building the sorted set of {@link #variables()}. */
    void addVariablesTo(java.util.Collection<String> out) {
        SortedSet<String> v = variables;
        if (v != null) {
            out.addAll(v);
            return;
        }
        Collections.addAll(out, num.vars);
        for (Polynomial l : lin) {
            Collections.addAll(out, l.vars);
        }
        Collections.addAll(out, cof.vars);
    }

    /**
     * The image of a linear denominator factor as content times a primitive base (null when the image
     * is constant). Memoised images share their bases between all the coefficients that have them.
     */
    record FactorImage(Rational content, Polynomial base) { }

    /** The image of a denominator factor (memoised when a memo is given); zero throws. */
    private static FactorImage imageOf(Polynomial l, Map<String, Polynomial> values, Map<Polynomial, FactorImage> images) {
        FactorImage img = images == null ? null : images.get(l);
        if (img == null) {
            Polynomial p = l.substitute(values);
            if (p.isZero()) {
                throw new ContourException("division by zero: the denominator factor (" + l + ") vanishes after substitution");
            }
            Rational c = p.content();
            img = new FactorImage(c, p.isConstant() ? null : c.isOne() ? p : p.multiply(c.inverse()));
            if (images != null) {
                images.put(l, img);
            }
        }
        return img;
    }

    /** Whether the affine map of the variables of this function has a linear part of full rank. */
    private boolean isInvertible(Map<String, Polynomial> used) {
        SortedSet<String> own = variables();
        TreeSet<String> target = new TreeSet<>();
        Map<String, Polynomial> images = new HashMap<>();
        for (String v : own) {
            Polynomial img = used.getOrDefault(v, Polynomial.variable(v));
            images.put(v, img);
            target.addAll(img.variables());
        }
        if (target.size() < own.size()) {
            return false;
        }
        List<String> cols = new ArrayList<>(target);
        Rational[][] m = new Rational[own.size()][cols.size()];
        int r = 0;
        for (String v : own) {
            Polynomial img = images.get(v);
            for (int c = 0; c < cols.size(); c++) {
                m[r][c] = img.coefficient(cols.get(c), 1).isZero() ? Rational.ZERO
                        : img.coefficient(cols.get(c), 1).constantValue();
            }
            r++;
        }
        return rank(m) == own.size();
    }

    private static int rank(Rational[][] m) {
        int rows = m.length;
        int cols = rows == 0 ? 0 : m[0].length;
        int rank = 0;
        for (int c = 0; c < cols && rank < rows; c++) {
            int p = -1;
            for (int i = rank; i < rows; i++) {
                if (!m[i][c].isZero()) {
                    p = i;
                    break;
                }
            }
            if (p < 0) {
                continue;
            }
            Rational[] t = m[p];
            m[p] = m[rank];
            m[rank] = t;
            for (int i = rank + 1; i < rows; i++) {
                if (!m[i][c].isZero()) {
                    Rational f = m[i][c].divide(m[rank][c]);
                    for (int k = c; k < cols; k++) {
                        m[i][k] = m[i][k].subtract(f.multiply(m[rank][k]));
                    }
                }
            }
            rank++;
        }
        return rank;
    }

    /** Value at a point; ContourException naming the factor when the point is a pole. */
    public Rational evaluate(Map<String, Rational> point) {
        Rational den = Rational.ONE;
        for (int i = 0; i < lin.length; i++) {
            Rational v = lin[i].evaluate(point);
            if (v.isZero()) {
                throw new ContourException("pole: the denominator factor (" + lin[i] + ") vanishes at " + point);
            }
            den = den.multiply(v.pow(mult[i]));
        }
        if (!cof.isOne()) {
            Rational v = cof.evaluate(point);
            if (v.isZero()) {
                throw new ContourException("pole: the denominator factor (" + cof + ") vanishes at " + point);
            }
            den = den.multiply(v);
        }
        return num.evaluate(point).divide(den);
    }

    public RationalFunction evaluatePartially(Map<String, Rational> point) {
        Map<String, Polynomial> values = new HashMap<>();
        for (Map.Entry<String, Rational> e : point.entrySet()) {
            values.put(e.getKey(), Polynomial.constant(e.getValue()));
        }
        return substituteLinear(values);
    }

    public RationalFunction derivative(String variable) {
        // (n/D)' = (n' - n * D'/D) / D with D'/D = sum e_i l_i'/l_i + c'/c.
        RationalFunction logDerivative = ZERO;
        for (int i = 0; i < lin.length; i++) {
            Polynomial d = lin[i].derivative(variable);
            if (!d.isZero()) {
                logDerivative = logDerivative.add(of(d.multiply(Rational.of(mult[i])), lin[i]));
            }
        }
        if (!cof.isOne()) {
            logDerivative = logDerivative.add(of(cof.derivative(variable), cof));
        }
        RationalFunction top = of(num.derivative(variable)).subtract(of(num).multiply(logDerivative));
        return top.multiply(new RationalFunction(Polynomial.ONE, lin, mult, cof));
    }

    // ---------------------------------------------------------------- structure

    public Polynomial numerator() {
        return num;
    }

    /** The expanded denominator (product of the factors). */
    public Polynomial denominator() {
        Polynomial d = expanded;
        if (d == null) {
            List<Polynomial> fs = new ArrayList<>();
            for (int i = 0; i < lin.length; i++) {
                addPowers(fs, lin[i], mult[i]);
            }
            d = productOf(fs).multiply(cof);
            expanded = d;
        }
        return d;
    }

    /** The denominator's factors with their exponents, in canonical order: linear factors sorted, then the cofactor (if any). */
    public List<LinearFactors.Factor> denominatorFactors() {
        List<LinearFactors.Factor> out = new ArrayList<>();
        for (int i = 0; i < lin.length; i++) {
            out.add(new LinearFactors.Factor(lin[i], mult[i]));
        }
        if (!cof.isOne()) {
            out.add(new LinearFactors.Factor(cof, 1));
        }
        return Collections.unmodifiableList(out);
    }

    public boolean isZero() {
        return num.isZero();
    }

    public boolean isOne() {
        return isPolynomial() && num.isOne();
    }

    public boolean isPolynomial() {
        return lin.length == 0 && cof.isOne();
    }

    public boolean isConstant() {
        return isPolynomial() && num.isConstant();
    }

    public Rational constantValue() {
        if (!isConstant()) {
            throw new ContourException("not a constant: " + this);
        }
        return num.constantValue();
    }

    public SortedSet<String> variables() {
        SortedSet<String> v = variables;
        if (v == null) {
            TreeSet<String> s = new TreeSet<>(Arrays.asList(num.vars));
            for (Polynomial l : lin) {
                s.addAll(Arrays.asList(l.vars));
            }
            s.addAll(Arrays.asList(cof.vars));
            v = Collections.unmodifiableSortedSet(s);
            variables = v;
        }
        return v;
    }

    /** Re-checks every canonical-form invariant from scratch (tests call it after each operation). */
    public boolean isCanonical() {
        if (num.isZero()) {
            return lin.length == 0 && cof.isOne();
        }
        if (lin.length != mult.length) {
            return false;
        }
        for (int i = 0; i < lin.length; i++) {
            Polynomial l = lin[i];
            if (!l.isLinear() || !l.primitivePart().equals(l) || mult[i] < 1) {
                return false;
            }
            if (i > 0 && lin[i - 1].compareTo(l) >= 0) {
                return false;
            }
            if (num.divideOrNull(l) != null) {
                return false;
            }
        }
        if (cof.isZero() || !cof.primitivePart().equals(cof)) {
            return false;
        }
        if (!cof.isOne()) {
            if (cof.isConstant() || !LinearFactors.split(cof).factors().isEmpty()) {
                return false;
            }
            if (!PolynomialGcd.gcd(num, cof).isConstant()) {
                return false;
            }
        }
        return true;
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        return o instanceof RationalFunction r && hashCode() == r.hashCode() && num.equals(r.num)
                && Arrays.equals(mult, r.mult) && Arrays.equals(lin, r.lin) && cof.equals(r.cof);
    }

    @Override
    public int hashCode() {
        int h = hash;
        if (h == 0) {
            h = ((num.hashCode() * 31 + Arrays.hashCode(lin)) * 31 + Arrays.hashCode(mult)) * 31 + cof.hashCode();
            hash = h == 0 ? 1 : h;
        }
        return hash;
    }

    /** A debugging form such as {@code (s + 1)/((s - 2)^2*(t - 3))}; user-facing printing lives in print/. */
    @Override
    public String toString() {
        if (isPolynomial()) {
            return num.toString();
        }
        StringBuilder d = new StringBuilder();
        for (LinearFactors.Factor f : denominatorFactors()) {
            if (d.length() > 0) {
                d.append('*');
            }
            d.append('(').append(f.base()).append(')');
            if (f.multiplicity() > 1) {
                d.append('^').append(f.multiplicity());
            }
        }
        return "(" + num + ")/(" + d + ")";
    }
}
