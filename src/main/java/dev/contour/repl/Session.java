package dev.contour.repl;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import dev.contour.eval.Suggestions;
import dev.contour.lang.Diagnostic;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

/**
 * One interactive session: takes complete inputs (code or {@code :commands}), runs code on a
 * worker thread in one {@link Interpreter}, and prints results and errors the way the script
 * runner does, with {@code <repl>} as the file name and the session's line numbers.
 *
 * <p>Lines are numbered across the whole session, so a one-line input's number is its line and
 * an error in a function defined ten inputs ago still points at the line that defined it. To get
 * those numbers from the parser without rewriting spans, each input runs padded with the blank
 * lines that stand for everything typed before it.
 */
public final class Session {
    /** The file name in the session's error locations. */
    public static final String FILE = "<repl>";

    /** Words that open a statement; an input that opens with anything else is a bare expression. */
    private static final Set<String> STATEMENT_WORDS =
            Set.of("vars", "let", "def", "unknown", "use", "show", "check", "for", "rule", "derive");

    /** A {@code :command}: its name, its argument (empty for none) and what it does. */
    record Command(String name, String argument, String summary) { }

    static final List<Command> COMMANDS = List.of(
            new Command("help", "", "this list"),
            new Command("defs", "", "the session's definitions, as script text"),
            new Command("names", "", "every name in scope: definitions, variables, built-ins"),
            new Command("write", "FILE", "save the definitions to FILE as a script (replacing it whole)"),
            new Command("run", "FILE", "run a script in this session; its definitions join the session"),
            new Command("end", "", "leave the session (Ctrl-D does too)"));

    private static final long GRACE_MILLIS = 500;

    private final ReplSettings settings;
    private final PrintStream out;
    private final PrintStream err;
    private final Evaluation evaluation = new Evaluation(GRACE_MILLIS);
    /** Every line typed so far: the source the session's spans point into. */
    private final List<String> transcript = new ArrayList<>();
    private Interpreter interpreter;
    private SwitchableOutput sink;
    private boolean anyError;
    private boolean anyCheckFailed;

    /**
     * An input as typed (or a file's text) and where it goes: for session input the padded
     * script text is rebuilt on demand, so a long session does not keep every padding around.
     */
    private record Past(String text, String fileName, int start, boolean bare) {
        String script() {
            if (start == 0) {
                return text;
            }
            // A bare expression is shown as if typed after 'show'. The word goes on the padding
            // line above the input so that columns stay as typed; on line 1 there is no room above.
            return bare && start == 1 ? "show " + text
                    : bare ? "\n".repeat(start - 2) + "show\n" + text
                    : "\n".repeat(start - 1) + text;
        }
    }

    /**
     * @param out where results go
     * @param err where errors go (the same stream on a terminal)
     */
    public Session(ReplSettings settings, PrintStream out, PrintStream err) {
        this.settings = settings;
        this.out = out;
        this.err = err;
        this.sink = new SwitchableOutput(out);
        this.interpreter = newInterpreter(sink);
    }

    /** The number of the line the next input starts on. */
    public int nextLine() {
        return transcript.size() + 1;
    }

    /** The primary prompt, showing the next line's number. */
    public String prompt() {
        return "contour " + nextLine() + "> ";
    }

    /** Every name a completion may offer: definitions, variables, families and built-ins. */
    public Set<String> names() {
        return interpreter.namesInScope();
    }

    /** 2 if any input failed with an error, else 1 if any check failed, else 0. */
    public int exitCode() {
        return anyError ? 2 : anyCheckFailed ? 1 : 0;
    }

    /** Stops the input that is running, if any (the terminal's Ctrl-C handler calls this). */
    public void interrupt() {
        evaluation.interrupt();
    }

    /** Whether the text is a {@code :command} (these always fit on one line). */
    static boolean isCommand(String input) {
        return input.stripLeading().startsWith(":");
    }

    /**
     * Takes one complete input (one or more lines) and runs it.
     *
     * @return false when the input ends the session
     */
    public boolean accept(String input) {
        int start = nextLine();
        transcript.addAll(List.of(input.split("\r?\n", -1)));
        if (input.isBlank()) {
            return true;
        }
        if (isCommand(input)) {
            return command(input.strip(), start);
        }
        execute(new Past(input, FILE, start, isBareExpression(input)));
        return true;
    }

