package dev.contour.bench;

import dev.contour.cli.BenchRegistry;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/**
 * The "cftdata" workload: from a reduced amplitude to the exact table of averaged anomalous dimensions,
 * as a user runs it (a script through the interpreter using backgrounds/ads5s5_cftdata.ctr): &lt;2222&gt;
 * with n &lt;= 10, l &lt;= 20, then the singlet long sector of &lt;pppp&gt;, p = 3, 4, with n &lt;= 5,
 * l &lt;= 10 (the library's closed-form amplitude, the SU(4) projection of the free correlator and of
 * the amplitude): small-U expansion, series in z, zbar, the free and log U block decompositions and the
 * quotient. Each script runs in a fresh interpreter; figures are printed, never asserted.
 */
public final class CftDataBench {
    private CftDataBench() { }

    /** The script of the &lt;2222&gt; workload for rows n <= nmax and spins l <= lmax. */
    public static String script(int nmax, int lmax) {
        return """
                use "ads5s5_cftdata.ctr"
                let Mred = 1/((s - 2)*(t - 2)*(utilde - 2)) at utilde = 4 - s - t
                show gamma_2222(Mred, %d, %d)
                """.formatted(nmax, lmax);
    }

    /** The script of the &lt;pppp&gt; workload (singlet long sector) for rows n <= nmax and spins l <= lmax. */
    public static String script(int p, int nmax, int lmax) {
        return """
                use "ads5s5_cftdata.ctr"
                show gamma_pppp(closed_form({%d, %d, %d, %d}), %d, %d, %d)
                """.formatted(p, p, p, p, p, nmax, lmax);
    }

    public static void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("cftdata",
                "the averaged anomalous dimensions gamma_(n,l) from a reduced amplitude: <2222> n <= 10, l <= 20;"
                        + " <pppp> singlet, p = 3, 4, n <= 5, l <= 10 (whole scripts)",
                CftDataBench::run));
    }

    static void run(PrintStream out) {
        time(out, script(10, 20), "<2222> n <= 10, l <= 20");
        time(out, script(3, 5, 10), "<3333> n <= 5, l <= 10");
        time(out, script(4, 5, 10), "<4444> n <= 5, l <= 10");
    }

    private static void time(PrintStream out, String script, String label) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        PrintStream sink = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        Interpreter interpreter = new Interpreter(InterpreterOptions.to(sink));
        java.lang.management.OperatingSystemMXBean os = java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        long cpu0 = cpuNanos(os);
        long t0 = System.nanoTime();
        interpreter.run(script, "bench-cftdata.ctr");
        long t1 = System.nanoTime();
        long cpu1 = cpuNanos(os);
        out.println(bytes.toString(StandardCharsets.UTF_8).strip());
        out.printf("cftdata %s: %.2f s wall, %.2f s process CPU%n", label, (t1 - t0) / 1e9, (cpu1 - cpu0) / 1e9);
    }

    private static long cpuNanos(java.lang.management.OperatingSystemMXBean os) {
        return os instanceof com.sun.management.OperatingSystemMXBean sun ? sun.getProcessCpuTime() : 0L;
    }
}
