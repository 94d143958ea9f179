package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.Parallel;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.Supplier;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Collecting an operator application ({@link ShiftedSum#expandAt}) on the shared pool gives the same
 * canonical expression with 1, 2 and 4 threads, and the same as adding the shifted products one by
 * one with {@link Expression#add} (an independent route through the algebra).
 */
class ParallelCollectionProperties {
    private static final List<Integer> THREADS = List.of(1, 2, 4);

    @Property(tries = 15)
    void collectionDoesNotDependOnTheThreadCount(@ForAll("blocks") List<ShiftedSum.Block> blocks,
                                                 @ForAll("arguments") Expression argument) {
        Expression reference = Expression.ZERO;
        for (ShiftedSum.Block b : blocks) {
            Expression moved = b.shift().isEmpty() ? argument : argument.substituteLinear(b.substitution());
            reference = reference.add(b.coefficient().multiply(moved));
        }
        for (int n : THREADS) {
            Expression value = withThreads(n, () -> ShiftedSum.expandAt(blocks, argument));
            assertTrue(value.isCanonical(), "canonical with " + n + " threads");
            assertEquals(reference, value, "collected with " + n + " threads");
            assertEquals(reference.toString(), value.toString(), "printed alike with " + n + " threads");
        }
    }

    static <T> T withThreads(int n, Supplier<T> work) {
        int before = Parallel.threads();
        Parallel.setThreads(n);
        try {
            return work.get();
        } finally {
            Parallel.setThreads(before);
        }
    }

    @Provide
    Arbitrary<List<ShiftedSum.Block>> blocks() {
        Arbitrary<Map<String, Rational>> shift = Combinators.combine(Arbitraries.integers().between(-3, 3),
                Arbitraries.integers().between(-3, 3)).as((a, b) -> {
                    Map<String, Rational> m = new TreeMap<>();
                    if (a != 0) {
                        m.put("s", Rational.of(a));
                    }
                    if (b != 0) {
                        m.put("t", Rational.of(b));
                    }
                    return m;
                });
        Arbitrary<ShiftedSum.Block> block = Combinators.combine(shift, collected(2))
                .as((m, c) -> new ShiftedSum.Block(new TreeMap<>(m), c));
        return block.list().ofMinSize(1).ofMaxSize(4);
    }

    @Provide
    Arbitrary<Expression> arguments() {
        return collected(8);
    }

    /** Expressions in collected sigma, tau with random rational-function coefficients in s, t, u. */
    private static Arbitrary<Expression> collected(int maxTerms) {
        Arbitrary<Map.Entry<Monomial, RationalFunction>> term = Combinators.combine(Arbitraries.integers().between(0, 3),
                Arbitraries.integers().between(0, 3), Gen.rationalFunctions())
                .as((a, b, c) -> Map.entry(Monomial.of(Map.of("sigma", a, "tau", b)), c));
        return term.list().ofMinSize(1).ofMaxSize(maxTerms).map(ts -> {
            Expression e = Expression.ZERO;
            for (Map.Entry<Monomial, RationalFunction> t : ts) {
                if (!t.getValue().isZero()) {
                    Map<Monomial, RationalFunction> one = new java.util.HashMap<>();
                    one.put(t.getKey(), t.getValue());
                    e = e.add(Expression.of(one));
                }
            }
            return e;
        });
    }

    @Property(tries = 60)
    void resultsComeBackInIndexOrder(@ForAll("numbers") List<Integer> xs) {
        List<Integer> expected = new ArrayList<>();
        xs.forEach(x -> expected.add(x * x - 3));
        for (int n : THREADS) {
            assertEquals(expected, withThreads(n, () -> Parallel.map(xs.size(), i -> xs.get(i) * xs.get(i) - 3)));
            List<Integer> seen = new ArrayList<>();
            List<Integer> order = new ArrayList<>();
            withThreads(n, () -> {
                Parallel.forEachOrdered(xs.size(), i -> xs.get(i) * xs.get(i) - 3, (i, r) -> {
                    order.add(i);
                    seen.add(r);
                });
                return null;
            });
            assertEquals(expected, seen, "consumed results with " + n + " threads");
            assertEquals(java.util.stream.IntStream.range(0, xs.size()).boxed().toList(), order, "consumed in index order");
        }
    }

    @Provide
    Arbitrary<List<Integer>> numbers() {
        return Arbitraries.integers().between(-1000, 1000).list().ofMaxSize(300);
    }

    /**
     * The modular solver takes its primes' images in batches on the pool: the solution (or the
     * verdict of inconsistency) is the same with 1, 2 and 4 threads, and a planted unique solution
     * is found. Large entries make it need several primes.
     */
    @Property(tries = 30)
    void modularSolutionsDoNotDependOnTheThreadCount(@ForAll @net.jqwik.api.constraints.IntRange(min = 1, max = 12) int n,
                                                     @ForAll @net.jqwik.api.constraints.IntRange(min = 1, max = 16) int m,
                                                     @ForAll boolean spoil, @ForAll long seed) {
        java.util.Random rnd = new java.util.Random(seed);
        List<Rational> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(Rational.of(java.math.BigInteger.valueOf(rnd.nextLong()).pow(2), java.math.BigInteger.valueOf(1 + rnd.nextInt(1000))));
        }
        List<Map<Integer, Rational>> rows = new ArrayList<>();
        List<Rational> rhs = new ArrayList<>();
        for (int r = 0; r < m; r++) {
            Map<Integer, Rational> c = new java.util.HashMap<>();
            Rational b = Rational.ZERO;
            for (int i = 0; i < n; i++) {
                if (rnd.nextInt(2) == 0) {
                    Rational v = Rational.of(rnd.nextInt(2001) - 1000, 1 + rnd.nextInt(9));
                    c.put(i, v);
                    b = b.add(v.multiply(x.get(i)));
                }
            }
            rows.add(c);
            rhs.add(spoil && r == m - 1 ? b.add(Rational.ONE) : b);
        }
        List<LinearSystem.Solution> found = new ArrayList<>();
        for (int t : THREADS) {
            LinearSystem sys = new LinearSystem(n);
            for (int r = 0; r < m; r++) {
                sys.addRow(rows.get(r), rhs.get(r), r);
            }
            found.add(withThreads(t, sys::solve));
        }
        assertEquals(found.get(0), found.get(1), "2 threads");
        assertEquals(found.get(0), found.get(2), "4 threads");
        if (!spoil && found.get(0) instanceof LinearSystem.Unique u) {
            assertEquals(x, u.values());
        }
    }
}
