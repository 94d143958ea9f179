package dev.contour.sweep;

import dev.contour.ContourException;
import dev.contour.eval.EvaluationLimits;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.RunResult;
import dev.contour.lang.Diagnostic;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The interpreter's side of a sweep: runs the script for one tuple in a fresh interpreter, the
 * tuple's values bound first as if by {@code let}, and turns the outcome into a {@link SweepRecord}.
 */
public final class TupleRunner {
    /** The file name the tuple's bindings are parsed under (it never appears in a located error of the script). */
    public static final String TUPLE_FILE = "<sweep tuple>";

    private final Path script;
    private final String text;
    private final Path rules;
    private final Duration timeLimit;
    private final String memoryNote;
    private boolean exhaustedMemory;

    /**
     * @param timeLimit  wall-clock budget of one tuple (zero: none)
     * @param memoryNote how the per-tuple heap was set, for an out-of-memory message
     */
    TupleRunner(Path script, String text, Path rules, Duration timeLimit, String memoryNote) {
        this.script = script;
        this.text = text;
        this.rules = rules;
        this.timeLimit = timeLimit;
        this.memoryNote = memoryNote;
    }

    /** Whether the last run ran out of memory (its worker is then best replaced by a fresh one). */
    boolean exhaustedMemory() {
        return exhaustedMemory;
    }

    /**
     * Loads the interpreter's classes and the parser before the first tuple, so neither a tuple's
     * time nor its time limit pays for the worker's start.
     */
    void warmUp() {
        Interpreter interpreter = new Interpreter(InterpreterOptions.to(new PrintStream(java.io.OutputStream.nullOutputStream())));
        interpreter.run("vars warm_s\nlet warm_x = (warm_s + 1)^2 / (warm_s - 1)\nshow warm_x\ncheck warm_x == warm_x\n", "<sweep warm-up>");
    }

    SweepRecord run(Map<String, Long> tuple) {
        exhaustedMemory = false;
        ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(buffer, true, StandardCharsets.UTF_8);
        EvaluationLimits d = EvaluationLimits.DEFAULT;
        InterpreterOptions options = new InterpreterOptions(out, OutputFormat.PLAIN, false, rules, false,
                // A tuple's memory bound is its worker's heap (--memory): running out ends that tuple and the
                // pool restarts the worker, so the statement memory budget (a share of the same heap) is off.
                new EvaluationLimits(d.maxExponent(), d.maxSetSize(), d.maxLoopIterations(), d.maxCallDepth(), timeLimit)
                        .withStatementBudget(d.statementTime(), 0));
        List<SweepRecord.Shown> shown = new ArrayList<>();
        List<MemoryPoolMXBean> pools = heapPools();
        pools.forEach(MemoryPoolMXBean::resetPeakUsage);
        long start = System.nanoTime();
        SweepRecord.Status status;
        String error = null;
        int passed = 0;
        int failed = 0;
        Interpreter interpreter = null;
        try {
            interpreter = new Interpreter(options);
            StringBuilder bindings = new StringBuilder();
            tuple.forEach((k, v) -> bindings.append("let ").append(k).append(" = ").append(v).append('\n'));
            interpreter.run(bindings.toString(), TUPLE_FILE);
            interpreter.watchShows((label, value, latex) -> shown.add(new SweepRecord.Shown(label, value, latex)));
            RunResult result = interpreter.run(text, script.toString());
            passed = result.checksPassed();
            failed = result.checksFailed();
            status = result.ok() ? SweepRecord.Status.OK : SweepRecord.Status.CHECK_FAILED;
        } catch (ContourException e) {
            status = SweepRecord.Status.ERROR;
            String message = Diagnostic.render(e, sourceOf(e));
            if (e.getMessage() != null && e.getMessage().startsWith("out of memory")) {
                exhaustedMemory = true;
                int cut = message.indexOf("; a larger heap can be given with CONTOUR_JAVA_OPTS");
                int end = message.indexOf('\n');
                if (cut >= 0 && cut < end) {
                    message = message.substring(0, cut) + message.substring(end); // the launcher's option does not reach workers
                }
                message = message.replaceFirst("\n", "; " + memoryNote + "\n");
            } else if (e.getMessage() != null && e.getMessage().startsWith("the script ran past its time limit")) {
                // the interpreter's limit is the tuple's: name the sweep option that sets it
                message = message.replaceFirst("\n", "; each tuple may take --tuple-time " + Math.max(1, timeLimit.toSeconds())
                        + " s; raise it with --tuple-time SECONDS\n");
            }
            error = message;
        } catch (OutOfMemoryError e) {
            exhaustedMemory = true;
            status = SweepRecord.Status.ERROR;
            error = "out of memory outside any statement [in a sweep: " + memoryNote + "]\n";
        } catch (RuntimeException | StackOverflowError e) {
            status = SweepRecord.Status.ERROR;
            error = "internal error: " + e + "\n";
        }
        long millis = (System.nanoTime() - start) / 1_000_000;
        long peak = 0;
        for (MemoryPoolMXBean p : pools) {
            peak += p.getPeakUsage() == null ? 0 : p.getPeakUsage().getUsed();
        }
        out.flush();
        Map<String, String> libraries = new java.util.LinkedHashMap<>();
        if (interpreter != null) {
            interpreter.libraryDigests().forEach((file, digest) -> libraries.put(file.toString(), digest));
        }
        return new SweepRecord(tuple, status, error, shown, buffer.toString(StandardCharsets.UTF_8),
                passed, failed, millis, pools.isEmpty() ? -1 : peak, libraries);
    }

    private static List<MemoryPoolMXBean> heapPools() {
        List<MemoryPoolMXBean> out = new ArrayList<>();
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            if (p.getType() == MemoryType.HEAP && p.isValid()) {
                out.add(p);
            }
        }
        return out;
    }

    /** The text of the file an error points into: the script itself or a library it used. */
    private String sourceOf(ContourException e) {
        if (e.span() == null || e.span().file().equals(script.toString())) {
            return text;
        }
        try {
            return Files.readString(Path.of(e.span().file()), StandardCharsets.UTF_8);
        } catch (IOException | RuntimeException x) {
            return null;
        }
    }
}
