package dev.contour.eval;

import java.util.List;

/** {@code {a, b, c}}. */
public record ListValue(List<Value> items) implements Value {
    public ListValue {
        items = List.copyOf(items);
    }

    @Override
    public String kind() {
        return "list";
    }
}
