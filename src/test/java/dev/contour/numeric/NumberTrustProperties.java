package dev.contour.numeric;

import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Tag;
import net.jqwik.api.constraints.IntRange;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Numbers keep their word at random points: a value at two precisions compares equal, and the
 * printed digits lie within the stated error of a 50-digit reference computed by apfloat's own
 * Gamma, polylogarithm and logarithm (an independent implementation).
 */
class NumberTrustProperties {
    private static final long REF = 50;

    private static String run(String script, RunResult[] result) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        RunResult r = new Interpreter(InterpreterOptions.to(out)).run(script, "property.ctr");
        if (result != null) {
            result[0] = r;
        }
        return bytes.toString(StandardCharsets.UTF_8);
    }

    /** The number printed after ") = " on the last line: "a", "a + b i" or "a - b i". */
    static Apcomplex printed(String output) {
        String line = output.strip().lines().reduce((a, b) -> b).orElseThrow();
        String tail = line.substring(line.indexOf(") = ") + 4);
        String number = tail.substring(0, tail.indexOf(" ("));
        String[] parts = number.split(" ");
        if (parts.length == 1) {
            return new Apfloat(parts[0], REF);
        }
        Apfloat im = new Apfloat(parts[2], REF);
        return new Apcomplex(new Apfloat(parts[0], REF), parts[1].equals("-") ? im.negate() : im);
    }

    /** The claimed digits, "(n digits". */
    static int claimed(String output) {
        String line = output.strip().lines().reduce((a, b) -> b).orElseThrow();
        String tail = line.substring(line.indexOf(") = ") + 4);
        return Integer.parseInt(tail.substring(tail.indexOf('(') + 1, tail.indexOf(" digits")));
    }

    /** One unit in the last claimed place of the printed value (at the scale of its larger part). */
    static Apfloat lastUnit(Apcomplex printed, int digits) {
        return ApfloatMath.scale(new Apfloat(1, 5), printed.scale() - digits);
    }

    @Property(tries = 25)
    void aValueAtTwoPrecisionsComparesEqual(@ForAll @IntRange(min = 1, max = 400) int num, @ForAll @IntRange(min = 1, max = 37) int den,
                                            @ForAll @IntRange(min = 3, max = 40) int n, @ForAll @IntRange(min = 3, max = 40) int m) {
        // Gamma at positive rationals; Li_2 at rationals in (-1, 1) (num/den scaled into it).
        String x = num + "/" + den;
        String y = (num % (2 * den + 1) - den) + "/" + (den + 1);
        RunResult[] r = new RunResult[1];
        String out = run("check value(Gamma(" + x + "), digits: " + n + ") == value(Gamma(" + x + "), digits: " + m + ")\n"
                + "check value(polylog(2, " + y + "), digits: " + n + ") == value(polylog(2, " + y + "), digits: " + m + ")\n", r);
        assertEquals(2, r[0].checksPassed(), out);
    }

    @Property(tries = 25)
    void gammaDigitsAreWithinOneUnitOfTheReference(@ForAll @IntRange(min = -300, max = 300) int re, @ForAll @IntRange(min = -300, max = 300) int im,
                                                   @ForAll @IntRange(min = 1, max = 29) int den, @ForAll @IntRange(min = 3, max = 35) int digits) {
        if (im == 0 && re <= 0 && re % den == 0) {
            return; // a pole of Gamma
        }
        String out = run("vars z\nshow value(Gamma(z), point: {z, complex(" + re + "/" + den + ", " + im + "/" + den + ")}, digits: " + digits + ")\n", null);
        Apcomplex z = new Apcomplex(new Apfloat(re, REF + 10).divide(new Apfloat(den, REF + 10)),
                new Apfloat(im, REF + 10).divide(new Apfloat(den, REF + 10)));
        Apcomplex reference = ApcomplexMath.gamma(z);
        Apcomplex p = printed(out);
        int n = claimed(out);
        assertTrue(n >= 1, out);
        assertTrue(ApcomplexMath.abs(p.subtract(reference)).compareTo(lastUnit(p, n)) <= 0, out + " reference " + reference);
    }

    private static void polylogWithinOneUnit(int order, int re, int im, int digits) {
        if (re == 0 && im == 0 || im == 0 && re >= 20) {
            return; // Li_n(0) = 0 is exact; the cut along [1, infinity) is not sampled
        }
        String out = run("vars z\nshow value(polylog(" + order + ", z), point: {z, complex(" + re + "/20, " + im + "/20)}, digits: " + digits + ")\n", null);
        Apcomplex z = new Apcomplex(new Apfloat(re, REF + 10).divide(new Apfloat(20, REF + 10)),
                new Apfloat(im, REF + 10).divide(new Apfloat(20, REF + 10)));
        Apcomplex reference = ApcomplexMath.polylog(new Apfloat(order, REF + 10), z);
        Apcomplex p = printed(out);
        int n = claimed(out);
        assertTrue(n >= 1, out);
        assertTrue(ApcomplexMath.abs(p.subtract(reference)).compareTo(lastUnit(p, n)) <= 0, out + " reference " + reference);
    }

    @Property(tries = 4)
    void polylogDigitsAreWithinOneUnitOfTheReference(@ForAll @IntRange(min = 2, max = 3) int order,
                                                     @ForAll @IntRange(min = -24, max = 24) int re, @ForAll @IntRange(min = -24, max = 24) int im,
                                                     @ForAll @IntRange(min = 3, max = 20) int digits) {
        polylogWithinOneUnit(order, re, im, digits);
    }

    @Property(tries = 25)
    @Tag("slow")
    void polylogDigitsAreWithinOneUnitOfTheReferenceWider(@ForAll @IntRange(min = 2, max = 4) int order,
                                                          @ForAll @IntRange(min = -40, max = 40) int re, @ForAll @IntRange(min = -40, max = 40) int im,
                                                          @ForAll @IntRange(min = 3, max = 30) int digits) {
        polylogWithinOneUnit(order, re, im, digits);
    }

    /** The box function in closed form (Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363), by apfloat alone. */
    static Apcomplex boxReference(Apcomplex z) {
        Apcomplex zb = z.conj();
        Apcomplex one = new Apfloat(1, REF + 10);
        Apcomplex two = new Apfloat(2, REF + 10);
        Apcomplex dilogs = two.multiply(ApcomplexMath.polylog(two, z).subtract(ApcomplexMath.polylog(two, zb)));
        Apcomplex logs = ApcomplexMath.log(z.multiply(zb)).multiply(ApcomplexMath.log(one.subtract(z).divide(one.subtract(zb))));
        return dilogs.add(logs).divide(z.subtract(zb));
    }

    private static void boxWithinItsError(int re, int im, int digits) {
        String out = run("vars s, t\nlet box = mellin_measure(gamma: {{-s, 2}, {-t, 2}, {1 + s + t, 2}}, kernel: {s, t})\n"
                + "show 4*position_value(1, box, z: complex(" + re + "/20, " + im + "/20), zbar: complex(" + re + "/20, " + (-im) + "/20), "
                + "contour: {-1/3, -1/3}, digits: " + digits + ")\n", null);
        Apcomplex z = new Apcomplex(new Apfloat(re, REF + 10).divide(new Apfloat(20, REF + 10)),
                new Apfloat(im, REF + 10).divide(new Apfloat(20, REF + 10)));
        Apcomplex reference = boxReference(z);
        Apcomplex p = printed(out);
        Apfloat error = NumberTrustTest.printedError(out);
        assertTrue(ApcomplexMath.abs(p.subtract(reference)).compareTo(error) <= 0, out + " reference " + reference);
    }

    @Property(tries = 2)
    void boxDigitsAreWithinTheStatedError(@ForAll @IntRange(min = 5, max = 15) int re, @ForAll @IntRange(min = 3, max = 9) int im,
                                          @ForAll @IntRange(min = 5, max = 8) int digits) {
        boxWithinItsError(re, im, digits);
    }

    @Property(tries = 8)
    @Tag("slow")
    void boxDigitsAreWithinTheStatedErrorAtMoreDigits(@ForAll @IntRange(min = 4, max = 16) int re, @ForAll @IntRange(min = 2, max = 10) int im,
                                                      @ForAll @IntRange(min = 8, max = 16) int digits) {
        boxWithinItsError(re, im, digits);
    }
}
