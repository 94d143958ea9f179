package dev.contour.eval;

/**
 * What the rewriting engine reports for a statement it ran: whether it held (for checks), a
 * one-line summary (what {@code contour check} prints) and the full text (a derivation or proof).
 */
public record RuleReport(boolean holds, String summary, String detail) { }
