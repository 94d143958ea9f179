package dev.contour.eval;

/** The three output forms of {@code show}. */
public enum OutputFormat { PLAIN, LATEX, JSON }
