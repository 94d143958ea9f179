package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A long {@code for} loop reports where it is on standard error; when that is not a terminal (here
 * a buffer, as a log file would be) the reports are plain lines, and they stop with the run.
 */
@Tag("slow") // waits for the first report, which comes after five seconds
class ProgressOutputTest {
    @TempDir
    Path dir;

    @Test
    void aLongLoopReportsInPlainLinesAndFallsSilentWhenStopped() throws Exception {
        Path script = dir.resolve("long-loop.ctr");
        Files.writeString(script, "vars s, t\nfor i in 1..1000000 {\n  let z = (s + i*t)^20\n}\n");
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        PrintStream captured = new PrintStream(err, true, StandardCharsets.UTF_8);
        PrintStream saved = System.err;
        AtomicInteger code = new AtomicInteger(-1);
        System.setErr(captured);
        try {
            Thread run = new Thread(() -> code.set(Main.run(new String[] {"run", script.toString()}, new ByteArrayInputStream(new byte[0]),
                    new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8), captured)));
            run.start();
            long until = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
            while (!text(err).contains("for i = ") && System.nanoTime() < until) {
                Thread.sleep(50);
            }
            run.interrupt();
            run.join(TimeUnit.SECONDS.toMillis(30));
            assertFalse(run.isAlive());
            String atStop = text(err);
            Thread.sleep(300);
            assertEquals(atStop, text(err), "nothing is printed after the run ended");
            assertEquals(Main.BAD_INPUT, code.get());
            assertFalse(atStop.contains("\r"), "no carriage returns when standard error is not a terminal");
            String first = atStop.lines().findFirst().orElse("");
            assertTrue(first.matches("for i = \\d+ \\(\\d+ of 1000000\\)"), atStop);
            assertTrue(java.util.regex.Pattern.compile("long-loop\\.ctr:3:\\d+: interrupted\n").matcher(atStop).find(), atStop);
        } finally {
            System.setErr(saved);
        }
    }

    private static String text(ByteArrayOutputStream b) {
        return b.toString(StandardCharsets.UTF_8);
    }
}
