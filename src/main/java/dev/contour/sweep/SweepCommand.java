package dev.contour.sweep;

import dev.contour.ContourException;
import dev.contour.cli.Subcommand;
import dev.contour.eval.InterpreterOptions;
import dev.contour.lang.Diagnostic;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * {@code contour sweep}: runs a script once per tuple of an index set on a pool of worker
 * processes, one record file per tuple in a results folder; resumes, retries failures, runs one
 * chunk of a Slurm job array, writes the array's submission script, and merges records into a table.
 */
public final class SweepCommand implements Subcommand {
    static final int OK = 0;
    static final int FAILED = 1;
    static final int BAD_INPUT = 2;

    static final String USAGE = """
            usage: contour sweep SCRIPT --over NAME in RANGE [, NAME in RANGE ...] [--where CONSTRAINTS] [OPTIONS]
                   contour sweep --merge FOLDER [TABLE OPTIONS]

            Runs SCRIPT once per tuple of the index set (written as after 'sum': ranges and linear
            constraints), each tuple's values bound by name before the script starts. Tuples start
            from the end of the index set, where the costliest usually are.

            sweep options:
              --results DIR         results folder (default: the script's name with .sweep)
              --jobs N              worker processes (default: every core)
              --tuple-threads N     threads each worker computes its tuple with (default: the
                                    cores left over per worker, at least 1; 1 with --jobs = cores)
              --memory SIZE         heap of each worker, so of each tuple (512m, 2g; default: a share of memory)
              --tuple-time SECONDS  wall-clock limit of one tuple (default 3600)
              --retry-failed        run again the tuples whose record is a failure
              --chunk I/N           run only chunk I of N (every N-th tuple from the I-th), as a job-array task
              --emit-array slurm    write a Slurm job-array script instead of running (--chunks N,
                                    --task-cores N, --array-file FILE)
            table options (after a sweep, and with --merge):
              --table text|csv|json|latex   the table's form (default text)
              --column LABEL        a shown value to print, by its show label (repeatable; default all)
              --sort NAME           order rows by a tuple name, a label, status, millis or peak
              --descending          reverse the order
              --timings             add wall time and peak heap columns
              --output FILE         write the table to FILE (whole or not at all)

            exit status: 0 every tuple ok, 1 a tuple failed, is missing or is stale (made with a library
            that has changed since), 2 bad input or usage
            """;

    @Override
    public String name() {
        return "sweep";
    }

    @Override
    public String summary() {
        return "run a script over an index set on every core or as a Slurm job array";
    }

    /** The parsed command line. */
    static final class Options {
        Path script;
        String over;
        String where = "";
        Path results;
        int jobs = Runtime.getRuntime().availableProcessors();
        /** 0: the cores per worker. */
        int tupleThreads;
        String memory;
        long tupleSeconds = 3600;
        boolean retryFailed;
        int chunk;
        int chunks;
        String emit;
        int emitChunks;
        int taskCores = 1;
        Path arrayFile;
        Path merge;
        SummaryTable.Format table = SummaryTable.Format.TEXT;
        List<String> columns = new ArrayList<>();
        String sort;
        boolean descending;
        boolean timings;
        Path output;
        Path rules;
    }

    /** A usage error: the message says what to write instead. */
    static final class Usage extends Exception {
        Usage(String message) {
            super(message);
        }
    }

    @Override
    public int run(List<String> args, InputStream in, PrintStream out, PrintStream err) {
        Options o;
        try {
            o = parse(args);
        } catch (Usage e) {
            err.println("contour sweep: " + e.getMessage());
            err.print(USAGE);
            return BAD_INPUT;
        }
        if (o == null) {
            out.print(USAGE);
            return OK;
        }
        try {
            return o.merge != null ? merge(o, out, err) : sweep(o, out, err);
        } catch (Refusal e) {
            err.print(e.getMessage().endsWith("\n") ? e.getMessage() : e.getMessage() + "\n");
            return BAD_INPUT;
        } catch (IOException e) {
            err.println("contour sweep: " + e);
            return BAD_INPUT;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            err.println("contour sweep: interrupted");
            return BAD_INPUT;
        } catch (IllegalStateException e) {
            err.println("contour sweep: " + e.getMessage());
            return BAD_INPUT;
        }
    }

