package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * What a session keeps: after Ctrl-C the definitions it had before the interrupted input (kept,
 * not recomputed), and in a saved file the statements that built it (not their expanded values).
 */
class SessionStateTest {
    @TempDir
    Path dir;

    private final ByteArrayOutputStream out = new ByteArrayOutputStream();
    private final ByteArrayOutputStream err = new ByteArrayOutputStream();

    private Session session() {
        return new Session(ReplSettings.plain(), new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
    }

    /** Runs the input on another thread, interrupts it once it has run a while, and waits for the prompt. */
    private static void interrupt(Session s, String input) throws InterruptedException {
        Thread typing = new Thread(() -> s.accept(input), "typing");
        typing.start();
        Thread.sleep(500);
        long until = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (typing.isAlive() && System.nanoTime() < until) {
            s.interrupt();
            typing.join(100);
        }
        assertFalse(typing.isAlive(), "the input did not stop");
    }

    @Test
    void ctrlCKeepsTheDefinitionsAsTheyWereInsteadOfRecomputingThem() throws Exception {
        // A library that changes on disk after it was loaded: recomputing the session (reading it
        // again) would give the new text; keeping the definitions gives the old one.
        Path lib = dir.resolve("tags.ctr");
        Files.writeString(lib, "let tag = \"as loaded\"\n");
        Session s = session();
        s.accept("vars s, t");
        s.accept("use \"" + lib + "\"");
        s.accept("let kept = s + t");
        Files.writeString(lib, "let tag = \"changed on disk\"\n");
        interrupt(s, "let kept = 0; let tag = 1; for i in 1..1000000 { let z = (s + i*t)^20 }");
        assertTrue(err.toString(StandardCharsets.UTF_8).contains("interrupted\n"), err.toString(StandardCharsets.UTF_8));
        assertFalse(err.toString(StandardCharsets.UTF_8).contains("restoring"), "nothing is re-run");
        out.reset();
        s.accept("show {tag, kept}");
        assertEquals("{tag, kept} = {\"as loaded\", s + t}\n", out.toString(StandardCharsets.UTF_8));
        s.accept("show z");
        assertTrue(err.toString(StandardCharsets.UTF_8).contains("unknown name 'z'"), err.toString(StandardCharsets.UTF_8));
    }

    @Test
    void ctrlCForgetsRulesAndFamiliesDeclaredByTheInterruptedInput() throws Exception {
        Session s = session();
        s.accept("vars s, t");
        interrupt(s, "unknown c[k] with k <= 2; rule step : Gamma(@x + 1) becomes @x*Gamma(@x)\n"
                + "for i in 1..1000000 { let z = (s + i*t)^20 }");
        out.reset();
        s.accept("unknown c[k] with k <= 3"); // the name is free again
        s.accept("show sum k with k <= 3 : c[k]");
        assertEquals("sum k with k <= 3 : c[k] = c[3] + c[2] + c[1] + c[0]\n", out.toString(StandardCharsets.UTF_8),
                err.toString(StandardCharsets.UTF_8));
        s.accept("derive Gamma(s + 1)"); // the rule went with the input
        assertTrue(err.toString(StandardCharsets.UTF_8).contains("no rules to rewrite with"), err.toString(StandardCharsets.UTF_8));
    }

    @Test
    void aSavedSessionHoldsTheStatementsNotTheirExpandedValues() throws IOException {
        Path saved = dir.resolve("saved.ctr");
        Session s = session();
        s.accept("vars s, t");
        s.accept("let big = (s + t + 1)^40");
        s.accept("for k in 1..3 {\n  let last = k*big\n}");
        s.accept("let a = 2");
        s.accept("let b = a + 1");
        s.accept("let a = 5");
        s.accept("let unused = 1");
        s.accept("let unused = 2");
        s.accept(":write " + saved);
        String text = Files.readString(saved);
        assertEquals("""
                # Definitions saved from a contour repl session.
                vars s, t
                let big = (s + t + 1)^40
                for k in 1..3 {
                  let last = k*big
                }
                let a = 2
                let b = a + 1
                let a = 5
                let unused = 2
                """, text);
        // the saved script rebuilds the same values
        String shows = "show last at (s = 1/2, t = 1/3)\nshow {a, b}\n";
        out.reset();
        s.accept(shows);
        String inSession = out.toString(StandardCharsets.UTF_8);
        Path rerun = dir.resolve("rerun.ctr");
        Files.writeString(rerun, text + shows);
        StreamReplTest.Run script = StreamReplTest.script(rerun);
        assertEquals(0, script.code(), script.err());
        assertEquals(inSession, script.out());
    }
}
