package dev.contour.solve;

import dev.contour.bench.SolveBench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import dev.contour.Span;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import dev.contour.algebra.Rational;
import java.math.BigInteger;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

class SupergravityAnsatzTest {

    /** The same ansatz written as a user writes it, solved through the language and the rule library. */
    private static Solution solveScript(int p) {
        Interpreter interpreter = new Interpreter(InterpreterOptions.to(
                new PrintStream(OutputStream.nullOutputStream(), true, StandardCharsets.UTF_8)), BuiltinRegistry.standard());
        interpreter.run(SolveBench.script(p), "ansatz.ctr");
        return ((SolutionValue) interpreter.lookup("sol")).solution();
    }

    // Two independent constructions of the same conditions (hand-built factored pieces here; the
    // dictionary's ward(p) applied to the script's ansatz there) give the same solution.
    @ParameterizedTest
    @ValueSource(ints = {2, 3, 5, 8, 12})
    void theLanguageAndTheHandBuiltPiecesAgree(int p) {
        Solution.Family a = assertInstanceOf(Solution.Family.class, solve(p));
        Solution.Family b = assertInstanceOf(Solution.Family.class, solveScript(p));
        String top = "a[0,0," + (p - 2) + "]";
        assertEquals(a.normalized(top, Rational.ONE, Span.NONE), b.normalized(top, Rational.ONE, Span.NONE));
    }

    private static Solution solve(int p) {
        SupergravityAnsatz ansatz = new SupergravityAnsatz(p);
        return new LinearConstraintBuilder(ansatz.unknowns())
                .add(ansatz.residueConstraint(new Span("test", 1, 1, 1)))
                .solve(SolveProgress.silent());
    }

    // Polynomial residues fix the equal-weight reduced amplitude uniquely up to one overall
    // constant: arXiv:1608.06624, arXiv:1710.05923 (physics reference section 4).
    @ParameterizedTest
    @ValueSource(ints = {2, 3, 4, 5, 6})
    void uniqueUpToNormalisation(int p) {
        Solution.Family fam = assertInstanceOf(Solution.Family.class, solve(p));
        assertEquals(1, fam.dimension());
        Solution.Unique u = assertInstanceOf(Solution.Unique.class,
                fam.normalized("a[0,0," + (p - 2) + "]", Rational.ONE, Span.NONE));
        assertEquals((p - 1) * p / 2, u.values().size());
    }

    // p = 3: the unique solution has a_001 = a_010 = a_100 (arXiv:1710.05923; physics reference section 4).
    @Test
    void weightThreeHasEqualCoefficients() {
        Solution.Family fam = assertInstanceOf(Solution.Family.class, solve(3));
        Solution.Unique u = assertInstanceOf(Solution.Unique.class, fam.normalized("a[0,0,1]", Rational.ONE, Span.NONE));
        assertEquals(List.of(Rational.ONE, Rational.ONE, Rational.ONE), u.values());
    }

    // Cross-check with a second, independent computation (a throwaway dense exact elimination of the
    // same double-residue equations written separately, not a published value): with a[0,0,p-2] = 1
    // the solution is a[i,j,k] = ((p-2)! / (i! j! k!))^2.
    @ParameterizedTest
    @ValueSource(ints = {4, 6, 9})
    void agreesWithAnIndependentComputation(int p) {
        Solution.Family fam = assertInstanceOf(Solution.Family.class, solveScript(p));
        Solution.Unique u = assertInstanceOf(Solution.Unique.class,
                fam.normalized("a[0,0," + (p - 2) + "]", Rational.ONE, Span.NONE));
        for (int i = 0; i <= p - 2; i++) {
            for (int j = 0; i + j <= p - 2; j++) {
                int k = p - 2 - i - j;
                BigInteger multinomial = fact(p - 2).divide(fact(i).multiply(fact(j)).multiply(fact(k)));
                assertEquals(Rational.of(multinomial.pow(2)), u.value("a[" + i + "," + j + "," + k + "]"));
            }
        }
    }

    private static BigInteger fact(int n) {
        BigInteger f = BigInteger.ONE;
        for (int i = 2; i <= n; i++) {
            f = f.multiply(BigInteger.valueOf(i));
        }
        return f;
    }
}