    /** Bad input found after parsing: the message is the whole report. */
    static final class Refusal extends Exception {
        Refusal(String message) {
            super(message);
        }
    }

    static Options parse(List<String> args) throws Usage {
        Options o = new Options();
        List<String> a = new ArrayList<>(args);
        for (int i = 0; i < a.size(); i++) {
            String w = a.get(i);
            switch (w) {
                case "-h", "--help" -> {
                    return null;
                }
                case "--over" -> {
                    StringBuilder b = new StringBuilder();
                    while (i + 1 < a.size() && !a.get(i + 1).startsWith("--")) {
                        b.append(b.length() == 0 ? "" : " ").append(a.get(++i));
                    }
                    if (b.toString().isBlank()) {
                        throw new Usage("--over needs an index set, as in --over p in 2..20");
                    }
                    o.over = b.toString().strip();
                }
                case "--where" -> {
                    StringBuilder b = new StringBuilder();
                    while (i + 1 < a.size() && !a.get(i + 1).startsWith("--")) {
                        b.append(b.length() == 0 ? "" : " ").append(a.get(++i));
                    }
                    if (b.toString().isBlank()) {
                        throw new Usage("--where needs constraints, as in --where p + q <= 10");
                    }
                    o.where = b.toString().strip();
                }
                case "--results" -> o.results = Path.of(value(a, ++i, w));
                case "--jobs" -> o.jobs = positive(value(a, ++i, w), w);
                case "--tuple-threads" -> {
                    try {
                        o.tupleThreads = dev.contour.Parallel.parseThreads(value(a, ++i, w), w);
                    } catch (dev.contour.ContourException e) {
                        throw new Usage(e.getMessage());
                    }
                }
                case "--memory" -> {
                    o.memory = value(a, ++i, w).toLowerCase(Locale.ROOT);
                    if (!o.memory.matches("\\d+[kmg]")) {
                        throw new Usage("--memory takes a size such as 512m or 2g, not '" + o.memory + "'");
                    }
                }
                case "--tuple-time" -> o.tupleSeconds = positive(value(a, ++i, w), w);
                case "--retry-failed" -> o.retryFailed = true;
                case "--chunk" -> {
                    String c = value(a, ++i, w);
                    String[] parts = c.split("/");
                    if (parts.length != 2) {
                        throw new Usage("--chunk takes I/N, as in --chunk 3/10");
                    }
                    o.chunk = positive(parts[0], w);
                    o.chunks = positive(parts[1], w);
                    if (o.chunk > o.chunks) {
                        throw new Usage("--chunk " + c + ": I must be between 1 and N");
                    }
                }
                case "--emit-array" -> {
                    o.emit = value(a, ++i, w);
                    if (!o.emit.equals("slurm")) {
                        throw new Usage("--emit-array knows 'slurm' only, not '" + o.emit + "'");
                    }
                }
                case "--chunks" -> o.emitChunks = positive(value(a, ++i, w), w);
                case "--task-cores" -> o.taskCores = positive(value(a, ++i, w), w);
                case "--array-file" -> o.arrayFile = Path.of(value(a, ++i, w));
                case "--merge" -> o.merge = Path.of(value(a, ++i, w));
                case "--table" -> {
                    String f = value(a, ++i, w);
                    try {
                        o.table = SummaryTable.Format.valueOf(f.toUpperCase(Locale.ROOT));
                    } catch (IllegalArgumentException e) {
                        throw new Usage("--table takes text, csv, json or latex, not '" + f + "'");
                    }
                }
                case "--json" -> o.table = SummaryTable.Format.JSON;
                case "--latex" -> o.table = SummaryTable.Format.LATEX;
                case "--column" -> o.columns.add(value(a, ++i, w));
                case "--sort" -> o.sort = value(a, ++i, w);
                case "--descending" -> o.descending = true;
                case "--timings" -> o.timings = true;
                case "--output" -> o.output = Path.of(value(a, ++i, w));
                case "--rules" -> o.rules = Path.of(value(a, ++i, w));
                case "--debug" -> { }
                default -> {
                    if (w.startsWith("--rules=")) {
                        o.rules = Path.of(w.substring("--rules=".length()));
                    } else if (w.startsWith("-") && !w.equals("-")) {
                        throw new Usage("unknown option '" + w + "'");
                    } else if (o.script == null && o.merge == null) {
                        o.script = Path.of(w);
                    } else {
                        throw new Usage("one script only (found '" + w + "' as well); an index set follows --over");
                    }
                }
            }
        }
        if (o.merge != null) {
            if (o.script != null || o.over != null) {
                throw new Usage("--merge reads a results folder and takes no script or --over");
            }
            return o;
        }
        if (o.script == null) {
            throw new Usage("no script given");
        }
        if (o.over == null) {
            throw new Usage("no index set given: add --over NAME in RANGE");
        }
        if (o.emit != null && o.chunks > 0) {
            throw new Usage("--emit-array writes the script that passes --chunk itself");
        }
        return o;
    }

