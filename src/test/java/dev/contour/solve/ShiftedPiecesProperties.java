package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.ShiftedSum;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * A shift operator applied to an ansatz gives the same solution whether the solver reads the
 * uncollected sum piece by piece (ShiftedPieces) or the collected expression: the two are the
 * same linear conditions, summed differently.
 */
class ShiftedPiecesProperties {
    private static final Expression S = Expression.variable("s");
    private static final Expression T = Expression.variable("t");
    private static final Expression SIGMA = Expression.collectedVariable("sigma");
    private static final Span AT = new Span("p.ctr", 1, 1, 1);

    @Property(tries = 60)
    void piecewiseAndCollectedSolutionsAgree(@ForAll("seeds") long seed, @ForAll @IntRange(min = 0, max = 3) int kind) {
        Random rnd = new Random(seed);
        int n = 2 + rnd.nextInt(4);
        List<String> unknowns = new ArrayList<>();
        Expression f = Expression.ZERO;
        for (int i = 0; i < n; i++) {
            String name = "a[" + i + "]";
            unknowns.add(name);
            Expression term = Expression.collectedVariable(name).multiply(SIGMA.pow(rnd.nextInt(2)))
                    .divide(S.subtract(k(2 * rnd.nextInt(3))).multiply(T.subtract(k(2 * rnd.nextInt(3)))));
            if (rnd.nextBoolean()) {
                term = term.divide(S.add(T).subtract(k(2 + 2 * rnd.nextInt(3))));
            }
            f = f.add(term);
        }
        f = f.add(k(rnd.nextInt(3) - 1).divide(S.subtract(k(4)))); // a known part
        List<ShiftedSum.Block> blocks = new ArrayList<>();
        int nb = 1 + rnd.nextInt(3);
        for (int b = 0; b < nb; b++) {
            TreeMap<String, Rational> shift = new TreeMap<>();
            shift.put("s", Rational.of(-2 * rnd.nextInt(2)));
            shift.put("t", Rational.of(2 * rnd.nextInt(2) - 2));
            Expression c = k(rnd.nextInt(5) - 2).multiply(S.subtract(k(rnd.nextInt(4))))
                    .multiply(T.add(k(rnd.nextInt(3))).pow(1 + rnd.nextInt(2)));
            if (rnd.nextBoolean()) {
                c = c.add(SIGMA.multiply(S.add(T)));
            }
            blocks.add(new ShiftedSum.Block(shift, c));
        }
        ShiftedSum sum = ShiftedSum.of(blocks, f);
        Constraint.Condition cond = switch (kind) {
            case 0 -> new Constraint.Vanishes();
            case 1 -> new Constraint.PolynomialIn(List.of("s"));
            case 2 -> new Constraint.ResiduesPolynomial(List.of(
                    new Constraint.Poles("s", Polynomial.variable("s"), Set.of(Rational.of(0), Rational.of(2))),
                    new Constraint.Poles("t", Polynomial.variable("t"), Set.of(Rational.of(-2), Rational.of(0)))), true);
            default -> new Constraint.GrowthAtMost(List.of("s", "t"), 0);
        };
        Solution piecewise = new LinearConstraintBuilder(unknowns)
                .add(Constraint.on(dev.contour.eval.ExprValue.deferred(sum), unknowns, cond, AT, "piecewise")).solve(SolveProgress.silent());
        Solution collected = new LinearConstraintBuilder(unknowns)
                .add(Constraint.on(sum.value(), unknowns, cond, AT, "collected")).solve(SolveProgress.silent());
        assertSameSolutions(piecewise, collected);
        assertSameSolutions(collected, piecewise);
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<Long> seeds() {
        return net.jqwik.api.Arbitraries.longs();
    }

    /** Every solution of a (its particular point and each free direction) solves b, and the kinds agree. */
    private static void assertSameSolutions(Solution a, Solution b) {
        assertEquals(a.kind(), b.kind(), a + " vs " + b);
        if (a instanceof Solution.Unique ua) {
            assertEquals(ua.values(), ((Solution.Unique) b).values());
        } else if (a instanceof Solution.Family fa) {
            Solution.Family fb = (Solution.Family) b;
            assertEquals(fa.dimension(), fb.dimension());
            for (int d = -1; d < fa.dimension(); d++) {
                List<Rational> point = new ArrayList<>();
                for (List<Rational> row : fa.affine()) {
                    point.add(row.get(0).add(d < 0 ? Rational.ZERO : row.get(d + 1)));
                }
                assertEquals(point, evaluate(fb, point));
            }
        }
    }

    /** b's point with the same values of b's free unknowns as the given point. */
    private static List<Rational> evaluate(Solution.Family b, List<Rational> point) {
        List<Rational> out = new ArrayList<>();
        for (List<Rational> row : b.affine()) {
            Rational v = row.get(0);
            for (int f = 0; f < b.dimension(); f++) {
                v = v.add(row.get(f + 1).multiply(point.get(b.unknowns().indexOf(b.free().get(f)))));
            }
            out.add(v);
        }
        return out;
    }

    private static Expression k(long c) {
        return Expression.constant(c);
    }
}
