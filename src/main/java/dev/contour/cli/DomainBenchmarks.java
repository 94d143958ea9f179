package dev.contour.cli;

import dev.contour.bench.AnsatzSumBench;
import dev.contour.bench.WardBench;
import dev.contour.bench.NumericBench;
import dev.contour.bench.SolveBench;

/** The workloads of the Mellin, solver and numeric parts, each printing its own table. */
public final class DomainBenchmarks implements BenchRegistry.Provider {
    @Override
    public void register(BenchRegistry r) {
        r.register(BenchRegistry.Workload.report("ward",
                "build M = R^ M~ for the equal-weight AdS5xS5 ansatz, p = 2..128 (or CONTOUR_WARD_P=\"64,128\"),"
                        + " then its pole and residue analysis",
                out -> WardBench.runWard(out, weights("CONTOUR_WARD_P", 2, 4, 8, 16, 32, 64, 128))));
        r.register(BenchRegistry.Workload.report("solve",
                "run the equal-weight AdS5xS5 ansatz script (sum, ward(p), solve for polynomial residues), p = 2..512;"
                        + " unknowns, equations, build and solve times (CONTOUR_SOLVE_P=\"512\" for chosen weights)",
                out -> SolveBench.runSolve(out, weights("CONTOUR_SOLVE_P", 2, 8, 32, 64, 128, 256, 512))));
        r.register(BenchRegistry.Workload.report("ansatz-sum",
                "evaluate the AdS5xS5 reduced ansatz as a script's sum over i + j + k = p - 2 with utilde eliminated, p = 32, 128, 512",
                out -> AnsatzSumBench.run(out, 32, 128, 512)));
        r.register(BenchRegistry.Workload.report("box",
                "the one-loop box function as a two-variable Mellin-Barnes integral to 15 digits",
                NumericBench::runBench));
        dev.contour.bench.CftDataBench.register(r);
        dev.contour.bench.SweepBench.register(r);
        dev.contour.bench.Ads7Bench.register(r);
    }

    /** The weights named by the environment variable (comma-separated), else the defaults. */
    private static int[] weights(String variable, int... defaults) {
        return BenchEnv.numbers(variable, defaults);
    }
}