    private static String value(List<String> a, int i, String option) throws Usage {
        if (i >= a.size() || a.get(i).startsWith("--")) {
            throw new Usage(option + " needs a value");
        }
        return a.get(i);
    }

    private static int positive(String s, String option) throws Usage {
        try {
            int n = Integer.parseInt(s.trim());
            if (n >= 1) {
                return n;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new Usage(option + " takes a whole number of at least 1, not '" + s + "'");
    }

    // ------------------------------------------------------------------ sweep

    private int sweep(Options o, PrintStream out, PrintStream err) throws Refusal, IOException, InterruptedException {
        String text;
        try {
            text = Files.readString(o.script, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw new Refusal("contour sweep: no such file: " + o.script);
        }
        String file = o.script.toString();
        List<String> names;
        List<long[]> tuples;
        String indexText = SweepBinding.indexSetText(o.over, o.where);
        try {
            names = SweepBinding.names(o.over, o.where);
            tuples = SweepBinding.tuples(o.over, o.where, o.rules);
        } catch (ContourException e) {
            throw new Refusal("contour sweep: in the index set (--over " + o.over + (o.where.isEmpty() ? "" : " --where " + o.where)
                    + "), read as:\n" + Diagnostic.render(e, indexText));
        }
        if (tuples.isEmpty()) {
            throw new Refusal("contour sweep: the index set " + o.over + (o.where.isEmpty() ? "" : " with " + o.where)
                    + " has no tuples; nothing to run");
        }
        try {
            SweepBinding.checkScriptUses(text, file, names);
        } catch (ContourException e) {
            throw new Refusal(e.span() == null ? "contour sweep: " + e.getMessage() : Diagnostic.render(e, text));
        }
        ResultsFolder folder = new ResultsFolder(o.results != null ? o.results : defaultFolder(o.script));
        ResultsFolder.Manifest mine = new ResultsFolder.Manifest(o.script.toAbsolutePath().normalize().toString(),
                ResultsFolder.sha256(text), o.over, o.where, names, tuples);
        ResultsFolder.Manifest theirs = readManifest(folder);
        if (theirs != null) {
            refuseIfDifferent(folder, theirs, mine);
        } else {
            ResultsFolder.writeWhole(folder.root().resolve(ResultsFolder.MANIFEST), mine.toJson());
        }
        Files.createDirectories(folder.records());
        if (o.emit != null) {
            return emit(o, folder, mine, out);
        }
        ResultsFolder.Contents contents = folder.read();
        if (!contents.damaged().isEmpty()) {
            throw new Refusal(damagedReport(contents.damaged()));
        }
        List<Integer> todo = new ArrayList<>();
        LibraryState libraries = new LibraryState();
        java.util.Set<String> changed = new java.util.TreeSet<>();
        int stale = 0;
        for (int i = 0; i < tuples.size(); i++) {
            if (o.chunks > 0 && i % o.chunks != o.chunk - 1) {
                continue;
            }
            SweepRecord r = contents.records().get(ResultsFolder.key(mine.tuple(i)));
            List<String> old = r == null ? List.of() : libraries.changed(r);
            if (r == null || (o.retryFailed && r.status() != SweepRecord.Status.OK) || !old.isEmpty()) {
                todo.add(i);
                if (r != null && !old.isEmpty()) {
                    stale++;
                    changed.addAll(old);
                }
            }
        }
        if (stale > 0) {
            err.println("sweep: " + stale + " record" + (stale == 1 ? " was" : "s were") + " made with a library that has changed since ("
                    + String.join(", ", changed) + "); running " + (stale == 1 ? "its tuple" : "those tuples") + " again");
        }
        int jobs = Math.max(1, Math.min(o.jobs, todo.size()));
        String memory = o.memory != null ? o.memory : defaultMemory(jobs);
        String memoryNote = "each tuple's heap is --memory " + memory + "; raise it with --memory SIZE";
        if (!todo.isEmpty()) {
            int threads = o.tupleThreads > 0 ? o.tupleThreads : Math.max(1, Runtime.getRuntime().availableProcessors() / jobs);
            err.println("sweep: " + todo.size() + " of " + tuples.size() + " tuples to run on " + jobs + " worker"
                    + (jobs == 1 ? "" : "s") + " (" + memory + " heap and " + threads + " thread" + (threads == 1 ? "" : "s")
                    + " each) into " + folder.root());
            WorkerPool.Settings settings = new WorkerPool.Settings(javaCommand(memory, threads),
                    List.of(folder.root().toAbsolutePath().toString(), o.script.toAbsolutePath().toString(),
                            o.rules == null ? "" : o.rules.toAbsolutePath().toString(), Long.toString(o.tupleSeconds), memoryNote),
                    jobs, Duration.ofSeconds(o.tupleSeconds + 2 + o.tupleSeconds / 10), memoryNote,
                    "each tuple may take --tuple-time " + o.tupleSeconds + " s; raise it with --tuple-time SECONDS");
            SweepProgress progress = new SweepProgress(err, System.console() != null, todo.size());
            // Workers take tuples from the end of the index set: sweeps over weights, k or widths
            // list the costliest last, and started first they cannot be left running alone at the
            // end while the other workers idle. Records and tables do not depend on the order.
            List<Integer> order = new ArrayList<>(todo);
            java.util.Collections.reverse(order);
            new WorkerPool(settings, folder, mine).run(order, progress);
            progress.close();
        } else {
            err.println("sweep: every tuple" + (o.chunks > 0 ? " of chunk " + o.chunk + "/" + o.chunks : "")
                    + " already has a record in " + folder.root() + (o.retryFailed ? "" : " (--retry-failed runs failures again)"));
        }
        if (o.chunks > 0) {
            return chunkSummary(o, folder, mine, err);
        }
        return table(o, folder, mine, out, err);
    }

    private static Path defaultFolder(Path script) {
        String name = script.getFileName().toString();
        String base = name.endsWith(".ctr") ? name.substring(0, name.length() - 4) : name;
        Path parent = script.toAbsolutePath().getParent();
        return parent.resolve(base + ".sweep");
    }

    private static ResultsFolder.Manifest readManifest(ResultsFolder folder) throws Refusal, IOException {
        try {
            return folder.readManifest();
        } catch (Json.Malformed e) {
            throw new Refusal("contour sweep: " + folder.root().resolve(ResultsFolder.MANIFEST) + ":1:" + e.column
                    + ": this is not a sweep's description: " + e.getMessage() + " (use another --results folder)");
        }
    }

    private static void refuseIfDifferent(ResultsFolder folder, ResultsFolder.Manifest theirs, ResultsFolder.Manifest mine)
            throws Refusal {
        if (!theirs.scriptSha256().equals(mine.scriptSha256())) {
            throw new Refusal("contour sweep: the results folder " + folder.root() + " was made by the script "
                    + theirs.script() + " (SHA-256 " + theirs.scriptSha256().substring(0, 12) + "...), not by "
                    + mine.script() + " (SHA-256 " + mine.scriptSha256().substring(0, 12) + "...)"
                    + (theirs.script().equals(mine.script()) ? "; the script changed since" : "")
                    + "; give another --results folder, or remove that one to start afresh");
        }
        boolean sameTuples = theirs.names().equals(mine.names()) && theirs.tuples().size() == mine.tuples().size();
        for (int i = 0; sameTuples && i < mine.tuples().size(); i++) {
            sameTuples = Arrays.equals(theirs.tuples().get(i), mine.tuples().get(i));
        }
        if (!sameTuples) {
            throw new Refusal("contour sweep: the results folder " + folder.root() + " holds the index set '"
                    + theirs.indexSet() + "' (" + theirs.tuples().size() + " tuples), not '" + mine.indexSet() + "' ("
                    + mine.tuples().size() + " tuples); give another --results folder");
        }
    }

    static String damagedReport(List<ResultsFolder.Damaged> damaged) {
        StringBuilder b = new StringBuilder("contour sweep: " + damaged.size() + " record file"
                + (damaged.size() == 1 ? " is" : "s are") + " damaged (a record is never dropped silently):\n");
        for (ResultsFolder.Damaged d : damaged) {
            b.append("  ").append(d.file()).append(": ").append(d.reason()).append('\n');
        }
        b.append("delete a damaged file to run its tuple again\n");
        return b.toString();
    }

    /**
     * The JVM that runs workers: this one's executable and class path, its JIT/GC/sharing options,
     * the tuple heap, and the cores the worker may use (its pool's threads and its collector's).
     */
    private static List<String> javaCommand(String memory, int threads) {
        List<String> c = new ArrayList<>();
        c.add(ProcessHandle.current().info().command().orElse(Path.of(System.getProperty("java.home"), "bin", "java").toString()));
        boolean stack = false;
        for (String arg : ManagementFactory.getRuntimeMXBean().getInputArguments()) {
            if (arg.startsWith("-XX:SharedArchiveFile") || arg.startsWith("-Xshare") || arg.startsWith("-Xlog:cds")
                    || arg.startsWith("-XX:TieredStopAtLevel") || arg.startsWith("-XX:MaxNewSize") || arg.startsWith("-Xss")) {
                c.add(arg);
                stack |= arg.startsWith("-Xss");
            }
        }
        if (!stack) {
            c.add("-Xss16m"); // as the launcher: deep expressions recurse
        }
        // The parallel collector gives up with an out-of-memory error when nearly all time goes to
        // collection; G1 has no such limit and a tuple near its heap bound thrashed for minutes.
        // Tighter than its defaults (98% of time, 2% freed), so a hopeless tuple ends sooner.
        c.add("-XX:+UseParallelGC");
        c.add("-XX:GCTimeLimit=90");
        c.add("-XX:GCHeapFreeLimit=10");
        c.add("-Xmx" + memory);
        // workers share the cores rather than each claiming all; the worker's pool sizes itself from this
        c.add("-XX:ActiveProcessorCount=" + threads);
        c.add("-cp");
        c.add(System.getProperty("java.class.path"));
        return c;
    }

    /** A share of the machine's memory per worker: 70% of it over the workers, between 256 MiB and 8 GiB. */
    private static String defaultMemory(int jobs) {
        long total = 4L << 30;
        if (ManagementFactory.getOperatingSystemMXBean() instanceof com.sun.management.OperatingSystemMXBean os) {
            total = os.getTotalMemorySize();
        }
        long share = Math.max(256L << 20, Math.min(8L << 30, total * 7 / 10 / jobs));
        return (share >> 20) + "m";
    }

    private int emit(Options o, ResultsFolder folder, ResultsFolder.Manifest m, PrintStream out) throws Refusal, IOException {
        int chunks = o.emitChunks > 0 ? Math.min(o.emitChunks, m.tuples().size()) : Math.min(m.tuples().size(), 100);
        String memory = o.memory != null ? o.memory : "2g";
        long memoryMb = switch (memory.charAt(memory.length() - 1)) {
            case 'g' -> Long.parseLong(memory.substring(0, memory.length() - 1)) * 1024;
            case 'm' -> Long.parseLong(memory.substring(0, memory.length() - 1));
            default -> Math.max(1, Long.parseLong(memory.substring(0, memory.length() - 1)) / 1024);
        };
        long taskMb = o.taskCores * (memoryMb + 256) + 256; // each worker JVM's heap plus its own overhead, and the chunk's JVM
        Path root = folder.root().toAbsolutePath().normalize();
        if (root.toString().matches(".*\\s.*")) {
            throw new Refusal("contour sweep: a Slurm array needs a results folder path without spaces, not '" + root + "'");
        }
        List<String> args = new ArrayList<>(List.of(o.script.toAbsolutePath().normalize().toString(), "--over", o.over));
        if (!o.where.isEmpty()) {
            args.addAll(List.of("--where", o.where));
        }
        args.addAll(List.of("--results", root.toString(), "--memory", memory, "--tuple-time", Long.toString(o.tupleSeconds)));
        if (o.rules != null) {
            args.addAll(List.of("--rules", o.rules.toAbsolutePath().toString()));
        }
        Path launcher = InterpreterOptions.projectRoot().toAbsolutePath().resolve("contour");
        String script = SlurmArray.script(launcher, args, chunks, o.taskCores, taskMb, root.resolve("logs"), m.indexSet(),
                m.tuples().size());
        Path target = o.arrayFile != null ? o.arrayFile : root.resolve("slurm-array.sh");
        Files.createDirectories(root.resolve("logs"));
        ResultsFolder.writeWhole(target, script);
        target.toFile().setExecutable(true);
        out.println("wrote " + target + ": " + chunks + " array tasks over " + m.tuples().size() + " tuples");
        out.println("submit with: sbatch " + target);
        out.println("then merge with: contour sweep --merge " + root);
        return OK;
    }

    private static int chunkSummary(Options o, ResultsFolder folder, ResultsFolder.Manifest m, PrintStream err) throws IOException {
        ResultsFolder.Contents c = folder.read();
        int failed = 0;
        for (int i = o.chunk - 1; i < m.tuples().size(); i += o.chunks) {
            SweepRecord r = c.records().get(ResultsFolder.key(m.tuple(i)));
            if (r == null || r.status() != SweepRecord.Status.OK) {
                failed++;
            }
        }
        err.println("sweep: chunk " + o.chunk + "/" + o.chunks + " finished; " + failed + " of its tuples failed"
                + " (contour sweep --merge " + folder.root() + " lists them)");
        return failed == 0 ? OK : FAILED;
    }

    // ------------------------------------------------------------------ merge and the table

    private int merge(Options o, PrintStream out, PrintStream err) throws Refusal, IOException {
        ResultsFolder folder = new ResultsFolder(o.merge);
        if (!Files.isDirectory(o.merge)) {
            throw new Refusal("contour sweep: no such results folder: " + o.merge);
        }
        ResultsFolder.Manifest m = readManifest(folder);
        if (m == null) {
            throw new Refusal("contour sweep: " + o.merge + " is not a sweep's results folder (it has no " + ResultsFolder.MANIFEST + ")");
        }
        return table(o, folder, m, out, err);
    }

    private int table(Options o, ResultsFolder folder, ResultsFolder.Manifest m, PrintStream out, PrintStream err)
            throws Refusal, IOException {
        ResultsFolder.Contents c = folder.read();
        if (!c.damaged().isEmpty()) {
            throw new Refusal(damagedReport(c.damaged()));
        }
        List<SweepRecord> rows = new ArrayList<>();
        List<Map<String, Long>> missing = new ArrayList<>();
        List<SweepRecord> failed = new ArrayList<>();
        List<String> stale = new ArrayList<>();
        LibraryState libraries = new LibraryState();
        int belonging = 0;
        for (int i = 0; i < m.tuples().size(); i++) {
            SweepRecord r = c.records().get(ResultsFolder.key(m.tuple(i)));
            List<String> old = r == null ? List.of() : libraries.changed(r);
            if (r != null) {
                belonging++;
            }
            if (r == null) {
                missing.add(m.tuple(i));
            } else if (!old.isEmpty()) {
                // left out of the table: its values came from a library text that no longer exists
                stale.add(SweepRecord.describe(r.tuple()) + ": made with " + String.join(", ", old) + ", changed since");
            } else {
                rows.add(r);
                if (r.status() != SweepRecord.Status.OK) {
                    failed.add(r);
                }
            }
        }
        if (belonging != c.records().size()) {
            throw new Refusal("contour sweep: " + (c.records().size() - belonging) + " record file(s) in " + folder.records()
                    + " belong to no tuple of the index set " + m.indexSet());
        }
        for (String col : o.columns) {
            if (!SummaryTable.knowsColumn(col, m.names(), rows)) {
                throw new Refusal("contour sweep: no record shows a value labelled '" + col + "' (--column takes a show"
                        + " statement's label as printed, before ' = ')");
            }
        }
        if (o.sort != null && !SummaryTable.knowsColumn(o.sort, m.names(), rows)) {
            throw new Refusal("contour sweep: --sort " + o.sort + ": not a tuple name, a shown label, status, millis or peak");
        }
        String text = new SummaryTable(m.names(), rows, o.columns, o.sort, o.descending, o.timings).render(o.table);
        if (o.output != null) {
            ResultsFolder.writeWhole(o.output, text);
        } else {
            out.print(text);
        }
        PrintStream notes = o.table == SummaryTable.Format.TEXT && o.output == null ? out : err;
        if (!missing.isEmpty()) {
            notes.println("missing (" + missing.size() + " of " + m.tuples().size() + "): "
                    + String.join("; ", missing.stream().map(SweepRecord::describe).toList()));
        }
        if (!stale.isEmpty()) {
            notes.println("stale, left out of the table (" + stale.size() + "; run the sweep again to redo them): "
                    + String.join("; ", stale));
        }
        for (SweepRecord r : failed) {
            notes.println("failed: " + SweepRecord.describe(r.tuple()) + ": " + r.status().word
                    + (r.error() == null ? "" : "\n    " + r.error().strip().replace("\n", "\n    ")));
        }
        return missing.isEmpty() && failed.isEmpty() && stale.isEmpty() ? OK : FAILED;
    }

    /** The current digest of each library file records name, read once per file. */
    private static final class LibraryState {
        private final Map<String, String> now = new java.util.HashMap<>();

        /** The library files of this record whose text is no longer what the record was made with. */
        List<String> changed(SweepRecord r) {
            List<String> out = new ArrayList<>();
            r.libraries().forEach((file, digest) -> {
                String current = now.computeIfAbsent(file, f -> {
                    try {
                        return dev.contour.eval.Interpreter.libraryDigest(Path.of(f));
                    } catch (IOException | RuntimeException e) {
                        return "(unreadable)";
                    }
                });
                if (!current.equals(digest)) {
                    out.add(file);
                }
            });
            return out;
        }
    }
}
