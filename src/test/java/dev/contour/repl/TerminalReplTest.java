package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.jline.terminal.Terminal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The REPL on a (pipe-made) terminal: line editing, history, completion, continuation, Ctrl-C. */
class TerminalReplTest {
    /** Ctrl-P: the previous history entry (whatever the arrow keys send on this terminal type). */
    private static final String PREVIOUS = "\u0010";

    @TempDir
    Path dir;

    private TerminalHarness session(Path history) throws Exception {
        return new TerminalHarness(ReplSettings.plain().withHistory(history));
    }

    @Test
    void eachAcceptedLineIsInTheHistoryFileAtOnceAndTheNextSessionRecallsIt() throws Exception {
        Path history = dir.resolve("history");
        try (TerminalHarness t = session(history)) {
            t.type("let kept = \"first session\"\n");
            t.awaitText("contour 2> ");
            // Still inside the session: nothing waits for a clean exit before writing.
            assertTrue(Files.readString(history).contains("let kept = \"first session\""), Files.readString(history));
            t.type(" show kept\n");
            t.awaitText("first session\n");
            assertTrue(Files.readString(history).contains("show kept"), "lines opening with a space are kept too");
            assertEquals(0, t.finish());
        }
        try (TerminalHarness t = session(history)) {
            t.awaitText("contour 1> ");
            t.type(PREVIOUS + PREVIOUS + "\n");
            t.awaitText("contour 2> ");
            t.type(PREVIOUS + PREVIOUS + "\n");
            t.awaitText("contour 3> ");
            // The recalled definition ran again, then the recalled 'show' printed its value.
            String screen = t.await(s -> s.indexOf("first session\n", s.indexOf("contour 2> ")) > 0, "the recalled show");
            assertTrue(screen.contains("contour 2> "), screen);
            t.finish();
        }
    }

    @Test
    void anInteractiveSessionWithErrorsAndFailedChecksEndsWithStatusZeroOnCtrlD() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("show nope\n");
            t.awaitText("unknown name 'nope'");
            t.type("check 1 == 2\n");
            t.awaitText("FAILED");
            assertEquals(0, t.finish());
        }
        // the same inputs piped: the status reports them
        assertEquals(2, StreamReplTest.repl("show nope\ncheck 1 == 2\n").code());
        assertEquals(1, StreamReplTest.repl("check 1 == 2\n").code());
    }

    @Test
    void tabCompletesADefinedName() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("let greeting_text = \"hello there\"\n");
            t.type("{greet\t}\n");
            t.awaitText("{greeting_text} = {\"hello there\"}\n");
            t.type(":wr\t" + dir.resolve("saved.ctr") + "\n");
            t.awaitText("wrote 1 line to ");
            assertTrue(Files.readString(dir.resolve("saved.ctr")).contains("let greeting_text = \"hello there\""));
        }
    }

    @Test
    void anOpenBracketContinuesOnTheNextLine() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("let w = \"x\"\n");
            t.type("show {w,\n");
            t.awaitText("         | "); // the continuation prompt, as wide as "contour 2> "
            t.type("w,\nw}\n");
            t.awaitText("{w, w, w} = {\"x\", \"x\", \"x\"}\n");
            t.awaitText("contour 5> ");
        }
    }

    @Test
    void aSyntaxErrorIsReportedWithLineAndColumnAndTheSessionGoesOn() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("let w = \"still here\"\n");
            t.type("let = 3\n");
            t.awaitText("<repl>:2:5: expected a name, found '='\n    let = 3\n        ^\n");
            t.type("w\n");
            t.awaitText("still here\n");
            assertEquals(0, t.finish(), "on a terminal the error was shown and the session went on");
        }
    }

    @Test
    void ctrlCWhileTypingDropsTheUnfinishedInput() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("show {\"dropped\",\n");
            t.awaitText(" | ");
            t.raise(Terminal.Signal.INT);
            // A fresh prompt, with the same number: the half-typed input was not counted.
            t.await(s -> s.indexOf("contour 1> ") != s.lastIndexOf("contour 1> "), "a second 'contour 1> ' prompt");
            t.type("show \"next\"\n");
            t.awaitText("next\n");
            assertTrue(!t.screen().contains("dropped\"}"), t.screen());
            assertEquals(0, t.finish());
        }
    }

    @Test
    void ctrlCStopsALongComputationAndTheSessionKeepsItsEarlierState() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("vars s, t\nlet kept = s + t\n");
            t.awaitText("contour 3> ");
            // Hours of work if left alone: a million expansions of a 20th power.
            t.type("let kept = 0; for i in 1..1000000 { let z = (s + i*t)^20 }\n");
            t.awaitText("for i in 1..1000000 { let z = (s + i*t)^20 }\n");
            while (!t.screen().contains("interrupted\n")) {
                t.raise(Terminal.Signal.INT); // again, in case the first came before the work began
                Thread.sleep(100);
            }
            t.awaitText("interrupted\n");
            t.awaitText("contour 4> ");
            t.type("show kept\n");
            t.awaitText("kept = s + t\n");
            t.type("z\n");
            t.awaitText("unknown name 'z'");
            t.type(":end\n");
            assertEquals(0, t.finish(), "an interactive session ends normally whatever errors it showed");
        }
    }

    @Test
    void ctrlCDuringAShowNeedsNoRestoring() throws Exception {
        try (TerminalHarness t = session(null)) {
            t.type("vars s, t\nlet kept = s + t\n");
            t.awaitText("contour 3> ");
            t.type("show sum i in 1..1000000 : (s + i*t)^20\n");
            t.awaitText("(s + i*t)^20\n");
            while (!t.screen().contains("interrupted\n")) {
                t.raise(Terminal.Signal.INT);
                Thread.sleep(100);
            }
            t.awaitText("contour 4> ");
            t.type("kept^2\n");
            t.awaitText("kept^2 = s^2 + 2*s*t + t^2\n");
            assertFalse(t.screen().contains("restoring"), t.screen());
            assertEquals(0, t.finish());
        }
    }
}
