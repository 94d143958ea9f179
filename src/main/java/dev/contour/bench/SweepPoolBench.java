package dev.contour.bench;

import dev.contour.Parallel;
import dev.contour.cli.BenchEnv;
import dev.contour.cli.BenchRegistry;
import dev.contour.sweep.SweepCommand;
import dev.contour.sweep.TupleRunner;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * The {@code sweep-pool} benchmark: the "sweep" workload of {@link SweepBench} (every AdS5xS5
 * correlator with 2 <= p4 <= p3 <= p2 <= p1 <= N, even weight sum and L >= 2, solved from the general
 * ansatz of width 1 and checked) as one script per tuple ({@code bench/ads5s5-sweep-tuple.ctr})
 * through {@code contour sweep} with one and two workers, against the same tuples run one after
 * another in this process. N is 10 (216 tuples), or {@code CONTOUR_SWEEP_BENCH_TOP}.
 */
public final class SweepPoolBench implements BenchRegistry.Provider {
    @Override
    public void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("sweep-pool",
                "every AdS5xS5 correlator <p1 p2 p3 p4>, p_i <= 10 (CONTOUR_SWEEP_BENCH_TOP), solved and checked through"
                        + " 'contour sweep' with --jobs 1 and 2, and in-process, best of CONTOUR_SWEEP_BENCH_ROUNDS (2); per-tuple overhead",
                SweepPoolBench::run));
    }

    /** The per-tuple script: p1..p4 and h = (p1 + p2 + p3 + p4)/2 unbound; the sweep binds them. */
    static String script() {
        try (InputStream in = SweepPoolBench.class.getResourceAsStream("/bench/ads5s5-sweep-tuple.ctr")) {
            if (in == null) {
                throw new IllegalStateException("the tuple script bench/ads5s5-sweep-tuple.ctr is missing from the class path");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The weight tuples of the "sweep" workload up to n, in the order the sweep's index set lists them. */
    static List<int[]> tuples(int n) {
        List<int[]> out = new ArrayList<>();
        for (int p1 = 2; p1 <= n; p1++) {
            for (int p2 = 2; p2 <= p1; p2++) {
                for (int p3 = 2; p3 <= p2; p3++) {
                    for (int p4 = 2; p4 <= p3; p4++) {
                        if ((p1 + p2 + p3 + p4) % 2 == 0 && p2 + p3 + p4 >= p1 + 4) {
                            out.add(new int[] {p1, p2, p3, p4});
                        }
                    }
                }
            }
        }
        return out;
    }

    static void run(PrintStream out) {
        int top = BenchEnv.count("CONTOUR_SWEEP_BENCH_TOP", 2, 100, 10);
        int rounds = BenchEnv.count("CONTOUR_SWEEP_BENCH_ROUNDS", 1, 100, 2);
        List<int[]> tuples = tuples(top);
        int n = tuples.size();
        try {
            Path dir = Files.createTempDirectory("contour-sweep-bench");
            try {
                Path script = dir.resolve("correlator.ctr");
                String text = script();
                Files.writeString(script, text);
                PrintStream sink = new PrintStream(OutputStream.nullOutputStream());
                runInProcess(text, script, new int[] {2, 2, 2, 2}, sink); // warm-up
                int cores = Runtime.getRuntime().availableProcessors();
                out.printf("correlators p_i <= %d (%d tuples), %d cores, %d rounds, load before: %s%n", top, n, cores, rounds, load());
                out.printf("%-6s %12s %12s %12s %12s%n", "round", "in-process", "--jobs 1", "--jobs 2", "--jobs 1");
                out.printf("%-6s %12s %12s %12s %12s%n", "", "1 thread", "1 thread", "1 thread", cores + " threads");
                // each round times the four runs one after another, so a slow spell of a shared
                // machine touches every column alike; the best of the rounds is the figure
                double[] best = {Double.MAX_VALUE, Double.MAX_VALUE, Double.MAX_VALUE, Double.MAX_VALUE};
                for (int r = 1; r <= rounds; r++) {
                    double[] t = {
                        inProcess(text, script, tuples, sink),
                        sweep(script, dir.resolve(r + "-one"), top, 1, "1"),
                        sweep(script, dir.resolve(r + "-two"), top, 2, "1"),
                        sweep(script, dir.resolve(r + "-one-all"), top, 1, null)};
                    out.printf("%-6d %10.2f s %10.2f s %10.2f s %10.2f s%n", r, t[0], t[1], t[2], t[3]);
                    for (int k = 0; k < 4; k++) {
                        best[k] = Math.min(best[k], t[k]);
                    }
                }
                out.printf("%-6s %10.2f s %10.2f s %10.2f s %10.2f s%n", "best", best[0], best[1], best[2], best[3]);
                out.printf("--jobs 2 against --jobs 1 (one thread per tuple): %.2fx faster%n", best[1] / best[2]);
                out.printf("overhead per tuple (--jobs 1 against in-process, one thread): %.1f ms%n", (best[1] - best[0]) / n * 1000);
            } finally {
                try (Stream<Path> s = Files.walk(dir)) {
                    s.sorted(Comparator.reverseOrder()).forEach(f -> f.toFile().delete());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The tuples one after another in this process, each on one thread (as a --tuple-threads 1 worker computes it). */
    private static double inProcess(String text, Path script, List<int[]> tuples, PrintStream sink) {
        int threadsBefore = Parallel.threads();
        Parallel.setThreads(1);
        try {
            long t0 = System.nanoTime();
            for (int[] w : tuples) {
                runInProcess(text, script, w, sink);
            }
            return (System.nanoTime() - t0) / 1e9;
        } finally {
            Parallel.setThreads(threadsBefore);
        }
    }

    private static void runInProcess(String text, Path script, int[] w, PrintStream sink) {
        Interpreter i = new Interpreter(InterpreterOptions.to(sink));
        i.run("let p1 = " + w[0] + "\nlet p2 = " + w[1] + "\nlet p3 = " + w[2] + "\nlet p4 = " + w[3]
                + "\nlet h = " + (w[0] + w[1] + w[2] + w[3]) / 2 + "\n", TupleRunner.TUPLE_FILE);
        RunResult r = i.run(text, script.toString());
        if (!r.ok()) {
            throw new IllegalStateException("the in-process run of <" + w[0] + " " + w[1] + " " + w[2] + " " + w[3]
                    + "> failed");
        }
    }

    /** Wall time of the benchmark sweep; {@code threads} null leaves --tuple-threads at its default. */
    private static double sweep(Path script, Path results, int top, int jobs, String threads) {
        ByteArrayOutputStream o = new ByteArrayOutputStream();
        ByteArrayOutputStream e = new ByteArrayOutputStream();
        long t0 = System.nanoTime();
        List<String> args = new ArrayList<>(List.of(script.toString(), "--over",
                "p1 in 2.." + top + ", p2 in 2.." + top + ", p3 in 2.." + top + ", p4 in 2.." + top + ", h in 4.." + 2 * top,
                "--where", "p2 <= p1, p3 <= p2, p4 <= p3, p2 + p3 + p4 >= p1 + 4, p1 + p2 + p3 + p4 = 2*h",
                "--results", results.toString(), "--jobs", Integer.toString(jobs)));
        if (threads != null) {
            args.addAll(List.of("--tuple-threads", threads));
        }
        int code = new SweepCommand().run(args, System.in,
                new PrintStream(o, true, StandardCharsets.UTF_8), new PrintStream(e, true, StandardCharsets.UTF_8));
        double wall = (System.nanoTime() - t0) / 1e9;
        if (code != 0) {
            throw new IllegalStateException("the benchmark sweep failed:\n" + e.toString(StandardCharsets.UTF_8)
                    + o.toString(StandardCharsets.UTF_8));
        }
        return wall;
    }

    private static String load() {
        try {
            return Files.readString(Path.of("/proc/loadavg")).strip();
        } catch (IOException | RuntimeException x) {
            return "unknown";
        }
    }
}
