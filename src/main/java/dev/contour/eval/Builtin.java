package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import java.util.Set;

/**
 * A named built-in function: how many positional arguments it takes, which named ones it
 * accepts, whether it takes {@code name in domain} arguments, a one-line summary, and the code.
 */
public record Builtin(String name, int minPositional, int maxPositional, Set<String> namedArguments,
                      boolean takesDomains, String summary, Implementation implementation) implements CallableValue {
    /** The code of a built-in; arguments are already evaluated. */
    @FunctionalInterface
    public interface Implementation {
        Value apply(Arguments arguments, Span span);
    }

    /**
     * In {@code namedArguments}: any declared variable may name an argument (as in
     * {@code shift(x: 1, y: -2)}); the interpreter checks that each such name is a variable.
     */
    public static final String ANY_VARIABLE = "<variable>";

    public Builtin {
        namedArguments = Set.copyOf(namedArguments);
    }

    /** Whether any declared variable may name an argument. */
    public boolean takesVariableNames() {
        return namedArguments.contains(ANY_VARIABLE);
    }

    /** A built-in with exactly {@code arity} positional arguments and nothing else. */
    public static Builtin of(String name, int arity, String summary, Implementation implementation) {
        return new Builtin(name, arity, arity, Set.of(), false, summary, implementation);
    }

    @Override
    public Value call(Arguments arguments, Span span) {
        int n = arguments.positional().size();
        if (n < minPositional || n > maxPositional) {
            String want = minPositional == maxPositional ? String.valueOf(minPositional)
                    : maxPositional == Integer.MAX_VALUE ? "at least " + minPositional
                    : minPositional + " to " + maxPositional;
            throw new ContourException(name + " takes " + want + " argument" + (want.equals("1") ? "" : "s")
                    + ", not " + n, span);
        }
        for (Arguments.Argument a : arguments.named()) {
            if (!namedArguments.contains(a.name()) && !takesVariableNames()) {
                throw new ContourException(name + " has no argument named '" + a.name() + "'"
                        + (namedArguments.isEmpty() ? "" : " (it takes " + String.join(", ", new java.util.TreeSet<>(namedArguments)) + ")"), a.span());
            }
        }
        if (!takesDomains && !arguments.domains().isEmpty()) {
            throw new ContourException(name + " takes no 'name in ...' arguments", arguments.domains().get(0).span());
        }
        return implementation.apply(arguments, span);
    }

    @Override
    public String kind() {
        return "built-in function";
    }
}
