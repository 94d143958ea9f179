package dev.contour.eval;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;

/**
 * The definitions of a session in the order they happened, re-emitted as script text. A
 * {@code let} that a later {@code let} of the same name replaces is dropped, unless a definition
 * in between (a function, a family, a library) may have read it.
 */
final class SessionLog {
    enum Kind { VARS, LET, OTHER }

    /** One definition; the text is rendered only when the script is asked for (values can be large). */
    private record Entry(Kind kind, String name, Supplier<String> text) { }

    private final List<Entry> entries = new ArrayList<>();

    void add(Kind kind, String name, String text) {
        entries.add(new Entry(kind, name, () -> text));
    }

    void addLazily(Kind kind, String name, Supplier<String> text) {
        entries.add(new Entry(kind, name, text));
    }

    String asScript() {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < entries.size(); i++) {
            Entry e = entries.get(i);
            if (e.kind() == Kind.LET && supersededLater(i)) {
                continue;
            }
            out.append(e.text().get()).append('\n');
        }
        return out.toString();
    }

    private boolean supersededLater(int i) {
        String name = entries.get(i).name();
        for (int j = i + 1; j < entries.size(); j++) {
            Entry e = entries.get(j);
            if (e.kind() == Kind.OTHER) {
                return false;
            }
            if (e.kind() == Kind.LET && e.name().equals(name)) {
                return true;
            }
        }
        return false;
    }
}
