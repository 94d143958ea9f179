package dev.contour.sweep;

import java.nio.file.Path;
import java.util.List;

/**
 * Writes a Slurm job-array submission script: array task I of N runs
 * {@code contour sweep ... --chunk I/N} into the shared results folder. Slurm itself does the
 * scheduling; nothing here talks to it.
 */
final class SlurmArray {
    private SlurmArray() { }

    /**
     * @param launcher     the {@code contour} command on the cluster's nodes
     * @param sweepArgs    the sweep's own arguments (script, --over, --where, --results, --memory, ...)
     * @param chunks       number of array tasks
     * @param taskCores    cores per array task (its --jobs)
     * @param taskMemoryMb memory Slurm should grant one task, in MiB
     */
    static String script(Path launcher, List<String> sweepArgs, int chunks, int taskCores, long taskMemoryMb,
                         Path logs, String indexSet, int tuples) {
        StringBuilder args = new StringBuilder();
        for (String a : sweepArgs) {
            args.append(' ').append(shellQuote(a));
        }
        return "#!/bin/bash\n"
                + "# A Contour sweep as a Slurm job array: " + tuples + " tuples of " + indexSet.replace('\n', ' ') + "\n"
                + "# in " + chunks + " chunks. Submit with: sbatch THIS-FILE; then merge with: contour sweep --merge FOLDER\n"
                + "#SBATCH --job-name=contour-sweep\n"
                + "#SBATCH --array=1-" + chunks + "\n"
                + "#SBATCH --ntasks=1\n"
                + "#SBATCH --cpus-per-task=" + taskCores + "\n"
                + "#SBATCH --mem=" + taskMemoryMb + "M\n"
                + "#SBATCH --output=" + shellQuote(logs.resolve("slurm-%A_%a.out").toString()) + "\n"
                + "set -euo pipefail\n"
                + "exec " + shellQuote(launcher.toString()) + " sweep" + args
                + " --chunk \"${SLURM_ARRAY_TASK_ID}/" + chunks + "\" --jobs \"${SLURM_CPUS_PER_TASK:-" + taskCores + "}\"\n";
    }

    /** A word the shell reads back unchanged: single quotes, with embedded quotes closed and escaped. */
    static String shellQuote(String s) {
        if (s.matches("[A-Za-z0-9_./=:,+-]+")) {
            return s;
        }
        return "'" + s.replace("'", "'\\''") + "'";
    }
}
