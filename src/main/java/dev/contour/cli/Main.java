package dev.contour.cli;

import dev.contour.ContourException;
import dev.contour.Parallel;
import dev.contour.eval.Interpreter;
import dev.contour.eval.EvaluationLimits;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.RunResult;
import dev.contour.lang.Diagnostic;
import dev.contour.lang.SourceFiles;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.ServiceLoader;

/**
 * The {@code contour} command: {@code run}, {@code check}, {@code bench}, and whatever
 * {@link Subcommand}s other packages contribute ({@code repl}). Exit codes: 0 ok, 1 a check
 * failed, 2 bad input or usage.
 */
public final class Main {
    public static final String VERSION = "0.1.0";
    public static final int OK = 0;
    public static final int CHECK_FAILED = 1;
    public static final int BAD_INPUT = 2;
    /** Stopped by Ctrl-C (128 + SIGINT, as shells report it). */
    public static final int INTERRUPTED = 130;

    private static final String USAGE = """
            usage: contour COMMAND [OPTIONS] [FILE...]

            commands:
              run FILE...      run derivation scripts, printing what they show and check
              check FILE...    run scripts, printing only their checks (one line each)
              repl             an interactive session
              bench [NAME]     list benchmark workloads, or time one

            options:
              --latex          print shown values as LaTeX
              --json           print shown values and checks as JSON, one object per line
              --rules DIR      where 'use' looks for libraries (default: the project's rules/);
                               also --rules=DIR
              --report FILE.tex  also write the run as a LaTeX derivation report (pole maps
                               shown become figures beside it); also --report=FILE.tex
              --time-budget SECONDS   time one statement may take, printing included
                               (default 300; 0 for no limit)
              --memory-budget MIB     heap one statement may add (default: three quarters
                               of the Java heap; 0 for no limit)
              --max-digits DIGITS     largest exact number, in decimal digits (default 315652)
              --threads N      threads for independent parts of a computation (default:
                               $CONTOUR_THREADS, else the number of cores; 1 = sequential);
                               also --threads=N
              --debug          show Java detail (stack traces) on errors
              -h, --help       this help
              -V, --version    the version

            exit status: 0 all checks held, 1 a check failed, 2 bad input or usage,
                         130 stopped by Ctrl-C (run and check: the first Ctrl-C stops the
                         statement with its location, a second one at once)
                         (repl on a terminal: 0 when left; piped: as for run)
            """;

    private Main() { }

    public static void main(String[] args) {
        int code = run(args, System.in, System.out, System.err);
        System.out.flush();
        System.exit(code);
    }

    /** Runs the command line in-process (tests call this); returns the exit code. */
    public static int run(String[] args, InputStream in, PrintStream out, PrintStream err) {
        // --threads applies to this command only: an in-process caller keeps its own setting
        int threadsBefore = Parallel.threads();
        try {
            return runCommand(args, in, out, err);
        } finally {
            Parallel.setThreads(threadsBefore);
        }
    }

