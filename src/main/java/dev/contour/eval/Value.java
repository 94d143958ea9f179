package dev.contour.eval;

/**
 * A value of the language. Deliberately not sealed: other packages add kinds (shift operators,
 * solutions) by implementing this interface, and opt into arithmetic, calls, substitution or
 * {@code with} through {@link OperandValue}, {@link CallableValue}, {@link SubstitutableValue}
 * and {@link BindingValue}.
 */
public interface Value {
    /** A short noun for error messages: "expression", "function", "range", ... */
    String kind();

    /** How {@code show} prints a value of a kind the printers do not know. */
    default String render(OutputFormat format) {
        return "<" + kind() + ">";
    }

    /** As {@link #render(OutputFormat)}, with coefficients factored when asked ({@code show ... factored}). */
    default String render(OutputFormat format, boolean factored) {
        return render(format);
    }
}
