package dev.contour.solve;

import dev.contour.Span;
import java.io.PrintStream;

/**
 * Benchmark workload "solve": the equal-weight AdS5xS5 ansatz with polynomial residues, for the
 * given weights, as a table of unknowns, equations, build time, solve time and solution kind.
 */
public final class SolveBench {
    private SolveBench() { }

    public static void runSolve(PrintStream out, int... weights) {
        out.printf("%6s %10s %10s %10s %10s  %s%n", "p", "unknowns", "equations", "build s", "solve s", "solution");
        for (int p : weights) {
            SupergravityAnsatz ansatz = new SupergravityAnsatz(p);
            SolveProgress progress = SolveProgress.to(System.err);
            long t0 = System.nanoTime();
            SparseSystem system = new LinearConstraintBuilder(ansatz.unknowns())
                    .add(ansatz.residueConstraint(new Span("bench", 1, 1, 1)))
                    .build(progress);
            long t1 = System.nanoTime();
            Solution sol = system.solve(progress);
            long t2 = System.nanoTime();
            String kind = sol instanceof Solution.Family f ? "family, " + f.dimension() + " free (" + f.free().get(0) + ")"
                    : sol.kind();
            out.printf("%6d %10d %10d %10.2f %10.2f  %s%n", p, ansatz.count(), system.equations(),
                    (t1 - t0) / 1e9, (t2 - t1) / 1e9, kind);
        }
    }

    public static void main(String[] args) {
        int[] weights = args.length == 0 ? new int[] {2, 8, 32, 64, 128, 256, 512}
                : java.util.Arrays.stream(args).mapToInt(Integer::parseInt).toArray();
        runSolve(System.out, weights);
    }
}