    private static int runCommand(String[] args, InputStream in, PrintStream out, PrintStream err) {
        String threadsEnv = System.getenv(Parallel.THREADS_VARIABLE);
        if (threadsEnv != null && !threadsEnv.isBlank()) {
            try {
                Parallel.setThreads(Parallel.parseThreads(threadsEnv, Parallel.THREADS_VARIABLE));
            } catch (ContourException e) {
                err.println("contour: " + e.getMessage());
                return BAD_INPUT;
            }
        }
        List<String> rest = new ArrayList<>(Arrays.asList(args));
        Options options = new Options();
        List<String> operands = new ArrayList<>();
        boolean endOfOptions = false;
        for (int index = 0; index < rest.size(); index++) {
            String a = rest.get(index);
            if (endOfOptions || !a.startsWith("-") || a.equals("-")) {
                operands.add(a);
                continue;
            }
            switch (a) {
                case "--" -> endOfOptions = true;
                case "--latex", "--json" -> {
                    OutputFormat chosen = a.equals("--latex") ? OutputFormat.LATEX : OutputFormat.JSON;
                    if (options.format != OutputFormat.PLAIN && options.format != chosen) {
                        err.println("contour: --latex and --json cannot be used together: choose one output format");
                        return BAD_INPUT;
                    }
                    options.format = chosen;
                }
                case "--debug" -> options.debug = true;
                case "--time-budget", "--memory-budget", "--max-digits" -> {
                    if (index + 1 >= rest.size()) {
                        err.println("contour: " + a + " needs a whole number (see 'contour --help')");
                        return BAD_INPUT;
                    }
                    String problem = options.budget(a, rest.get(++index));
                    if (problem != null) {
                        err.println("contour: " + problem);
                        return BAD_INPUT;
                    }
                }
                case "--threads" -> {
                    if (index + 1 >= rest.size()) {
                        err.println("contour: --threads needs a whole number (--threads N or --threads=N)");
                        return BAD_INPUT;
                    }
                    String problem = threads("--threads", rest.get(++index));
                    if (problem != null) {
                        err.println("contour: " + problem);
                        return BAD_INPUT;
                    }
                }
                case "--rules" -> {
                    if (index + 1 >= rest.size()) {
                        err.println("contour: --rules needs a folder (--rules DIR or --rules=DIR)");
                        return BAD_INPUT;
                    }
                    options.rules = Path.of(rest.get(++index));
                }
                case "--report" -> {
                    if (index + 1 >= rest.size()) {
                        err.println("contour: --report needs a file (--report FILE.tex or --report=FILE.tex)");
                        return BAD_INPUT;
                    }
                    options.report = Path.of(rest.get(++index));
                }
                case "-h", "--help" -> {
                    out.print(usage());
                    return OK;
                }
                case "-V", "--version" -> {
                    out.println("contour " + VERSION);
                    return OK;
                }
                default -> {
                    if (a.startsWith("--threads=")) {
                        String problem = threads("--threads", a.substring("--threads=".length()));
                        if (problem != null) {
                            err.println("contour: " + problem);
                            return BAD_INPUT;
                        }
                    } else if (a.startsWith("--rules=")) {
                        options.rules = Path.of(a.substring("--rules=".length()));
                    } else if (a.startsWith("--report=")) {
                        options.report = Path.of(a.substring("--report=".length()));
                    } else if (operands.isEmpty() || !isExternal(operands.get(0))) {
                        err.println("contour: unknown option '" + a + "' (see 'contour --help')");
                        return BAD_INPUT;
                    } else {
                        operands.add(a); // options of a contributed command are its own business
                    }
                }
            }
        }
        if (options.rules != null && !Files.isDirectory(options.rules)) {
            err.println("contour: --rules " + options.rules + ": " + (Files.exists(options.rules)
                    ? "not a folder" : "no such folder") + " (it names the folder where 'use' looks for libraries)");
            return BAD_INPUT;
        }
        if (operands.isEmpty()) {
            err.print(usage());
            return BAD_INPUT;
        }
        String command = operands.get(0);
        List<String> files = operands.subList(1, operands.size());
        switch (command) {
            case "run":
                return runFiles(files, options, false, out, err);
            case "check":
                return runFiles(files, options, true, out, err);
            case "bench":
                return Bench.run(files, out, err);
            default:
                for (Subcommand s : ServiceLoader.load(Subcommand.class)) {
                    if (s.name().equals(command)) {
                        List<String> passOn = new ArrayList<>(rest);
                        passOn.remove(command);
                        return s.run(passOn, in, out, err);
                    }
                }
                if (command.equals("repl")) {
                    err.println("contour: the 'repl' command is not part of this build");
                } else {
                    err.println("contour: unknown command '" + command + "' (see 'contour --help')");
                }
                return BAD_INPUT;
        }
    }

    /** Applies a thread count; returns what is wrong with it, or null. */
    private static String threads(String option, String value) {
        try {
            Parallel.setThreads(Parallel.parseThreads(value, option));
            return null;
        } catch (ContourException e) {
            return e.getMessage();
        }
    }

    private static boolean isExternal(String command) {
        return !List.of("run", "check", "bench").contains(command);
    }

