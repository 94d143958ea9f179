package dev.contour.solve;

import dev.contour.algebra.Expression;
import dev.contour.eval.ExprValue;
import dev.contour.eval.Value;
import java.util.List;

/**
 * A condition made by a built-in such as residues_polynomial(M, ...): what must hold for which
 * expression, waiting for {@code solve ... for a} to supply the unknowns.
 */
public record ConditionValue(List<Part> parts, String description) implements Value {
    /** One target expression (possibly an operator application not yet collected) and the condition on it. */
    public record Part(ExprValue target, Constraint.Condition condition) {
        public Part(Expression target, Constraint.Condition condition) {
            this(new ExprValue(target), condition);
        }
    }

    public ConditionValue {
        parts = List.copyOf(parts);
    }

    @Override
    public String kind() {
        return "condition";
    }

    @Override
    public String render(dev.contour.eval.OutputFormat format) {
        return "condition: " + description;
    }
}
