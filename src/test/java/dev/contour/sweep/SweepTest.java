package dev.contour.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code contour sweep} through the command line: records, resumption, failures, bad input, merge and tables. */
class SweepTest {
    /**
     * A made-up recursion solved once per n (an invented scenario): the normalized solution is
     * n!/(2 (s/2)_(n+1)), which the script checks against its closed form.
     */
    static final String RECURSION = """
            vars s
            unknown c[i] with i <= n
            def G(x) = sum i with i <= n : c[i] / (x + 2*i)
            let sol = solve polynomial_in((s + 2*n + 2) * G(s + 2) - s * G(s), s) for c
            let top = c[n] with sol normalized c[0] = 1
            show top
            show G(s) with sol normalized c[0] = 1
            check G(s) with sol normalized c[0] = 1 == n! / (2 * poch(s/2, n + 1))
            """;

    @TempDir
    Path dir;

    record Cli(int code, String out, String err) { }

    static Cli cli(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = Main.run(args, new ByteArrayInputStream(new byte[0]),
                new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Cli(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    /** Every record of a folder without its timings, keyed by tuple: what must not depend on scheduling. */
    static Map<String, String> records(Path folder) throws Exception {
        Map<String, String> out = new TreeMap<>();
        for (Map.Entry<String, SweepRecord> e : new ResultsFolder(folder).read().records().entrySet()) {
            SweepRecord r = e.getValue();
            out.put(e.getKey(), r.status() + "|" + r.error() + "|" + r.shown() + "|" + r.output() + "|" + r.checksPassed()
                    + "|" + r.checksFailed());
        }
        return out;
    }

    @Test
    void parallelSweepGivesTheSameRecordsAsASequentialOne() throws Exception {
        Path script = write("recursion.ctr", RECURSION);
        Cli one = cli("sweep", script.toString(), "--over", "n", "in", "1..6", "--results", dir.resolve("one").toString(), "--jobs", "1");
        Cli two = cli("sweep", script.toString(), "--over", "n", "in", "1..6", "--results", dir.resolve("two").toString(), "--jobs", "2");
        assertEquals(0, one.code(), one.err());
        assertEquals(0, two.code(), two.err());
        assertEquals(records(dir.resolve("one")), records(dir.resolve("two")));
        assertEquals(6, records(dir.resolve("one")).size());
        assertEquals(one.out(), two.out());
        // one worker takes the tuples from the end of the index set: its records were written n = 6 first
        List<String> written;
        try (Stream<Path> files = Files.list(dir.resolve("one").resolve("records"))) {
            written = files.sorted(java.util.Comparator.comparing(f -> {
                try {
                    return Files.getLastModifiedTime(f);
                } catch (IOException e) {
                    throw new java.io.UncheckedIOException(e);
                }
            })).map(f -> f.getFileName().toString()).toList();
        }
        assertEquals(List.of("n=6.json", "n=5.json", "n=4.json", "n=3.json", "n=2.json", "n=1.json"), written);
        // each worker's threads: what the user chose, else the cores per worker (at least one)
        int cores = Runtime.getRuntime().availableProcessors();
        assertTrue(one.err().contains(" heap and " + cores + " thread"), one.err());
        assertTrue(two.err().contains(" heap and " + Math.max(1, cores / 2) + " thread"), two.err());
        Cli three = cli("sweep", script.toString(), "--over", "n", "in", "1..6", "--results", dir.resolve("three").toString(),
                "--jobs", "2", "--tuple-threads", "3");
        assertEquals(0, three.code(), three.err());
        assertTrue(three.err().contains(" heap and 3 threads each)"), three.err());
        assertEquals(records(dir.resolve("one")), records(dir.resolve("three")));
        // the table: tuple, status, then each shown value by label; 2^n n!/(s (s+2)...(s+2n)) at n = 3 is 48/(...)
        assertTrue(one.out().contains("3 | ok     | -1  | 48/(s*(s + 2)*(s + 4)*(s + 6))"), one.out());
        // a rerun finds every tuple done and runs nothing
        Cli again = cli("sweep", script.toString(), "--over", "n", "in", "1..6", "--results", dir.resolve("one").toString());
        assertEquals(0, again.code());
        assertTrue(again.err().contains("every tuple already has a record"), again.err());
        assertEquals(one.out(), again.out());
    }

    @Test
    void aKilledSweepResumedGivesTheSameTableAsAnUninterruptedOne() throws Exception {
        // each tuple takes a noticeable moment (a product with about n^2 terms), so the kill lands mid-sweep
        Path script = write("slow.ctr", """
                vars x, y
                let f = (1 + x + y + x*y)^(20 + n) * (1 - x)^n
                show n
                check f == (1 + x)^(20 + n) * (1 + y)^(20 + n) * (1 - x)^n
                """);
        String[] over = {"--over", "n", "in", "1..12"};
        Path killed = dir.resolve("killed");
        List<String> command = new ArrayList<>(List.of(javaExecutable(), "-Xss8m", "-cp", System.getProperty("java.class.path"),
                Main.class.getName(), "sweep", script.toString()));
        command.addAll(List.of(over));
        command.addAll(List.of("--results", killed.toString(), "--jobs", "1"));
        Process p = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (countRecords(killed) < 3 && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        // the whole tree goes at once, as when a machine is lost: workers too, mid-tuple
        p.descendants().forEach(ProcessHandle::destroyForcibly);
        p.destroyForcibly();
        assertTrue(p.waitFor(30, TimeUnit.SECONDS));
        int before = countRecords(killed);
        assertTrue(before >= 3, "records before the kill: " + before);
        Cli resumed = cli(concat(new String[] {"sweep", script.toString()}, over, new String[] {"--results", killed.toString(), "--jobs", "2"}));
        Cli straight = cli(concat(new String[] {"sweep", script.toString()}, over,
                new String[] {"--results", dir.resolve("straight").toString(), "--jobs", "2"}));
        assertEquals(0, resumed.code(), resumed.err());
        assertEquals(0, straight.code(), straight.err());
        if (before < 12) {
            assertTrue(resumed.err().contains((12 - before) + " of 12 tuples to run"), resumed.err());
        }
        assertEquals(straight.out(), resumed.out());
        assertEquals(records(dir.resolve("straight")), records(killed));
    }

    private static int countRecords(Path folder) throws IOException {
        Path records = folder.resolve("records");
        if (!Files.isDirectory(records)) {
            return 0;
        }
        try (Stream<Path> s = Files.list(records)) {
            return (int) s.filter(f -> f.getFileName().toString().endsWith(".json")).count();
        }
    }

    private static String javaExecutable() {
        return ProcessHandle.current().info().command().orElse(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    }

    private static String[] concat(String[]... parts) {
        return Stream.of(parts).flatMap(Stream::of).toArray(String[]::new);
    }

    @Test
    void failingTuplesAreRecordedAndTheOthersFinish() throws Exception {
        // n = 1 ok; n = 2 a failed check; n = 3 a division by zero; n = 4 a polynomial of 735,471 terms (a
        // power the size estimates allow), far beyond a 64 MiB heap
        Path script = write("mixed.ctr", """
                vars a, b, c, d, e, f, g, h
                let r = 1/(n - 3)
                check (n - 1)*(n - 3)*(n - 4)*a == 0
                let big = (a + b + c + d + e + f + g + h + 1)^(16*(n - 1)*(n - 2)*(n - 3)/6)
                show n
                """);
        Path folder = dir.resolve("mixed");
        Cli r = cli("sweep", script.toString(), "--over", "n", "in", "1..4", "--results", folder.toString(), "--jobs", "2",
                "--memory", "64m");
        assertEquals(1, r.code(), r.err());
        Map<String, SweepRecord> rec = new ResultsFolder(folder).read().records();
        assertEquals(4, rec.size());
        assertEquals(SweepRecord.Status.OK, rec.get("n=1").status());
        assertEquals(SweepRecord.Status.CHECK_FAILED, rec.get("n=2").status(), rec.get("n=2").error());
        assertEquals(SweepRecord.Status.ERROR, rec.get("n=3").status());
        assertTrue(rec.get("n=3").error().startsWith(script + ":2:"), rec.get("n=3").error());
        assertTrue(rec.get("n=3").error().contains("^"), "the error shows the line with a caret");
        assertEquals(SweepRecord.Status.ERROR, rec.get("n=4").status());
        assertTrue(rec.get("n=4").error().contains("out of memory"), rec.get("n=4").error());
        assertTrue(rec.get("n=4").error().contains("--memory 64m"), rec.get("n=4").error());
        assertTrue(r.out().contains("failed: n = 2: check failed"), r.out());
        assertTrue(r.out().contains("failed: n = 4: error"), r.out());

        // --retry-failed runs the three failures again (and they fail the same way); without it nothing runs
        Cli plain = cli("sweep", script.toString(), "--over", "n", "in", "1..4", "--results", folder.toString(), "--memory", "64m");
        assertTrue(plain.err().contains("already has a record"), plain.err());
        Cli retry = cli("sweep", script.toString(), "--over", "n", "in", "1..4", "--results", folder.toString(), "--memory", "64m",
                "--retry-failed", "--jobs", "1");
        assertTrue(retry.err().contains("3 of 4 tuples to run"), retry.err());
        assertEquals(1, retry.code());
        // one worker runs n = 4 first and exits when its heap runs out; the next tuples get a fresh
        // worker and fail for their own reasons, not because they were sent to the exiting one
        Map<String, SweepRecord> again = new ResultsFolder(folder).read().records();
        assertTrue(again.get("n=4").error().contains("out of memory"), again.get("n=4").error());
        assertTrue(again.get("n=3").error().startsWith(script + ":2:"), again.get("n=3").error());
        assertEquals(SweepRecord.Status.CHECK_FAILED, again.get("n=2").status(), again.get("n=2").error());
    }

    @Test
    void aTupleOverItsTimeLimitIsRecordedWithTheLimitToRaise() throws Exception {
        Path script = write("long.ctr", """
                vars w, x, y, z
                let f = (1 + w + x + y + z)^(n*50)
                show n
                """);
        Path folder = dir.resolve("long");
        Cli r = cli("sweep", script.toString(), "--over", "n", "in", "0..1", "--results", folder.toString(), "--tuple-time", "1");
        assertEquals(1, r.code(), r.err());
        Map<String, SweepRecord> rec = new ResultsFolder(folder).read().records();
        assertEquals(SweepRecord.Status.OK, rec.get("n=0").status());
        assertEquals(SweepRecord.Status.ERROR, rec.get("n=1").status());
        assertTrue(rec.get("n=1").error().contains("--tuple-time 1 s"), rec.get("n=1").error());
    }

    @Test
    void badInputIsAClearErrorWithExitCodeTwo() throws Exception {
        Path script = write("recursion.ctr", RECURSION);
        // an empty index set
        Cli empty = cli("sweep", script.toString(), "--over", "n", "in", "1..4", "--where", "n", ">", "9", "--results", dir.resolve("e").toString());
        assertEquals(2, empty.code());
        assertTrue(empty.err().contains("has no tuples"), empty.err());
        // a name the script does not use
        Cli unused = cli("sweep", script.toString(), "--over", "n", "in", "1..2,", "q", "in", "1..2", "--results", dir.resolve("u").toString());
        assertEquals(2, unused.code());
        assertTrue(unused.err().contains("never uses 'q'"), unused.err());
        // an index set that does not parse: located, with a caret
        Cli syntax = cli("sweep", script.toString(), "--over", "n", "in", "1..", "--results", dir.resolve("s").toString());
        assertEquals(2, syntax.code());
        assertTrue(syntax.err().contains("sweep index set:1:"), syntax.err());
        assertTrue(syntax.err().contains("^"), syntax.err());
        // a results folder from a different script: refused, naming both
        Path other = write("other.ctr", "show n^2\n");
        Path folder = dir.resolve("shared");
        assertEquals(0, cli("sweep", script.toString(), "--over", "n", "in", "1..2", "--results", folder.toString()).code());
        Cli clash = cli("sweep", other.toString(), "--over", "n", "in", "1..2", "--results", folder.toString());
        assertEquals(2, clash.code());
        assertTrue(clash.err().contains(script.toAbsolutePath().toString()) && clash.err().contains(other.toAbsolutePath().toString()),
                clash.err());
        // the same script over another index set is refused too
        Cli wider = cli("sweep", script.toString(), "--over", "n", "in", "1..3", "--results", folder.toString());
        assertEquals(2, wider.code());
        assertTrue(wider.err().contains("holds the index set 'n in 1..2'"), wider.err());
        // a corrupt record: reported by name, by the sweep and by the merge, never dropped
        Files.writeString(folder.resolve("records").resolve("n=2.json"), "{\"tuple\":{\"n\":2},\"status\":\"ok\",\"sho");
        Cli resumed = cli("sweep", script.toString(), "--over", "n", "in", "1..2", "--results", folder.toString());
        assertEquals(2, resumed.code());
        assertTrue(resumed.err().contains("n=2.json") && resumed.err().contains("damaged"), resumed.err());
        Cli merged = cli("sweep", "--merge", folder.toString());
        assertEquals(2, merged.code());
        assertTrue(merged.err().contains("n=2.json"), merged.err());
        // the script binding a swept name itself
        Path binds = write("binds.ctr", "let n = 3\nshow n\n");
        Cli b = cli("sweep", binds.toString(), "--over", "n", "in", "1..2", "--results", dir.resolve("b").toString());
        assertEquals(2, b.code());
        assertTrue(b.err().contains(binds + ":1:1") && b.err().contains("binds 'n' itself"), b.err());
        // usage errors
        assertEquals(2, cli("sweep", script.toString()).code());
        assertEquals(2, cli("sweep", script.toString(), "--over", "n", "in", "1..2", "--jobs", "0").code());
        Cli threads = cli("sweep", script.toString(), "--over", "n", "in", "1..2", "--tuple-threads", "none");
        assertEquals(2, threads.code());
        assertTrue(threads.err().contains("--tuple-threads needs a whole number of threads"), threads.err());
        assertEquals(2, cli("sweep", "--merge", dir.resolve("nothing").toString()).code());
    }

    @Test
    void aRecordMadeWithALibraryThatChangedIsStaleNotCurrent() throws Exception {
        // An invented library: a scale the script multiplies by. Editing it must not leave records
        // made with the old text in the table as if they were current.
        Path lib = write("scale.ctr", "def scale(n) = 2 * n\n");
        Path script = write("scaled.ctr", "use \"scale.ctr\"\nlet v = scale(n)\nshow v\n");
        Path folder = dir.resolve("scaled");
        Cli first = cli("sweep", script.toString(), "--over", "n", "in", "1..3", "--results", folder.toString(), "--jobs", "1");
        assertEquals(0, first.code(), first.err());
        assertTrue(first.out().contains("6"), first.out());
        for (SweepRecord r : new ResultsFolder(folder).read().records().values()) {
            assertEquals(Map.of(lib.toAbsolutePath().normalize().toString(),
                    dev.contour.eval.Interpreter.sha256("def scale(n) = 2 * n\n")), r.libraries());
        }
        Files.writeString(lib, "def scale(n) = 3 * n\n");
        Cli merged = cli("sweep", "--merge", folder.toString());
        assertEquals(1, merged.code(), merged.out());
        assertTrue(merged.out().contains("stale, left out of the table (3; run the sweep again to redo them)"), merged.out());
        assertTrue(merged.out().contains("scale.ctr, changed since"), merged.out());
        assertFalse(merged.out().contains("| 6"), merged.out()); // no value made with the old library is shown
        Cli again = cli("sweep", script.toString(), "--over", "n", "in", "1..3", "--results", folder.toString(), "--jobs", "1");
        assertEquals(0, again.code(), again.err());
        assertTrue(again.err().contains("3 records were made with a library that has changed since"), again.err());
        assertTrue(again.out().contains("9"), again.out()); // 3 * 3 with the new library
        assertFalse(again.out().contains("stale"), again.out());
    }

    @Test
    void chunksMergeIntoTheTableOfTheWholeSweep() throws Exception {
        Path script = write("recursion.ctr", RECURSION);
        Path whole = dir.resolve("whole");
        Path chunked = dir.resolve("chunked");
        Cli all = cli("sweep", script.toString(), "--over", "n", "in", "1..5", "--results", whole.toString());
        assertEquals(0, all.code(), all.err());
        Cli first = cli("sweep", script.toString(), "--over", "n", "in", "1..5", "--results", chunked.toString(), "--chunk", "1/2");
        assertEquals(0, first.code(), first.err());
        Cli partial = cli("sweep", "--merge", chunked.toString());
        assertEquals(1, partial.code());
        assertTrue(partial.out().contains("missing (2 of 5): n = 2; n = 4"), partial.out()); // chunk 1/2 runs every other tuple
        Cli second = cli("sweep", script.toString(), "--over", "n", "in", "1..5", "--results", chunked.toString(), "--chunk", "2/2");
        assertEquals(0, second.code(), second.err());
        Cli merged = cli("sweep", "--merge", chunked.toString());
        assertEquals(0, merged.code(), merged.err());
        assertEquals(all.out(), merged.out());
        assertEquals(records(whole), records(chunked));
    }

    @Test
    void theTablePrintsChosenColumnsSortedInEveryForm() throws Exception {
        Path script = write("recursion.ctr", RECURSION);
        Path folder = dir.resolve("t");
        assertEquals(0, cli("sweep", script.toString(), "--over", "n", "in", "1..4", "--results", folder.toString()).code());
        Cli text = cli("sweep", "--merge", folder.toString(), "--column", "top", "--sort", "top", "--descending");
        assertEquals("""
                n | status | top
                --+--------+----
                2 | ok     | 1
                4 | ok     | 1
                1 | ok     | -1
                3 | ok     | -1
                """, text.out());
        Cli csv = cli("sweep", "--merge", folder.toString(), "--table", "csv", "--column", "G(s) with sol normalized c[0] = 1");
        assertEquals("n,status,G(s) with sol normalized c[0] = 1\r\n1,ok,2/(s*(s + 2))\r\n", csv.out().substring(0, csv.out().indexOf("2,ok")));
        Cli json = cli("sweep", "--merge", folder.toString(), "--table", "json", "--column", "top");
        assertEquals("{\"tuple\":{\"n\":1},\"status\":\"ok\",\"shown\":{\"top\":\"-1\"}}", json.out().lines().findFirst().orElseThrow());
        Cli latex = cli("sweep", "--merge", folder.toString(), "--table", "latex", "--column", "G(s) with sol normalized c[0] = 1");
        assertTrue(latex.out().contains("$1$ & ok & $\\frac{2}{s\\,\\left(s + 2\\right)}$ \\\\"), latex.out());
        assertTrue(latex.out().startsWith("\\begin{tabular}{lll}"), latex.out());
        Path file = dir.resolve("table.csv");
        assertEquals(0, cli("sweep", "--merge", folder.toString(), "--table", "csv", "--output", file.toString()).code());
        assertTrue(Files.readString(file).startsWith("n,status,top,"));
        Cli timings = cli("sweep", "--merge", folder.toString(), "--timings", "--column", "top");
        assertTrue(timings.out().lines().findFirst().orElseThrow().endsWith("| millis | peak MiB"), timings.out());
        Cli unknown = cli("sweep", "--merge", folder.toString(), "--column", "nothing");
        assertEquals(2, unknown.code());
        assertTrue(unknown.err().contains("'nothing'"), unknown.err());
    }

    @Test
    void emitsASlurmArrayScriptThatRunsChunks() throws Exception {
        Path script = write("recursion.ctr", RECURSION);
        Path folder = dir.resolve("array");
        Cli r = cli("sweep", script.toString(), "--over", "n", "in", "1..7", "--where", "n", "!=", "3", "--results", folder.toString(),
                "--emit-array", "slurm", "--chunks", "3", "--memory", "512m");
        // '!=' is not an index constraint: the error is located in the index set
        assertEquals(2, r.code());
        r = cli("sweep", script.toString(), "--over", "n", "in", "1..7", "--where", "n", ">=", "2", "--results", folder.toString(),
                "--emit-array", "slurm", "--chunks", "3", "--memory", "512m");
        assertEquals(0, r.code(), r.err());
        String array = Files.readString(folder.resolve("slurm-array.sh"));
        assertTrue(array.contains("#SBATCH --array=1-3\n"), array);
        assertTrue(array.contains("--over 'n in 1..7' --where 'n >= 2'"), array);
        assertTrue(array.contains("--chunk \"${SLURM_ARRAY_TASK_ID}/3\""), array);
        assertTrue(array.contains("#SBATCH --mem=1024M"), array); // one 512 MiB worker, its JVM and the chunk's own JVM
        Process check = new ProcessBuilder("bash", "-n", folder.resolve("slurm-array.sh").toString()).redirectErrorStream(true).start();
        assertTrue(check.waitFor(30, TimeUnit.SECONDS));
        assertEquals(0, check.exitValue(), new String(check.getInputStream().readAllBytes(), StandardCharsets.UTF_8));
        assertFalse(Files.exists(folder.resolve("records").resolve("n=2.json")), "emitting runs nothing");
    }
}
