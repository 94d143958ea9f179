package dev.contour.eval;

import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * How an {@link Interpreter} runs: where output goes and in which format, whether only checks
 * print, where {@code use} finds rule libraries, whether errors keep their Java detail, and the
 * evaluation limits.
 */
public record InterpreterOptions(PrintStream out, OutputFormat format, boolean checksOnly, Path rulesDirectory,
                                 boolean debug, EvaluationLimits limits) {
    public InterpreterOptions {
        if (out == null) {
            throw new IllegalArgumentException("out");
        }
        format = format == null ? OutputFormat.PLAIN : format;
        rulesDirectory = rulesDirectory == null ? defaultRulesDirectory() : rulesDirectory;
        limits = limits == null ? EvaluationLimits.DEFAULT : limits;
    }

    public InterpreterOptions(PrintStream out, OutputFormat format, boolean checksOnly, Path rulesDirectory, boolean debug) {
        this(out, format, checksOnly, rulesDirectory, debug, EvaluationLimits.DEFAULT);
    }

    /** Plain output to {@code out}, everything else default. */
    public static InterpreterOptions to(PrintStream out) {
        return new InterpreterOptions(out, OutputFormat.PLAIN, false, null, false, EvaluationLimits.DEFAULT);
    }

    public InterpreterOptions withLimits(EvaluationLimits l) {
        return new InterpreterOptions(out, format, checksOnly, rulesDirectory, debug, l);
    }

    public InterpreterOptions withFormat(OutputFormat f) {
        return new InterpreterOptions(out, f, checksOnly, rulesDirectory, debug, limits);
    }

    /**
     * {@code rules/} in the project that holds the running jar ({@code target/contour.jar}), else
     * {@code rules/} in the working directory.
     */
    public static Path defaultRulesDirectory() {
        return projectRoot().resolve("rules");
    }

    /**
     * Where {@code use} looks after the script's own folder and the rules directory: the project's
     * {@code backgrounds/} (library files that define a background) and {@code rules/} (rewrite-rule
     * files), in that order.
     */
    public static java.util.List<Path> libraryDirectories() {
        Path root = projectRoot();
        return java.util.List.of(root.resolve("backgrounds"), root.resolve("rules"));
    }

    /** The project folder that holds the running jar (it has {@code pom.xml} and {@code rules/}), else the working directory. */
    public static Path projectRoot() {
        try {
            var source = InterpreterOptions.class.getProtectionDomain().getCodeSource();
            if (source != null) {
                Path here = Path.of(source.getLocation().toURI());
                for (Path p = here; p != null; p = p.getParent()) {
                    if (Files.isDirectory(p.resolve("rules")) && Files.exists(p.resolve("pom.xml"))) {
                        return p;
                    }
                }
            }
        } catch (URISyntaxException | SecurityException | IllegalArgumentException e) {
            // Fall through to the working directory: an odd class-path location is not an error.
        }
        return Path.of("");
    }
}
