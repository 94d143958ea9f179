package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The REPL section of docs/language.md is executable: each {@code repl} transcript is typed into a
 * session (the lines after a prompt) and must print the rest, and every prompt must show the
 * session's line number.
 */
class ReplReferenceTest {
    private static final Path DOC = Path.of("docs", "language.md");
    private static final Pattern TRANSCRIPT = Pattern.compile("```repl\\n(.*?)```\\n", Pattern.DOTALL);
    private static final Pattern PROMPT = Pattern.compile("contour (\\d+)> (.*)");
    private static final Pattern CONTINUATION = Pattern.compile(" +\\| (.*)");

    @Test
    void everyTranscriptTypesInAndPrintsItsOutput() throws Exception {
        Matcher m = TRANSCRIPT.matcher(Files.readString(DOC, StandardCharsets.UTF_8));
        List<String> transcripts = new ArrayList<>();
        while (m.find()) {
            transcripts.add(m.group(1));
        }
        assertFalse(transcripts.isEmpty(), "the reference shows a REPL transcript");
        for (String t : transcripts) {
            StringBuilder typed = new StringBuilder();
            StringBuilder printed = new StringBuilder();
            int line = 1;
            for (String l : t.split("\n", -1)) {
                Matcher p = PROMPT.matcher(l);
                Matcher c = CONTINUATION.matcher(l);
                if (p.matches()) {
                    assertEquals(line, Integer.parseInt(p.group(1)), "the prompt's number in: " + l);
                    typed.append(p.group(2)).append('\n');
                    line++;
                } else if (c.matches()) {
                    typed.append(c.group(1)).append('\n');
                    line++;
                } else if (!l.isEmpty()) {
                    printed.append(l).append('\n');
                }
            }
            ByteArrayOutputStream screen = new ByteArrayOutputStream();
            PrintStream both = new PrintStream(screen, true, StandardCharsets.UTF_8);
            Repl.onStreams(new ByteArrayInputStream(typed.toString().getBytes(StandardCharsets.UTF_8)), both, both,
                    ReplSettings.plain(), s -> { });
            assertEquals(printed.toString(), screen.toString(StandardCharsets.UTF_8));
        }
    }
}
