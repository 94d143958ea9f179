package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command line through its in-process entry point: commands, options, exit codes, error layout. */
class MainTest {
    @TempDir
    Path dir;

    private String script(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p.toString();
    }

    @Test
    void helpAndVersion() {
        CliRunner help = CliRunner.run("--help");
        assertEquals(Main.OK, help.exitCode());
        assertTrue(help.out().startsWith("usage: contour COMMAND"));
        assertTrue(help.out().contains("--latex"));
        assertEquals("contour " + Main.VERSION + "\n", CliRunner.run("--version").out());
        assertEquals(Main.OK, CliRunner.run("-V").exitCode());
    }

    @Test
    void usageMistakesExitWithTwo() {
        assertEquals(Main.BAD_INPUT, CliRunner.run().exitCode());
        CliRunner unknown = CliRunner.run("frobnicate");
        assertEquals(Main.BAD_INPUT, unknown.exitCode());
        assertTrue(unknown.err().contains("unknown command 'frobnicate'"));
        CliRunner option = CliRunner.run("run", "--colour", "x.ctr");
        assertEquals(Main.BAD_INPUT, option.exitCode());
        assertTrue(option.err().contains("unknown option '--colour'"));
        assertEquals(Main.BAD_INPUT, CliRunner.run("run").exitCode());
        CliRunner missing = CliRunner.run("run", dir.resolve("absent.ctr").toString());
        assertEquals(Main.BAD_INPUT, missing.exitCode());
        assertTrue(missing.err().startsWith("contour: no such file: "));
    }

    @Test
    void runPrintsShowsAndChecksAndExitsWithOneOnAFailedCheck() throws IOException {
        String ok = script("ok.ctr", "vars s\nshow (s + 1)^2\ncheck s*s == s^2\n");
        CliRunner r = CliRunner.run("run", ok);
        assertEquals(Main.OK, r.exitCode());
        assertEquals("(s + 1)^2 = s^2 + 2*s + 1\ncheck s*s == s^2  ok\n", r.out());
        String bad = script("bad.ctr", "vars s\ncheck s == s + 1\ncheck s == s\n");
        CliRunner f = CliRunner.run("run", bad);
        assertEquals(Main.CHECK_FAILED, f.exitCode());
        assertTrue(f.out().startsWith("check s == s + 1  FAILED (line 2)\n"), f.out());
        assertTrue(f.out().endsWith("check s == s  ok\n"), "later checks still run");
    }

    @Test
    void checkCommandPrintsOnlyChecksOneLineEach() throws IOException {
        String file = script("c.ctr", "vars s, t\nshow s\ncheck s + t == t + s\ncheck s == t\n");
        CliRunner r = CliRunner.run("check", file);
        assertEquals(Main.CHECK_FAILED, r.exitCode());
        List<String> lines = r.out().lines().toList();
        assertEquals(2, lines.size(), r.out());
        assertEquals("check s + t == t + s  ok", lines.get(0));
        assertTrue(lines.get(1).startsWith("check s == t  FAILED ("), lines.get(1));
    }

    @Test
    void errorsShowFileLineColumnTheLineAndACaret() throws IOException {
        String file = script("e.ctr", "vars sigma, tau collected\nshow sigam + tau\n");
        CliRunner r = CliRunner.run("run", file);
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertEquals(file + ":2:6: unknown name 'sigam'; did you mean 'sigma'?\n"
                + "    show sigam + tau\n"
                + "         ^~~~~\n", r.err());
        assertFalse(r.err().contains("at dev.contour"), "no stack trace without --debug");
        CliRunner debug = CliRunner.run("--debug", "run", file);
        assertTrue(debug.err().contains("at dev.contour"), "--debug shows the Java detail");
    }

    @Test
    void syntaxErrorsPointIntoTheLine() throws IOException {
        String file = script("s.ctr", "let x = (1 +\n  2\nshow x\n");
        CliRunner r = CliRunner.run("run", file);
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertEquals(file + ":3:1: expected ')' to close '(' opened at 1:9, found 'show'\n"
                + "    show x\n"
                + "    ^~~~\n", r.err());
    }

    @Test
    void errorsInsideALibraryShowTheLibraryLine() throws IOException {
        script("lib.ctr", "def f(x) = x +\n");
        String main = script("main.ctr", "use \"lib.ctr\"\n");
        CliRunner r = CliRunner.run("run", main);
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertTrue(r.err().startsWith(dir.resolve("lib.ctr") + ":2:1: expected an expression, found end of input"), r.err());
    }

