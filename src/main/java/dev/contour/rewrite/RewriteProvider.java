package dev.contour.rewrite;

import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;

/** Plugs the rewriting engine into every interpreter: each session gets its own rule collection. */
public final class RewriteProvider implements BuiltinProvider {
    @Override
    public void register(BuiltinRegistry registry) {
        registry.setRuleSink(new SessionRules());
    }
}
