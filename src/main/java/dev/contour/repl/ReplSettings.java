package dev.contour.repl;

import dev.contour.eval.EvaluationLimits;
import dev.contour.eval.OutputFormat;
import java.nio.file.Path;
import java.util.Map;

/**
 * How a REPL session runs.
 *
 * @param historyFile where typed lines are kept between sessions, or null for no history
 * @param format      how shown values print
 * @param rules       where {@code use} looks for libraries, or null for the default
 * @param debug       whether errors keep their Java detail
 * @param limits      the evaluation limits and statement budgets ({@code --time-budget} and the others)
 */
public record ReplSettings(Path historyFile, OutputFormat format, Path rules, boolean debug, EvaluationLimits limits) {
    /** The environment variable that moves the history file (an empty value turns history off). */
    public static final String HISTORY_VARIABLE = "CONTOUR_HISTORY";

    public ReplSettings {
        format = format == null ? OutputFormat.PLAIN : format;
        limits = limits == null ? EvaluationLimits.DEFAULT : limits;
    }

    /** Default limits and budgets. */
    public ReplSettings(Path historyFile, OutputFormat format, Path rules, boolean debug) {
        this(historyFile, format, rules, debug, EvaluationLimits.DEFAULT);
    }

    /** Plain output, default rules, no history, no debug detail. */
    public static ReplSettings plain() {
        return new ReplSettings(null, OutputFormat.PLAIN, null, false);
    }

    public ReplSettings withHistory(Path file) {
        return new ReplSettings(file, format, rules, debug, limits);
    }

    /** {@code $CONTOUR_HISTORY} when set (empty: none), else {@code .contour_history} in {@code $HOME} (or the account's home). */
    public static Path defaultHistoryFile() {
        return defaultHistoryFile(System.getenv(), System.getProperty("user.home"));
    }

    /** The choice of {@link #defaultHistoryFile()} for a given environment and account home. */
    static Path defaultHistoryFile(Map<String, String> env, String accountHome) {
        String override = env.get(HISTORY_VARIABLE);
        if (override != null) {
            return override.isBlank() ? null : Path.of(override);
        }
        // ~ as the shell means it: $HOME when set (Java's user.home is the account's entry, which
        // differs when HOME was changed), else the account's home.
        String home = env.get("HOME");
        if (home == null || home.isBlank()) {
            home = accountHome;
        }
        return home == null || home.isBlank() ? null : Path.of(home, ".contour_history");
    }
}
