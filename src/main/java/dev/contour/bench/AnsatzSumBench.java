package dev.contour.bench;

import dev.contour.eval.*;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import java.io.OutputStream;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Map;

/**
 * Benchmark workload "ansatz-sum": the AdS5xS5 reduced-amplitude ansatz built the way a script
 * writes it (a sum over i + j + k = p - 2 of a[i,j,k] sigma^i tau^j over three linear factors, then
 * utilde eliminated with {@code at}), evaluated through the {@link Interpreter}.
 *
 * <p>Prints one row per weight: the number of sigma-tau-a monomials, wall-clock and this thread's CPU
 * seconds for the whole script (the library load included), and a checksum (the coefficient of
 * a[0,0,p-2] at s = 1/3, t = 1/7, exact) so a faster algebra can be checked to compute the same thing.
 * Figures are printed, never asserted.
 */
public final class AnsatzSumBench {
    private AnsatzSumBench() { }

    /** The script of the workload for weight p (also what a physicist would type). */
    public static String script(int p) {
        return "use \"ads5s5.ctr\"\n"
                + "let p = " + p + "\n"
                + "unknown a[i, j, k] with i + j + k = p - 2\n"
                + "let Mred = (sum i, j, k with i + j + k = p - 2 :\n"
                + "    a[i, j, k] * sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i)))"
                + " at (utilde = 4*p - 4 - s - t)\n";
    }

    /** Runs the script for weight p in a fresh session and returns the value of Mred. */
    public static Expression build(int p) {
        Interpreter session = new Interpreter(InterpreterOptions.to(new PrintStream(OutputStream.nullOutputStream())));
        session.run(script(p), "ansatz-sum.ctr");
        return ((ExprValue) session.evaluate("Mred", "ansatz-sum.ctr")).value();
    }

    public static void run(PrintStream out, int... weights) {
        // A small warm-up so the first row does not measure class loading alone.
        build(4);
        ThreadMXBean cpu = ManagementFactory.getThreadMXBean();
        out.printf("%6s %10s %10s %10s   %s%n", "p", "terms", "wall s", "cpu s", "checksum");
        Map<String, Rational> point = Map.of("s", Rational.of(1, 3), "t", Rational.of(1, 7));
        for (int p : weights) {
            long t0 = System.nanoTime();
            long c0 = cpu.getCurrentThreadCpuTime();
            Expression m = build(p);
            long t1 = System.nanoTime();
            long c1 = cpu.getCurrentThreadCpuTime();
            Monomial corner = Monomial.of(UnknownFamilyValue.memberName("a", java.util.List.of(0, 0, p - 2)), 1);
            out.printf("%6d %10d %10.3f %10.3f   %s%n", p, m.terms().size(), (t1 - t0) / 1e9, (c1 - c0) / 1e9,
                    m.coefficient(corner).evaluate(point));
        }
    }

    public static void main(String[] args) {
        int[] weights = args.length == 0 ? new int[] {32, 128, 512}
                : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray();
        run(System.out, weights);
    }
}
