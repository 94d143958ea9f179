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

    /** The scripts users see first: the examples and the language reference's snippets. */
    private static List<String> documentedScripts() throws IOException {
        List<String> out = new java.util.ArrayList<>();
        try (Stream<Path> files = Files.list(Path.of("examples"))) {
            for (Path p : files.filter(p -> p.toString().endsWith(".ctr")).sorted().toList()) {
                out.add(read(p));
            }
        }
        String doc = read(Path.of("docs", "language.md"));
        int at = 0;
        while ((at = doc.indexOf("```contour\n", at)) >= 0) {
            int end = doc.indexOf("```", at + 11);
            out.add(doc.substring(at + 11, end));
            at = end + 3;
        }
        return out;
    }

    @Provide
    Arbitrary<String> mutatedDocumentedScripts() throws IOException {
        List<String> scripts = documentedScripts();
        Arbitrary<List<int[]>> edits = Combinators.combine(
                        Arbitraries.integers().between(0, 3), Arbitraries.integers().between(0, 100_000),
                        Arbitraries.integers().between(0, 12), Arbitraries.integers().between(0, TOKENS.size() - 1))
                .as((kind, at, length, token) -> new int[] {kind, at, length, token})
                .list().ofMinSize(1).ofMaxSize(3);
        return Combinators.combine(Arbitraries.of(scripts), edits).as((text, es) -> {
            for (int[] e : es) {
                text = mutate(text, e);
            }
            return text;
        });
    }

    /**
     * Through the command line with a statement budget of two seconds: a mutated documented script
     * ends (the budget stops any statement; the generous wait below only catches a hang), prints no
     * Java exception, and either succeeds, fails a check, or reports a located error
     * ({@code file:line:column: message}).
     */
    @Property(tries = 120)
    void mutatedDocumentedScriptsEndWithinBudgetWithAResultOrALocatedError(@ForAll("mutatedDocumentedScripts") String text)
            throws Exception {
        Path dir = Files.createTempDirectory("fuzz");
        Path file = dir.resolve("mutated.ctr");
        Files.writeString(file, text);
        java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
        java.io.ByteArrayOutputStream err = new java.io.ByteArrayOutputStream();
        java.util.concurrent.ExecutorService runner = java.util.concurrent.Executors.newSingleThreadExecutor();
        try {
            java.util.concurrent.Future<Integer> code = runner.submit(() -> dev.contour.cli.Main.run(
                    new String[] {"run", "--time-budget", "2", file.toString()}, java.io.InputStream.nullInputStream(),
                    new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8)));
            int exit = code.get(10, java.util.concurrent.TimeUnit.MINUTES);
            String errors = err.toString(StandardCharsets.UTF_8);
            if (errors.contains("Exception") || errors.contains("\tat ") || errors.contains("internal error")) {
                fail("a Java exception for input:\n" + text + "\n" + errors);
            }
            if (exit == 2 && !errors.startsWith(file + ":") && !errors.startsWith("contour: ")) {
                fail("an error without a location for input:\n" + text + "\n" + errors);
            }
            if (exit != 0 && exit != 1 && exit != 2) {
                fail("exit status " + exit);
            }
        } finally {
            runner.shutdownNow();
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
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
