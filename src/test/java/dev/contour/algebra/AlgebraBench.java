package dev.contour.algebra;

import cc.redberry.rings.Rings;
import cc.redberry.rings.bigint.BigInteger;
import cc.redberry.rings.poly.multivar.MultivariateGCD;
import cc.redberry.rings.poly.multivar.MultivariatePolynomial;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.function.Supplier;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Benchmarks of the algebra core against rings 2.5.8 in the same JVM run (never timed assertions).
 * Run with {@code mvn -B -Pbench test -Dtest=AlgebraBench}; prints medians after JIT warm-up.
 */
@Tag("bench")
class AlgebraBench {
    private static final int WARMUP = 2;
    private static final int RUNS = 5;
    private static final java.lang.management.ThreadMXBean CPU = java.lang.management.ManagementFactory.getThreadMXBean();

    /**
     * Median CPU time of this thread in milliseconds over RUNS timed runs after WARMUP untimed ones;
     * checks each result. CPU time rather than wall time because the build machine is shared.
     */
    private static <T> double median(Supplier<T> work, java.util.function.Consumer<T> check) {
        for (int i = 0; i < WARMUP; i++) {
            check.accept(work.get());
        }
        double[] ms = new double[RUNS];
        for (int i = 0; i < RUNS; i++) {
            long t0 = CPU.getCurrentThreadCpuTime();
            T r = work.get();
            ms[i] = (CPU.getCurrentThreadCpuTime() - t0) / 1e6;
            check.accept(r);
        }
        Arrays.sort(ms);
        return ms[RUNS / 2];
    }

    private static final Polynomial S = Polynomial.variable("s");
    private static final Polynomial T = Polynomial.variable("t");

    @Test
    void sumOfFactoredFractions() {
        Random rnd = new Random(20261202);
        int n = 200;
        long[] a = new long[n];
        long[] b = new long[n];
        long[] c = new long[n];
        for (int k = 0; k < n; k++) {
            a[k] = rnd.nextInt(21) - 10;
            b[k] = rnd.nextInt(21) - 10;
            c[k] = rnd.nextInt(21) - 10;
        }
        List<RationalFunction> ours = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            Polynomial den = S.subtract(Polynomial.constant(a[k])).multiply(T.subtract(Polynomial.constant(b[k])))
                    .multiply(S.add(T).subtract(Polynomial.constant(c[k])));
            ours.add(RationalFunction.of(Polynomial.constant(k + 1), den));
        }
        var ring = Rings.MultivariateRingZ(2);
        var frac = Rings.Frac(ring);
        List<cc.redberry.rings.Rational<MultivariatePolynomial<BigInteger>>> theirs = new ArrayList<>();
        RingsBridge bridge = new RingsBridge(List.of("s", "t"));
        for (int k = 0; k < n; k++) {
            theirs.add(new cc.redberry.rings.Rational<>(ring, ring.valueOf(k + 1), bridge.toRings(ours.get(k).denominator())));
        }
        RationalFunction[] result = new RationalFunction[1];
        double oursSeq = median(() -> {
            RationalFunction acc = RationalFunction.ZERO;
            for (RationalFunction f : ours) {
                acc = acc.add(f);
            }
            return acc;
        }, r -> result[0] = r);
        double oursTree = median(() -> RationalFunction.sum(ours), r -> {
            if (!r.equals(result[0])) {
                throw new AssertionError("balanced sum differs from sequential sum");
            }
        });
        java.util.function.Consumer<cc.redberry.rings.Rational<MultivariatePolynomial<BigInteger>>> same = r -> {
            Polynomial refDen = bridge.fromRings(r.denominator()).primitivePart();
            if (!refDen.equals(result[0].denominator().primitivePart())) {
                throw new AssertionError("denominators differ from the reference");
            }
        };
        double ringsSeq = median(() -> {
            var acc = frac.getZero();
            for (var f : theirs) {
                acc = acc.add(f);
            }
            return acc;
        }, same);
        double ringsTree = median(() -> ringsSum(theirs, 0, theirs.size()), same);
        System.out.printf("[bench a] sum of %d fractions k/((s-a)(t-b)(s+t-c)), CPU ms (median of %d): ours sequential %.1f, ours balanced %.1f; rings sequential %.1f, rings balanced %.1f; ratio ours/rings %.2f sequential, %.2f balanced, %.2f best to best (goal: below 1) (result: %d linear factors, numerator of %d terms)%n",
                n, RUNS, oursSeq, oursTree, ringsSeq, ringsTree, oursSeq / ringsSeq, oursTree / ringsTree,
                Math.min(oursSeq, oursTree) / Math.min(ringsSeq, ringsTree),
                result[0].denominatorFactors().size(), result[0].numerator().termCount());
    }

    private static cc.redberry.rings.Rational<MultivariatePolynomial<BigInteger>> ringsSum(
            List<cc.redberry.rings.Rational<MultivariatePolynomial<BigInteger>>> fs, int from, int to) {
        if (to - from == 1) {
            return fs.get(from);
        }
        int mid = (from + to) >>> 1;
        return ringsSum(fs, from, mid).add(ringsSum(fs, mid, to));
    }

    private static Polynomial denseRandom(Random rnd, int degree) {
        Polynomial p = Polynomial.ZERO;
        for (int i = 0; i <= degree; i++) {
            for (int j = 0; i + j <= degree; j++) {
                for (int k = 0; i + j + k <= degree; k++) {
                    int c = rnd.nextInt(21) - 10;
                    p = p.add(Polynomial.monomial(Rational.of(c), Map.of("x", i, "y", j, "z", k)));
                }
            }
        }
        return p;
    }

    @Test
    void gcdOfDenseTrivariates() {
        Random rnd = new Random(7);
        Polynomial g = denseRandom(rnd, 5);
        Polynomial a = denseRandom(rnd, 5).multiply(g);
        Polynomial b = denseRandom(rnd, 5).multiply(g);
        RingsBridge bridge = new RingsBridge(List.of("x", "y", "z"));
        MultivariatePolynomial<BigInteger> ra = bridge.toRings(a);
        MultivariatePolynomial<BigInteger> rb = bridge.toRings(b);
        Polynomial expected = PolynomialGcd.gcd(a, b);
        if (expected.tryDivide(g).isEmpty()) {
            throw new AssertionError("gcd misses the planted factor");
        }
        double ours = median(() -> PolynomialGcd.gcd(a, b), r -> {
            if (!r.equals(expected)) {
                throw new AssertionError("unstable gcd");
            }
        });
        double theirs = median(() -> MultivariateGCD.PolynomialGCD(ra, rb), r -> {
            if (!bridge.fromRings(r).primitivePart().equals(expected)) {
                throw new AssertionError("gcd differs from the reference");
            }
        });
        System.out.printf("[bench b] gcd of dense trivariates of total degree 10 with a common factor of degree 5 (%d and %d terms), CPU ms (median of %d): ours %.1f, rings %.1f; ratio ours/rings %.2f (goal: below 2)%n",
                a.termCount(), b.termCount(), RUNS, ours, theirs, ours / theirs);
    }
}
