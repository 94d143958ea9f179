package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Polynomial;

import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * The poles an amplitude may have: for each named form the allowed locations, and the highest
 * allowed order (1 for simple poles only).
 */
public record AllowedPoles(Map<String, Set<Polynomial>> locations, int maxOrder) {
    public AllowedPoles {
        if (maxOrder < 1) {
            throw new ContourException("the highest allowed pole order must be at least 1, got " + maxOrder);
        }
        TreeMap<String, Set<Polynomial>> copy = new TreeMap<>();
        locations.forEach((k, v) -> copy.put(k, Set.copyOf(v)));
        locations = java.util.Collections.unmodifiableMap(copy);
    }

    /** True when {@code pole} lies on a named form at an allowed location with an allowed order. */
    public boolean allows(Pole pole) {
        return pole.form() != null && pole.order() <= maxOrder
                && locations.getOrDefault(pole.form(), Set.of()).contains(pole.location());
    }
}
