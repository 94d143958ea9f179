package dev.contour.report;

import java.util.ArrayList;
import java.util.List;

/**
 * Breaks long LaTeX displays across lines by itself (no breqn, which stock installations lack): a
 * sum is cut at its top-level {@code +} and {@code -} signs into rows of an {@code align*}
 * environment, which may also break across pages; a single term too wide for a line is scaled to
 * the line's width. Rows of an {@code aligned} block (a solution, a collected expression) are
 * kept and broken the same way after their last alignment point.
 */
final class LatexLines {
    private LatexLines() { }

    /** The most visible characters on one displayed row (a rough measure: commands and braces do not count). */
    static final int ROW = 62;

    /** The display for one shown value's LaTeX. */
    static String display(String latex) {
        String body = latex.strip();
        if (body.startsWith("\\begin{aligned}") && body.endsWith("\\end{aligned}")) {
            String inner = body.substring("\\begin{aligned}".length(), body.length() - "\\end{aligned}".length());
            StringBuilder out = new StringBuilder("\\begin{align*}\n");
            for (String row : inner.split("\\\\\\\\")) {
                if (row.isBlank()) {
                    continue;
                }
                row = row.strip();
                int last = lastAlignment(row);
                String head = row.substring(0, last + 1);
                String tail = row.substring(last + 1);
                List<String> rows = rows(tail);
                String continuation = head.replaceAll("[^&]", "") + "\\quad ";
                for (int i = 0; i < rows.size(); i++) {
                    out.append(i == 0 ? head : continuation).append(rows.get(i)).append(" \\\\\n");
                }
            }
            return out.append("\\end{align*}\n").toString();
        }
        List<String> rows = rows(body);
        if (rows.size() == 1 && width(body) > ROW) {
            rows = bracketRows(body);
        }
        StringBuilder out = new StringBuilder();
        boolean open = false;
        for (int i = 0; i < rows.size(); i++) {
            String r = rows.get(i);
            if (width(r) > ROW + 8) {
                if (open) {
                    out.append("\\end{align*}\n");
                    open = false;
                }
                out.append("\\par\\noindent\\resizebox{\\linewidth}{!}{$\\displaystyle ").append(i == 0 ? "" : "\\quad ")
                        .append(r).append("$}\\par\n");
                continue;
            }
            if (!open) {
                out.append("\\begin{align*}\n");
                open = true;
            }
            out.append(i == 0 ? "& " : "&\\quad ").append(r).append(" \\\\\n");
        }
        if (open) {
            out.append("\\end{align*}\n");
        }
        return out.toString();
    }

    /**
     * A product ending in a bracketed sum, {@code C\\,\\left(a + b + ...\\right)} (a common factor
     * pulled out), cut inside the bracket: the rows open with {@code \\Bigl(} and close with
     * {@code \\Bigr)}, which, unlike \\left and \\right, may stand on different rows.
     */
    static List<String> bracketRows(String text) {
        if (!text.endsWith("\\right)")) {
            return List.of(text);
        }
        int depth = 0;
        int open = -1;
        for (int i = text.length() - "\\right)".length() - 1; i >= 0; i--) {
            if (text.startsWith("\\right", i) && !text.startsWith("\\rightarrow", i)) {
                depth++;
            } else if (text.startsWith("\\left", i) && !text.startsWith("\\leftarrow", i)) {
                if (depth == 0) {
                    open = i;
                    break;
                }
                depth--;
            }
        }
        if (open < 0 || !text.startsWith("\\left(", open)) {
            return List.of(text);
        }
        String prefix = text.substring(0, open);
        List<String> inner = rows(text.substring(open + "\\left(".length(), text.length() - "\\right)".length()));
        List<String> out = new ArrayList<>();
        for (int i = 0; i < inner.size(); i++) {
            out.add((i == 0 ? prefix + "\\Bigl(" : "") + inner.get(i) + (i == inner.size() - 1 ? "\\Bigr)" : ""));
        }
        return out;
    }