    // ---------------------------------------------------------------- running code

    /** Runs an input in the session's interpreter on the worker and reports how it went. */
    private void execute(Past input) {
        String text = input.script();
        String fileName = input.fileName();
        Interpreter target = interpreter;
        // Values are immutable, so keeping the definitions as they are now costs a few map copies.
        Interpreter.Snapshot before = target.snapshot();
        RunResult[] result = new RunResult[1];
        Evaluation.Outcome outcome = evaluation.run(() -> result[0] = target.run(text, fileName));
        out.flush();
        Throwable failure = evaluation.failure();
        boolean interrupted = outcome == Evaluation.Outcome.STOPPED || outcome == Evaluation.Outcome.ABANDONED
                || outcome == Evaluation.Outcome.INTERRUPTED && failure != null;
        if (interrupted) {
            err.println("interrupted");
            // The session goes on with the definitions it had before this input.
            restore(before, outcome == Evaluation.Outcome.ABANDONED);
            return;
        }
        if (failure == null) {
            anyCheckFailed |= !result[0].ok();
        } else {
            report(failure, text, fileName, input.bare() ? input.start() : 0);
        }
    }

    private void report(Throwable failure, String text, String fileName, int bareStart) {
        anyError = true;
        if (failure instanceof ContourException e) {
            Span span = bareStart > 0 ? unpad(e.span(), bareStart) : e.span();
            err.print(Diagnostic.render(new ContourException(e.getMessage(), span), sourceOf(span, text, fileName)));
        } else {
            err.println("contour: internal error: " + failure + (settings.debug() ? "" : " (run with --debug for details)"));
        }
        if (settings.debug()) {
            failure.printStackTrace(err);
        }
        err.flush();
    }

    /** Maps a span that falls on the inserted {@code show} back onto the bare expression as typed. */
    private static Span unpad(Span span, int start) {
        if (span == null || !FILE.equals(span.file())) {
            return span;
        }
        if (start == 1 && span.line() == 1) {
            return new Span(FILE, 1, Math.max(1, span.column() - "show ".length()), span.length());
        }
        if (start > 1 && span.line() == start - 1 && span.column() == 1) {
            return new Span(FILE, start, 1, span.length());
        }
        return span;
    }

    /** The text an error's span points into: the session, the file being run, or a library on disk. */
    private String sourceOf(Span span, String text, String fileName) {
        if (span == null || FILE.equals(span.file())) {
            return String.join("\n", transcript);
        }
        if (span.file().equals(fileName)) {
            return text;
        }
        return dev.contour.lang.SourceFiles.readForDisplay(Path.of(span.file()));
    }

    /**
     * Puts the definitions back as they were before an interrupted input. A worker that could not
     * be stopped may still touch its interpreter, so then a fresh interpreter takes the snapshot
     * and the old one is muted and left to the worker.
     */
    private void restore(Interpreter.Snapshot before, boolean workerStillRuns) {
        if (workerStillRuns) {
            sink.redirect(OutputStream.nullOutputStream());
            sink = new SwitchableOutput(out);
            interpreter = newInterpreter(sink);
        }
        interpreter.restore(before);
    }

    private Interpreter newInterpreter(OutputStream to) {
        PrintStream stream = new PrintStream(to, true, StandardCharsets.UTF_8);
        return new Interpreter(new InterpreterOptions(stream, settings.format(), false, settings.rules(), settings.debug(), settings.limits()));
    }

    private static boolean isBareExpression(String input) {
        int i = 0;
        while (i < input.length()) {
            char c = input.charAt(i);
            if (c == '#') {
                int end = input.indexOf('\n', i);
                if (end < 0) {
                    return false; // only a comment
                }
                i = end + 1;
            } else if (Character.isWhitespace(c)) {
                i++;
            } else {
                break;
            }
        }
        if (i == input.length() || input.charAt(i) == ';') {
            return false;
        }
        int end = i;
        while (end < input.length() && InputCompleteness.isWordChar(input.charAt(end))) {
            end++;
        }
        return !STATEMENT_WORDS.contains(input.substring(i, end));
    }

