package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The REPL fed from a plain stream (piped input), reached through {@code contour repl}. */
class StreamReplTest {
    @TempDir
    Path dir;

    /** Output, errors and exit code of one piped session. */
    record Run(String out, String err, int code) { }

    static Run repl(String input, String... options) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        String[] args = new String[options.length + 2];
        args[0] = "repl";
        args[1] = "--no-history";
        System.arraycopy(options, 0, args, 2, options.length);
        int code = Main.run(args, new ByteArrayInputStream(input.getBytes(StandardCharsets.UTF_8)),
                new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Run(out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8), code);
    }

    static Run script(Path file) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = Main.run(new String[] {"run", file.toString()}, new ByteArrayInputStream(new byte[0]),
                new PrintStream(out, true, StandardCharsets.UTF_8), new PrintStream(err, true, StandardCharsets.UTF_8));
        return new Run(out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8), code);
    }

    @Test
    void statementBudgetsApplyInTheReplAndTheSessionGoesOn() {
        // the same budget options as 'contour run': a runaway statement stops, names the option, and
        // what came before and after it still runs
        Run r = repl("vars s, t\nshow 1\nlet x = (s + t + 1)^500\nshow 2\n", "--time-budget", "1");
        assertEquals("1\n2\n", r.out());
        assertTrue(r.err().startsWith("<repl>:3:1: this statement ran past its time budget of 1 seconds; raise it with"
                + " --time-budget SECONDS"), r.err());
        Run digits = repl("show 10^40\n", "--max-digits", "20");
        assertTrue(digits.err().contains("past the limit of 20 digits; raise it with --max-digits DIGITS"), digits.err());
        Run bad = repl("show 1\n", "--time-budget", "soon");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--time-budget needs a whole number, not 'soon'"), bad.err());
    }

    @Test
    void aBareExpressionIsShownLikeShow() {
        Run r = repl("let word = \"ansatz\"\n{word, word}\nshow {word, word}\n");
        assertEquals("{word, word} = {\"ansatz\", \"ansatz\"}\n".repeat(2), r.out());
        assertEquals("", r.err());
        assertEquals(0, r.code());
    }

    @Test
    void inputContinuesWhileABracketIsOpen() {
        Run r = repl("let w = \"x\"\nshow {w,\n  w,\n  w}\n");
        assertEquals("{w, w, w} = {\"x\", \"x\", \"x\"}\n", r.out());
        assertEquals("", r.err());
    }

    @Test
    void errorsNameTheSessionLineAndColumnAndTheSessionGoesOn() {
        Run r = repl("let w = \"x\"\nlet = 3\nshow {w,\n  nope}\nshow w\n");
        assertEquals("""
                <repl>:2:5: expected a name, found '='
                    let = 3
                        ^
                <repl>:4:3: unknown name 'nope'
                      nope}
                      ^~~~
                """, r.err());
        assertEquals("x\n", r.out());
        assertEquals(Main.BAD_INPUT, r.code());
    }

    @Test
    void aBareExpressionOnTheFirstLineKeepsItsColumns() {
        Run r = repl("{\"a\", unknown_thing}\n");
        assertTrue(r.err().startsWith("<repl>:1:7: unknown name 'unknown_thing'"), r.err());
        assertTrue(r.err().contains("    {\"a\", unknown_thing}\n          ^~~~~~~~~~~~~\n"), r.err());
    }

    @Test
    void anErrorInAFunctionPointsAtTheLineThatDefinedIt() {
        Run r = repl("def f(x) = x(1)\nlet w = \"x\"\nshow f(w)\n");
        assertTrue(r.err().startsWith("<repl>:1:"), r.err());
        assertTrue(r.err().contains("    def f(x) = x(1)\n"), r.err());
    }

    @Test
    void anUnfinishedInputAtTheEndIsReported() {
        Run r = repl("show {1,\n");
        assertTrue(r.err().startsWith("<repl>:1:"), r.err());
        assertTrue(r.err().contains("expected"), r.err());
        assertEquals(Main.BAD_INPUT, r.code());
    }

    @Test
    void theSessionSavedToAFileRerunsToTheSameValues() throws IOException {
        Path saved = dir.resolve("session.ctr");
        String shows = "show {greeting, wrap(greeting), wrap(wrap(greeting))}\n";
        Run session = repl("def wrap(x) = {x, x}\nlet greeting = \"hi\"\nlet greeting = \"hello\"\n" + shows
                + ":write " + saved + "\n");
        assertEquals(0, session.code(), session.err());
        assertTrue(session.out().endsWith("wrote 2 lines to " + saved + "\n"), session.out());

        Path rerun = dir.resolve("rerun.ctr");
        Files.writeString(rerun, Files.readString(saved) + shows);
        Run script = script(rerun);
        assertEquals(0, script.code(), script.err());
        String shown = session.out().substring(0, session.out().indexOf("wrote "));
        assertEquals(shown, script.out());
        assertFalse(Files.readString(saved).contains("\"hi\""), "the replaced definition is not saved");
    }

    @Test
    void aSavedSessionOfAlgebraRerunsToTheSameValues() throws IOException {
        // A toy scenario of our own: a made-up weight-3 ansatz with one shifted pole.
        Path saved = dir.resolve("algebra.ctr");
        String shows = """
                show m
                show shifted(m)
                show m at (s = t, t = s)
                show sum i, j with i + j = 2 : c[i, j] * s^i * t^j
                """;
        Run session = repl("""
                vars s, t
                unknown c[i, j] with i + j = 2
                let p = 3
                let m = (s + t)^p / ((s - 2) * (t - 2 +
                    1/3))
                def shifted(f) = f at s = s + 2
                let p = 4
                """ + shows + ":write " + saved + "\n");
        assertEquals(0, session.code(), session.err());
        Path rerun = dir.resolve("rerun-algebra.ctr");
        Files.writeString(rerun, Files.readString(saved) + shows);
        Run script = script(rerun);
        assertEquals(0, script.code(), script.err());
        assertEquals(session.out().substring(0, session.out().indexOf("wrote ")), script.out());
        assertTrue(script.out().lines().count() >= 4, script.out());
    }

    @Test
    void valuesWithoutAScriptFormAreSavedAsTheStatementsThatMadeThem() throws IOException {
        // a solution has no script form of its own: the saved session recomputes it, after the
        // definitions it used (a planted system: c[0] + c[1] = 2, c[1] = c[2])
        Path saved = dir.resolve("solved.ctr");
        String shows = "show c with sol\nshow alias(4)\n";
        Run session = repl("""
                unknown c[i] with i <= 2
                let total = c[0] + c[1]
                let sol = solve total == 2,
                                c[1] - c[2] == 0 for c
                let total = 0
                let alias = Gamma
                """ + shows + ":write " + saved + "\n");
        assertEquals(0, session.code(), session.err());
        String text = Files.readString(saved);
        assertTrue(text.contains("let total = c[0] + c[1]\nlet sol = solve total == 2, c[1] - c[2] == 0 for c\n"), text);
        assertTrue(text.contains("let alias = Gamma"), text);
        Path rerun = dir.resolve("rerun-solved.ctr");
        Files.writeString(rerun, text + shows);
        Run script = script(rerun);
        assertEquals(0, script.code(), script.err());
        assertEquals(session.out().substring(0, session.out().indexOf("wrote ")), script.out());
    }

    @Test
    void writingReplacesAFileWholeAndAFailedWriteLeavesItAlone() throws IOException {
        Path target = dir.resolve("defs.ctr");
        Files.writeString(target, "# an older file, much longer than what replaces it\n".repeat(50));
        Run ok = repl("let a = \"x\"\n:write " + target + "\n");
        assertEquals(0, ok.code(), ok.err());
        assertEquals("# Definitions saved from a contour repl session.\nlet a = \"x\"\n", Files.readString(target));

        Path intoAFile = target.resolve("below-a-file.ctr"); // a file cannot hold files: the write fails
        Run failed = repl("let b = \"y\"\n:write " + intoAFile + "\n");
        assertEquals(Main.BAD_INPUT, failed.code());
        assertTrue(failed.err().startsWith("<repl>:2:1: cannot write '" + intoAFile + "'"), failed.err());
        assertEquals("# Definitions saved from a contour repl session.\nlet a = \"x\"\n", Files.readString(target));
        try (var left = Files.list(dir)) {
            assertEquals(List.of(target), left.toList(), "no temporary file is left behind");
        }
    }

    @Test
    void runningAFileAddsItsDefinitionsToTheSession() throws IOException {
        Path lib = dir.resolve("lib.ctr");
        Files.writeString(lib, "let tag = \"from a file\"\ndef twice(x) = {x, x}\n");
        Run r = repl(":run " + lib + "\nshow twice(tag)\n:defs\n");
        assertEquals("twice(tag) = {\"from a file\", \"from a file\"}\nlet tag = \"from a file\"\ndef twice(x) = {x, x}\n", r.out());
        assertEquals(0, r.code(), r.err());
    }

    @Test
    void anErrorInARunFileNamesThatFile() throws IOException {
        Path lib = dir.resolve("broken.ctr");
        Files.writeString(lib, "let a = \"ok\"\nlet b = {a,\n  nope}\n");
        Run r = repl(":run " + lib + "\nshow a\n");
        assertTrue(r.err().startsWith(lib + ":3:3: unknown name 'nope'\n      nope}\n"), r.err());
        assertEquals("ok\n", r.out(), "the statements before the error took effect");
    }

    @Test
    void commandsHelpListAndEnd() {
        Run r = repl(":help\n:defs\n:names\n:end\nshow \"not reached\"\n");
        assertTrue(r.out().contains(":write FILE"), r.out());
        assertTrue(r.out().contains("(no definitions yet)\n"), r.out());
        assertTrue(r.out().contains("Gamma"), r.out());
        assertFalse(r.out().contains("not reached"), r.out());
        assertEquals(0, r.code(), r.err());
    }

    @Test
    void anUnknownCommandSuggestsTheNearestOne() {
        Run r = repl(":wirte x.ctr\n:frobnicate\n");
        assertTrue(r.err().startsWith("<repl>:1:1: unknown command ':wirte'; did you mean ':write'?"), r.err());
        assertTrue(r.err().contains("<repl>:2:1: unknown command ':frobnicate' (:help lists them)"), r.err());
    }

    @Test
    void scriptsNamedOnTheCommandLineRunFirst() throws IOException {
        Path lib = dir.resolve("first.ctr");
        Files.writeString(lib, "let early = \"loaded\"\n");
        Run r = repl("show early\n", lib.toString());
        assertEquals("loaded\n", r.out());
    }

    @Test
    void javaDetailOnlyWithDebug() {
        assertFalse(repl("show nope\n").err().contains("\tat dev.contour."));
        assertTrue(repl("show nope\n", "--debug").err().contains("\tat dev.contour."));
    }

    @Test
    void rulesAndHistoryTakeTheirValueSpacedOrAfterAnEqualsSign() throws IOException {
        Path rules = Files.createDirectories(dir.resolve("my-rules"));
        Files.writeString(rules.resolve("toy.ctr"), "let from_library = \"found\"\n");
        assertEquals("found\n", repl("use \"toy.ctr\"\nshow from_library\n", "--rules", rules.toString()).out());
        assertEquals("found\n", repl("use \"toy.ctr\"\nshow from_library\n", "--rules=" + rules).out());
        Run r = repl("show 1\n", "--history", dir.resolve("h").toString());
        assertEquals("1\n", r.out(), r.err());
    }

    @Test
    void badOptionsAreUsageErrors() {
        Run r = repl("", "--frobnicate");
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.err().contains("unknown option '--frobnicate'"), r.err());
    }
}
