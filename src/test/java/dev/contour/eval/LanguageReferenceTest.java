package dev.contour.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * The documentation is executable: every {@code contour} snippet in docs/language.md and in the
 * README's tour runs in a fresh session and must print its {@code output} block exactly;
 * {@code contour-fails} snippets must print theirs and report a failed check.
 */
class LanguageReferenceTest {
    private static final Path DOC = Path.of("docs", "language.md");
    private static final Path README = Path.of("README.md");
    private static final Pattern SNIPPET =
            Pattern.compile("```(contour|contour-fails)\\n(.*?)```\\n(?:```output\\n(.*?)```\\n)?", Pattern.DOTALL);

    private record Snippet(int number, boolean fails, String code, String output) { }

    @TestFactory
    Stream<DynamicTest> everySnippetRunsAndPrintsItsOutput() throws IOException {
        return snippetsOf(DOC, 12);
    }

    @TestFactory
    Stream<DynamicTest> theReadmeTourRunsAndPrintsItsOutput() throws IOException {
        return snippetsOf(README, 6);
    }

    private static Stream<DynamicTest> snippetsOf(Path file, int atLeast) throws IOException {
        String doc = Files.readString(file, StandardCharsets.UTF_8);
        List<Snippet> snippets = new ArrayList<>();
        Matcher m = SNIPPET.matcher(doc);
        while (m.find()) {
            snippets.add(new Snippet(snippets.size() + 1, m.group(1).endsWith("fails"), m.group(2), m.group(3)));
        }
        assertTrue(snippets.size() >= atLeast, file + " should show at least " + atLeast + " runnable examples");
        return snippets.stream().map(s -> DynamicTest.dynamicTest("snippet " + s.number() + ": " + s.code().lines().findFirst().orElse(""), () -> {
            ByteArrayOutputStream buffer = new ByteArrayOutputStream();
            Interpreter i = new Interpreter(InterpreterOptions.to(new PrintStream(buffer, true, StandardCharsets.UTF_8)));
            RunResult r = i.run(s.code(), file.toString());
            assertEquals(!s.fails(), r.ok(), "whether the snippet's checks hold");
            if (s.output() != null) {
                assertEquals(s.output(), buffer.toString(StandardCharsets.UTF_8));
            }
        }));
    }
}
