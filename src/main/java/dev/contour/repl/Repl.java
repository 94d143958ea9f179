package dev.contour.repl;

import dev.contour.cli.Main;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.function.Consumer;
import org.jline.reader.EndOfFileException;
import org.jline.reader.LineReader;
import org.jline.reader.LineReaderBuilder;
import org.jline.reader.UserInterruptException;
import org.jline.terminal.Size;
import org.jline.terminal.Terminal;

/**
 * The two ways a session reads its input: a JLine terminal (line editing, history, completion,
 * continuation lines, Ctrl-C) or a plain stream (piped input: no prompts, no history).
 */
public final class Repl {
    /** Continuation lines: the primary prompt's width, then a bar. */
    private static final String CONTINUATION_PROMPT = "%P | ";

    private Repl() { }

    /**
     * Runs a session on a terminal until {@code :end} or Ctrl-D.
     *
     * @param prepare runs first (preloading scripts, say) with the new session
     * @return 0: on a terminal every error was shown where it happened and the user went on, so
     *         leaving is a normal end (piped sessions report errors and failed checks, see
     *         {@link #onStreams})
     */
    public static int onTerminal(Terminal terminal, ReplSettings settings, Consumer<Session> prepare) {
        if (terminal.getWidth() <= 0) {
            // Some hosts (a pty without a window size) report 0 columns, and JLine cannot lay out a prompt in none.
            terminal.setSize(new Size(80, Math.max(terminal.getHeight(), 24)));
        }
        PrintStream out = new PrintStream(terminal.output(), true, terminal.encoding());
        Session session = new Session(settings, out, out);
        LineReaderBuilder builder = LineReaderBuilder.builder()
                .terminal(terminal)
                .appName("contour")
                .parser(new ContourLineParser())
                .completer(new NameCompleter(session::names))
                .variable(LineReader.SECONDARY_PROMPT_PATTERN, CONTINUATION_PROMPT)
                .option(LineReader.Option.DISABLE_EVENT_EXPANSION, true) // '!' is the factorial, not a history reference
                .option(LineReader.Option.HISTORY_INCREMENTAL, true)     // each accepted line reaches the file at once
                .option(LineReader.Option.HISTORY_IGNORE_SPACE, false);
        if (settings.historyFile() != null) {
            builder.variable(LineReader.HISTORY_FILE, settings.historyFile());
        }
        LineReader reader = builder.build();
        Terminal.SignalHandler previous = terminal.handle(Terminal.Signal.INT, signal -> session.interrupt());
        try {
            out.println("contour " + Main.VERSION + ": type :help for commands, Ctrl-D to leave");
            prepare.accept(session);
            while (true) {
                String input;
                try {
                    input = reader.readLine(session.prompt());
                } catch (UserInterruptException e) {
                    continue; // Ctrl-C while typing drops the unfinished input
                } catch (EndOfFileException e) {
                    break;
                }
                if (!session.accept(input)) {
                    break;
                }
            }
        } finally {
            terminal.handle(Terminal.Signal.INT, previous);
            out.flush();
        }
        return Main.OK;
    }

    /**
     * Runs a session on plain streams: lines are gathered into inputs the same way a terminal
     * does it, and run until {@code :end} or the end of the input.
     */
    public static int onStreams(InputStream in, PrintStream out, PrintStream err, ReplSettings settings,
                                Consumer<Session> prepare) throws IOException {
        Session session = new Session(settings, out, err);
        prepare.accept(session);
        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
        StringBuilder pending = new StringBuilder();
        for (String line = reader.readLine(); line != null; line = reader.readLine()) {
            if (!pending.isEmpty()) {
                pending.append('\n');
            }
            pending.append(line);
            String input = pending.toString();
            if (!Session.isCommand(input) && InputCompleteness.needsMore(input)) {
                continue;
            }
            pending.setLength(0);
            if (!session.accept(input)) {
                return session.exitCode();
            }
        }
        if (!pending.isEmpty()) {
            session.accept(pending.toString()); // unfinished at the end: the parser says what is missing
        }
        return session.exitCode();
    }

    /** Runs each script in the session, as {@code :run} would. */
    static Consumer<Session> preloading(List<String> files) {
        return session -> files.forEach(f -> session.runScript(f));
    }
}
