package dev.contour.eval;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The statements that defined a session, in the order they ran, re-emitted as script text: the
 * statements themselves, not their values, so a saved session re-runs as fast as it was built (a
 * value can be far longer than the statement that computed it). A {@code let} that a later
 * {@code let} of the same name replaces is dropped when nothing in between (nor the replacing
 * statement) mentions the name; a {@code use} keeps everything before it, since a library may read
 * any name.
 */
final class SessionLog {
    enum Kind { VARS, LET, USE, OTHER }

    /**
     * One statement as typed; {@code reads} is the part that may read names (for a {@code let},
     * what follows its {@code =}).
     */
    private record Entry(Kind kind, String name, String text, String reads) { }

    private final List<Entry> entries = new ArrayList<>();

    SessionLog() { }

    private SessionLog(List<Entry> entries) {
        this.entries.addAll(entries);
    }

    /** An independent copy (entries are immutable, so the copy shares them). */
    SessionLog copy() {
        return new SessionLog(entries);
    }

    void add(Kind kind, String name, String text) {
        String reads = text;
        if (kind == Kind.LET) {
            int eq = text.indexOf('=');
            reads = eq < 0 ? text : text.substring(eq + 1);
        }
        entries.add(new Entry(kind, name, text, reads));
    }

    String asScript() {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < entries.size(); i++) {
            Entry e = entries.get(i);
            if (e.kind() == Kind.LET && supersededLater(i)) {
                continue;
            }
            out.append(e.text()).append('\n');
        }
        return out.toString();
    }

    private boolean supersededLater(int i) {
        String name = entries.get(i).name();
        Pattern word = Pattern.compile("(?<![A-Za-z0-9_])" + Pattern.quote(name) + "(?![A-Za-z0-9_])");
        for (int j = i + 1; j < entries.size(); j++) {
            Entry e = entries.get(j);
            if (e.kind() == Kind.USE || e.kind() != Kind.VARS && word.matcher(e.reads()).find()) {
                return false;
            }
            if (e.kind() == Kind.LET && e.name().equals(name)) {
                return true;
            }
        }
        return false;
    }
}
