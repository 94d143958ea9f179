package dev.contour.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What one tuple of a sweep produced: the tuple, how it ended, the values it showed (by the
 * {@code show} statement's label), its full printed output, its wall time and peak heap.
 *
 * @param tuple   index name to value, in the index set's order
 * @param status  how the run ended
 * @param error   for {@link Status#ERROR} the located message (file:line:column, line, caret); else null
 * @param shown   the shown values in the order they printed
 * @param output  everything the script printed, as {@code contour run} prints it
 * @param millis  wall time of the tuple's run in milliseconds
 * @param peakHeapBytes the largest heap in use during the run (all heap pools' peaks summed), or -1
 * @param libraries every library file the run loaded with {@code use} (absolute path) with the SHA-256
 *                of the text it read; a record whose library has changed since is stale
 */
record SweepRecord(Map<String, Long> tuple, Status status, String error, List<Shown> shown, String output,
                   int checksPassed, int checksFailed, long millis, long peakHeapBytes, Map<String, String> libraries) {
    SweepRecord {
        tuple = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(tuple));
        libraries = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(libraries));
        shown = List.copyOf(shown);
        output = output == null ? "" : output;
    }

    /** How a tuple's run ended. */
    enum Status {
        OK("ok"), CHECK_FAILED("check failed"), ERROR("error");

        final String word;

        Status(String word) {
            this.word = word;
        }

        static Status of(String word) {
            for (Status s : values()) {
                if (s.word.equals(word)) {
                    return s;
                }
            }
            return null;
        }
    }

    /** One shown value: the statement's label and the value's plain text and LaTeX. */
    record Shown(String label, String value, String latex) { }

    /** The tuple as {@code p = 3, q = 1}. */
    static String describe(Map<String, Long> tuple) {
        StringBuilder out = new StringBuilder();
        tuple.forEach((k, v) -> out.append(out.length() == 0 ? "" : ", ").append(k).append(" = ").append(v));
        return out.toString();
    }

    /** The LaTeX of the first shown value with this label, or null. */
    String shownLatex(String label) {
        for (Shown s : shown) {
            if (s.label().equals(label)) {
                return s.latex();
            }
        }
        return null;
    }

    /** The first shown value with this label, or null. */
    String shownValue(String label) {
        for (Shown s : shown) {
            if (s.label().equals(label)) {
                return s.value();
            }
        }
        return null;
    }

    /** The record as one JSON line (no line break). */
    String toJson() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("tuple", tuple);
        m.put("status", status.word);
        if (error != null) {
            m.put("error", error);
        }
        List<Object> s = new ArrayList<>();
        for (Shown x : shown) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("label", x.label());
            one.put("value", x.value());
            one.put("latex", x.latex());
            s.add(one);
        }
        m.put("shown", s);
        m.put("checks_passed", checksPassed);
        m.put("checks_failed", checksFailed);
        m.put("millis", millis);
        m.put("peak_heap_bytes", peakHeapBytes);
        m.put("output", output);
        m.put("libraries", new LinkedHashMap<String, Object>(libraries));
        return Json.write(m);
    }

    /** A record read back; a field that is absent or of the wrong kind is {@link Json.Malformed}. */
    static SweepRecord fromJson(String line) throws Json.Malformed {
        Object v = Json.read(line);
        if (!(v instanceof Map<?, ?> m)) {
            throw new Json.Malformed("a record is a JSON object", 1);
        }
        Map<String, Long> tuple = new LinkedHashMap<>();
        if (!(m.get("tuple") instanceof Map<?, ?> t) || t.isEmpty()) {
            throw new Json.Malformed("the record has no \"tuple\" object", 1);
        }
        for (Map.Entry<?, ?> e : t.entrySet()) {
            if (!(e.getValue() instanceof Long n)) {
                throw new Json.Malformed("tuple value of '" + e.getKey() + "' is not an integer", 1);
            }
            tuple.put((String) e.getKey(), n);
        }
        Status status = m.get("status") instanceof String w ? Status.of(w) : null;
        if (status == null) {
            throw new Json.Malformed("the record's \"status\" is not ok, check failed or error", 1);
        }
        String error = m.get("error") instanceof String e ? e : null;
        if (status == Status.ERROR && error == null) {
            throw new Json.Malformed("an error record has no \"error\" text", 1);
        }
        List<Shown> shown = new ArrayList<>();
        if (!(m.get("shown") instanceof List<?> list)) {
            throw new Json.Malformed("the record has no \"shown\" list", 1);
        }
        for (Object o : list) {
            if (!(o instanceof Map<?, ?> one) || !(one.get("label") instanceof String l) || !(one.get("value") instanceof String val)
                    || !(one.get("latex") instanceof String tex)) {
                throw new Json.Malformed("a \"shown\" item needs \"label\", \"value\" and \"latex\" strings", 1);
            }
            shown.add(new Shown(l, val, tex));
        }
        Map<String, String> libraries = new LinkedHashMap<>();
        if (m.containsKey("libraries")) {
            if (!(m.get("libraries") instanceof Map<?, ?> lib)) {
                throw new Json.Malformed("the record's \"libraries\" is not an object of file digests", 1);
            }
            for (Map.Entry<?, ?> e : lib.entrySet()) {
                if (!(e.getValue() instanceof String digest)) {
                    throw new Json.Malformed("the digest of library '" + e.getKey() + "' is not a string", 1);
                }
                libraries.put((String) e.getKey(), digest);
            }
        }
        return new SweepRecord(tuple, status, error, shown, m.get("output") instanceof String o ? o : "",
                (int) integer(m, "checks_passed"), (int) integer(m, "checks_failed"),
                integer(m, "millis"), integer(m, "peak_heap_bytes"), libraries);
    }

    private static long integer(Map<?, ?> m, String key) throws Json.Malformed {
        if (!(m.get(key) instanceof Long n)) {
            throw new Json.Malformed("the record's \"" + key + "\" is not an integer", 1);
        }
        return n;
    }
}
