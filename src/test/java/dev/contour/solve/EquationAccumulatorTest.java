package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import dev.contour.Parallel;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The equation builder's accumulators on equations with every unknown in them and coefficients
 * far past 64 bits (the compact storage's growth and its big-number slots), against a planted
 * solution; the same answer with 1 and 3 threads.
 */
class EquationAccumulatorTest {
    private static final int N = 6;

    private static Expression c(int i) {
        return Expression.collectedVariable("c[" + i + "]");
    }

    @Test
    void aDenseSystemWithHugeCoefficientsGivesThePlantedSolution() {
        Random rnd = new Random(20261206);
        List<String> unknowns = new ArrayList<>();
        for (int i = 0; i < N; i++) {
            unknowns.add("c[" + i + "]");
        }
        // A lower-unitriangular plus random huge entries above: invertible over Q whatever the draw
        BigInteger[][] a = new BigInteger[N][N];
        for (int k = 0; k < N; k++) {
            for (int i = 0; i < N; i++) {
                a[k][i] = i == k ? BigInteger.ONE : i > k ? new BigInteger(90, rnd).subtract(BigInteger.ONE.shiftLeft(89))
                        : BigInteger.ZERO;
            }
        }
        Rational[] planted = new Rational[N];
        for (int i = 0; i < N; i++) {
            planted[i] = Rational.of(BigInteger.valueOf(rnd.nextInt(2001) - 1000), BigInteger.valueOf(rnd.nextInt(97) + 1));
        }
        // sum_i c_i P_i(s) - sum_k (A x)_k s^k vanishes for c = x, and only then: row k is the s^k coefficient
        Expression s = Expression.variable("s");
        Expression e = Expression.constant(0);
        for (int i = 0; i < N; i++) {
            Expression p = Expression.constant(0);
            for (int k = 0; k < N; k++) {
                p = p.add(Expression.constant(Rational.of(a[k][i])).multiply(s.pow(k)));
            }
            e = e.add(c(i).multiply(p));
        }
        for (int k = 0; k < N; k++) {
            Rational ax = Rational.ZERO;
            for (int i = 0; i < N; i++) {
                ax = ax.add(Rational.of(a[k][i]).multiply(planted[i]));
            }
            e = e.subtract(Expression.constant(ax).multiply(s.pow(k)));
        }
        int before = Parallel.threads();
        try {
            for (int threads : new int[] {1, 3}) {
                Parallel.setThreads(threads);
                Solution sol = new LinearConstraintBuilder(unknowns)
                        .add(Constraint.on(e, unknowns, new Constraint.Vanishes(), new Span("planted.ctr", 1, 1, 1), "planted"))
                        .solve(SolveProgress.silent());
                Solution.Unique u = assertInstanceOf(Solution.Unique.class, sol, "threads " + threads);
                assertEquals(List.of(planted), u.values(), "threads " + threads);
            }
        } finally {
            Parallel.setThreads(before);
        }
    }
}
