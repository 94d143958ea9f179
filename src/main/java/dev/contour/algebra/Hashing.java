package dev.contour.algebra;

/**
 * Hash combination for keys built from small integers (exponents, form coefficients).
 *
 * <p>Why: the plain {@code 31 * h + x} combination is linear, so sigma^i tau^j and
 * sigma^(i+1) tau^(j-31) collide, and the solver's equation keys (a monomial, then lines and
 * orders) collide by the thousand at large weights, degrading hash maps to tree bins. Each step
 * here goes through the MurmurHash3 finaliser, which spreads every input bit over the result.
 */
public final class Hashing {
    private Hashing() { }

    /** The MurmurHash3 32-bit finaliser. */
    public static int mix(int h) {
        h ^= h >>> 16;
        h *= 0x85EBCA6B;
        h ^= h >>> 13;
        h *= 0xC2B2AE35;
        h ^= h >>> 16;
        return h;
    }

    /** Combines a running hash with the next part. */
    public static int combine(int h, int part) {
        return mix(h * 0x9E3779B9 + part);
    }
}
