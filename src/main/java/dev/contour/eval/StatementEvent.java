package dev.contour.eval;

import dev.contour.lang.Stmt;

/**
 * What one statement of a script did, for printers that lay out a whole run (the derivation
 * report): the statement, the loop context it ran in, what it showed (in plain text and LaTeX),
 * a check's verdict, and how long it took. Only statements of the script itself are reported,
 * not those of libraries it uses.
 *
 * @param shown the value a {@code show} printed, else null
 * @param plain what the statement printed in plain text (a show's line, a check's verdict and detail), else ""
 * @param latex the LaTeX a {@code show} prints under {@code --latex} (its "% label" line removed), else ""
 * @param holds a check's verdict, else null
 * @param nanos wall-clock time of the statement, printing included
 */
public record StatementEvent(Stmt statement, String context, Value shown, String plain, String latex, Boolean holds, long nanos) { }
