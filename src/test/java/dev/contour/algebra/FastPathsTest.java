package dev.contour.algebra;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * The shortcuts taken for large ansatz sums (division by a linear form straight into the factored
 * denominator, linear substitution over linear factors, coefficient scaling, one-term products,
 * monomial merging, allocation-free polynomial order) give exactly the values of the plain paths.
 */
class FastPathsTest {
    @Provide
    Arbitrary<RationalFunction> fns() {
        return Gen.rationalFunctions();
    }

    /** Linear forms, sometimes scaled by a rational (so equal factors arrive with different contents). */
    @Provide
    Arbitrary<List<Polynomial>> forms() {
        Arbitrary<Polynomial> scaled = Combinators.combine(Gen.linearForms(),
                Arbitraries.of(Rational.ONE, Rational.MINUS_ONE, Rational.of(2), Rational.of(-3, 2)))
                .as(Polynomial::multiply);
        return scaled.list().ofMinSize(1).ofMaxSize(4);
    }

    /** Substitutions of linear forms (or constants) for some of s, t, u: invertible or not. */
    @Provide
    Arbitrary<Map<String, Polynomial>> linearMaps() {
        Arbitrary<Polynomial> value = Arbitraries.oneOf(Gen.linearForms(),
                Arbitraries.integers().between(-3, 3).map(Polynomial::constant));
        return Combinators.combine(value.injectNull(0.3), value.injectNull(0.3), value.injectNull(0.5)).as((a, b, c) -> {
            Map<String, Polynomial> m = new HashMap<>();
            if (a != null) {
                m.put("s", a);
            }
            if (b != null) {
                m.put("t", b);
            }
            if (c != null) {
                m.put("u", c);
            }
            return m;
        });
    }

    @Provide
    Arbitrary<Expression> exprs() {
        Arbitrary<Expression> term = Combinators.combine(Gen.rationalFunctions(), Arbitraries.integers().between(-1, 2),
                Arbitraries.integers().between(0, 2), Arbitraries.integers().between(0, 1))
                .as((c, i, j, k) -> Expression.of(Map.of(Monomial.of(Map.of("sigma", i, "tau", j, "a[0,1]", k)), c)));
        return term.list().ofMaxSize(3).map(ts -> ts.stream().reduce(Expression.ZERO, Expression::add));
    }

    private static Polynomial product(List<Polynomial> fs) {
        return fs.stream().reduce(Polynomial.ONE, Polynomial::multiply);
    }

    @Property(tries = 200)
    void dividingByLinearFormsOneByOneEqualsDividingByTheirExpandedProduct(@ForAll("fns") RationalFunction f,
            @ForAll("forms") List<Polynomial> ls) {
        // A dividend that shares the first form, so that it cancels.
        for (RationalFunction a : List.of(f, f.multiply(RationalFunction.of(ls.get(0))))) {
            RationalFunction stepwise = a;
            for (Polynomial l : ls) {
                stepwise = stepwise.divide(RationalFunction.of(l));
                assertTrue(stepwise.isCanonical(), "not canonical: " + stepwise);
            }
            Polynomial p = product(ls);
            assertEquals(a.multiply(RationalFunction.of(p).inverse()), stepwise);
            assertEquals(RationalFunction.of(a.numerator(), a.denominator().multiply(p)), stepwise);
            assertEquals(stepwise.toString(), RationalFunction.of(a.numerator(), a.denominator().multiply(p)).toString());
        }
    }

    @Property(tries = 120)
    void expressionsDividedByLinearFormsMatchThePlainPath(@ForAll("exprs") Expression e, @ForAll("forms") List<Polynomial> ls) {
        Expression stepwise = e;
        for (Polynomial l : ls) {
            stepwise = stepwise.divide(Expression.of(RationalFunction.of(l)));
        }
        assertTrue(stepwise.isCanonical(), "not canonical: " + stepwise);
        RationalFunction inverse = RationalFunction.of(Polynomial.ONE, product(ls));
        assertEquals(naiveProduct(e, Expression.of(inverse)), stepwise);
    }

    @Property(tries = 120)
    void productsMatchTheTermByTermDefinition(@ForAll("exprs") Expression a, @ForAll("exprs") Expression b,
            @ForAll("fns") RationalFunction c) {
        Expression r = Expression.of(c);
        for (Expression[] xy : List.of(new Expression[] {a, b}, new Expression[] {a, r}, new Expression[] {r, b},
                new Expression[] {single(a), single(b)})) {
            Expression p = xy[0].multiply(xy[1]);
            assertTrue(p.isCanonical(), "not canonical: " + p);
            assertEquals(naiveProduct(xy[0], xy[1]), p);
        }
        if (!c.isZero()) {
            assertEquals(naiveProduct(a, Expression.of(c.inverse())), a.divide(r));
        }
    }

