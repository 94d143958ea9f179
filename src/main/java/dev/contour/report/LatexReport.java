package dev.contour.report;

import dev.contour.ContourException;
import dev.contour.eval.StatementEvent;
import dev.contour.lang.Stmt;
import dev.contour.picture.PictureFiles;
import dev.contour.picture.PictureValue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A derivation report: a printer that lays out a whole script run as a LaTeX document (each
 * statement with its source, each shown value typeset, each check with its verdict, pole maps as
 * figures, the times and the tool's version). It consumes the same statement results as the
 * plain, LaTeX and JSON printers ({@link StatementEvent}s). The document needs only packages of a
 * stock TeX installation (amsmath, graphicx, geometry, lmodern); long sums are broken across lines
 * by {@link LatexLines}.
 */
public final class LatexReport {
    private final Path target;
    private final String version;
    private final StringBuilder body = new StringBuilder();
    private final List<Path> figures = new ArrayList<>();
    private String source = "";
    private String fileName = "";
    private int step;
    private int held;
    private int failedChecks;
    private long totalNanos;

    /** A report to be written to {@code target} (a {@code .tex} file) by {@link #write}. */
    public LatexReport(Path target, String version) {
        String name = target.getFileName() == null ? "" : target.getFileName().toString();
        if (!name.endsWith(".tex")) {
            throw new ContourException("a report is a .tex file, not '" + target + "'");
        }
        this.target = target;
        this.version = version;
    }

    /** Starts the part of the report for one script, whose text locates each statement's source. */
    public void beginScript(String file, String text) {
        this.fileName = file;
        this.source = text;
        body.append("\\section*{").append(textOf(file)).append("}\n\n");
    }

    /** Adds one statement's result. */
    public void accept(StatementEvent e) {
        totalNanos += e.nanos();
        step++;
        Stmt s = e.statement();
        body.append("\\paragraph{Step ").append(step).append(" (line ").append(s.span().line()).append(")")
                .append(e.context().isEmpty() ? "" : " " + textOf(e.context().trim()))
                .append(".} {\\small ").append(seconds(e.nanos())).append("}\n");
        body.append(verbatim(sourceOf(s)));
        if (e.holds() != null) {
            if (e.holds()) {
                held++;
            } else {
                failedChecks++;
            }
            body.append("\\noindent Verdict: \\textbf{").append(e.holds() ? "holds" : "FAILED").append("}\n\n");
            if (!e.holds()) {
                body.append(verbatim(e.plain()));
            }
        } else if (e.shown() != null) {
            if (e.shown() instanceof PictureValue p) {
                body.append(verbatim(e.plain()));
                figure(p);
            } else if (e.latex().isBlank() || e.latex().startsWith("\\text{") || e.latex().startsWith("%")) {
                body.append(verbatim(e.plain()));
            } else {
                body.append(LatexLines.display(e.latex().strip()));
            }
        }
        body.append('\n');
    }

    /** Notes an error that stopped the script (bad input), so the report says where the run ended. */
    public void stopped(String message) {
        body.append("\\paragraph{The run stopped here.}\n").append(verbatim(message));
    }

    /** Writes the document (and its figures, already written) whole or not at all. */
    public void write() {
        StringBuilder doc = new StringBuilder();
        doc.append("% A derivation report written by contour ").append(version).append(".\n")
                .append("\\documentclass[11pt]{article}\n")
                .append("\\usepackage{amsmath}\n\\usepackage{amssymb}\n")
                .append("\\usepackage{graphicx}\n\\usepackage[margin=2cm]{geometry}\n")
                .append("\\allowdisplaybreaks\n\\setlength{\\parindent}{0pt}\n\\sloppy\n")
                .append("\\title{Derivation report: ").append(textOf(fileName)).append("}\n")
                .append("\\author{written by contour ").append(textOf(version)).append("}\n")
                .append("\\date{").append(textOf(java.time.LocalDate.now().toString())).append("}\n")
                .append("\\begin{document}\n\\maketitle\n\n")
                .append("\\noindent ").append(step).append(" statements; ").append(held).append(held == 1 ? " check holds, " : " checks hold, ")
                .append(failedChecks).append(failedChecks == 1 ? " check failed" : " checks failed")
                .append("; statements took ").append(seconds(totalNanos)).append(" in all (contour ").append(textOf(version))
                .append(", Java ").append(textOf(System.getProperty("java.version", "?"))).append(").\n\n")
                .append(body)
                .append("\\end{document}\n");
        try {
            write(target, doc.toString().getBytes(StandardCharsets.UTF_8));
        } catch (IOException | RuntimeException x) {
            throw new ContourException("cannot write the report " + target + ": " + x.getMessage());
        }
    }

    /** The figures written so far, in order. */
    public List<Path> figures() {
        return List.copyOf(figures);
    }

    private void figure(PictureValue p) {
        String base = target.getFileName().toString();
        base = base.substring(0, base.length() - ".tex".length());
        Path png = target.toAbsolutePath().resolveSibling(base + "-figure-" + (figures.size() + 1) + ".png");
        PictureFiles.write(p.map(), png);
        figures.add(png);
        body.append("\\begin{figure}[htbp]\n\\centering\n\\includegraphics[width=\\linewidth]{")
                .append(png.getFileName().toString()).append("}\n\\caption{Pole map of ").append(textOf(p.map().title()))
                .append(" (step ").append(step).append(").}\n\\end{figure}\n");
    }

    /** The statement's text in the script, from its span. */
    private String sourceOf(Stmt s) {
        String[] lines = source.split("\n", -1);
        int line = s.span().line() - 1;
        if (line < 0 || line >= lines.length) {
            return "";
        }
        int offset = 0;
        for (int i = 0; i < line; i++) {
            offset += lines[i].length() + 1;
        }
        offset += s.span().column() - 1;
        int end = Math.min(source.length(), offset + s.span().length());
        return offset < end ? source.substring(offset, end) : "";
    }

    /** Text set in a verbatim block, lines folded at 86 characters and non-ASCII characters spelled out. */
    static String verbatim(String text) {
        if (text == null || text.isBlank()) {
            return "";
        }
        StringBuilder out = new StringBuilder("{\\small\n\\begin{verbatim}\n");
        for (String line : text.strip().split("\n")) {
            StringBuilder ascii = new StringBuilder();
            line.codePoints().forEach(c -> {
                if (c == '\t') {
                    ascii.append("    ");
                } else if (c < 0x20 || c > 0x7e) {
                    ascii.append(String.format(Locale.ROOT, "<U+%04X>", c));
                } else {
                    ascii.appendCodePoint(c);
                }
            });
            String rest = ascii.toString();
            String indent = "";
            while (rest.length() > 86) {
                out.append(indent).append(rest, 0, 86 - indent.length()).append('\n');
                rest = rest.substring(86 - indent.length());
                indent = "      ";
            }
            out.append(indent).append(rest).append('\n');
        }
        // "\end{verbatim}" inside the text would end the block early
        return out.toString().replace("\\end{verbatim}", "\\end {verbatim}") + "\\end{verbatim}\n}\n";
    }

    /** Plain text for running LaTeX text (titles, captions). */
    static String textOf(String plain) {
        StringBuilder b = new StringBuilder();
        plain.codePoints().forEach(c -> {
            switch (c) {
                case '\\' -> b.append("\\textbackslash{}");
                case '{', '}', '_', '#', '%', '&', '$' -> b.append('\\').appendCodePoint(c);
                case '^' -> b.append("\\textasciicircum{}");
                case '~' -> b.append("\\textasciitilde{}");
                default -> {
                    if (c < 0x20 || c > 0x7e) {
                        b.append('?');
                    } else {
                        b.appendCodePoint(c);
                    }
                }
            }
        });
        return b.toString();
    }

    private static String seconds(long nanos) {
        return String.format(Locale.ROOT, "%.3f s", nanos / 1e9);
    }

    private static void write(Path target, byte[] bytes) throws IOException {
        Path absolute = target.toAbsolutePath();
        Path folder = absolute.getParent();
        if (folder == null || !Files.isDirectory(folder)) {
            throw new IOException("no such folder: " + folder);
        }
        Path temporary = Files.createTempFile(folder, "." + absolute.getFileName() + ".", ".tmp");
        try {
            Files.write(temporary, bytes);
            Files.move(temporary, absolute, java.nio.file.StandardCopyOption.ATOMIC_MOVE,
                    java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        } finally {
            Files.deleteIfExists(temporary);
        }
    }
}
