package dev.contour.algebra;

import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;

/** Random generators shared by the algebra property tests. */
final class Gen {
    private Gen() { }

    static final List<String> VARS = List.of("s", "t", "u");

    static Arbitrary<Rational> rationals() {
        return Combinators.combine(Arbitraries.integers().between(-20, 20), Arbitraries.integers().between(1, 6))
                .as((n, d) -> Rational.of(n, d));
    }

    static Arbitrary<Polynomial> term(int maxExp) {
        return Combinators.combine(rationals(), Arbitraries.integers().between(0, maxExp),
                Arbitraries.integers().between(0, maxExp), Arbitraries.integers().between(0, maxExp))
                .as((c, a, b, e) -> Polynomial.monomial(c, Map.of("s", a, "t", b, "u", e)));
    }

    /** Sparse polynomials in s, t, u with small coefficients and degrees. */
    static Arbitrary<Polynomial> polynomials(int maxTerms, int maxExp) {
        return term(maxExp).list().ofMinSize(0).ofMaxSize(maxTerms)
                .map(ts -> ts.stream().reduce(Polynomial.ZERO, Polynomial::add));
    }

    static Arbitrary<Polynomial> nonZeroPolynomials(int maxTerms, int maxExp) {
        return polynomials(maxTerms, maxExp).filter(p -> !p.isZero());
    }

    /** Linear forms a*s + b*t + c*u + d with small integers, non-constant. */
    static Arbitrary<Polynomial> linearForms() {
        return Combinators.combine(Arbitraries.integers().between(-2, 2), Arbitraries.integers().between(-2, 2),
                Arbitraries.integers().between(-1, 1), Arbitraries.integers().between(-8, 8))
                .as((a, b, c, d) -> Polynomial.variable("s").multiply(Rational.of(a))
                        .add(Polynomial.variable("t").multiply(Rational.of(b)))
                        .add(Polynomial.variable("u").multiply(Rational.of(c)))
                        .add(Polynomial.constant(d)))
                .filter(p -> !p.isConstant());
    }

    /** Rational functions whose denominators are products of linear forms and sometimes a non-linear factor. */
    static Arbitrary<RationalFunction> rationalFunctions() {
        Arbitrary<Polynomial> den = Combinators.combine(linearForms().list().ofMaxSize(3), Arbitraries.integers().between(0, 4))
                .as((ls, k) -> {
                    Polynomial d = ls.stream().reduce(Polynomial.ONE, Polynomial::multiply);
                    // k == 0: add an irreducible quadratic so the cofactor path is exercised too
                    return k == 0 ? d.multiply(Polynomial.variable("s").pow(2).add(Polynomial.variable("t").pow(2))
                            .add(Polynomial.ONE)) : d;
                });
        return Combinators.combine(polynomials(4, 2), den).as(RationalFunction::of);
    }

    static Arbitrary<Map<String, Rational>> points() {
        Arbitrary<Rational> r = Combinators.combine(Arbitraries.integers().between(-1000, 1000), Arbitraries.integers().between(1, 97))
                .as((n, d) -> Rational.of(n, d));
        return Combinators.combine(r, r, r).as((a, b, c) -> Map.of("s", a, "t", b, "u", c));
    }
}
