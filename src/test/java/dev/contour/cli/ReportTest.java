package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code contour run --report FILE.tex}: the report holds every statement, the verdict of every
 * check, a figure per pole map, and compiles with pdflatex; pdftotext of the PDF shows the verdicts.
 */
class ReportTest {
    @TempDir
    Path dir;

    /** A scenario of our own: a made-up measure, a long sum that must be broken, a pole map, one check that holds and one that fails. */
    private static final String SCRIPT = """
            vars s, t, u
            vars x, y collected
            let m = mellin_measure(gamma: {{(5 - s)/2, 2}, {(6 - t)/2, 1}, {(5 - u)/2, 2}},
                                   kernel: {s/2, t/2 - 3}, eliminate: u, total: 10)
            let A = sum i, j with i + j <= 5 : x^i * y^j * (s + i)*(t - j)/((s - 2)*(t - 4 - 2*j)*(u - 3)) at (u = 10 - s - t)
            show A
            check A at (x = 0, y = 0) == s*t/((s - 2)*(t - 4)*(7 - s - t))
            check A at (x = 0, y = 0) == 1
            show pole_map(A at (x = 0, y = 0), m, contour: {1, 1}, title: "A at x = y = 0")
            """;

    private Path script() throws IOException {
        Path p = dir.resolve("made_up.ctr");
        Files.writeString(p, SCRIPT, StandardCharsets.UTF_8);
        return p;
    }

    @Test
    void theReportHoldsEveryStatementVerdictAndFigure() throws Exception {
        Path tex = dir.resolve("derivation.tex");
        CliRunner r = CliRunner.run("run", "--report", tex.toString(), script().toString());
        assertEquals(Main.CHECK_FAILED, r.exitCode(), r.err());
        String text = Files.readString(tex, StandardCharsets.UTF_8);
        assertTrue(text.contains("\\documentclass"));
        assertTrue(text.contains("Verdict: \\textbf{holds}"));
        assertTrue(text.contains("Verdict: \\textbf{FAILED}"));
        assertTrue(text.contains("contour " + Main.VERSION));
        assertTrue(text.contains("\\includegraphics[width=\\linewidth]{derivation-figure-1.png}"));
        assertTrue(Files.size(dir.resolve("derivation-figure-1.png")) > 1000);
        assertTrue(text.contains("let m = mellin_measure("), "each statement's source is in the report");
        assertTrue(text.contains("\\begin{align*}"), "the long sum is broken into rows");

        boolean present;
        try {
            present = new ProcessBuilder("pdflatex", "--version").redirectErrorStream(true).start().waitFor(30, TimeUnit.SECONDS)
                    && new ProcessBuilder("pdftotext", "-v").redirectErrorStream(true).start().waitFor(30, TimeUnit.SECONDS);
        } catch (IOException e) {
            present = false;
        }
        Assumptions.assumeTrue(present, "pdflatex or pdftotext is not installed (Debian texlive-latex-base, poppler-utils):"
                + " skipping the compile check; .ci/install-tools installs them");
        Process latex = new ProcessBuilder("pdflatex", "-interaction=nonstopmode", "-halt-on-error", tex.getFileName().toString())
                .directory(dir.toFile()).redirectErrorStream(true).start();
        String log = new String(latex.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(latex.waitFor(120, TimeUnit.SECONDS));
        assertEquals(0, latex.exitValue(), log);
        assertFalse(log.contains("Overfull \\hbox"), "nothing runs off the page:\n" + log);
        Process text2 = new ProcessBuilder("pdftotext", "-layout", "derivation.pdf", "-").directory(dir.toFile())
                .redirectErrorStream(true).start();
        String pdf = new String(text2.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(text2.waitFor(60, TimeUnit.SECONDS));
        assertTrue(pdf.contains("Verdict: holds"), pdf);
        assertTrue(pdf.contains("Verdict: FAILED"), pdf);
        assertTrue(pdf.contains("Pole map of A at x = y = 0"), pdf);
    }

    @Test
    void theDrawCommandWritesAPoleMapOfTheScriptsSession() throws Exception {
        Path svg = dir.resolve("map.svg");
        CliRunner r = CliRunner.run("draw", script().toString(), "pole_map(A at (x = 0, y = 0), m, contour: {1, 1})", svg.toString());
        // the script has a failing check: the picture is still drawn, and the status says so
        assertEquals(Main.CHECK_FAILED, r.exitCode(), r.err());
        assertTrue(r.out().startsWith("wrote " + svg), r.out());
        assertTrue(Files.readString(svg).startsWith("<?xml"));
        CliRunner wrong = CliRunner.run("draw", script().toString(), "A", dir.resolve("a.svg").toString());
        assertEquals(Main.BAD_INPUT, wrong.exitCode());
        assertTrue(wrong.err().contains("not a pole map"), wrong.err());
        assertFalse(Files.exists(dir.resolve("a.svg")));
        CliRunner usage = CliRunner.run("draw", script().toString());
        assertEquals(Main.BAD_INPUT, usage.exitCode());
        assertTrue(usage.err().contains("usage: contour draw"), usage.err());
    }

    @Test
    void aBadReportNameIsAUsageError() throws Exception {
        CliRunner r = CliRunner.run("run", "--report", dir.resolve("report.pdf").toString(), script().toString());
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertTrue(r.err().contains(".tex"), r.err());
        CliRunner missing = CliRunner.run("run", "--report");
        assertEquals(Main.BAD_INPUT, missing.exitCode());
    }

    @Test
    void aRunStoppedByBadInputStillWritesAWholeReportSayingWhere() throws Exception {
        Path bad = dir.resolve("bad.ctr");
        Files.writeString(bad, "vars s\nshow s + \n", StandardCharsets.UTF_8);
        Path tex = dir.resolve("bad.tex");
        CliRunner r = CliRunner.run("run", "--report=" + tex, bad.toString());
        assertEquals(Main.BAD_INPUT, r.exitCode());
        String text = Files.readString(tex, StandardCharsets.UTF_8);
        assertTrue(text.contains("The run stopped here."));
        assertTrue(text.endsWith("\\end{document}\n"));
    }
}
