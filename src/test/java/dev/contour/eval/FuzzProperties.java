package dev.contour.eval;

import static org.junit.jupiter.api.Assertions.fail;

import dev.contour.ContourException;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.stream.Stream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Bad input of every shape: random token streams and random mutations of the examples go through
 * the parser and interpreter, under tight limits. Only ContourException may come out, and every
 * run ends (the time limit is part of the limits, so a hang would surface as that error).
 */
class FuzzProperties {
    private static final EvaluationLimits TIGHT = new EvaluationLimits(12, 2_000, 2_000, 40, Duration.ofSeconds(3));
    private static final List<String> TOKENS = List.of(
            "vars", "let", "def", "unknown", "use", "show", "check", "for", "in", "sum", "with", "at", "solve",
            "normalized", "collected", "factored", "as", "latex", "json", "step", "rule", "becomes", "when",
            "s", "t", "x", "y", "a", "f", "p", "Gamma", "poch", "binom", "factorial", "coefficient", "sigma",
            "0", "1", "2", "3", "10", "1/2", "0.5", "\"lib.ctr\"", "\"text\"", "\"",
            "(", ")", "[", "]", "{", "}", ",", ":", ";", "=", "==", ">=", "<=", "<", ">", "..",
            "+", "-", "*", "/", "^", "!", "#", "\n", "$", "@");

    private static final String PRELUDE = "vars s, t\nvars x, y collected\nunknown a[i, j] with i + j = 2\n"
            + "def f(u, v) = u*v + 1\nlet p = 3\n";

    @Provide
    Arbitrary<String> tokenStreams() {
        return Arbitraries.of(TOKENS).list().ofMaxSize(40).map(ts -> String.join(" ", ts));
    }

    @Property(tries = 600)
    void randomTokenStreamsFailOnlyWithContourException(@ForAll("tokenStreams") String text) {
        runExpectingOnlyContourErrors(text, "fuzz.ctr");
        runExpectingOnlyContourErrors(PRELUDE + text, "fuzz.ctr");
    }

    @Provide
    Arbitrary<String[]> mutatedExamples() throws IOException {
        List<Path> examples;
        try (Stream<Path> files = Files.list(Path.of("examples"))) {
            examples = files.filter(p -> p.toString().endsWith(".ctr")).sorted().toList();
        }
        Arbitrary<Path> example = Arbitraries.of(examples);
        Arbitrary<List<int[]>> edits = Combinators.combine(
                        Arbitraries.integers().between(0, 3), Arbitraries.integers().between(0, 100_000),
                        Arbitraries.integers().between(0, 12), Arbitraries.integers().between(0, TOKENS.size() - 1))
                .as((kind, at, length, token) -> new int[] {kind, at, length, token})
                .list().ofMinSize(1).ofMaxSize(4);
        return Combinators.combine(example, edits).as((p, es) -> {
            String text = read(p);
            for (int[] e : es) {
                text = mutate(text, e);
            }
            return new String[] {p.toString(), text};
        });
    }

    @Property(tries = 450)
    void mutatedExamplesFailOnlyWithContourException(@ForAll("mutatedExamples") String[] fileAndText) {
        runExpectingOnlyContourErrors(fileAndText[1], fileAndText[0]);
    }

    /** Deletes, duplicates or replaces a stretch, or inserts a token. */
    private static String mutate(String text, int[] e) {
        if (text.isEmpty()) {
            return TOKENS.get(e[3]);
        }
        int at = e[1] % text.length();
        int end = Math.min(text.length(), at + e[2]);
        return switch (e[0]) {
            case 0 -> text.substring(0, at) + text.substring(end);
            case 1 -> text.substring(0, end) + text.substring(at, end) + text.substring(end);
            case 2 -> text.substring(0, at) + " " + TOKENS.get(e[3]) + " " + text.substring(end);
            default -> text.substring(0, at) + " " + TOKENS.get(e[3]) + " " + text.substring(at);
        };
    }

    private static void runExpectingOnlyContourErrors(String text, String file) {
        PrintStream quiet = new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8);
        Interpreter interpreter = new Interpreter(InterpreterOptions.to(quiet).withLimits(TIGHT));
        try {
            interpreter.run(text, file);
        } catch (ContourException expected) {
            // bad input, reported the way users see it: with the place it arose (file:line:column)
            if (expected.span() == null) {
                fail("an error without a location (" + expected.getMessage() + ") for input:\n" + text);
            }
        } catch (RuntimeException | StackOverflowError e) {
            fail("not a ContourException for input:\n" + text, e);
        }
    }

    private static String read(Path p) {
        try {
            return Files.readString(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }
}
