package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import java.util.Collections;
import java.util.Map;
import java.util.Optional;
import java.util.ServiceLoader;
import java.util.Set;
import java.util.TreeMap;

/**
 * Named built-in functions, the solver and the rule sink that scripts can reach. The core
 * built-ins come from {@link CoreBuiltins}; other packages add theirs through a
 * {@link BuiltinProvider}, without touching the evaluator.
 */
public final class BuiltinRegistry {
    private final Map<String, Builtin> builtins = new TreeMap<>();
    private Solver solver;
    private RuleSink ruleSink;

    /** An empty registry (tests). */
    public BuiltinRegistry() { }

    /** The core built-ins plus everything the {@link BuiltinProvider}s on the class path register. */
    public static BuiltinRegistry standard() {
        BuiltinRegistry r = new BuiltinRegistry();
        CoreBuiltins.register(r);
        UtilityBuiltins.register(r);
        for (BuiltinProvider p : ServiceLoader.load(BuiltinProvider.class)) {
            p.register(r);
        }
        return r;
    }

    /** Adds a built-in; a name may be registered once. */
    public BuiltinRegistry register(Builtin b) {
        if (builtins.putIfAbsent(b.name(), b) != null) {
            throw new IllegalStateException("built-in '" + b.name() + "' registered twice");
        }
        return this;
    }

    public Optional<Builtin> lookup(String name) {
        return Optional.ofNullable(builtins.get(name));
    }

    public Set<String> names() {
        return Collections.unmodifiableSet(builtins.keySet());
    }

    /** Sets the solver that {@code solve ... for ...} dispatches to. */
    public BuiltinRegistry setSolver(Solver s) {
        this.solver = s;
        return this;
    }

    public Solver solver(Span span) {
        if (solver == null) {
            throw new ContourException("no solver is available in this build ('solve' needs the dev.contour.solve package)", span);
        }
        return solver;
    }

    /** Sets the receiver of {@code rule} statements. */
    public BuiltinRegistry setRuleSink(RuleSink sink) {
        this.ruleSink = sink;
        return this;
    }

    /** Whether a rule sink is registered (the rewriting engine is in this build). */
    public boolean hasRuleSink() {
        return ruleSink != null;
    }

    public RuleSink ruleSink(Span span) {
        if (ruleSink == null) {
            throw new ContourException("'rule' statements need the rewriting engine, which is not in this build", span);
        }
        return ruleSink;
    }
}
