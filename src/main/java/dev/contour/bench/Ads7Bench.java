package dev.contour.bench;

import dev.contour.cli.BenchRegistry;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import dev.contour.solve.Solution;
import dev.contour.solve.SolutionValue;

import java.io.OutputStream;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.charset.StandardCharsets;

/**
 * Benchmark workload "ads7": the AdS7xS4 ansatz of backgrounds/ads7s4.ctr at equal weights 2k, its
 * Ward equations derived from epsilon = 2 (backgrounds/ward_from_eps.ctr) and solved with crossing,
 * written as a user writes it. One row per k: unknowns, equations, solution dimension, the time to
 * build the ansatz and derive the equations, the time to solve, and the peak heap of the run.
 * CONTOUR_ADS7_K chooses the k (default 2..6); each statement may take CONTOUR_ADS7_BUDGET seconds
 * (default 1800); a k that runs past it prints one "stopped" line and the next k runs.
 */
public final class Ads7Bench {
    private Ads7Bench() { }

    /** Registers the workload (one line in cli/DomainBenchmarks calls this). */
    public static void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("ads7",
                "AdS7xS4 at Delta = 2k, k = 2..6: derive the Ward equations from epsilon = 2 and solve the ansatz with crossing;"
                        + " unknowns, equations, dimension, derive and solve times, peak heap",
                out -> run(out, sizes())));
    }

    /** k = 2..6, or the list in CONTOUR_ADS7_K ("4" or "2,3,4"). */
    private static int[] sizes() {
        return dev.contour.cli.BenchEnv.numbers("CONTOUR_ADS7_K", 2, 3, 4, 5, 6);
    }

    /** The statement budget of the solve: CONTOUR_ADS7_BUDGET seconds (0: no limit), default 30 minutes. */
    private static java.time.Duration budget() {
        return java.time.Duration.ofSeconds(dev.contour.cli.BenchEnv.number("CONTOUR_ADS7_BUDGET", 0, 1800));
    }

    /** The ansatz and the derived equations for k. */
    static String derive(int k) {
        return "use \"ads7s4.ctr\"\n"
                + "let k = " + k + "\n"
                + "unknown x[a, b, c in 1..3, q in 2..2*k - 1, d in 0..2] with a + b <= k\n"
                + "unknown y[a, b, i, j] with a + b <= k, i + j <= 1\n"
                + "let M = ads7_ansatz(k, x, y)\n"
                + "let W = ads7_ward(M, k)\n";
    }

    static String solve() {
        return "let sol = solve ads7_cross13(k)(M) == M, ads7_cross12(k)(M) == M, vanishes(W) for x, y\n";
    }

    public static void run(PrintStream out, int... ks) {
        out.printf("%4s %10s %10s %10s %10s %10s %10s %10s%n", "k", "unknowns", "equations", "dimension", "derive s",
                "solve s", "total s", "peak MiB");
        for (int k : ks) {
            resetPeaks();
            PrintStream sink = new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8);
            InterpreterOptions options = InterpreterOptions.to(sink).withLimits(dev.contour.eval.EvaluationLimits.DEFAULT
                    .withStatementBudget(budget(), dev.contour.eval.EvaluationLimits.defaultMemoryMiB()));
            Interpreter interpreter = new Interpreter(options, BuiltinRegistry.standard());
            long t0 = System.nanoTime();
            long t1 = t0;
            RunResult derived;
            RunResult solved;
            try {
                derived = interpreter.run(derive(k), "ads7-bench-k" + k + ".ctr");
                t1 = System.nanoTime();
                solved = interpreter.run(solve(), "ads7-bench-k" + k + ".ctr");
            } catch (dev.contour.ContourException e) {
                out.printf("%4d   stopped after %.1f s: %s (this workload: CONTOUR_ADS7_BUDGET=SECONDS, 0 for no limit)%n", k,
                        (System.nanoTime() - t0) / 1e9, e.getMessage());
                continue;
            }
            long t2 = System.nanoTime();
            if (!(interpreter.lookup("sol") instanceof SolutionValue sv) || sv.figures() == null || !derived.ok() || !solved.ok()) {
                throw new IllegalStateException("the ads7 benchmark script did not run for k = " + k);
            }
            SolutionValue.Figures f = sv.figures();
            String dimension = sv.solution() instanceof Solution.Family fam ? Integer.toString(fam.dimension()) : sv.solution().kind();
            out.printf("%4d %10d %10d %10s %10.2f %10.2f %10.2f %10.0f%n", k, f.unknowns(), f.equations(), dimension,
                    (t1 - t0) / 1e9, (t2 - t1) / 1e9, (t2 - t0) / 1e9, peakHeap() / 1048576.0);
        }
    }

    private static void resetPeaks() {
        System.gc();
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            pool.resetPeakUsage();
        }
    }

    /** The sum of the heap pools' peaks since the last reset (an upper bound of the peak heap in use). */
    private static long peakHeap() {
        long sum = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP && pool.getPeakUsage() != null) {
                sum += pool.getPeakUsage().getUsed();
            }
        }
        return sum;
    }

    public static void main(String[] args) {
        int[] ks = args.length == 0 ? new int[] {2, 3, 4, 5, 6} : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray();
        run(System.out, ks);
    }
}
