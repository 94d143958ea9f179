package dev.contour.bench;

import dev.contour.solve.*;

import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/**
 * Benchmark workload "solve": the equal-weight AdS5xS5 reduced ansatz solved for polynomial
 * residues, written as a user writes it (the script below, through the interpreter, with the rule
 * library's ward(p) and supergravity_poles). One table row per weight: unknowns, equations, the
 * whole script's time, and of it the time spent building the equations and solving them.
 */
public final class SolveBench {
    /** The derivation timed for weight p: the ansatz of the "ansatz-sum" workload, then the solve. */
    public static String script(int p) {
        return AnsatzSumBench.script(p)
                + "let sol = solve supergravity_poles(ward(p)(Mred), p) for a\n"
                + "show free_unknowns(sol)\n";
    }

    private SolveBench() { }

    public static void runSolve(PrintStream out, int... weights) {
        out.printf("%6s %10s %10s %10s %10s %10s  %s%n", "p", "unknowns", "equations", "script s", "build s", "solve s",
                "solution");
        for (int p : weights) {
            PrintStream sink = new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8);
            Interpreter interpreter = new Interpreter(InterpreterOptions.to(sink), BuiltinRegistry.standard());
            long t0 = System.nanoTime();
            RunResult r = interpreter.run(script(p), "solve-bench-p" + p + ".ctr");
            long t1 = System.nanoTime();
            if (!(interpreter.lookup("sol") instanceof SolutionValue sv) || sv.figures() == null || !r.ok()) {
                throw new IllegalStateException("the solve benchmark script did not run for p = " + p);
            }
            SolutionValue.Figures f = sv.figures();
            String kind = sv.solution() instanceof Solution.Family fam
                    ? "family, " + fam.dimension() + " free (" + String.join(", ", fam.free()) + ")"
                    : sv.solution().kind();
            out.printf("%6d %10d %10d %10.2f %10.2f %10.2f  %s%n", p, f.unknowns(), f.equations(), (t1 - t0) / 1e9,
                    f.buildSeconds(), f.solveSeconds(), kind);
        }
    }

    public static void main(String[] args) {
        int[] weights = args.length == 0 ? new int[] {2, 8, 32, 64, 128, 256, 512}
                : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray();
        runSolve(System.out, weights);
    }
}
