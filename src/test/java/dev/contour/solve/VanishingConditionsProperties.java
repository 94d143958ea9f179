package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * The vanishing conditions of a factored term (TermConditions.vanish): the one-variable fast path
 * gives exactly the general expansion's keys and values, and the conditions are linear functionals,
 * so a function written as one term and as a sum of differently factored terms gives the same
 * equations (the answer planted by construction: f1 + f2 - (f1 + f2) has every condition zero).
 */
class VanishingConditionsProperties {
    private static final List<String> ONE_VAR = List.of("t");
    private static final List<String> TWO_VARS = List.of("s", "t");

    @Property(tries = 300)
    void oneVariableFastPathMatchesTheGeneralExpansion(@ForAll("seeds") long seed) {
        Random rnd = new Random(seed);
        FactoredTerm term = randomUnivariate(rnd);
        Map<Object, Rational> fast = new HashMap<>();
        TermConditions.vanish(ONE_VAR, term, "root", (k, v) -> fast.merge(k, v, Rational::add));
        Map<Object, Rational> general = new HashMap<>();
        TermConditions.vanishByExpansion(ONE_VAR, term, "root", (k, v) -> general.merge(k, v, Rational::add));
        assertEquals(nonZero(general), nonZero(fast), term.toString());
    }

    @Property(tries = 120)
    void conditionsAreLinearAcrossFactorisations(@ForAll("seeds") long seed) {
        Random rnd = new Random(seed);
        boolean two = rnd.nextBoolean();
        List<String> vars = two ? TWO_VARS : ONE_VAR;
        Polynomial den = Polynomial.ONE;
        int poles = 1 + rnd.nextInt(3);
        for (int i = 0; i < poles; i++) {
            den = den.multiply(randomLine(rnd, two).pow(1 + rnd.nextInt(2)));
        }
        Polynomial p1 = randomPolynomial(rnd, two);
        Polynomial p2 = randomPolynomial(rnd, two);
        if (rnd.nextBoolean()) {
            // a numerator that vanishes on a pole line exercises the higher Taylor orders there
            p2 = p2.multiply(randomLine(rnd, two));
        }
        RationalFunction f1 = RationalFunction.of(p1, den);
        RationalFunction f2 = RationalFunction.of(p2, den.multiply(rnd.nextBoolean() ? randomLine(rnd, two) : Polynomial.ONE));
        RationalFunction whole = f1.add(f2);
        Map<Object, Rational> acc = new HashMap<>();
        int[] count = {0};
        for (RationalFunction f : List.of(f1, f2, whole.negate())) {
            // numerators split into linear factors or kept whole: the same function, the same conditions
            FactoredTerm t = rnd.nextBoolean() ? Piece.factored(f, vars) : Piece.withWholeNumerator(f, vars);
            if (t != null) {
                TermConditions.vanish(vars, t, "root", (k, v) -> {
                    count[0]++;
                    acc.merge(k, v, Rational::add);
                });
            }
        }
        assertTrue(count[0] > 0, "no condition was produced");
        assertEquals(Map.of(), nonZero(acc), "f1 = " + f1 + ", f2 = " + f2);
    }

    @Provide
    Arbitrary<Long> seeds() {
        return Arbitraries.longs();
    }

    private static FactoredTerm randomUnivariate(Random rnd) {
        int k = rnd.nextInt(4);
        List<LinearForm> forms = new java.util.ArrayList<>();
        List<Integer> exps = new java.util.ArrayList<>();
        java.util.Set<Rational> used = new java.util.HashSet<>();
        for (int i = 0; i < k; i++) {
            Rational a = Rational.of(rnd.nextInt(13) - 6, 1 + rnd.nextInt(3));
            if (used.add(a)) {
                forms.add(new LinearForm(a, new Rational[] {Rational.ONE}));
                int e = rnd.nextInt(7) - 4;
                exps.add(e == 0 ? -1 : e);
            }
        }
        Polynomial cof = null;
        if (rnd.nextInt(3) > 0) {
            // any polynomial, possibly vanishing at a pole (restrictions of cofactors to lines do)
            cof = randomPolynomial(rnd, false);
            if (rnd.nextBoolean() && !forms.isEmpty()) {
                cof = cof.multiply(forms.get(0).toPolynomial(ONE_VAR));
            }
        }
        FactoredTerm t = FactoredTerm.of(Rational.of(rnd.nextInt(9) - 4, 1 + rnd.nextInt(4)), forms, exps, cof);
        return t != null ? t : FactoredTerm.of(Rational.ONE, forms, exps, null);
    }

    private static Polynomial randomLine(Random rnd, boolean two) {
        Polynomial t = Polynomial.variable("t");
        Polynomial c = Polynomial.constant(Rational.of(2 * (rnd.nextInt(7) - 3)));
        if (!two) {
            return t.add(c);
        }
        Polynomial s = Polynomial.variable("s");
        return switch (rnd.nextInt(3)) {
            case 0 -> s.add(c);
            case 1 -> t.add(c);
            default -> s.add(t).add(c);
        };
    }

    private static Polynomial randomPolynomial(Random rnd, boolean two) {
        Polynomial p = Polynomial.ZERO;
        int d = rnd.nextInt(5);
        for (int i = 0; i <= d; i++) {
            for (int j = 0; j <= (two ? d - i : 0); j++) {
                if (rnd.nextInt(3) > 0) {
                    Polynomial m = Polynomial.constant(Rational.of(rnd.nextInt(11) - 5, 1 + rnd.nextInt(2)))
                            .multiply(Polynomial.variable("t").pow(i));
                    p = p.add(two ? m.multiply(Polynomial.variable("s").pow(j)) : m);
                }
            }
        }
        return p.isZero() ? Polynomial.ONE : p;
    }

    private static Map<Object, Rational> nonZero(Map<Object, Rational> m) {
        Map<Object, Rational> out = new HashMap<>(m);
        out.values().removeIf(Rational::isZero);
        return out;
    }
}
