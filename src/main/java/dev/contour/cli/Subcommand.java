package dev.contour.cli;

import java.io.InputStream;
import java.io.PrintStream;
import java.util.List;

/**
 * A {@code contour NAME ...} command contributed by another package (the REPL, for one). Found
 * with {@link java.util.ServiceLoader}: list the class in
 * {@code META-INF/services/dev.contour.cli.Subcommand}.
 */
public interface Subcommand {
    /** The word after {@code contour}. */
    String name();

    /** One line for {@code contour --help}. */
    String summary();

    /** Runs the command; returns the exit code (0 ok, 1 a check failed, 2 bad input or usage). */
    int run(List<String> args, InputStream in, PrintStream out, PrintStream err);
}
