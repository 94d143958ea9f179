package dev.contour.eval;

/** A string: file names, labels for {@code show}. */
public record StringValue(String value) implements Value {
    @Override
    public String kind() {
        return "string";
    }
}
