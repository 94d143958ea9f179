package dev.contour.sweep;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * One row per tuple: the tuple's values, its status, and the shown values chosen by their
 * {@code show} label, as plain text, CSV, JSON lines or a LaTeX tabular. Timings are columns only
 * when asked for, so two runs of the same sweep give the same table.
 */
final class SummaryTable {
    enum Format { TEXT, CSV, JSON, LATEX }

    private final List<String> names;
    private final List<String> labels;
    private final boolean timings;
    private final List<SweepRecord> rows;

    /**
     * @param columns the shown labels to print; empty: every label any record shows, in first-seen order
     * @param sortBy  a tuple name, a shown label, {@code status}, {@code millis} or {@code peak}; null keeps tuple order
     */
    SummaryTable(List<String> names, List<SweepRecord> records, List<String> columns, String sortBy, boolean descending,
                 boolean timings) {
        this.names = names;
        this.timings = timings;
        if (columns.isEmpty()) {
            Set<String> seen = new LinkedHashSet<>();
            for (SweepRecord r : records) {
                r.shown().forEach(s -> seen.add(s.label()));
            }
            this.labels = List.copyOf(seen);
        } else {
            this.labels = List.copyOf(columns);
        }
        List<SweepRecord> sorted = new ArrayList<>(records);
        if (sortBy != null) {
            Comparator<SweepRecord> order = Comparator.comparing(r -> sortKey(r, sortBy), SummaryTable::compareCells);
            sorted.sort(descending ? order.reversed() : order); // stable: ties keep tuple order
        }
        this.rows = List.copyOf(sorted);
    }

    /** Whether a column of this name exists (a tuple name, a shown label or a fixed column). */
    static boolean knowsColumn(String name, List<String> names, List<SweepRecord> records) {
        if (names.contains(name) || List.of("status", "millis", "peak").contains(name)) {
            return true;
        }
        return records.stream().anyMatch(r -> r.shownValue(name) != null);
    }

    private String sortKey(SweepRecord r, String by) {
        if (r.tuple().containsKey(by)) {
            return Long.toString(r.tuple().get(by));
        }
        return switch (by) {
            case "status" -> r.status().word;
            case "millis" -> Long.toString(r.millis());
            case "peak" -> Long.toString(r.peakHeapBytes());
            default -> r.shownValue(by);
        };
    }

    /** Integers and fractions by value, before any other text; other text by its characters; absent last. */
    private static int compareCells(String a, String b) {
        if (a == null || b == null) {
            return a == null ? (b == null ? 0 : 1) : -1;
        }
        BigInteger[] x = fraction(a);
        BigInteger[] y = fraction(b);
        if (x != null && y != null) {
            return x[0].multiply(y[1]).compareTo(y[0].multiply(x[1]));
        }
        if (x != null || y != null) {
            return x != null ? -1 : 1;
        }
        return a.compareTo(b);
    }

    private static BigInteger[] fraction(String s) {
        String t = s.replace(" ", "");
        if (!t.matches("-?\\d+(/\\d+)?")) {
            return null;
        }
        int slash = t.indexOf('/');
        BigInteger n = new BigInteger(slash < 0 ? t : t.substring(0, slash));
        BigInteger d = slash < 0 ? BigInteger.ONE : new BigInteger(t.substring(slash + 1));
        return d.signum() == 0 ? null : new BigInteger[] {n, d};
    }

    private List<String> header() {
        List<String> h = new ArrayList<>(names);
        h.add("status");
        h.addAll(labels);
        if (timings) {
            h.add("millis");
            h.add("peak MiB");
        }
        return h;
    }

    private List<String> cells(SweepRecord r) {
        List<String> c = new ArrayList<>();
        for (String n : names) {
            c.add(Long.toString(r.tuple().get(n)));
        }
        c.add(r.status().word);
        for (String l : labels) {
            String v = r.shownValue(l);
            c.add(v == null ? "" : v);
        }
        if (timings) {
            c.add(Long.toString(r.millis()));
            c.add(r.peakHeapBytes() < 0 ? "" : String.format(Locale.ROOT, "%.1f", r.peakHeapBytes() / 1048576.0));
        }
        return c;
    }

