package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * Every script in examples/ runs through the CLI entry point and prints exactly its checked-in
 * {@code NAME.out}; a script whose expected output reports a failed check must exit with 1, the
 * others with 0. Libraries that other examples {@code use} need no output file.
 */
class ExamplesTest {
    private static final Path EXAMPLES = Path.of("examples");

    @TestFactory
    Stream<DynamicTest> everyExamplePrintsItsExpectedOutput() throws IOException {
        List<Path> scripts;
        try (Stream<Path> files = Files.list(EXAMPLES)) {
            scripts = files.filter(p -> p.toString().endsWith(".ctr")).sorted().toList();
        }
        assertTrue(scripts.size() >= 4, "examples/ should hold at least hello.ctr and three derivations");
        String allSources = String.join("\n", scripts.stream().map(ExamplesTest::read).toList());
        return scripts.stream().map(script -> DynamicTest.dynamicTest(script.getFileName().toString(), () -> {
            String name = script.getFileName().toString();
            Path expected = EXAMPLES.resolve(name.replace(".ctr", ".out"));
            if (!Files.exists(expected)) {
                assertTrue(allSources.contains("use \"" + name + "\""),
                        name + " has no expected output and no example uses it as a library");
                return;
            }
            String want = read(expected);
            CliRunner r = CliRunner.run("run", script.toString());
            assertEquals("", r.err(), "stderr of " + name);
            assertEquals(want, r.out(), "output of " + name);
            assertEquals(want.contains("  FAILED") ? Main.CHECK_FAILED : Main.OK, r.exitCode(), "exit code of " + name);
        }));
    }

    @TestFactory
    Stream<DynamicTest> everyExamplePrintsWellFormedJsonLines() throws IOException {
        List<Path> scripts;
        try (Stream<Path> files = Files.list(EXAMPLES)) {
            scripts = files.filter(p -> p.toString().endsWith(".ctr") && Files.exists(Path.of(p.toString().replace(".ctr", ".out"))))
                    .sorted().toList();
        }
        return scripts.stream().map(script -> DynamicTest.dynamicTest(script.getFileName() + " --json", () -> {
            CliRunner r = CliRunner.run("--json", "run", script.toString());
            List<String> lines = r.out().lines().toList();
            assertTrue(!lines.isEmpty(), "no output from " + script);
            lines.forEach(dev.contour.print.JsonSyntax::check);
        }));
    }

    private static String read(Path p) {
        try {
            return Files.readString(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }
}
