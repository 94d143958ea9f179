package dev.contour.eval;

import dev.contour.Span;
import java.util.List;

/** What {@code solve c1, c2 for a} dispatches to; registered in the {@link BuiltinRegistry}. */
@FunctionalInterface
public interface Solver {
    /** One condition: {@code left == right}, or a condition value alone ({@code right} null). */
    record Condition(Value left, Value right, Span span) { }

    Value solve(List<Condition> conditions, List<UnknownFamilyValue> unknowns, Span span);
}
