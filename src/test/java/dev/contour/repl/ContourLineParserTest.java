package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.jline.reader.EOFError;
import org.jline.reader.ParsedLine;
import org.jline.reader.Parser.ParseContext;
import org.junit.jupiter.api.Test;

class ContourLineParserTest {
    private final ContourLineParser parser = new ContourLineParser();

    @Test
    void theWordUnderTheCursorIsAName() {
        ParsedLine line = parser.parse("show f(alp", 10, ParseContext.COMPLETE);
        assertEquals("alp", line.word());
        assertEquals(3, line.wordCursor());
        assertEquals(List.of("show", "f", "alp"), line.words());
    }

    @Test
    void afterAnOperatorTheWordIsEmpty() {
        ParsedLine line = parser.parse("let a = b + ", 12, ParseContext.COMPLETE);
        assertEquals("", line.word());
        assertEquals(3, line.wordIndex());
    }

    @Test
    void inTheMiddleOfALine() {
        ParsedLine line = parser.parse("f(ab, cd)", 3, ParseContext.COMPLETE);
        assertEquals("ab", line.word());
        assertEquals(1, line.wordCursor());
    }

    @Test
    void commandsSplitAtSpaces() {
        ParsedLine line = parser.parse(":write out/a-b.ctr", 18, ParseContext.COMPLETE);
        assertEquals(List.of(":write", "out/a-b.ctr"), line.words());
        assertEquals(1, line.wordIndex());
    }

    @Test
    void enterOnAnUnfinishedInputAsksForAnotherLine() {
        assertThrows(EOFError.class, () -> parser.parse("let a = (1 +", 12, ParseContext.ACCEPT_LINE));
        assertEquals("let a = (1 + 2)", parser.parse("let a = (1 + 2)", 15, ParseContext.ACCEPT_LINE).line());
        // A command never continues, whatever it ends with.
        assertEquals(":write a+", parser.parse(":write a+", 9, ParseContext.ACCEPT_LINE).line());
    }
}
