package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;
import dev.contour.algebra.RationalFunction;
import dev.contour.eval.ExprValue;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import java.util.Map;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import static org.junit.jupiter.api.Assertions.*;

/** {@code position_operator}: a polynomial in U, V and stand-ins for the Euler operators, through the language. */
class PositionOperatorProperties {
    private static String run(String script) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        RunResult r = new Interpreter(InterpreterOptions.to(new PrintStream(bytes, true, StandardCharsets.UTF_8)))
                .run(script, "test.ctr");
        String out = bytes.toString(StandardCharsets.UTF_8);
        assertTrue(r.ok() && r.checksPassed() > 0, out);
        return out;
    }

    private static final long PRECISION = 50;

    @Property(tries = 25)
    void translatedWordsAgreeWithGammaFunctionsNumerically(@ForAll @IntRange(min = -1, max = 2) int m,
            @ForAll @IntRange(min = -1, max = 2) int n, @ForAll @IntRange(min = 0, max = 2) int j,
            @ForAll @IntRange(min = 0, max = 2) int k, @ForAll @IntRange(min = -1000, max = 1000) int a,
            @ForAll @IntRange(min = 100, max = 1000) int b) {
        // physics-reference section 3: U^m V^n (U d/dU)^j (V d/dV)^k on the kernel U^(s/2) V^(t/2 - p) is the
        // shift (s, t) -> (s - 2m, t - 2n) of (s/2)^j (t/2 - p)^k M times Gamma(shifted)/Gamma; here the
        // Gamma functions come from apfloat at complex points (off the real axis: no poles), to 30 digits.
        Interpreter in = new Interpreter(InterpreterOptions.to(new PrintStream(new ByteArrayOutputStream(), true,
                StandardCharsets.UTF_8)));
        RunResult r = in.run("""
                vars s, t, u
                vars U, V, DU, DV collected
                let p = 3
                let ms = mellin_measure(gamma: {{(2*p - s)/2, 2}, {(2*p - t)/2, 2}, {(2*p - u)/2, 2}},
                                        kernel: {s/2, t/2 - p}, eliminate: u, total: 4*p)
                let E = mellin(position_operator(U^%1$d*V^%2$d*DU^%3$d*DV^%4$d, euler: {DU, DV}), from: ms, to: ms)
                check E == mellin(U^%1$d*V^%2$d*euler(U)^%3$d*euler(V)^%4$d, from: ms, to: ms)
                """.formatted(m, n, j, k), "test.ctr");
        assertTrue(r.ok());
        RationalFunction applied = ((ExprValue) in.evaluate("E((s + 2*t + 1/3)/(s - t + 1/5))", "test.ctr")).value()
                .asRationalFunction();
        Apcomplex s = new Apcomplex(new Apfloat(a, PRECISION).divide(new Apfloat(137, PRECISION)),
                new Apfloat(b, PRECISION).divide(new Apfloat(211, PRECISION)));
        Apcomplex t = new Apcomplex(new Apfloat(b - a, PRECISION).divide(new Apfloat(89, PRECISION)),
                new Apfloat(-b, PRECISION).divide(new Apfloat(173, PRECISION)));
        Apcomplex s1 = s.subtract(real(2L * m));
        Apcomplex t1 = t.subtract(real(2L * n));
        Apcomplex f = s1.add(t1.multiply(real(2))).add(new Apfloat(1, PRECISION).divide(new Apfloat(3, PRECISION)))
                .divide(s1.subtract(t1).add(new Apfloat(1, PRECISION).divide(new Apfloat(5, PRECISION))));
        Apcomplex euler = ApcomplexMath.pow(s1.divide(real(2)), j).multiply(ApcomplexMath.pow(t1.divide(real(2)).subtract(real(3)), k));
        Apcomplex expected = euler.multiply(f).multiply(gammas(s1, t1)).divide(gammas(s, t));
        Apcomplex exact = Numeric.evaluate(applied, Map.of("s", s, "t", t), PRECISION);
        Apfloat relative = ApcomplexMath.abs(exact.subtract(expected)).divide(ApcomplexMath.abs(expected));
        assertTrue(relative.compareTo(new Apfloat("1e-30", PRECISION)) < 0, relative.toString());
    }

    /** Gamma((6 - s)/2)^2 Gamma((6 - t)/2)^2 Gamma((s + t - 6)/2)^2: the p = 3 measure with u = 12 - s - t. */
    private static Apcomplex gammas(Apcomplex s, Apcomplex t) {
        Apcomplex g1 = ApcomplexMath.gamma(real(6).subtract(s).divide(real(2)));
        Apcomplex g2 = ApcomplexMath.gamma(real(6).subtract(t).divide(real(2)));
        Apcomplex g3 = ApcomplexMath.gamma(s.add(t).subtract(real(6)).divide(real(2)));
        Apcomplex g = g1.multiply(g2).multiply(g3);
        return g.multiply(g);
    }

    private static Apcomplex real(long x) {
        return new Apcomplex(new Apfloat(x, PRECISION));
    }

    @Test
    void negativeEulerPowersAndInnerStandInsAreLocatedErrors() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars U, V, DU, DV collected
                let X = position_operator(U*DU^-1, euler: {DU, DV})
                """));
        assertTrue(e.getMessage().contains("negative power") && e.span().line() == 2, e.getMessage());
        ContourException same = assertThrows(ContourException.class, () -> run("""
                vars U, V, DU collected
                let X = position_operator(U*DU, euler: {DU, DU})
                """));
        assertTrue(same.getMessage().contains("must differ") && same.span().line() == 2, same.getMessage());
    }
}
