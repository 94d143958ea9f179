package dev.contour.eval;

import dev.contour.lang.Expr;
import java.util.List;
import java.util.Map;

/**
 * A user function from {@code def name(params) = body}; calls go through the interpreter.
 * {@code captured} holds the loop variables in scope where it was defined (a def inside a
 * {@code for} body sees the iteration's values); names not found there are looked up at call time.
 */
public record FunctionValue(String name, List<String> parameters, Expr body, String source,
                            Map<String, Value> captured) implements Value {
    public FunctionValue {
        parameters = List.copyOf(parameters);
        captured = Map.copyOf(captured);
    }

    public FunctionValue(String name, List<String> parameters, Expr body, String source) {
        this(name, parameters, body, source, Map.of());
    }

    @Override
    public String kind() {
        return "function";
    }
}
