package dev.contour.repl;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.Set;

/**
 * Decides whether REPL input is finished or continues on the next line: it continues while a
 * bracket {@code ( [ {} is open or while the last token is an operator or a word that needs
 * something after it.
 *
 * <p>A light scan, not a parse: it skips strings and {@code #} comments so that brackets inside
 * them do not count. Anything odd (a stray closing bracket, a string left open) counts as
 * finished, so the parser reports it instead of the prompt waiting forever.
 */
final class InputCompleteness {
    /** Words after which an expression or statement cannot end. */
    private static final Set<String> DANGLING_WORDS =
            Set.of("at", "with", "step", "in", "becomes", "when", "normalized", "for", "sum", "solve",
                    "let", "def", "vars", "unknown", "use", "show", "check", "rule", "derive", "using", "within", "by");

    private InputCompleteness() { }

    /** Whether {@code text} needs more lines before it can be run. */
    static boolean needsMore(String text) {
        Deque<Character> open = new ArrayDeque<>();
        String last = "";
        int i = 0;
        int n = text.length();
        while (i < n) {
            char c = text.charAt(i);
            if (c == '#') {
                while (i < n && text.charAt(i) != '\n') {
                    i++;
                }
            } else if (c == '"') {
                int end = closingQuote(text, i);
                if (end < 0) {
                    return false; // a string left open on its line: the parser says so
                }
                last = "\"";
                i = end + 1;
            } else if (Character.isWhitespace(c)) {
                i++;
            } else if (isWordChar(c)) {
                int start = i;
                while (i < n && isWordChar(text.charAt(i))) {
                    i++;
                }
                last = text.substring(start, i);
            } else {
                if (c == '(' || c == '[' || c == '{') {
                    open.push(c);
                } else if (c == ')' || c == ']' || c == '}') {
                    if (open.isEmpty() || open.pop() != opener(c)) {
                        return false; // unbalanced: let the parser point at it
                    }
                }
                last = text.startsWith("..", i) ? ".." : String.valueOf(c);
                i += last.length();
            }
        }
        return !open.isEmpty() || dangles(last);
    }

    private static boolean dangles(String last) {
        if (last.isEmpty()) {
            return false;
        }
        if (DANGLING_WORDS.contains(last) || last.equals("..")) {
            return true;
        }
        return last.length() == 1 && "+-*/^,=<>:".indexOf(last.charAt(0)) >= 0;
    }

    /** The index of the quote that closes the string opening at {@code from}, or -1 if it stays open on its line. */
    private static int closingQuote(String text, int from) {
        for (int i = from + 1; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\\') {
                i++;
            } else if (c == '"') {
                return i;
            } else if (c == '\n' || c == '\r') {
                return -1;
            }
        }
        return -1;
    }

    private static char opener(char closer) {
        return closer == ')' ? '(' : closer == ']' ? '[' : '{';
    }

    static boolean isWordChar(char c) {
        return c == '_' || Character.isLetterOrDigit(c) && c < 128;
    }
}
