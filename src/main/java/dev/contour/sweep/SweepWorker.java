package dev.contour.sweep;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;

/**
 * A worker process of a sweep: reads tuple numbers (positions in the folder's tuple list), one a
 * line, from standard input; runs each in a fresh interpreter; writes the tuple's record file;
 * answers {@code done N} on standard output. It ends at the end of its input (its sweep is gone)
 * and after running out of memory (the sweep starts a fresh worker).
 *
 * <p>Arguments: results folder, script path, rules folder, per-tuple time limit in seconds, and a
 * note saying how the heap was set.
 */
public final class SweepWorker {
    /** Exit status after a tuple exhausted the heap: the pool replaces this worker. */
    static final int EXIT_MEMORY = 3;
    /** Follows "done INDEX" when the worker exits after that tuple (its heap ran out). */
    static final String EXITING = "exiting";

    private SweepWorker() { }

    public static void main(String[] args) throws Exception {
        PrintStream protocol = new PrintStream(new java.io.FileOutputStream(java.io.FileDescriptor.out), true, StandardCharsets.UTF_8);
        System.setOut(System.err); // anything a library prints goes to the worker's log, not into the protocol
        ResultsFolder folder = new ResultsFolder(Path.of(args[0]));
        Path script = Path.of(args[1]);
        Path rules = args[2].isEmpty() ? null : Path.of(args[2]);
        Duration limit = Duration.ofSeconds(Long.parseLong(args[3]));
        ResultsFolder.Manifest manifest = folder.readManifest();
        String text = Files.readString(script, StandardCharsets.UTF_8);
        if (manifest == null || !manifest.scriptSha256().equals(ResultsFolder.sha256(text))) {
            System.err.println("contour sweep worker: " + script + " changed since the sweep started; stopping");
            System.exit(2);
        }
        TupleRunner runner = new TupleRunner(script, text, rules, limit, args[4]);
        runner.warmUp();
        protocol.println("ready");
        BufferedReader in = new BufferedReader(new InputStreamReader(System.in, StandardCharsets.UTF_8));
        for (String line = in.readLine(); line != null; line = in.readLine()) {
            if (line.isBlank()) {
                continue;
            }
            int index = Integer.parseInt(line.trim());
            SweepRecord r = runner.run(manifest.tuple(index));
            folder.writeRecord(r);
            if (runner.exhaustedMemory()) {
                // said with the answer, so the pool starts a fresh worker instead of sending the
                // next tuple to one that is exiting (that tuple was then recorded as failed)
                protocol.println("done " + index + " " + EXITING);
                System.exit(EXIT_MEMORY);
            }
            protocol.println("done " + index);
        }
        System.exit(0);
    }
}