    String render(Format f) {
        return switch (f) {
            case TEXT -> text();
            case CSV -> csv();
            case JSON -> json();
            case LATEX -> latex();
        };
    }

    private String text() {
        List<List<String>> all = new ArrayList<>();
        all.add(header());
        rows.forEach(r -> all.add(cells(r)));
        int[] width = new int[all.get(0).size()];
        for (List<String> row : all) {
            for (int i = 0; i < row.size(); i++) {
                width[i] = Math.max(width[i], row.get(i).length());
            }
        }
        StringBuilder out = new StringBuilder();
        for (int k = 0; k < all.size(); k++) {
            List<String> row = all.get(k);
            StringBuilder line = new StringBuilder();
            for (int i = 0; i < row.size(); i++) {
                line.append(i == 0 ? "" : " | ").append(row.get(i)).append(" ".repeat(width[i] - row.get(i).length()));
            }
            out.append(line.toString().stripTrailing()).append('\n');
            if (k == 0) {
                StringBuilder rule = new StringBuilder();
                for (int i = 0; i < width.length; i++) {
                    rule.append(i == 0 ? "" : "-+-").append("-".repeat(width[i]));
                }
                out.append(rule).append('\n');
            }
        }
        return out.toString();
    }

    private String csv() {
        StringBuilder out = new StringBuilder();
        out.append(csvLine(header()));
        rows.forEach(r -> out.append(csvLine(cells(r))));
        return out.toString();
    }

    /** RFC 4180: a field with a comma, quote or line break is quoted, quotes doubled; lines end in CRLF. */
    private static String csvLine(List<String> cells) {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < cells.size(); i++) {
            String c = cells.get(i);
            if (i > 0) {
                out.append(',');
            }
            if (c.contains(",") || c.contains("\"") || c.contains("\n") || c.contains("\r")) {
                out.append('"').append(c.replace("\"", "\"\"")).append('"');
            } else {
                out.append(c);
            }
        }
        return out.append("\r\n").toString();
    }

    private String json() {
        StringBuilder out = new StringBuilder();
        for (SweepRecord r : rows) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("tuple", r.tuple());
            m.put("status", r.status().word);
            Map<String, Object> values = new LinkedHashMap<>();
            for (String l : labels) {
                values.put(l, r.shownValue(l));
            }
            m.put("shown", values);
            if (timings) {
                m.put("millis", r.millis());
                m.put("peak_heap_bytes", r.peakHeapBytes());
            }
            out.append(Json.write(m)).append('\n');
        }
        return out.toString();
    }

    /** Header cells as text; tuple values and shown values in math mode, as the show statement's LaTeX form prints them. */
    private String latex() {
        List<String> h = header();
        StringBuilder out = new StringBuilder("\\begin{tabular}{" + "l".repeat(h.size()) + "}\n\\hline\n");
        out.append(String.join(" & ", h.stream().map(c -> "\\texttt{" + latexEscape(c) + "}").toList())).append(" \\\\\n\\hline\n");
        for (SweepRecord r : rows) {
            List<String> c = new ArrayList<>();
            for (String n : names) {
                c.add("$" + r.tuple().get(n) + "$");
            }
            c.add(r.status().word);
            for (String l : labels) {
                String v = r.shownLatex(l);
                c.add(v == null ? "" : "$" + v + "$");
            }
            if (timings) {
                List<String> plain = cells(r);
                c.add(plain.get(plain.size() - 2));
                c.add(plain.get(plain.size() - 1));
            }
            out.append(String.join(" & ", c)).append(" \\\\\n");
        }
        return out.append("\\hline\n\\end{tabular}\n").toString();
    }

    /** Plain text safe inside {@code \texttt}: TeX's special characters written as commands. */
    static String latexEscape(String s) {
        StringBuilder out = new StringBuilder();
        for (char c : s.toCharArray()) {
            switch (c) {
                case '\\' -> out.append("\\textbackslash{}");
                case '{', '}', '$', '&', '#', '_', '%' -> out.append('\\').append(c);
                case '^' -> out.append("\\textasciicircum{}");
                case '~' -> out.append("\\textasciitilde{}");
                default -> out.append(c);
            }
        }
        return out.toString();
    }
}
