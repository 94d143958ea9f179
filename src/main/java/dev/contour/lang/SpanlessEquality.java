package dev.contour.lang;

import dev.contour.Span;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.RecordComponent;
import java.util.Objects;

/**
 * Record equality that skips every {@link Span} component, so that two trees parsed from
 * differently laid-out text compare equal.
 */
final class SpanlessEquality {
    private SpanlessEquality() { }

    static boolean equals(Record a, Object b) {
        if (a == b) {
            return true;
        }
        if (b == null || a.getClass() != b.getClass()) {
            return false;
        }
        for (RecordComponent c : a.getClass().getRecordComponents()) {
            if (c.getType() == Span.class) {
                continue;
            }
            if (!Objects.equals(read(c, a), read(c, b))) {
                return false;
            }
        }
        return true;
    }

    static int hash(Record a) {
        int h = a.getClass().getName().hashCode();
        for (RecordComponent c : a.getClass().getRecordComponents()) {
            if (c.getType() != Span.class) {
                h = 31 * h + Objects.hashCode(read(c, a));
            }
        }
        return h;
    }

    private static Object read(RecordComponent c, Object target) {
        try {
            return c.getAccessor().invoke(target);
        } catch (IllegalAccessException | InvocationTargetException e) {
            throw new IllegalStateException("cannot read record component " + c.getName(), e);
        }
    }
}
