package dev.contour.eval;

import java.util.AbstractList;
import java.util.List;

/** The integers {@code from, from + step, ...} up to {@code to} (inclusive); step is positive or negative, never zero. */
public record RangeValue(long from, long to, long step) implements Value {
    public RangeValue {
        if (step == 0) {
            throw new IllegalArgumentException("step 0");
        }
    }

    public long size() {
        long span = (to - from) / step;
        return span < 0 || Long.signum(to - from) * Long.signum(step) < 0 ? 0 : span + 1;
    }

    /** The members in order. */
    public List<Long> members() {
        long n = size();
        return new AbstractList<>() {
            @Override public Long get(int i) { return from + i * step; }
            @Override public int size() { return (int) Math.min(n, Integer.MAX_VALUE); }
        };
    }

    @Override
    public String kind() {
        return "range";
    }
}
