package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Messages and input handling through the command line: incomplete input, byte-order marks and
 * bad bytes, a solve without conditions, contradictory or wrong options, LaTeX for awkward names,
 * and the renamed rule guards.
 */
class InputTrustTest {
    @TempDir
    Path dir;

    private String script(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p.toString();
    }

    private String script(String name, byte[] bytes) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, bytes);
        return p.toString();
    }

    @Test
    void anUnclosedBracketAtTheEndIsNamedWhateverTheParserPredicted() throws IOException {
        CliRunner r = CliRunner.run("run", script("u.ctr", "vars s\nshow 1/f(1\n"));
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertTrue(r.err().contains("expected ')' to close '(' opened at 2:9, found end of input"), r.err());
        assertFalse(r.err().contains("a statement or end of input"), r.err());
        CliRunner power = CliRunner.run("run", script("v.ctr", "vars s\nshow 2^(s + {1\n"));
        assertTrue(power.err().contains("to close '{' opened at 2:13"), power.err());
    }

    @Test
    void aByteOrderMarkIsAcceptedAndABadByteIsLocated() throws IOException {
        byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
        byte[] body = "vars s\nshow s + 1\n".getBytes(StandardCharsets.UTF_8);
        byte[] withBom = new byte[bom.length + body.length];
        System.arraycopy(bom, 0, withBom, 0, 3);
        System.arraycopy(body, 0, withBom, 3, body.length);
        CliRunner ok = CliRunner.run("run", script("bom.ctr", withBom));
        assertEquals(Main.OK, ok.exitCode(), ok.err());
        assertEquals("s + 1\n", ok.out());

        // line 3, after "show \"é" (é is two bytes but one column): the lone 0xFF is column 8
        byte[] bad = "vars s\n# note\nshow \"\u00e9\u0000x\"\n".getBytes(StandardCharsets.UTF_8);
        int at = new String(bad, StandardCharsets.UTF_8).indexOf('\u0000') + 1; // the byte index of the NUL (é is 2 bytes)
        bad[at] = (byte) 0xFF;
        String file = script("bad.ctr", bad);
        CliRunner r = CliRunner.run("run", file);
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertTrue(r.err().startsWith(file + ":3:8: the file is not valid UTF-8: byte 0xff"), r.err());
        assertFalse(r.err().contains("Input length"), r.err());

        // the same through 'use': the library's own line and column
        script("lib.ctr", bad);
        CliRunner used = CliRunner.run("run", script("main.ctr", "use \"lib.ctr\"\n"));
        assertEquals(Main.BAD_INPUT, used.exitCode());
        assertTrue(used.err().contains("lib.ctr:3:8: the file is not valid UTF-8"), used.err());
    }

    @Test
    void aSolveWithoutConditionsSaysSo() throws IOException {
        CliRunner r = CliRunner.run("run", script("s.ctr", "vars s\nunknown c[i in 0..1]\nlet x = solve for c\n"));
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertTrue(r.err().contains(":3:9: 'solve' needs the conditions to solve before 'for'"), r.err());
        assertFalse(r.err().contains("is a keyword"), r.err());
    }

    @Test
    void aMissingRulesFolderAndTwoOutputFormatsAreUsageErrors() throws IOException {
        String ok = script("ok.ctr", "vars s\nshow s\n");
        CliRunner rules = CliRunner.run("run", "--rules", dir.resolve("absent").toString(), ok);
        assertEquals(Main.BAD_INPUT, rules.exitCode());
        assertTrue(rules.err().contains("no such folder"), rules.err());
        assertEquals(Main.BAD_INPUT, CliRunner.run("run", "--rules=" + ok, ok).exitCode(), "a file is not a folder");
        CliRunner both = CliRunner.run("run", "--latex", "--json", ok);
        assertEquals(Main.BAD_INPUT, both.exitCode());
        assertTrue(both.err().contains("--latex and --json cannot be used together"), both.err());
        assertEquals(Main.BAD_INPUT, CliRunner.run("run", "--json", "--latex", ok).exitCode());
        assertEquals(Main.OK, CliRunner.run("run", "--latex", "--latex", ok).exitCode(), "the same format twice is fine");
        assertEquals(Main.OK, CliRunner.run("run", "--rules", dir.toString(), ok).exitCode());
    }

    @Test
    void retiredGuardNamesNameTheirReplacements() throws IOException {
        CliRunner numeric = CliRunner.run("run", script("n.ctr",
                "vars s\nrule r : wrap(@x) becomes @x when numeric(@x)\n"));
        assertEquals(Main.BAD_INPUT, numeric.exitCode());
        assertTrue(numeric.err().contains(":2:35: rule 'r': the guard 'numeric' is now called 'rational_number'"), numeric.err());
        CliRunner freeOf = CliRunner.run("run", script("f.ctr",
                "vars s\nrule r : wrap(@x) becomes @x when free_of(@x, s)\n"));
        assertTrue(freeOf.err().contains("the guard 'free_of' is now called 'without_variable'"), freeOf.err());
        // the new names work: wrap(2) and wrap(t) unwrap, wrap(s) and wrap(s/2) stay
        CliRunner r = CliRunner.run("run", script("g.ctr", """
                vars s, t
                rule unwrap-number : wrap(@x) becomes @x when rational_number(@x)
                rule unwrap-free : twist(@x) becomes @x when without_variable(@x, s)
                derive wrap(2) + wrap(s/2) + twist(t) + twist(s)
                """));
        assertEquals(Main.OK, r.exitCode(), r.err());
        String last = r.out().lines().map(String::strip).filter(l -> l.startsWith("= ")).reduce((a, b) -> b).orElseThrow();
        assertTrue(last.contains("wrap(1/2*s)") && last.contains("twist(s)") && !last.contains("twist(t)")
                && !last.contains("wrap(2)") && last.contains("t + 2"), r.out());
    }

    /** Names with underscores, trailing underscores, digits and Greek words, in every LaTeX path. */
    private static final String AWKWARD = """
            vars s_1_2, a_, b__c, x1_, sigma_tau_2, t
            show shift(s_1_2: -2, a_: 1) as latex
            show a_^2 + b__c/(x1_ - sigma_tau_2) as latex
            show (s_1_2 - 2)*shift(b__c: 1/2) as latex
            show t^2*a_ as latex
            """;

    @Test
    void everyLatexFormOfAnAwkwardNameIsWellFormed() throws IOException, InterruptedException {
        CliRunner r = CliRunner.run("run", script("latex.ctr", AWKWARD));
        assertEquals(Main.OK, r.exitCode(), r.err());
        List<String> formulas = new ArrayList<>();
        for (String line : r.out().split("\n")) {
            if (!line.startsWith("%") && !line.isBlank()) {
                formulas.add(line);
            }
        }
        assertEquals(4, formulas.size(), r.out());
        for (String f : formulas) {
            assertWellFormed(f);
        }
        assertTrue(formulas.get(0).contains("\\mathrm{E}_{s_{1_{2}}}^{-2}"), formulas.get(0));
        assertTrue(formulas.get(1).contains("\\mathrm{a\\_}^{2}"), formulas.get(1));
        compileIfTexIsInstalled(formulas);
    }

    /**
     * Braces balance and no base gets two subscripts or superscripts in a row, the faults that make
     * pdflatex stop ("Double subscript", "Missing { inserted"); common practice for LaTeX math.
     */
    private static void assertWellFormed(String latex) {
        int depth = 0;
        for (int i = 0; i < latex.length(); i++) {
            char c = latex.charAt(i);
            boolean escaped = i > 0 && latex.charAt(i - 1) == '\\';
            if (c == '{' && !escaped) {
                depth++;
            } else if (c == '}' && !escaped) {
                depth--;
                assertTrue(depth >= 0, "unbalanced '}' in " + latex);
            } else if ((c == '_' || c == '^') && !escaped) {
                assertTrue(i + 1 < latex.length() && "{}^_".indexOf(latex.charAt(i + 1)) < 0 || latex.charAt(i + 1) == '{',
                        "a script mark without an argument in " + latex);
                // the argument of this script mark, then no second mark of the same kind directly after
                int end = i + 1;
                if (latex.charAt(end) == '{') {
                    int d = 0;
                    do {
                        if (latex.charAt(end) == '{' && latex.charAt(end - 1) != '\\') {
                            d++;
                        } else if (latex.charAt(end) == '}' && latex.charAt(end - 1) != '\\') {
                            d--;
                        }
                        end++;
                    } while (d > 0);
                } else {
                    end++;
                }
                assertTrue(end >= latex.length() || latex.charAt(end) != c, "double " + (c == '_' ? "subscript" : "superscript")
                        + " in " + latex);
            }
        }
        assertEquals(0, depth, "unbalanced braces in " + latex);
    }

    private void compileIfTexIsInstalled(List<String> formulas) throws IOException, InterruptedException {
        String tex = findOnPath("pdflatex");
        if (tex == null) {
            return; // the structural check above stands in for the compiler
        }
        StringBuilder doc = new StringBuilder("\\documentclass{article}\n\\usepackage{amsmath}\n\\begin{document}\n");
        for (String f : formulas) {
            doc.append("\\[").append(f).append("\\]\n");
        }
        doc.append("\\end{document}\n");
        Files.writeString(dir.resolve("names.tex"), doc);
        Process p = new ProcessBuilder(tex, "-interaction=nonstopmode", "-halt-on-error", "names.tex")
                .directory(dir.toFile()).redirectErrorStream(true).start();
        String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(60, TimeUnit.SECONDS), "pdflatex did not finish");
        assertEquals(0, p.exitValue(), log);
    }

    private static String findOnPath(String program) {
        String path = System.getenv("PATH");
        if (path == null) {
            return null;
        }
        for (String d : path.split(File.pathSeparator)) {
            Path candidate = Path.of(d, program);
            if (Files.isExecutable(candidate)) {
                return candidate.toString();
            }
        }
        return null;
    }
}
