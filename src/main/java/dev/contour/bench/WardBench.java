package dev.contour.bench;

import dev.contour.mellin.*;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.eval.ExprValue;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;

import java.io.OutputStream;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.util.Map;

/**
 * Benchmark workload "ward": the full AdS5 x S5 amplitude {@code M = ward(p)(Mred)} from the reduced
 * ansatz with every a_ijk = 1, written as the script a physicist types (the rule library's
 * {@code ward(p)}), then its pole and residue analysis ({@code poles} and {@code residue_check}), for
 * a list of weights, all through the {@link Interpreter}.
 *
 * <p>Prints one row per weight (number of sigma-tau monomials, build and analysis times in ms, wall
 * clock and this thread's CPU time, which is what to compare on a shared machine) and a checksum (the
 * monomial count and the sigma^0 tau^0 coefficient at s = 1/3, t = 1/7, exact), so a faster algebra
 * can be checked to compute the same thing. Figures are printed, never asserted.
 */
public final class WardBench {
    private WardBench() { }

    /** The build step for weight p: the all-ones reduced ansatz and {@code M = ward(p)(Mred)}. */
    public static String script(int p) {
        return "use \"ads5s5.ctr\"\n"
                + "let p = " + p + "\n"
                + "let Mred = (sum i, j, k with i + j + k = p - 2 :\n"
                + "    sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i)))"
                + " at (utilde = 4*p - 4 - s - t)\n"
                + "let M = ward(p)(Mred)\n";
    }

    /** The analysis step, evaluated after {@link #script}. */
    public static final String POLES = "poles(M, full_measure(p))";
    public static final String RESIDUES = "residue_check(M, full_measure(p))";

    /** One weight's figures. */
    record Row(Expression amplitude, int poles, int nonPolynomial, long buildNanos, long analysisNanos,
               long buildCpu, long analysisCpu) { }

    static Row run(int p) {
        ThreadMXBean cpu = ManagementFactory.getThreadMXBean();
        PrintStream sink = new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8);
        Interpreter session = new Interpreter(InterpreterOptions.to(sink));
        long t0 = System.nanoTime();
        long c0 = cpu.getCurrentThreadCpuTime();
        RunResult r = session.run(script(p), "ward-bench-p" + p + ".ctr");
        if (!r.ok()) {
            throw new IllegalStateException("the ward benchmark script did not run for p = " + p);
        }
        // ward(p)(Mred) is kept as a sum of shifted terms until asked for: collecting it is the build.
        Expression m = ((ExprValue) session.evaluate("M", "ward-bench.ctr")).value();
        long t1 = System.nanoTime();
        long c1 = cpu.getCurrentThreadCpuTime();
        ReportValue poles = (ReportValue) session.evaluate(POLES, "ward-bench.ctr");
        ReportValue residues = (ReportValue) session.evaluate(RESIDUES, "ward-bench.ctr");
        long t2 = System.nanoTime();
        long c2 = cpu.getCurrentThreadCpuTime();
        return new Row(m, poles.findings().size(), residues.findings().size(), t1 - t0, t2 - t1, c1 - c0, c2 - c1);
    }

    public static void runWard(PrintStream out, int... weights) {
        // A small warm-up so the first row does not measure class loading and the JIT.
        run(2);
        run(4);
        out.printf("%6s %10s %10s %12s %10s %13s   %s%n", "p", "monomials", "build ms", "analysis ms", "build cpu", "analysis cpu",
                "checksum");
        Map<String, Rational> point = Map.of("s", Rational.of(1, 3), "t", Rational.of(1, 7));
        for (int p : weights) {
            Row row = run(p);
            Expression m = row.amplitude();
            RationalFunction constant = m.coefficient(Monomial.ONE);
            Rational value = constant == null ? Rational.ZERO : constant.evaluate(point);
            out.printf("%6d %10d %10d %12d %10d %13d   %d %s   (%d poles, %d non-polynomial residues)%n", p, m.terms().size(),
                    row.buildNanos() / 1_000_000, row.analysisNanos() / 1_000_000, row.buildCpu() / 1_000_000,
                    row.analysisCpu() / 1_000_000, m.terms().size(), value, row.poles(), row.nonPolynomial());
        }
    }

    public static void main(String[] args) {
        int[] weights = args.length == 0 ? new int[] {2, 4, 8, 16, 32, 64, 128}
                : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray();
        runWard(System.out, weights);
    }
}
