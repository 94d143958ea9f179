package dev.contour.eval;

import dev.contour.Span;
import dev.contour.lang.Expr;
import java.nio.file.Path;

/** What the interpreter lends the rewriting engine while it runs one statement. */
public interface RuleContext {
    /** The value of an expression in the statement's scope. */
    Value evaluate(Expr e);

    /** A rule library named in a statement, found the way {@code use} finds files. */
    Path resolve(String file, Span span);

    /** The session's output format. */
    OutputFormat format();
}
