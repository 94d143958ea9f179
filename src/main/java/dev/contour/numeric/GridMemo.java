package dev.contour.numeric;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Supplier;
import org.apfloat.Apcomplex;

/**
 * Memoised special-function values for the duration of one integration, at one working precision.
 *
 * <p>The quadrature grids are exact decimal multiples of the step, so a Gamma factor of s, t or
 * s + t takes the same argument at many grid points; remembering its value turns the cost of a
 * two-variable integral from one Gamma evaluation per point into one per grid line. The memo lives
 * only while an integration runs (a bounded scope), so nothing accumulates between calls.
 */
final class GridMemo {
    private static final ThreadLocal<GridMemo> CURRENT = new ThreadLocal<>();

    enum Op { GAMMA, LOG_GAMMA, LOG, POWER, EXP, USER }

    private record Key(Op op, Object tag, Apcomplex a, Apcomplex b) { }

    private final long precision;
    private final Map<Key, Apcomplex> values = new ConcurrentHashMap<>();

    GridMemo(long precision) {
        this.precision = precision;
    }

    /** The memo of the integration running on this thread, or null. */
    static GridMemo current() {
        return CURRENT.get();
    }

    long precision() {
        return precision;
    }

    int size() {
        return values.size();
    }

    /** Runs {@code body} on this thread with this memo active (worker threads share one memo). */
    <T> T run(Supplier<T> body) {
        GridMemo previous = CURRENT.get();
        CURRENT.set(this);
        try {
            return body.get();
        } finally {
            if (previous == null) {
                CURRENT.remove();
            } else {
                CURRENT.set(previous);
            }
        }
    }

    Apcomplex get(Op op, Apcomplex a, Apcomplex b, Supplier<Apcomplex> compute) {
        return get(op, null, a, b, compute);
    }

    Apcomplex get(Op op, Object tag, Apcomplex a, Apcomplex b, Supplier<Apcomplex> compute) {
        Key key = new Key(op, tag, a, b == null ? Apcomplex.ZERO : b);
        Apcomplex known = values.get(key);
        if (known != null) {
            return known;
        }
        Apcomplex value = compute.get();
        values.putIfAbsent(key, value);
        return value;
    }
}
