package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.List;
import java.util.Map;

/**
 * Benchmark workload "ward": the full AdS5 x S5 amplitude {@code M = ward(p) M~} from the reduced
 * ansatz with every a_ijk = 1, then its pole and residue analysis, for a list of weights.
 *
 * <p>Prints one row per weight (number of sigma-tau monomials, build and analysis times in ms, wall
 * clock and this thread's CPU time, which is what to compare on a shared machine) and a checksum (the
 * monomial count and the sigma^0 tau^0 coefficient at s = 1/3, t = 1/7, exact), so a faster algebra
 * can be checked to compute the same thing. Figures are printed, never asserted.
 */
public final class WardBench {
    private WardBench() { }

    public static void runWard(PrintStream out, int... weights) {
        // A small warm-up so the first row does not measure class loading and the JIT.
        build(2);
        build(4);
        ThreadMXBean cpu = ManagementFactory.getThreadMXBean();
        out.printf("%6s %10s %10s %12s %10s %13s   %s%n", "p", "monomials", "build ms", "analysis ms", "build cpu", "analysis cpu",
                "checksum");
        Map<String, Rational> point = Map.of(AdS5S5.S, Rational.of(1, 3), AdS5S5.T, Rational.of(1, 7));
        for (int p : weights) {
            long t0 = System.nanoTime();
            long c0 = cpu.getCurrentThreadCpuTime();
            Expression m = build(p);
            long t1 = System.nanoTime();
            long c1 = cpu.getCurrentThreadCpuTime();
            List<NamedForm> forms = AdS5S5.poleForms(Polynomial.constant(p));
            PoleAnalysis.Result poles = PoleAnalysis.of(m, forms, AdS5S5.mellinVariables());
            ResiduePolynomiality.Result residues = ResiduePolynomiality.check(m, forms, AdS5S5.mellinVariables());
            long t2 = System.nanoTime();
            long c2 = cpu.getCurrentThreadCpuTime();
            RationalFunction constant = m.coefficient(Monomial.ONE);
            Rational value = constant == null ? Rational.ZERO : constant.evaluate(point);
            out.printf("%6d %10d %10d %12d %10d %13d   %d %s   (%d poles, %d non-polynomial residues)%n", p, m.terms().size(),
                    (t1 - t0) / 1_000_000, (t2 - t1) / 1_000_000, (c1 - c0) / 1_000_000, (c2 - c1) / 1_000_000, m.terms().size(), value,
                    poles.all().size(), residues.failures().size());
        }
    }

    /** The full amplitude from the all-ones reduced ansatz, every coefficient canonical. */
    static Expression build(int p) {
        Expression reduced = AdS5S5.reducedAnsatz(p, (i, j, k) -> Expression.ONE);
        return AdS5S5.ward(p).apply(reduced);
    }

    public static void main(String[] args) {
        int[] weights = args.length == 0 ? new int[] {2, 4, 8, 16, 32, 64, 128}
                : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray();
        runWard(System.out, weights);
    }
}