    @Test
    void anInnerNameMetAsCollectedIsStillExpanded() {
        // The one-term shortcut must leave a name conflict to the general path.
        Expression sigma = Expression.collectedVariable("sigma");
        Expression inner = Expression.variable("sigma").multiply(Expression.variable("s"));
        Expression p = inner.multiply(sigma);
        assertTrue(p.isCanonical());
        assertEquals(sigma.pow(2).multiply(Expression.variable("s")), p);
        assertEquals(Expression.variable("s"), inner.divide(sigma));
    }

    /** The first term of e alone (zero stays zero). */
    private static Expression single(Expression e) {
        return e.isZero() ? e : Expression.of(Map.of(e.terms().firstKey(), e.terms().get(e.terms().firstKey())));
    }

    /** The product from its definition: every pair of terms, collected through the public constructor. */
    private static Expression naiveProduct(Expression a, Expression b) {
        Map<Monomial, RationalFunction> out = new HashMap<>();
        for (Map.Entry<Monomial, RationalFunction> x : a.terms().entrySet()) {
            for (Map.Entry<Monomial, RationalFunction> y : b.terms().entrySet()) {
                out.merge(x.getKey().multiply(y.getKey()), x.getValue().multiply(y.getValue()), RationalFunction::add);
            }
        }
        return Expression.of(out);
    }

    @Property(tries = 200)
    void linearSubstitutionEqualsSubstitutingNumeratorAndDenominator(@ForAll("fns") RationalFunction f,
            @ForAll("linearMaps") Map<String, Polynomial> m) {
        Polynomial den = f.denominator().substitute(m);
        if (den.isZero()) {
            assertThrows(ContourException.class, () -> f.substituteLinear(m));
            return;
        }
        RationalFunction image = f.substituteLinear(m);
        assertTrue(image.isCanonical(), "not canonical: " + image);
        assertEquals(RationalFunction.of(f.numerator().substitute(m), den), image);
    }

