package dev.contour.repl;

import dev.contour.eval.OutputFormat;
import java.nio.file.Path;

/**
 * How a REPL session runs.
 *
 * @param historyFile where typed lines are kept between sessions, or null for no history
 * @param format      how shown values print
 * @param rules       where {@code use} looks for libraries, or null for the default
 * @param debug       whether errors keep their Java detail
 */
public record ReplSettings(Path historyFile, OutputFormat format, Path rules, boolean debug) {
    /** The environment variable that moves the history file (an empty value turns history off). */
    public static final String HISTORY_VARIABLE = "CONTOUR_HISTORY";

    public ReplSettings {
        format = format == null ? OutputFormat.PLAIN : format;
    }

    /** Plain output, default rules, no history, no debug detail. */
    public static ReplSettings plain() {
        return new ReplSettings(null, OutputFormat.PLAIN, null, false);
    }

    public ReplSettings withHistory(Path file) {
        return new ReplSettings(file, format, rules, debug);
    }

    /** {@code $CONTOUR_HISTORY} when set (empty: none), else {@code .contour_history} in the user's home. */
    public static Path defaultHistoryFile() {
        String override = System.getenv(HISTORY_VARIABLE);
        if (override != null) {
            return override.isBlank() ? null : Path.of(override);
        }
        String home = System.getProperty("user.home");
        return home == null || home.isBlank() ? null : Path.of(home, ".contour_history");
    }
}
