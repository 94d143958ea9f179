package dev.contour.bench;

import dev.contour.numeric.*;

import java.io.PrintStream;
import java.time.Duration;
import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;

/**
 * The numerics benchmark: the box function at z = 0.3 + 0.2i to 15 digits as a two-variable
 * Mellin-Barnes integral, timed, with the closed form beside it: once with the hand-written integrand
 * of {@link BoxFunction} and once as users run it, a script with {@code position_value} through the
 * interpreter (the generic measure integrand). {@code contour bench} calls
 * {@link #runBench(PrintStream)}; figures are printed, never asserted on time.
 */
public final class NumericBench {
    private NumericBench() { }

    static final int DIGITS = 15;

    /** What one run measured. */
    record Figures(NumericResult closedForm, double closedFormSeconds, NumericResult integral,
                   double integralSeconds, double integralCpuSeconds, long evaluations) {
        double agreementDigits() {
            return -integral.log10RelativeDistance(closedForm.value());
        }
    }

    /** The box function as a user writes it (the measure in the language, U and V of z = 0.3 + 0.2i). */
    static final String SCRIPT = """
            vars s, t
            let box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})
            let box_value = 4*position_value(1, box, z: complex(3/10, 1/5), zbar: complex(3/10, -1/5), contour: {-1/3, -1/3}, digits: %d)
            show box_value
            """.formatted(DIGITS);

    /** What the script run measured: its printed line, its value and times. */
    record ScriptFigures(String line, NumberValue value, double seconds, double cpuSeconds) { }

    /** Runs {@link #SCRIPT} through the interpreter, timed. */
    static ScriptFigures measureScript() {
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
        PrintStream out = new PrintStream(bytes, true, java.nio.charset.StandardCharsets.UTF_8);
        dev.contour.eval.Interpreter interpreter = new dev.contour.eval.Interpreter(dev.contour.eval.InterpreterOptions.to(out));
        long cpu0 = processCpuNanos();
        long t0 = System.nanoTime();
        interpreter.run(SCRIPT, "bench-box.ctr");
        long t1 = System.nanoTime();
        long cpu1 = processCpuNanos();
        String line = bytes.toString(java.nio.charset.StandardCharsets.UTF_8).strip();
        return new ScriptFigures(line, (NumberValue) interpreter.lookup("box_value"), (t1 - t0) / 1e9, (cpu1 - cpu0) / 1e9);
    }

    static Figures measure() {
        Apcomplex z = new Apcomplex(new Apfloat("0.3"), new Apfloat("0.2"));
        long t0 = System.nanoTime();
        NumericResult closed = BoxFunction.closedForm(z, DIGITS + 5);
        long t1 = System.nanoTime();
        long cpu0 = processCpuNanos();
        IntegrationLimits limits = IntegrationLimits.defaults().withTimeLimit(Duration.ofMinutes(5)).withProgress(null);
        long[] count = new long[1];
        Integrand2 f = BoxFunction.integrand(z, DIGITS);
        Apfloat c = BoxFunction.contour(DIGITS);
        NumericResult integral = MellinBarnes.integrate2((s, t) -> {
            synchronized (count) {
                count[0]++;
            }
            return f.at(s, t);
        }, c, c, DIGITS, limits);
        long t2 = System.nanoTime();
        long cpu1 = processCpuNanos();
        return new Figures(closed, (t1 - t0) / 1e9, integral, (t2 - t1) / 1e9, (cpu1 - cpu0) / 1e9, count[0]);
    }

    /** CPU time of this process (all threads), or -1 where the platform does not tell: on a shared machine a fairer figure than wall time. */
    private static long processCpuNanos() {
        if (java.lang.management.ManagementFactory.getOperatingSystemMXBean()
                instanceof com.sun.management.OperatingSystemMXBean os) {
            return os.getProcessCpuTime();
        }
        return -1;
    }

    public static void runBench(PrintStream out) {
        out.println("box function at z = 0.3 + 0.2i, " + DIGITS + " digits, "
                + Runtime.getRuntime().availableProcessors() + " processors");
        Figures m = measure();
        out.printf("  closed form (dilogarithms)   %s   %.2f s%n", m.closedForm(), m.closedFormSeconds());
        out.printf("  Mellin-Barnes integral       %s   %.2f s wall, %.2f s CPU, %,d integrand evaluations%n",
                m.integral(), m.integralSeconds(), m.integralCpuSeconds(), m.evaluations());
        out.printf("  agreement                    %.1f digits%n", m.agreementDigits());
        ScriptFigures sf = measureScript();
        out.printf("  script (position_value)      %s   %.2f s wall, %.2f s CPU%n", sf.value().digitsText(), sf.seconds(), sf.cpuSeconds());
        out.printf("  script agreement             %.1f digits; script / hand-written integrand time %.2f%n",
                -sf.value().result().log10RelativeDistance(m.closedForm().value()), sf.seconds() / m.integralSeconds());
    }

    public static void main(String[] args) {
        runBench(System.out);
    }
}
