package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * One unknown's share of a constrained expression: the known function it multiplies, as factored
 * terms per collected monomial (column -1 is the part free of unknowns).
 *
 * <p>Constraints are linear, so they are applied piece by piece and summed; no expression with
 * symbolic unknowns is ever built.
 */
public final class Piece {
    final int column;
    final List<Monomial> monomials;
    final List<FactoredTerm> terms;

    Piece(int column, List<Monomial> monomials, List<FactoredTerm> terms) {
        this.column = column;
        this.monomials = monomials;
        this.terms = terms;
    }

    /** A piece from collected monomials and their rational-function coefficients over vars. */
    static Piece of(int column, Map<Monomial, RationalFunction> terms, List<String> vars) {
        return of(column, terms, vars, true);
    }

    /**
     * A piece whose numerators are split into linear factors only when asked: the vanishing
     * condition reads every numerator through its Taylor and ray expansions, which take any
     * polynomial, while the search for linear factors of a large numerator that has none costs more
     * than all of that expansion (residue conditions do use the factors).
     */
    static Piece of(int column, Map<Monomial, RationalFunction> terms, List<String> vars, boolean splitNumerators) {
        List<Monomial> ms = new ArrayList<>();
        List<FactoredTerm> ts = new ArrayList<>();
        terms.forEach((m, f) -> {
            FactoredTerm t = splitNumerators ? factored(f, vars) : withWholeNumerator(f, vars);
            if (t != null) {
                ms.add(m);
                ts.add(t);
            }
        });
        return new Piece(column, ms, ts);
    }

    /** The rational function as one factored term whose cofactor is the whole numerator. */
    static FactoredTerm withWholeNumerator(RationalFunction f, List<String> vars) {
        if (f.isZero()) {
            return null;
        }
        List<LinearForm> forms = new ArrayList<>();
        List<Integer> exps = new ArrayList<>();
        denominatorForms(f, vars, forms, exps);
        Polynomial num = f.numerator();
        for (String v : num.variables()) {
            if (!vars.contains(v)) {
                throw new ContourException("variable " + v + " is not among " + vars);
            }
        }
        return num.isConstant() ? FactoredTerm.of(num.constantValue(), forms, exps, null) : FactoredTerm.of(Rational.ONE, forms, exps, num);
    }

    private static void denominatorForms(RationalFunction f, List<String> vars, List<LinearForm> forms, List<Integer> exps) {
        for (LinearFactors.Factor d : f.denominatorFactors()) {
            if (d.base().totalDegree() != 1) {
                throw new ContourException("the denominator factor " + d.base()
                        + " is not linear: pole and residue constraints need denominators that split into linear factors");
            }
            forms.add(LinearForm.of(d.base(), vars));
            exps.add(-d.multiplicity());
        }
    }

    /** The rational function as one factored term; its denominator must split into linear factors. */
    static FactoredTerm factored(RationalFunction f, List<String> vars) {
        if (f.isZero()) {
            return null;
        }
        List<LinearForm> forms = new ArrayList<>();
        List<Integer> exps = new ArrayList<>();
        denominatorForms(f, vars, forms, exps);
        LinearFactors.Split num = LinearFactors.split(f.numerator());
        for (LinearFactors.Factor n : num.factors()) {
            forms.add(LinearForm.of(n.base(), vars));
            exps.add(n.multiplicity());
        }
        Polynomial cof = num.cofactor();
        for (String v : cof.variables()) {
            if (!vars.contains(v)) {
                throw new ContourException("variable " + v + " is not among " + vars);
            }
        }
        return FactoredTerm.of(num.unit(), forms, exps, cof.isConstant() ? null : cof);
    }

}
