package dev.contour.repl;

import dev.contour.cli.Main;
import dev.contour.cli.Subcommand;
import dev.contour.eval.OutputFormat;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.jline.terminal.Terminal;
import org.jline.terminal.TerminalBuilder;

/**
 * {@code contour repl [OPTIONS] [FILE...]}: an interactive session, after running the given
 * scripts in it. On a terminal it edits lines with JLine; with piped input it reads plain lines.
 */
public final class ReplCommand implements Subcommand {
    private static final String USAGE = """
            usage: contour repl [OPTIONS] [FILE...]
              FILE...          scripts to run in the session before the first prompt
              --history FILE   keep typed lines in FILE (default: $%s, else ~/.contour_history);
                               also --history=FILE
              --no-history     keep no history
              --latex, --json, --rules DIR, --threads N, --debug   as for 'contour run'
              --time-budget SECONDS, --memory-budget MIB, --max-digits DIGITS
                               budgets of each statement, as for 'contour run'
            """.formatted(ReplSettings.HISTORY_VARIABLE);

    @Override
    public String name() {
        return "repl";
    }

    @Override
    public String summary() {
        return "an interactive session";
    }

    @Override
    public int run(List<String> args, InputStream in, PrintStream out, PrintStream err) {
        OutputFormat format = OutputFormat.PLAIN;
        Path rules = null;
        boolean debug = false;
        Path history = ReplSettings.defaultHistoryFile();
        List<String> files = new ArrayList<>();
        dev.contour.eval.EvaluationLimits limits = dev.contour.eval.EvaluationLimits.DEFAULT;
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            if (a.equals("--time-budget") || a.equals("--memory-budget") || a.equals("--max-digits")) {
                if (i + 1 >= args.size()) {
                    err.println("contour repl: " + a + " needs a whole number");
                    return Main.BAD_INPUT;
                }
                try {
                    limits = limits.withOption(a, args.get(++i));
                } catch (IllegalArgumentException e) {
                    err.println("contour repl: " + e.getMessage());
                    return Main.BAD_INPUT;
                }
                continue;
            }
            if (a.equals("--threads") && i + 1 < args.size() || a.startsWith("--threads=")) {
                i += a.equals("--threads") ? 1 : 0; // applied by Main before the session starts
                continue;
            }
            if ((a.equals("--rules") || a.equals("--history")) && i + 1 < args.size()) {
                a = a + "=" + args.get(++i); // the spaced form, as 'contour run' takes it
            }
            if (a.equals("--latex")) {
                format = OutputFormat.LATEX;
            } else if (a.equals("--json")) {
                format = OutputFormat.JSON;
            } else if (a.equals("--debug")) {
                debug = true;
            } else if (a.startsWith("--rules=")) {
                rules = Path.of(a.substring("--rules=".length()));
            } else if (a.startsWith("--history=")) {
                String file = a.substring("--history=".length());
                history = file.isBlank() ? null : Path.of(file);
            } else if (a.equals("--no-history")) {
                history = null;
            } else if (a.equals("-h") || a.equals("--help")) {
                out.print(USAGE);
                return Main.OK;
            } else if (a.startsWith("-") && !a.equals("-")) {
                err.println("contour repl: unknown option '" + a + "'");
                err.print(USAGE);
                return Main.BAD_INPUT;
            } else {
                files.add(a);
            }
        }
        ReplSettings settings = new ReplSettings(history, format, rules, debug, limits);
        try {
            if (in == System.in && System.console() != null) {
                try (Terminal terminal = TerminalBuilder.builder().system(true).build()) {
                    return Repl.onTerminal(terminal, settings, Repl.preloading(files));
                }
            }
            return Repl.onStreams(in, out, err, settings, Repl.preloading(files));
        } catch (IOException e) {
            err.println("contour repl: cannot read the input: " + e.getMessage());
            return Main.BAD_INPUT;
        }
    }
}
