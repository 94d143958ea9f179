package dev.contour.eval;

import dev.contour.lang.Expr;
import java.util.List;

/** A user function from {@code def name(params) = body}; calls go through the interpreter. */
public record FunctionValue(String name, List<String> parameters, Expr body, String source) implements Value {
    public FunctionValue {
        parameters = List.copyOf(parameters);
    }

    @Override
    public String kind() {
        return "function";
    }
}