    @Test
    void latexAndJsonOptionsChangeTheOutputForm() throws IOException {
        String file = script("f.ctr", "vars s\nvars sigma collected\nshow sigma^2/(s - 2)\ncheck s == s\n");
        CliRunner latex = CliRunner.run("run", "--latex", file);
        assertEquals("% sigma^2/(s - 2)\n\\frac{\\sigma^{2}}{s - 2}\n% check s == s  ok\n", latex.out());
        CliRunner json = CliRunner.run("--json", "run", file);
        List<String> lines = json.out().lines().toList();
        assertEquals(2, lines.size());
        assertTrue(lines.get(0).startsWith("{\"show\":\"sigma^2/(s - 2)\",\"value\":{\"kind\":\"expression\",\"terms\":[{\"monomial\":{\"sigma\":2}"), lines.get(0));
        assertEquals("{\"check\":\"s == s\",\"line\":4,\"ok\":true}", lines.get(1));
    }

    @Test
    void accentedNamesTypesetWithTheirAccent() throws IOException {
        // utilde is the shifted Mellin variable u - 4 of the AdS5xS5 background (physics-reference §4);
        // zbar the conjugate cross-ratio: both are written with an accent in papers (common practice)
        String file = script("acc.ctr", "vars utilde, zbar, sigmahat, ubar2, that2x\nshow utilde + zbar*sigmahat + ubar2 + that2x\n");
        CliRunner latex = CliRunner.run("run", "--latex", file);
        String tex = latex.out().lines().toList().get(1);
        assertTrue(tex.contains("\\tilde{u}"), tex);
        assertTrue(tex.contains("\\bar{z}"), tex);
        assertTrue(tex.contains("\\hat{\\sigma}"), tex);
        assertTrue(tex.contains("\\bar{u}_{2}"), tex);
        assertTrue(tex.contains("\\mathrm{that2x}"), tex); // not a letter and an accent: upright, as before
    }

    @Test
    void aJsonRunStaysJsonWhenAStatementAsksForAnotherForm() throws IOException {
        String file = script("j.ctr", "vars s\nshow {1, 2} as plain\nshow s^2 as latex\nshow \"heading\" as latex\n");
        List<String> lines = CliRunner.run("--json", "run", file).out().lines().toList();
        assertEquals(List.of("{\"show\":\"{1, 2}\",\"text\":\"{1, 2}\"}", "{\"show\":\"s^2\",\"latex\":\"s^{2}\"}",
                "{\"show\":\"\\\"heading\\\"\",\"text\":\"heading\"}"), lines);
        lines.forEach(dev.contour.print.JsonSyntax::check);
    }

    @Test
    void severalFilesRunInTurnWithHeaders() throws IOException {
        String a = script("a.ctr", "show 1\n");
        String b = script("b.ctr", "show 2\n");
        CliRunner r = CliRunner.run("run", a, b);
        assertEquals("== " + a + " ==\n1\n== " + b + " ==\n2\n", r.out());
    }

    @Test
    void rulesOptionSetsTheLibraryFolder() throws IOException {
        Path rules = Files.createDirectories(dir.resolve("myrules"));
        Files.writeString(rules.resolve("extra.ctr"), "let answer = 42\n");
        String main = script("m.ctr", "use \"extra.ctr\"\nshow answer\n");
        CliRunner r = CliRunner.run("run", "--rules=" + rules, main);
        assertEquals("answer = 42\n", r.out());
        assertEquals("answer = 42\n", CliRunner.run("run", "--rules", rules.toString(), main).out());
        assertEquals(Main.BAD_INPUT, CliRunner.run("run", main, "--rules").exitCode());
    }

    @Test
    void benchListsAndRunsWorkloads() {
        CliRunner list = CliRunner.run("bench");
        assertEquals(Main.OK, list.exitCode());
        assertTrue(list.out().contains("ansatz-sum-p16"));
        CliRunner one = CliRunner.run("bench", "parse", "1");
        assertEquals(Main.OK, one.exitCode());
        assertTrue(one.out().startsWith("parse: best "), one.out());
        assertEquals(Main.BAD_INPUT, CliRunner.run("bench", "nothing-like-this").exitCode());
    }

    @Test
    void replIsADispatchPointForAContributedCommand() {
        CliRunner r = CliRunner.run("repl");
        // Either a contributed REPL ran (and read the empty input) or the build says it has none.
        assertTrue(r.exitCode() == Main.OK || r.err().contains("'repl' command is not part of this build"), r.err());
    }
}