    private static String usage() {
        StringBuilder extra = new StringBuilder();
        for (Subcommand s : ServiceLoader.load(Subcommand.class)) {
            if (!s.name().equals("repl")) {
                extra.append(String.format("  %-16s %s%n", s.name(), s.summary()));
            }
        }
        if (extra.length() == 0) {
            return USAGE;
        }
        return USAGE.replace("\noptions:", extra + "\noptions:");
    }

    private static final class Options {
        OutputFormat format = OutputFormat.PLAIN;
        boolean debug;
        Path rules;
        Path report;
        EvaluationLimits limits = EvaluationLimits.DEFAULT;

        /** Applies one budget option; returns what is wrong with its value, or null. */
        String budget(String option, String value) {
            try {
                limits = limits.withOption(option, value);
                return null;
            } catch (IllegalArgumentException e) {
                return e.getMessage();
            }
        }
    }

    private static int runFiles(List<String> files, Options o, boolean checksOnly, PrintStream out, PrintStream err) {
        if (files.isEmpty()) {
            err.println("contour: no script given (usage: contour " + (checksOnly ? "check" : "run") + " FILE...)");
            return BAD_INPUT;
        }
        dev.contour.report.LatexReport report = null;
        if (o.report != null) {
            try {
                report = new dev.contour.report.LatexReport(o.report, VERSION);
            } catch (ContourException e) {
                err.println("contour: " + e.getMessage());
                return BAD_INPUT;
            }
        }
        int code;
        try (Interrupts ctrlC = Interrupts.install(Thread.currentThread(), err)) {
            code = runFiles(files, o, checksOnly, out, err, report);
            Thread.interrupted(); // an interrupt that came after the last check must not reach the report's writing
            if (ctrlC.received()) {
                err.println("contour: stopped by an interrupt (Ctrl-C); what was printed above stands, the rest did not run");
                code = INTERRUPTED;
            }
        }
        if (report != null) {
            try {
                report.write();
            } catch (ContourException e) {
                err.println("contour: " + e.getMessage());
                return BAD_INPUT;
            }
        }
        return code;
    }

    private static int runFiles(List<String> files, Options o, boolean checksOnly, PrintStream out, PrintStream err,
                                dev.contour.report.LatexReport report) {
        boolean failed = false;
        for (String file : files) {
            if (files.size() > 1 && !checksOnly && o.format == OutputFormat.PLAIN) {
                out.println("== " + file + " ==");
            }
            String text;
            try {
                text = SourceFiles.read(Path.of(file));
            } catch (NoSuchFileException e) {
                err.println("contour: no such file: " + file);
                return BAD_INPUT;
            } catch (ContourException e) {
                err.print(Diagnostic.render(e, SourceFiles.readForDisplay(Path.of(file))));
                return BAD_INPUT;
            } catch (IOException | RuntimeException e) {
                err.println("contour: cannot read " + file + ": " + e.getMessage());
                return BAD_INPUT;
            }
            InterpreterOptions options = new InterpreterOptions(out, o.format, checksOnly, o.rules, o.debug, o.limits);
            try {
                Interpreter interpreter = new Interpreter(options);
                if (report != null) {
                    report.beginScript(file, text);
                    interpreter.listen(report::accept);
                }
                RunResult result = interpreter.run(text, file);
                failed |= !result.ok();
            } catch (ContourException e) {
                out.flush();
                err.print(Diagnostic.render(e, sourceOf(e, file, text)));
                if (report != null) {
                    report.stopped(Diagnostic.render(e, sourceOf(e, file, text)));
                }
                if (o.debug) {
                    e.printStackTrace(err);
                }
                return BAD_INPUT;
            } catch (RuntimeException | StackOverflowError | OutOfMemoryError e) {
                out.flush();
                err.println("contour: internal error: " + e + (o.debug ? "" : " (run with --debug for details)"));
                if (o.debug) {
                    e.printStackTrace(err);
                }
                return BAD_INPUT;
            }
        }
        return failed ? CHECK_FAILED : OK;
    }

    /** The text of the file an error points into: the script itself or a library it used. */
    private static String sourceOf(ContourException e, String file, String text) {
        if (e.span() == null || e.span().file().equals(file)) {
            return text;
        }
        try {
            return SourceFiles.readForDisplay(Path.of(e.span().file()));
        } catch (RuntimeException x) {
            return null;
        }
    }
}