    /** The text cut at top-level signs into rows of at most {@link #ROW} visible characters where possible. */
    static List<String> rows(String text) {
        List<String> terms = terms(text);
        List<String> rows = new ArrayList<>();
        StringBuilder row = new StringBuilder();
        for (String t : terms) {
            if (row.length() > 0 && width(row.toString()) + width(t) > ROW) {
                rows.add(row.toString().strip());
                row.setLength(0);
            }
            row.append(t);
        }
        if (row.length() > 0 || rows.isEmpty()) {
            rows.add(row.toString().strip());
        }
        return rows;
    }

    /** The text split before each sign at brace depth 0 and outside \left ... \right pairs. */
    static List<String> terms(String text) {
        List<String> out = new ArrayList<>();
        int depth = 0;
        int start = 0;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\\' && text.startsWith("\\left", i) && !text.startsWith("\\leftarrow", i)) {
                depth++;
                i += 4;
            } else if (c == '\\' && text.startsWith("\\right", i) && !text.startsWith("\\rightarrow", i)) {
                depth--;
                i += 5;
            } else if (c == '\\') {
                i++; // an escaped character such as \{ or \, never counts
            } else if (c == '{') {
                depth++;
            } else if (c == '}') {
                depth--;
            } else if ((c == '+' || c == '-') && depth == 0 && i > 0 && text.charAt(i - 1) == ' ' && i > start) {
                out.add(text.substring(start, i));
                start = i;
            }
        }
        out.add(text.substring(start));
        return out;
    }

    /**
     * A rough measure of the printed width in characters: letters, digits and signs count one, a
     * fraction counts its wider part, exponents count half, spacing commands and braces nothing.
     */
    static int width(String latex) {
        return (int) Math.ceil(measure(latex, new int[] {0}, false));
    }

    private static double measure(String t, int[] at, boolean group) {
        double n = 0;
        while (at[0] < t.length()) {
            char c = t.charAt(at[0]);
            if (c == '}' && group) {
                at[0]++;
                return n;
            }
            if (c == '{') {
                at[0]++;
                n += measure(t, at, true);
            } else if (c == '^' || c == '_') {
                at[0]++;
                if (at[0] < t.length() && t.charAt(at[0]) == '{') {
                    at[0]++;
                    n += 0.6 * measure(t, at, true);
                } else {
                    at[0]++;
                    n += 0.6;
                }
            } else if (c == '\\') {
                int e = at[0] + 1;
                while (e < t.length() && Character.isLetter(t.charAt(e))) {
                    e++;
                }
                String command = e == at[0] + 1 ? t.substring(at[0] + 1, Math.min(t.length(), e + 1)) : t.substring(at[0] + 1, e);
                at[0] = e == at[0] + 1 ? e + 1 : e;
                switch (command) {
                    case "frac" -> {
                        double top = 0;
                        double bottom = 0;
                        if (at[0] < t.length() && t.charAt(at[0]) == '{') {
                            at[0]++;
                            top = measure(t, at, true);
                        }
                        if (at[0] < t.length() && t.charAt(at[0]) == '{') {
                            at[0]++;
                            bottom = measure(t, at, true);
                        }
                        n += Math.max(top, bottom) + 0.5;
                    }
                    case "left", "right" -> {
                        n += 0.6;
                        at[0]++; // the delimiter
                    }
                    case ",", "!", ";", ":" -> n += 0.2;
                    case "quad" -> n += 1.5;
                    case "text", "mathrm" -> { }
                    default -> n += 1;
                }
            } else {
                if (c != ' ' && c != '&') {
                    n += 1;
                }
                at[0]++;
            }
        }
        return n;
    }

    private static int lastAlignment(String row) {
        int depth = 0;
        int last = -1;
        for (int i = 0; i < row.length(); i++) {
            char c = row.charAt(i);
            if (c == '\\') {
                i++;
            } else if (c == '{') {
                depth++;
            } else if (c == '}') {
                depth--;
            } else if (c == '&' && depth == 0) {
                last = i;
            }
        }
        return last;
    }
}
