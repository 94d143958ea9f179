package dev.contour.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class ProgressTest {

    @Test
    void drawsInPlaceAndErasesAtTheEnd() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        Progress p = new Progress(new PrintStream(bytes, true, StandardCharsets.UTF_8), 0, 0);
        p.update(() -> "step 0.4, 100 evaluations");
        p.update(() -> "step 0.2");
        p.finish();
        String out = bytes.toString(StandardCharsets.UTF_8);
        // The shorter second line pads over the first; the end erases the widest line and returns.
        assertEquals("\rstep 0.4, 100 evaluations" + "\rstep 0.2" + " ".repeat(17)
                + "\r" + " ".repeat(25) + "\r", out);
    }

    @Test
    void staysSilentDuringTheFirstSecond() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        Progress p = new Progress(new PrintStream(bytes, true, StandardCharsets.UTF_8));
        p.update(() -> "should not appear");
        p.finish();
        assertTrue(bytes.size() == 0, bytes::toString);
    }
}
