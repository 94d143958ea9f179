package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.Rational;

import java.util.ArrayList;
import java.util.List;

/**
 * The decomposition of an exact double series into conformal blocks of given twists and spins.
 *
 * <p>Triangular: a block of twist tau and spin l starts at z^(tau/2 + l) zbar^(tau/2) with coefficient
 * one, and on the slice zbar^(tau/2) it has no lower power of z, while blocks of higher twist do not
 * reach that slice. Taking twists in increasing order and spins in increasing order, the coefficient
 * of each block is the residual's coefficient of its leading monomial; the block times it is
 * subtracted. For each listed twist every spin up to the order is solved for (the listed spins are
 * reported when twist + spin is within the order). What is left is the residual: zero when the series is a sum of blocks of the listed
 * twists to the order.
 */
public final class BlockDecomposition {
    private BlockDecomposition() { }

    /** One block's coefficient. */
    public record Coefficient(int twist, int spin, Rational value) { }

    /** The coefficients by twist then spin, and what remains. */
    public record Result(int dimension, List<Coefficient> coefficients, DoubleSeries residual) {
        public Result {
            coefficients = List.copyOf(coefficients);
        }

        /** The coefficient of the block of this twist and spin; a ContourException when it was not asked for. */
        public Rational coefficient(int twist, int spin) {
            for (Coefficient c : coefficients) {
                if (c.twist() == twist && c.spin() == spin) {
                    return c.value();
                }
            }
            throw new ContourException("no block of twist " + twist + " and spin " + spin + " in this decomposition");
        }
    }

    public static Result decompose(DoubleSeries f, int d, List<Integer> twists, List<Integer> spins) {
        List<Integer> ts = twists.stream().distinct().sorted().toList();
        List<Integer> ls = spins.stream().distinct().sorted().toList();
        if (ts.isEmpty() || ls.isEmpty()) {
            throw new ContourException("give at least one twist and one spin");
        }
        if (ts.get(0) + ls.get(0) > f.order()) {
            throw new ContourException("twist " + ts.get(0) + " and spin " + ls.get(0) + " need the series to total degree "
                    + (ts.get(0) + ls.get(0)) + ", but it is known to " + f.order() + "; raise its order");
        }
        for (int tw : ts) {
            if (tw < 0 || tw % 2 != 0) {
                throw new ContourException("twists must be even integers >= 0 (integer powers of z, zbar), got " + tw);
            }
        }
        for (int l : ls) {
            if (l < 0) {
                throw new ContourException("spins must be >= 0, got " + l);
            }
        }
        // Every spin a listed twist reaches within the order is solved for, so that blocks of low
        // twist and high spin do not leak into the leading terms of higher twists; the listed spins
        // are reported.
        DoubleSeries residual = f;
        List<Coefficient> out = new ArrayList<>();
        for (int tw : ts) {
            for (int l = 0; tw + l <= f.order(); l++) {
                Rational c = residual.coefficient(tw / 2 + l, tw / 2);
                if (ls.contains(l)) { // blocks beyond the order are not reported: their leading term is unknown
                    out.add(new Coefficient(tw, l, c));
                }
                if (!c.isZero()) {
                    residual = residual.combine(ConformalBlocks.block(d, Rational.of(tw + l), l, f.order()), c.negate());
                }
            }
        }
        return new Result(d, out, residual);
    }
}
