package dev.contour.print;

/**
 * A strict recognizer for JSON text (RFC 8259 grammar), so tests can check that every JSON line
 * Contour prints is well formed without a JSON library. Throws IllegalArgumentException naming
 * the offset of the first error.
 */
public final class JsonSyntax {
    private final String s;
    private int i;

    private JsonSyntax(String s) {
        this.s = s;
    }

    /** Checks that the text is exactly one JSON value (surrounding white space allowed). */
    public static void check(String text) {
        JsonSyntax p = new JsonSyntax(text);
        p.space();
        p.value();
        p.space();
        if (p.i != text.length()) {
            throw p.error("text after the value");
        }
    }

    private void value() {
        if (i >= s.length()) {
            throw error("a value");
        }
        char c = s.charAt(i);
        switch (c) {
            case '{' -> object();
            case '[' -> array();
            case '"' -> string();
            case 't' -> literal("true");
            case 'f' -> literal("false");
            case 'n' -> literal("null");
            default -> number();
        }
    }

    private void object() {
        sequence('}', () -> {
            string();
            space();
            expect(':');
            space();
            value();
        });
    }

    private void array() {
        sequence(']', this::value);
    }

    /** After the opening bracket: elements separated by commas up to the closing one (none allowed). */
    private void sequence(char close, Runnable element) {
        i++;
        space();
        if (peek(close)) {
            i++;
            return;
        }
        while (true) {
            space();
            element.run();
            space();
            if (peek(',')) {
                i++;
            } else {
                expect(close);
                return;
            }
        }
    }

    private void string() {
        expect('"');
        while (i < s.length() && s.charAt(i) != '"') {
            char c = s.charAt(i++);
            if (c < 0x20) {
                throw error("an escaped control character");
            }
            if (c == '\\') {
                if (i >= s.length()) {
                    throw error("an escape");
                }
                char e = s.charAt(i++);
                if (e == 'u') {
                    for (int k = 0; k < 4; k++, i++) {
                        if (i >= s.length() || Character.digit(s.charAt(i), 16) < 0) {
                            throw error("four hex digits");
                        }
                    }
                } else if ("\"\\/bfnrt".indexOf(e) < 0) {
                    throw error("a valid escape");
                }
            }
        }
        expect('"');
    }

    private void number() {
        int start = i;
        if (peek('-')) {
            i++;
        }
        if (peek('0')) {
            i++;
        } else {
            digits();
        }
        if (peek('.')) {
            i++;
            digits();
        }
        if (peek('e') || peek('E')) {
            i++;
            if (peek('+') || peek('-')) {
                i++;
            }
            digits();
        }
        if (i == start) {
            throw error("a value");
        }
    }

    private void digits() {
        int start = i;
        while (i < s.length() && Character.isDigit(s.charAt(i))) {
            i++;
        }
        if (i == start) {
            throw error("a digit");
        }
    }

    private void literal(String word) {
        if (!s.startsWith(word, i)) {
            throw error(word);
        }
        i += word.length();
    }

    private void space() {
        while (i < s.length() && " \t\n\r".indexOf(s.charAt(i)) >= 0) {
            i++;
        }
    }

    private boolean peek(char c) {
        return i < s.length() && s.charAt(i) == c;
    }

    private void expect(char c) {
        if (!peek(c)) {
            throw error("'" + c + "'");
        }
        i++;
    }

    private IllegalArgumentException error(String wanted) {
        return new IllegalArgumentException("expected " + wanted + " at offset " + i + " of " + s);
    }
}
