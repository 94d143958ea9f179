package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigInteger;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/** The product algorithms (merge, packed table, Kronecker substitution) against a term-by-term sum. */
class ProductAlgorithmsTest {
    @Provide
    Arbitrary<Polynomial> bigPolys() {
        Arbitrary<Rational> coefficient = Arbitraries.oneOf(
                Combinators.combine(Arbitraries.integers().between(-9, 9), Arbitraries.integers().between(1, 4)).as(Rational::of),
                Arbitraries.bigIntegers().between(BigInteger.TEN.pow(30).negate(), BigInteger.TEN.pow(30)).map(Rational::of));
        Arbitrary<Polynomial> term = Combinators.combine(coefficient, Arbitraries.integers().between(0, 9),
                Arbitraries.integers().between(0, 9), Arbitraries.integers().between(0, 2))
                .as((c, i, j, k) -> Polynomial.monomial(c, java.util.Map.of("s", i, "t", j, "u", k)));
        return term.list().ofMinSize(1).ofMaxSize(60).map(ts -> ts.stream().reduce(Polynomial.ZERO, Polynomial::add));
    }

    private static Polynomial termByTerm(Polynomial a, Polynomial b) {
        Polynomial out = Polynomial.ZERO;
        for (Polynomial.Term t : b.terms()) {
            out = out.add(a.multiply(Polynomial.monomial(t.coefficient(), t.exponents())));
        }
        return out;
    }

    @Property(tries = 150)
    void allProductPathsAgree(@ForAll("bigPolys") Polynomial a, @ForAll("bigPolys") Polynomial b) {
        Polynomial expected = termByTerm(a, b);
        assertEquals(expected, a.multiply(b));
        if (!a.isZero() && !b.isZero()) {
            String[] u = Polynomial.unionVars(a.vars, b.vars);
            assertEquals(expected, KroneckerProduct.multiply(u, a.expsOver(u), a.coeffs, b.expsOver(u), b.coeffs));
        }
    }
}
