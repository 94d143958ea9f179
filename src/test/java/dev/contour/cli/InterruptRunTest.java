package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Ctrl-C on {@code contour run}, as a real SIGINT to a real process: the running statement stops
 * with its location, the output before it stands, the report is written whole and says where the
 * run stopped, and the exit status is 130.
 */
class InterruptRunTest {
    @TempDir
    Path dir;

    @Test
    void anInterruptStopsTheRunningStatementWithItsLocation() throws Exception {
        Path script = dir.resolve("long.ctr");
        // a sum of a million partial fractions: many seconds, well inside every limit
        Files.writeString(script, "show 1 + 1\nvars x\nlet s = sum i in 1..1000000 : 1 / (x + i)\nshow 2\n");
        Path report = dir.resolve("long.tex");
        String javaExe = ProcessHandle.current().info().command().orElse(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        Path err = dir.resolve("err.txt");
        Process p = new ProcessBuilder(List.of(javaExe, "-cp", System.getProperty("java.class.path"), Main.class.getName(),
                "run", "--report", report.toString(), script.toString()))
                .redirectError(err.toFile()).start();
        try {
            BufferedReader out = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8));
            assertEquals("1 + 1 = 2", out.readLine());
            Thread.sleep(500); // inside the sum now
            Process kill = new ProcessBuilder("kill", "-INT", Long.toString(p.pid())).start();
            assertEquals(0, kill.waitFor());
            assertTrue(p.waitFor(60, TimeUnit.SECONDS), "the run did not stop within a minute of Ctrl-C");
            assertEquals(null, out.readLine(), "nothing after the interrupted statement runs");
            assertEquals(Main.INTERRUPTED, p.exitValue());
            String e = Files.readString(err);
            assertTrue(e.matches("(?s).*" + java.util.regex.Pattern.quote(script + ":3:") + "\\d+: interrupted.*"), e);
            assertTrue(e.contains("stopped by an interrupt"), e);
            String tex = Files.readString(report);
            assertTrue(tex.contains("The run stopped here") && tex.contains("interrupted") && tex.strip().endsWith("\\end{document}"), tex);
        } finally {
            p.destroyForcibly();
        }
    }
}
