package dev.contour;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** Progress reports: in place on a terminal, plain rare lines elsewhere, shared by nested work, silent once stopped. */
class ProgressLineTest {
    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    private final PrintStream stream = new PrintStream(bytes, true, StandardCharsets.UTF_8);

    private String shown() {
        return bytes.toString(StandardCharsets.UTF_8);
    }

    @Test
    void onATerminalTheLineIsRedrawnInPlaceAndErasedAtTheEnd() {
        ProgressLine p = new ProgressLine(stream, ProgressLine.Style.TERMINAL, 0, 0);
        p.update(() -> "step 0.4, 100 evaluations");
        p.update(() -> "step 0.2");
        p.close();
        // The shorter second line pads over the first; the end erases the widest line and returns.
        assertEquals("\rstep 0.4, 100 evaluations" + "\rstep 0.2" + " ".repeat(17)
                + "\r" + " ".repeat(25) + "\r", shown());
    }

    @Test
    void elsewhereReportsArePlainLinesAtALowRate() {
        ProgressLine p = new ProgressLine(stream, ProgressLine.Style.LINES, 0, 60_000_000_000L);
        for (int i = 0; i < 1000; i++) {
            int k = i;
            p.update(() -> "for k = " + k);
        }
        p.close();
        assertEquals("for k = 0\n", shown(), "one line per interval, no carriage return, nothing to erase");
    }

    @Test
    void nothingIsShownBeforeTheWorkHasRunAWhile() {
        ProgressLine p = new ProgressLine(stream, ProgressLine.Style.TERMINAL);
        p.update(() -> "should not appear");
        p.close();
        assertEquals("", shown());
        ProgressLine lines = new ProgressLine(stream, ProgressLine.Style.LINES);
        lines.update(() -> "should not appear either");
        lines.close();
        assertEquals("", shown());
    }

    @Test
    void nestedReportsShareOneLineOutermostFirst() {
        ProgressLine loop = new ProgressLine(stream, ProgressLine.Style.LINES, 0, 0);
        loop.update(() -> "for p = 4 (2 of 9)");
        bytes.reset();
        ProgressLine solve = new ProgressLine(stream, ProgressLine.Style.LINES, 0, 0);
        solve.update(() -> "solve: 1.0 s, 120 distinct equations");
        solve.close();
        loop.update(() -> "for p = 5 (3 of 9)");
        loop.close();
        assertEquals("for p = 4 (2 of 9) | solve: 1.0 s, 120 distinct equations\nfor p = 5 (3 of 9)\n", shown());
    }

    @Test
    void aReportFallsSilentOnceItsWorkIsAskedToStop() {
        Cancellation.Token token = Cancellation.Token.manual();
        Cancellation.run(token, () -> {
            ProgressLine p = new ProgressLine(stream, ProgressLine.Style.TERMINAL, 0, 0);
            p.update(() -> "working");
            token.cancel("interrupted");
            p.update(() -> "still working?");
            p.close();
        });
        assertEquals("\rworking\r       \r", shown(), "after the stop only the erasing is written");
        assertFalse(shown().contains("still"));
    }

    @Test
    void aStreamOtherThanATerminalGetsPlainLines() {
        assertEquals(ProgressLine.Style.LINES, ProgressLine.styleFor(stream));
        assertEquals(ProgressLine.standardErrorIsTerminal() ? ProgressLine.Style.TERMINAL : ProgressLine.Style.LINES,
                ProgressLine.styleFor(System.err));
    }
}
