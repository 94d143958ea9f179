package dev.contour.solve;

import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.algebra.ShiftedSum;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * The pieces of a shift operator applied to an ansatz, {@code sum_k c_k * f(v + a_k)}, read off
 * without collecting it: for every unknown, each operator coefficient term times each of the
 * unknown's terms in f, shifted. Both factors are products of linear forms (Pochhammer symbols,
 * pole factors), so each product is one {@link FactoredTerm} found by concatenating forms; shifting
 * a factored term only moves the constants of its forms.
 *
 * <p>The equations are those of the collected expression: every condition is linear, and the
 * contributions of terms sharing a monomial are summed under the same equation keys.
 */
final class ShiftedPieces implements Constraint.PieceSource {
    /** One operator term: its shift (per variable position) and its coefficient's collected terms, factored. */
    private record Block(Rational[] amounts, Map<String, Polynomial> substitution, List<Monomial> monomials,
                         List<FactoredTerm> terms) { }

    private final List<String> vars;
    private final List<Integer> columns;
    private final List<Expression> argumentPieces;
    private final List<Block> blocks;

    private ShiftedPieces(List<String> vars, List<Integer> columns, List<Expression> argumentPieces, List<Block> blocks) {
        this.vars = vars;
        this.columns = columns;
        this.argumentPieces = argumentPieces;
        this.blocks = blocks;
    }

    /**
     * The pieces of the sum, or null when it does not have the shape this path needs (unknowns in
     * an operator coefficient, or a denominator that does not split into linear factors); the
     * caller then uses the collected value.
     */
    static ShiftedPieces of(ShiftedSum sum, List<String> unknowns, Set<String> extra) {
        Set<String> unknownSet = Set.copyOf(unknowns);
        for (ShiftedSum.Block b : sum.blocks()) {
            if (!b.coefficient().collectedVariables().stream().noneMatch(unknownSet::contains)
                    || !linearDenominators(b.coefficient())) {
                return null;
            }
        }
        if (!linearDenominators(sum.argument())) {
            return null;
        }
        TreeSet<String> names = new TreeSet<>(extra);
        names.addAll(sum.innerVariables());
        List<String> vars = List.copyOf(names);
        List<Block> blocks = new ArrayList<>();
        for (ShiftedSum.Block b : sum.blocks()) {
            Rational[] amounts = new Rational[vars.size()];
            for (int i = 0; i < amounts.length; i++) {
                amounts[i] = b.shift().getOrDefault(vars.get(i), Rational.ZERO);
            }
            List<Monomial> ms = new ArrayList<>();
            List<FactoredTerm> ts = new ArrayList<>();
            b.coefficient().terms().forEach((m, f) -> {
                FactoredTerm t = Piece.factored(f, vars);
                if (t != null) {
                    ms.add(m);
                    ts.add(t);
                }
            });
            blocks.add(new Block(amounts, b.substitution(), ms, ts));
        }
        Map<Integer, Expression> parts = Constraint.pieceExpressions(sum.argument(), unknowns);
        return new ShiftedPieces(vars, new ArrayList<>(parts.keySet()), new ArrayList<>(parts.values()), blocks);
    }

    private static boolean linearDenominators(Expression e) {
        for (RationalFunction f : e.terms().values()) {
            for (LinearFactors.Factor d : f.denominatorFactors()) {
                if (d.base().totalDegree() != 1) {
                    return false;
                }
            }
        }
        return true;
    }

    @Override
    public List<String> variables() {
        return vars;
    }

    @Override
    public int count() {
        return columns.size();
    }

    @Override
    public Piece piece(int i) {
        List<Monomial> ms = new ArrayList<>();
        List<FactoredTerm> ts = new ArrayList<>();
        Map<Monomial, Monomial> products = new HashMap<>();
        argumentPieces.get(i).terms().forEach((ym, yf) -> {
            FactoredTerm y = Piece.factored(yf, vars);
            if (y == null) {
                return;
            }
            for (Block b : blocks) {
                FactoredTerm moved = shifted(y, b);
                for (int j = 0; j < b.terms.size(); j++) {
                    FactoredTerm t = product(b.terms.get(j), moved);
                    if (t != null) {
                        Monomial m = b.monomials.get(j).multiply(ym);
                        ms.add(products.computeIfAbsent(m, x -> x));
                        ts.add(t);
                    }
                }
            }
        });
        return new Piece(columns.get(i), ms, ts);
    }

    private static FactoredTerm shifted(FactoredTerm y, Block b) {
        LinearForm[] forms = new LinearForm[y.forms.length];
        for (int k = 0; k < forms.length; k++) {
            forms[k] = y.forms[k].translate(b.amounts);
        }
        Polynomial cof = y.cofactor == null || b.substitution.isEmpty() ? y.cofactor : y.cofactor.substitute(b.substitution);
        return FactoredTerm.of(y.coefficient, List.of(forms), asList(y.exps), cof);
    }

    private static FactoredTerm product(FactoredTerm a, FactoredTerm b) {
        List<LinearForm> forms = new ArrayList<>(a.forms.length + b.forms.length);
        forms.addAll(List.of(a.forms));
        forms.addAll(List.of(b.forms));
        List<Integer> exps = new ArrayList<>(forms.size());
        exps.addAll(asList(a.exps));
        exps.addAll(asList(b.exps));
        Polynomial cof = a.cofactor == null ? b.cofactor : b.cofactor == null ? a.cofactor : a.cofactor.multiply(b.cofactor);
        return FactoredTerm.of(a.coefficient.multiply(b.coefficient), forms, exps, cof);
    }

    private static List<Integer> asList(int[] xs) {
        List<Integer> out = new ArrayList<>(xs.length);
        for (int x : xs) {
            out.add(x);
        }
        return out;
    }
}
