package dev.contour.rewrite;

import dev.contour.ContourException;
import dev.contour.lang.Stmt;
import java.time.Duration;
import java.util.List;

/**
 * Bounds of one rewriting run: most steps, largest term (in nodes, see {@link Rewriter#size}) and a
 * wall-clock budget (zero: none).
 */
public record Limits(int maxSteps, long maxSize, Duration timeLimit) {
    /** Generous bounds for real derivations; a runaway rule set still stops within seconds. */
    public static final Limits DEFAULT = new Limits(10_000, 200_000, Duration.ofSeconds(20));

    public Limits {
        if (maxSteps < 0 || maxSize < 1 || timeLimit.isNegative()) {
            throw new IllegalArgumentException("limits must be positive");
        }
    }

    public Limits withSteps(int steps) {
        return new Limits(steps, maxSize, timeLimit);
    }

    public Limits withSize(long size) {
        return new Limits(maxSteps, size, timeLimit);
    }

    public Limits withTime(Duration time) {
        return new Limits(maxSteps, maxSize, time);
    }

    /** The default limits narrowed or widened by a statement's {@code within 500 steps, 2000 nodes, 5 seconds}. */
    public static Limits of(List<Stmt.RewriteLimit> written) {
        Limits l = DEFAULT;
        for (Stmt.RewriteLimit w : written) {
            if (w.amount() < 1) {
                throw new ContourException("a limit must be at least 1", w.span());
            }
            switch (w.unit()) {
                case "steps", "step" -> l = l.withSteps((int) Math.min(Integer.MAX_VALUE, w.amount()));
                case "nodes", "node" -> l = l.withSize(w.amount());
                case "seconds", "second" -> l = l.withTime(Duration.ofSeconds(Math.min(w.amount(), 86_400)));
                default -> throw new ContourException("unknown limit '" + w.unit() + "': use steps, nodes or seconds", w.span());
            }
        }
        return l;
    }
}