    @Property(tries = 100)
    void expressionSubstitutionIsCoefficientwise(@ForAll("exprs") Expression e, @ForAll("linearMaps") Map<String, Polynomial> m) {
        Map<Monomial, RationalFunction> expected = new TreeMap<>();
        try {
            for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
                RationalFunction c = t.getValue();
                expected.put(t.getKey(), RationalFunction.of(c.numerator().substitute(m), c.denominator().substitute(m)));
            }
        } catch (ContourException vanished) {
            assertThrows(ContourException.class, () -> e.substituteLinear(m));
            return;
        }
        Expression image = e.substituteLinear(m);
        assertTrue(image.isCanonical(), "not canonical: " + image);
        assertEquals(Expression.of(expected), image);
    }

    @Property(tries = 200)
    void monomialProductsAddExponents(@ForAll("exponents") Map<String, Integer> x, @ForAll("exponents") Map<String, Integer> y) {
        Map<String, Integer> sum = new HashMap<>(x);
        y.forEach((k, v) -> sum.merge(k, v, Integer::sum));
        Monomial p = Monomial.of(x).multiply(Monomial.of(y));
        assertEquals(Monomial.of(sum), p);
        assertEquals(Monomial.of(sum).hashCode(), p.hashCode());
        assertEquals(Monomial.of(sum).toString(), p.toString());
    }

    @Provide
    Arbitrary<Map<String, Integer>> exponents() {
        return Arbitraries.maps(Arbitraries.of("a[0,0]", "a[1,0]", "sigma", "tau"), Arbitraries.integers().between(-2, 2)).ofMaxSize(4);
    }

    @Property(tries = 300)
    void polynomialOrderEqualsTheOrderOverTheUnionOfVariables(@ForAll("polys") Polynomial a, @ForAll("polys") Polynomial b) {
        String[] u = Polynomial.unionVars(a.vars, b.vars);
        int[][] x = a.expsOver(u);
        int[][] y = b.expsOver(u);
        int expected = 0;
        for (int i = 0; i < Math.min(x.length, y.length) && expected == 0; i++) {
            expected = Polynomial.compareExponents(x[i], y[i]);
            if (expected == 0) {
                expected = a.coeffs[i].compareTo(b.coeffs[i]);
            }
        }
        if (expected == 0) {
            expected = Integer.compare(x.length, y.length);
        }
        assertEquals(Integer.signum(expected), Integer.signum(a.compareTo(b)));
        assertEquals(-Integer.signum(a.compareTo(b)), Integer.signum(b.compareTo(a)));
        assertEquals(a.equals(b), a.compareTo(b) == 0);
        java.util.TreeSet<String> names = new java.util.TreeSet<>(a.variables());
        names.addAll(b.variables());
        assertEquals(List.copyOf(names), List.of(u));
    }

    @Property(tries = 200)
    void addingAConstantEqualsTheGeneralSum(@ForAll("polys") Polynomial p, @ForAll("rationals") Rational c) {
        // Reference: both sides times a fresh variable w, so the addition takes the general merge, then w divided out.
        Polynomial w = Polynomial.variable("w");
        Polynomial expected = p.multiply(w).add(Polynomial.constant(c).multiply(w)).divideExact(w);
        for (Polynomial sum : List.of(p.add(Polynomial.constant(c)), Polynomial.constant(c).add(p))) {
            assertEquals(expected, sum);
            assertEquals(expected.hashCode(), sum.hashCode());
            assertEquals(expected.toString(), sum.toString());
            assertEquals(expected.variables(), sum.variables());
        }
    }

    /** Reference for substitution: every term expanded on its own, the value's powers by repeated products. */
    private static Polynomial termByTerm(Polynomial p, String x, Polynomial value) {
        Polynomial sum = Polynomial.ZERO;
        for (int t = 0; t < p.coeffs.length; t++) {
            Polynomial term = Polynomial.constant(p.coeffs[t]);
            for (int v = 0; v < p.vars.length; v++) {
                Polynomial base = p.vars[v].equals(x) ? value : Polynomial.variable(p.vars[v]);
                for (int k = 0; k < p.exps[t][v]; k++) {
                    term = term.multiply(base);
                }
            }
            sum = sum.add(term);
        }
        return sum;
    }

    @Property(tries = 300)
    void oneVariableReplacedByAnAffineValueEqualsTermByTermExpansion(@ForAll("polys") Polynomial p,
            @ForAll("affineValues") Polynomial value, @ForAll("variableNames") String x) {
        Polynomial image = p.substitute(Map.of(x, value));
        assertEquals(termByTerm(p, x, value), image);
        assertEquals(termByTerm(p, x, value).toString(), image.toString());
        assertEquals(termByTerm(p, x, value).variables(), image.variables());
    }

    @Property(tries = 300)
    void theCoefficientOfOnePowerIsTheDenseArraysEntry(@ForAll("polys") Polynomial p, @ForAll("variableNames") String x,
            @ForAll("smallPowers") int k) {
        Polynomial[] dense = p.coefficientsIn(x);
        Polynomial expected = k < dense.length ? dense[k] : Polynomial.ZERO;
        assertEquals(expected, p.coefficient(x, k));
        assertEquals(expected.toString(), p.coefficient(x, k).toString());
        // and p is the sum of its coefficients times the powers of x
        Polynomial back = Polynomial.ZERO;
        for (int j = 0; j < dense.length; j++) {
            back = back.add(p.coefficient(x, j).multiply(Polynomial.variable(x).pow(j)));
        }
        assertEquals(p, back);
    }

    @Property(tries = 300)
    void theFirstPoleOfAResidueIsTheOneOfTheBuiltResidue(@ForAll("fns") RationalFunction f, @ForAll("forms") List<Polynomial> ls) {
        // f over a product of forms: take the residue in s at each simple pole mentioning s.
        RationalFunction g = f;
        for (Polynomial l : ls) {
            g = g.divide(RationalFunction.of(l));
        }
        for (LinearFactors.Factor d : g.denominatorFactors()) {
            Polynomial l = d.base();
            if (d.multiplicity() != 1 || l.degree("s") != 1 || l.totalDegree() != 1) {
                continue;
            }
            Rational lambda = l.coefficient("s", 1).constantValue();
            Polynomial at = l.coefficient("s", 0).multiply(lambda.inverse()).negate();
            RationalFunction residue = g.multiply(RationalFunction.of(l)).substituteLinear(Map.of("s", at));
            for (java.util.function.Predicate<Polynomial> relevant : List.<java.util.function.Predicate<Polynomial>>of(
                    q -> q.variables().contains("t"), q -> q.variables().contains("u"), q -> true)) {
                Polynomial expected = null;
                for (LinearFactors.Factor r : residue.denominatorFactors()) {
                    if (relevant.test(r.base())) {
                        expected = r.base();
                        break;
                    }
                }
                assertEquals(expected, g.firstResiduePole("s", l, at, relevant), "residue " + residue + " of " + g + " at " + l);
            }
        }
    }

    @Provide
    Arbitrary<Polynomial> affineValues() {
        return Arbitraries.oneOf(Gen.linearForms(), Gen.rationals().map(Polynomial::constant),
                Gen.linearForms().map(l -> l.substitute(Map.of("u", Polynomial.variable("w")))));
    }

    @Provide
    Arbitrary<String> variableNames() {
        return Arbitraries.of("s", "t", "u", "w");
    }

    @Provide
    Arbitrary<Integer> smallPowers() {
        return Arbitraries.integers().between(0, 4);
    }

    @Provide
    Arbitrary<Rational> rationals() {
        return Gen.rationals();
    }

    @Provide
    Arbitrary<Polynomial> polys() {
        return Arbitraries.oneOf(Gen.polynomials(3, 2), Gen.linearForms(),
                Gen.linearForms().map(l -> l.substitute(Map.of("u", Polynomial.variable("w")))));
    }
}
