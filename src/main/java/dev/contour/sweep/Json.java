package dev.contour.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The small JSON subset sweep files use: objects (insertion-ordered maps), arrays, strings,
 * integers, booleans and null. Reading reports the first offending column, so a damaged record
 * is named rather than skipped.
 */
final class Json {
    private Json() { }

    /** A JSON text that does not parse, with the 1-based column where reading stopped. */
    static final class Malformed extends Exception {
        final int column;

        Malformed(String message, int column) {
            super(message);
            this.column = column;
        }
    }

    /** The JSON form of a string, quotes included (the printers' one escaping). */
    static String quote(String s) {
        return dev.contour.print.JsonPrinter.string(s);
    }

    /** Writes a value built of maps, lists, strings, numbers, booleans and null on one line. */
    static String write(Object v) {
        StringBuilder out = new StringBuilder();
        write(v, out);
        return out.toString();
    }

    private static void write(Object v, StringBuilder out) {
        if (v == null) {
            out.append("null");
        } else if (v instanceof String s) {
            out.append(quote(s));
        } else if (v instanceof Number || v instanceof Boolean) {
            out.append(v);
        } else if (v instanceof Map<?, ?> m) {
            out.append('{');
            boolean first = true;
            for (Map.Entry<?, ?> e : m.entrySet()) {
                if (!first) {
                    out.append(',');
                }
                first = false;
                out.append(quote(String.valueOf(e.getKey()))).append(':');
                write(e.getValue(), out);
            }
            out.append('}');
        } else if (v instanceof List<?> l) {
            out.append('[');
            for (int i = 0; i < l.size(); i++) {
                if (i > 0) {
                    out.append(',');
                }
                write(l.get(i), out);
            }
            out.append(']');
        } else {
            throw new IllegalArgumentException("not a JSON value: " + v.getClass());
        }
    }

    /** Reads one JSON value filling the whole text (white space aside). */
    static Object read(String text) throws Malformed {
        Json.Reader r = new Json.Reader(text);
        r.space();
        Object v = r.value();
        r.space();
        if (r.at < text.length()) {
            throw new Malformed("unexpected text after the value", r.at + 1);
        }
        return v;
    }

    private static final class Reader {
        private final String s;
        private int at;

        Reader(String s) {
            this.s = s;
        }

        void space() {
            while (at < s.length() && Character.isWhitespace(s.charAt(at))) {
                at++;
            }
        }

        Malformed fail(String what) {
            return new Malformed(at >= s.length() ? "the text ends where " + what + " should be" : "expected " + what, at + 1);
        }

        Object value() throws Malformed {
            if (at >= s.length()) {
                throw fail("a value");
            }
            char c = s.charAt(at);
            if (c == '{') {
                return object();
            }
            if (c == '[') {
                return array();
            }
            if (c == '"') {
                return string();
            }
            if (c == '-' || (c >= '0' && c <= '9')) {
                return number();
            }
            for (String word : new String[] {"true", "false", "null"}) {
                if (s.startsWith(word, at)) {
                    at += word.length();
                    return word.equals("null") ? null : Boolean.valueOf(word);
                }
            }
            throw fail("a value");
        }

        private Map<String, Object> object() throws Malformed {
            Map<String, Object> m = new LinkedHashMap<>();
            at++;
            space();
            if (at < s.length() && s.charAt(at) == '}') {
                at++;
                return m;
            }
            while (true) {
                space();
                if (at >= s.length() || s.charAt(at) != '"') {
                    throw fail("a quoted key");
                }
                String key = string();
                space();
                expect(':');
                space();
                m.put(key, value());
                space();
                if (at < s.length() && s.charAt(at) == ',') {
                    at++;
                    continue;
                }
                expect('}');
                return m;
            }
        }

        private List<Object> array() throws Malformed {
            List<Object> l = new ArrayList<>();
            at++;
            space();
            if (at < s.length() && s.charAt(at) == ']') {
                at++;
                return l;
            }
            while (true) {
                space();
                l.add(value());
                space();
                if (at < s.length() && s.charAt(at) == ',') {
                    at++;
                    continue;
                }
                expect(']');
                return l;
            }
        }

        private void expect(char c) throws Malformed {
            if (at >= s.length() || s.charAt(at) != c) {
                throw fail("'" + c + "'");
            }
            at++;
        }

        private String string() throws Malformed {
            at++;
            StringBuilder out = new StringBuilder();
            while (at < s.length()) {
                char c = s.charAt(at++);
                if (c == '"') {
                    return out.toString();
                }
                if (c != '\\') {
                    out.append(c);
                    continue;
                }
                if (at >= s.length()) {
                    break;
                }
                char e = s.charAt(at++);
                switch (e) {
                    case 'n' -> out.append('\n');
                    case 'r' -> out.append('\r');
                    case 't' -> out.append('\t');
                    case 'b' -> out.append('\b');
                    case 'f' -> out.append('\f');
                    case '/', '"', '\\' -> out.append(e);
                    case 'u' -> {
                        if (at + 4 > s.length()) {
                            throw fail("four hex digits");
                        }
                        try {
                            out.append((char) Integer.parseInt(s.substring(at, at + 4), 16));
                        } catch (NumberFormatException x) {
                            throw fail("four hex digits");
                        }
                        at += 4;
                    }
                    default -> {
                        at--;
                        throw fail("an escape (\\n, \\\", \\\\, \\uXXXX)");
                    }
                }
            }
            throw fail("a closing quote");
        }

        private Long number() throws Malformed {
            int start = at;
            if (s.charAt(at) == '-') {
                at++;
            }
            while (at < s.length() && Character.isDigit(s.charAt(at))) {
                at++;
            }
            try {
                return Long.parseLong(s.substring(start, at));
            } catch (NumberFormatException x) {
                at = start;
                throw fail("an integer");
            }
        }
    }
}
