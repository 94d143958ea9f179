package dev.contour.numeric;

import java.io.PrintStream;
import java.time.Duration;
import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;

/**
 * The numerics benchmark: the box function at z = 0.3 + 0.2i to 15 digits as a two-variable
 * Mellin-Barnes integral, timed, with the closed form beside it. {@code contour bench} calls
 * {@link #runBench(PrintStream)}; figures are printed, never asserted.
 */
public final class NumericBench {
    private NumericBench() { }

    public static void runBench(PrintStream out) {
        int digits = 15;
        Apcomplex z = new Apcomplex(new Apfloat("0.3"), new Apfloat("0.2"));
        out.println("box function at z = 0.3 + 0.2i, " + digits + " digits, "
                + Runtime.getRuntime().availableProcessors() + " processors");
        long t0 = System.nanoTime();
        NumericResult closed = BoxFunction.closedForm(z, digits + 5);
        long t1 = System.nanoTime();
        IntegrationLimits limits = IntegrationLimits.defaults().withTimeLimit(Duration.ofMinutes(5)).withProgress(null);
        NumericResult integral = BoxFunction.viaMellinBarnes(z, digits, limits);
        long t2 = System.nanoTime();
        out.printf("  closed form (dilogarithms)   %s   %.2f s%n", closed, (t1 - t0) / 1e9);
        out.printf("  Mellin-Barnes integral       %s   %.2f s%n", integral, (t2 - t1) / 1e9);
        out.printf("  agreement                    %.1f digits%n", -integral.log10RelativeDistance(closed.value()));
    }

    public static void main(String[] args) {
        runBench(System.out);
    }
}
