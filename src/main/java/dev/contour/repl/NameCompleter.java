package dev.contour.repl;

import java.util.List;
import java.util.Set;
import java.util.function.Supplier;
import org.jline.builtins.Completers;
import org.jline.reader.Candidate;
import org.jline.reader.Completer;
import org.jline.reader.LineReader;
import org.jline.reader.ParsedLine;

/**
 * Tab completion: the language's keywords and every name in the session's scope; after
 * {@code :} the REPL's commands, and file names after {@code :write} and {@code :run}.
 */
final class NameCompleter implements Completer {
    static final List<String> KEYWORDS = List.of("vars", "collected", "let", "def", "unknown", "use", "show", "check",
            "for", "in", "rule", "becomes", "when", "sum", "solve", "at", "with", "normalized", "step", "factored", "as",
            "derive", "using", "within", "by", "rules");

    private final Supplier<Set<String>> names;
    private final Completer files = new Completers.FileNameCompleter();

    NameCompleter(Supplier<Set<String>> names) {
        this.names = names;
    }

    @Override
    public void complete(LineReader reader, ParsedLine line, List<Candidate> candidates) {
        if (Session.isCommand(line.line())) {
            if (line.wordIndex() == 0) {
                for (Session.Command c : Session.COMMANDS) {
                    candidates.add(new Candidate(":" + c.name(), ":" + c.name(), null, c.summary(), null, null, true));
                }
            } else if (line.wordIndex() == 1 && List.of(":write", ":run").contains(line.words().get(0))) {
                files.complete(reader, line, candidates);
            }
            return;
        }
        for (String k : KEYWORDS) {
            candidates.add(new Candidate(k, k, "keywords", null, null, null, true));
        }
        for (String n : names.get()) {
            candidates.add(new Candidate(n, n, "names", null, null, null, false));
        }
    }
}
