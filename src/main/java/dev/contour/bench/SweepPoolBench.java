package dev.contour.bench;

import dev.contour.cli.BenchRegistry;
import dev.contour.sweep.SweepCommand;
import dev.contour.sweep.TupleRunner;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.stream.Stream;

/**
 * The {@code sweep-pool} benchmark: the equal-weight AdS5xS5 solve ({@code SolveBench}'s script with
 * p left to the sweep) for p = 2..P through {@code contour sweep} with one and two workers, against
 * the same runs one after another in this process. P is 40, or {@code CONTOUR_SWEEP_BENCH_TOP}.
 */
public final class SweepPoolBench implements BenchRegistry.Provider {
    @Override
    public void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("sweep-pool",
                "the equal-weight AdS5xS5 solve for p = 2..40 (CONTOUR_SWEEP_BENCH_TOP) through 'contour sweep' with"
                        + " --jobs 1 and 2, and in-process; per-tuple overhead",
                SweepPoolBench::run));
    }

    /** The solve script with p unbound: the sweep binds it. */
    static String script() {
        String s = SolveBench.script(0);
        String line = "let p = 0\n";
        if (!s.contains(line)) {
            throw new IllegalStateException("the solve benchmark script no longer binds p as expected");
        }
        return s.replace(line, "");
    }

    static void run(PrintStream out) {
        int top = Integer.parseInt(System.getenv().getOrDefault("CONTOUR_SWEEP_BENCH_TOP", "40"));
        int n = top - 1;
        try {
            Path dir = Files.createTempDirectory("contour-sweep-bench");
            try {
                Path script = dir.resolve("equal-weight.ctr");
                Files.writeString(script, script());
                String text = script();
                PrintStream sink = new PrintStream(OutputStream.nullOutputStream());
                runInProcess(text, script, 2, sink); // warm-up
                long t0 = System.nanoTime();
                for (int p = 2; p <= top; p++) {
                    runInProcess(text, script, p, sink);
                }
                double inProcess = (System.nanoTime() - t0) / 1e9;
                double one = sweep(script, dir.resolve("one"), top, 1);
                double two = sweep(script, dir.resolve("two"), top, 2);
                out.printf("tuples p = 2..%d (%d), load before: %s%n", top, n, load());
                out.printf("%-34s %8.2f s%n", "in-process, one after another", inProcess);
                out.printf("%-34s %8.2f s%n", "contour sweep --jobs 1 (wall)", one);
                out.printf("%-34s %8.2f s   (%.2fx faster than --jobs 1)%n", "contour sweep --jobs 2 (wall)", two, one / two);
                out.printf("%-34s %8.1f ms%n", "overhead per tuple (--jobs 1)", (one - inProcess) / n * 1000);
            } finally {
                try (Stream<Path> s = Files.walk(dir)) {
                    s.sorted(Comparator.reverseOrder()).forEach(f -> f.toFile().delete());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static void runInProcess(String text, Path script, int p, PrintStream sink) {
        Interpreter i = new Interpreter(InterpreterOptions.to(sink));
        i.run("let p = " + p + "\n", TupleRunner.TUPLE_FILE);
        i.run(text, script.toString());
    }

    private static double sweep(Path script, Path results, int top, int jobs) {
        ByteArrayOutputStream o = new ByteArrayOutputStream();
        ByteArrayOutputStream e = new ByteArrayOutputStream();
        long t0 = System.nanoTime();
        int code = new SweepCommand().run(java.util.List.of(script.toString(), "--over", "p", "in", "2.." + top,
                        "--results", results.toString(), "--jobs", Integer.toString(jobs)), System.in,
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