    /** Runs a script file in the session (as {@code :run} does), for scripts named on the command line. */
    public void runScript(String file) {
        try {
            runFile(path(file, "run", null), null);
        } catch (ContourException e) {
            anyError = true;
            err.print(Diagnostic.render(e, null));
        }
    }

    // ---------------------------------------------------------------- :commands

    private boolean command(String input, int line) {
        String body = input.substring(1).strip();
        int space = body.indexOf(' ');
        String name = space < 0 ? body : body.substring(0, space);
        String argument = unquote(space < 0 ? "" : body.substring(space + 1).strip());
        Span where = new Span(FILE, line, 1, input.length());
        try {
            switch (name) {
                case "help" -> out.print(help());
                case "defs" -> {
                    String defs = interpreter.definitionsAsScript();
                    out.print(defs.isEmpty() ? "(no definitions yet)\n" : defs);
                }
                case "names" -> out.println(String.join(" ", interpreter.namesInScope()));
                case "write" -> write(path(argument, "write", where), where);
                case "run" -> runFile(path(argument, "run", where), where);
                case "end" -> {
                    return false;
                }
                default -> {
                    List<String> names = COMMANDS.stream().map(Command::name).toList();
                    String near = Suggestions.nearest(name, names);
                    throw new ContourException("unknown command ':" + name + "'" + (near == null ? "" : "; did you mean ':" + near + "'?")
                            + " (:help lists them)", where);
                }
            }
        } catch (ContourException e) {
            anyError = true;
            err.print(Diagnostic.render(e, String.join("\n", transcript)));
        }
        out.flush();
        return true;
    }

    private static Path path(String argument, String command, Span where) {
        if (argument.isEmpty()) {
            throw new ContourException(":" + command + " needs a file name", where);
        }
        try {
            return Path.of(argument);
        } catch (InvalidPathException e) {
            throw new ContourException("'" + argument + "' is not a usable file name", where);
        }
    }

    private void write(Path file, Span where) {
        String defs = interpreter.definitionsAsScript();
        String text = "# Definitions saved from a contour repl session.\n" + defs;
        try {
            AtomicWrite.text(file, text);
        } catch (IOException | RuntimeException e) {
            throw new ContourException("cannot write '" + file + "': " + describe(e), where);
        }
        int lines = (int) defs.lines().count();
        out.println("wrote " + lines + " line" + (lines == 1 ? "" : "s") + " to " + file);
    }

    private void runFile(Path file, Span where) {
        String text;
        try {
            text = dev.contour.lang.SourceFiles.read(file);
        } catch (ContourException e) {
            throw e; // not UTF-8: located at the bad byte
        } catch (NoSuchFileException e) {
            throw new ContourException("no such file: " + file, where);
        } catch (IOException | RuntimeException e) {
            throw new ContourException("cannot read '" + file + "': " + describe(e), where);
        }
        execute(new Past(text, file.toString(), 0, false));
    }

    private static String describe(Exception e) {
        return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    }

    private static String unquote(String s) {
        return s.length() >= 2 && s.startsWith("\"") && s.endsWith("\"") ? s.substring(1, s.length() - 1) : s;
    }

    static String help() {
        StringBuilder b = new StringBuilder("""
                Type statements (let, def, vars, show, check, ...) or a bare expression to show it.
                Input continues on the next line while a bracket is open or a line ends with an operator.
                Ctrl-C stops a running computation (or clears the line being typed); Ctrl-D leaves.
                Commands:
                """);
        for (Command c : COMMANDS) {
            b.append(String.format("  %-13s %s%n", ":" + c.name() + (c.argument().isEmpty() ? "" : " " + c.argument()), c.summary()));
        }
        return b.toString();
    }

    /** An output stream whose destination can change: an abandoned interpreter is muted this way. */
    private static final class SwitchableOutput extends OutputStream {
        private volatile OutputStream target;

        SwitchableOutput(OutputStream target) {
            this.target = target;
        }

        void redirect(OutputStream to) {
            target = to;
        }

        @Override
        public void write(int b) throws IOException {
            target.write(b);
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            target.write(b, off, len);
        }

        @Override
        public void flush() throws IOException {
            target.flush();
        }
    }
}
