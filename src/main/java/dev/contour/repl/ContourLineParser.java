package dev.contour.repl;

import java.util.ArrayList;
import java.util.List;
import org.jline.reader.CompletingParsedLine;
import org.jline.reader.EOFError;
import org.jline.reader.ParsedLine;
import org.jline.reader.Parser;

/**
 * The JLine side of Contour input: Enter on an unfinished input (see {@link InputCompleteness})
 * opens a continuation line instead of running it, and words for completion are the language's
 * names, so {@code f(x} completes {@code x}.
 */
final class ContourLineParser implements Parser {
    @Override
    public ParsedLine parse(String line, int cursor, ParseContext context) {
        if (context == ParseContext.ACCEPT_LINE && !Session.isCommand(line) && InputCompleteness.needsMore(line)) {
            throw new EOFError(-1, cursor, "the input continues");
        }
        return Words.of(line, cursor);
    }

    /**
     * A line cut into words: names and numbers in code, whitespace-separated words in a
     * {@code :command}. The word under the cursor may be empty (after an operator, say).
     */
    record Words(String line, int cursor, List<String> words, int wordIndex, int wordCursor)
            implements CompletingParsedLine {
        static Words of(String line, int cursor) {
            boolean command = Session.isCommand(line);
            List<String> words = new ArrayList<>();
            int index = -1;
            int inWord = 0;
            int before = 0;
            int i = 0;
            while (i < line.length()) {
                if (!partOfWord(line.charAt(i), command)) {
                    i++;
                    continue;
                }
                int start = i;
                while (i < line.length() && partOfWord(line.charAt(i), command)) {
                    i++;
                }
                if (index < 0 && cursor >= start && cursor <= i) {
                    index = words.size();
                    inWord = cursor - start;
                } else if (i < cursor) {
                    before++;
                }
                words.add(line.substring(start, i));
            }
            if (index < 0) {
                index = before;
                words.add(index, "");
            }
            return new Words(line, cursor, List.copyOf(words), index, inWord);
        }

        private static boolean partOfWord(char c, boolean command) {
            return command ? !Character.isWhitespace(c) : InputCompleteness.isWordChar(c);
        }

        @Override
        public String word() {
            return words.get(wordIndex);
        }

        @Override
        public CharSequence escape(CharSequence candidate, boolean complete) {
            return candidate;
        }

        @Override
        public int rawWordCursor() {
            return wordCursor;
        }

        @Override
        public int rawWordLength() {
            return word().length();
        }
    }
}
