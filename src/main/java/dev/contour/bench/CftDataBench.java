package dev.contour.bench;

import dev.contour.cli.BenchRegistry;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/**
 * The "cftdata" workload: from the &lt;2222&gt; reduced amplitude to the exact table of averaged anomalous
 * dimensions gamma_(n,l), n &lt;= 10, l &lt;= 20, as a user runs it (a script through the interpreter using
 * backgrounds/ads5s5_cftdata.ctr): small-U expansion, series in z, zbar, the free and log U block
 * decompositions and the quotient. Figures are printed, never asserted.
 */
public final class CftDataBench {
    private CftDataBench() { }

    /** The script of the workload for rows n <= nmax and spins l <= lmax. */
    public static String script(int nmax, int lmax) {
        return """
                use "ads5s5_cftdata.ctr"
                let Mred = 1/((s - 2)*(t - 2)*(utilde - 2)) at utilde = 4 - s - t
                show gamma_2222(Mred, %d, %d)
                """.formatted(nmax, lmax);
    }

    public static void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("cftdata",
                "the averaged anomalous dimensions gamma_(n,l) of <2222> from its reduced amplitude, n <= 10, l <= 20 (whole script)",
                CftDataBench::run));
    }

    static void run(PrintStream out) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        PrintStream sink = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        Interpreter interpreter = new Interpreter(InterpreterOptions.to(sink));
        java.lang.management.OperatingSystemMXBean os = java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        long cpu0 = cpuNanos(os);
        long t0 = System.nanoTime();
        interpreter.run(script(10, 20), "bench-cftdata.ctr");
        long t1 = System.nanoTime();
        long cpu1 = cpuNanos(os);
        out.println(bytes.toString(StandardCharsets.UTF_8).strip());
        out.printf("cftdata <2222> n <= 10, l <= 20: %.2f s wall, %.2f s process CPU%n", (t1 - t0) / 1e9, (cpu1 - cpu0) / 1e9);
        out.println("<pppp>, p = 3, 4: not in this workload (the R-symmetry projection for p > 2 is not built; see DEVELOPERS.md)");
    }

    private static long cpuNanos(java.lang.management.OperatingSystemMXBean os) {
        return os instanceof com.sun.management.OperatingSystemMXBean sun ? sun.getProcessCpuTime() : 0L;
    }
}
