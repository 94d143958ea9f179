package dev.contour.bench;

import dev.contour.cli.BenchRegistry;
import dev.contour.ContourException;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.EvaluationLimits;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.Span;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;

/**
 * Benchmark workload "sweep": every AdS5xS5 correlator with 2 <= p4 <= p3 <= p2 <= p1 <= N, even
 * weight sum and L >= 2, solved from the general ansatz of width 1 and checked (one function, the
 * closed form, crossing), as ONE script with loops over the weight tuples (the resource
 * {@code bench/ads5s5-sweep.ctr}, with {@code let N = ...} put in front). One row per N: correlators,
 * total unknowns and equations, wall and process CPU seconds, peak resident memory. Figures are
 * printed, never asserted; each N runs in a fresh session of this process.
 */
public final class SweepBench {
    /**
     * The N the workload runs by default; CONTOUR_SWEEP_N="6,8,10,14" chooses others, and
     * CONTOUR_SWEEP_BUDGET the time budget of each sweep in seconds (default 7200, 0 for none).
     */
    private static final int[] DEFAULT_N = {6, 8, 10};

    private SweepBench() { }

    public static void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("sweep",
                "solve and check every AdS5xS5 correlator <p1 p2 p3 p4>, p_i <= N, from the general ansatz of width 1"
                        + " (one script; N = 6, 8, 10, or CONTOUR_SWEEP_N)",
                out -> run(out, sizes())));
    }

    private static int[] sizes() {
        return dev.contour.cli.BenchEnv.numbers("CONTOUR_SWEEP_N", DEFAULT_N);
    }

    /** The sweep script for weights up to n. */
    public static String script(int n) {
        try (InputStream in = SweepBench.class.getResourceAsStream("/bench/ads5s5-sweep.ctr")) {
            if (in == null) {
                throw new IllegalStateException("the sweep script bench/ads5s5-sweep.ctr is missing from the class path");
            }
            return "let N = " + n + "\n" + new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalStateException("cannot read the sweep script", e);
        }
    }

    public static void run(PrintStream out, int... sizes) {
        out.printf("%4s %12s %10s %11s %9s %9s %10s   %s%n", "N", "correlators", "unknowns", "equations", "wall s",
                "cpu s", "peak MiB", "checks");
        var os = ManagementFactory.getOperatingSystemMXBean();
        for (int n : sizes) {
            PrintStream sink = new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8);
            // The whole sweep is one statement (the loop), so the default statement budget of five
            // minutes would end N >= 14; CONTOUR_SWEEP_BUDGET (seconds, 0 for none) sets it.
            InterpreterOptions options = InterpreterOptions.to(sink).withLimits(
                    EvaluationLimits.DEFAULT.withStatementBudget(budget(), EvaluationLimits.defaultMemoryMiB()));
            Interpreter session = new Interpreter(options, BuiltinRegistry.standard());
            long c0 = processCpu(os);
            long t0 = System.nanoTime();
            RunResult r;
            try {
                r = session.run(script(n), "sweep-N" + n + ".ctr");
            } catch (ContourException e) {
                out.printf("%4d   stopped after %.1f s: %s (this workload: CONTOUR_SWEEP_BUDGET=SECONDS, 0 for no limit)%n", n,
                        (System.nanoTime() - t0) / 1e9, e.getMessage());
                continue;
            }
            long t1 = System.nanoTime();
            long c1 = processCpu(os);
            out.printf("%4d %12d %10d %11d %9.2f %9.2f %10d   %d passed, %d failed%n", n, number(session, "correlators"),
                    number(session, "unknowns"), number(session, "equations"), (t1 - t0) / 1e9,
                    c0 < 0 ? Double.NaN : (c1 - c0) / 1e9, peakMebibytes(), r.checksPassed(), r.checksFailed());
        }
    }

    /** The statement budget of a sweep: CONTOUR_SWEEP_BUDGET seconds (0: no limit), default two hours. */
    private static Duration budget() {
        return Duration.ofSeconds(dev.contour.cli.BenchEnv.number("CONTOUR_SWEEP_BUDGET", 0, 7200));
    }

    private static long number(Interpreter session, String name) {
        Value v = session.lookup(name);
        return Values.integer(v, Span.NONE, name);
    }

    private static long processCpu(java.lang.management.OperatingSystemMXBean os) {
        return os instanceof com.sun.management.OperatingSystemMXBean sun ? sun.getProcessCpuTime() : -1;
    }

    /** The process's peak resident set (Linux: VmHWM), else the heap's peak use. */
    private static long peakMebibytes() {
        try {
            for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
                if (line.startsWith("VmHWM:")) {
                    return Long.parseLong(line.replaceAll("[^0-9]", "")) / 1024;
                }
            }
        } catch (IOException | RuntimeException ignored) {
            // not Linux: fall back to the heap's peak
        }
        long peak = 0;
        for (var pool : ManagementFactory.getMemoryPoolMXBeans()) {
            peak += pool.getPeakUsage() == null ? 0 : pool.getPeakUsage().getUsed();
        }
        return peak / (1024 * 1024);
    }

    public static void main(String[] args) {
        run(System.out, args.length == 0 ? DEFAULT_N : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray());
    }
}
