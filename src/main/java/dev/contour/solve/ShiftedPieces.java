package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.algebra.ShiftedSum;
import java.lang.ref.SoftReference;
import java.lang.ref.WeakReference;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.atomic.AtomicReferenceArray;

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
    /** Pieces already computed (pieces are immutable; a second condition on the same sum reuses them). */
    private final AtomicReferenceArray<Piece> built;

    private ShiftedPieces(List<String> vars, List<Integer> columns, List<Expression> argumentPieces, List<Block> blocks) {
        this.vars = vars;
        this.columns = columns;
        this.argumentPieces = argumentPieces;
        this.blocks = blocks;
        this.built = new AtomicReferenceArray<>(columns.size());
    }

    /**
     * The pieces of the sum, or null when it does not have the shape this path needs (unknowns in
     * an operator coefficient, or a denominator that does not split into linear factors); the
     * caller then uses the collected value.
     */
    static ShiftedPieces of(ShiftedSum sum, List<String> unknowns, Set<String> extra) {
        LastBuilt last = lastBuilt.get();
        if (last != null && last.sum.get() == sum && last.unknowns.equals(unknowns) && last.extra.equals(extra)) {
            return last.pieces;
        }
        ShiftedPieces built = build(sum, unknowns, extra);
        if (built != null) {
            lastBuilt = new SoftReference<>(new LastBuilt(new WeakReference<>(sum), List.copyOf(unknowns), Set.copyOf(extra), built));
        }
        return built;
    }

    /**
     * The pieces built last, for the same operator application under the next condition: a solve
     * usually puts several conditions (residues, pole places) on one {@code E(M)}, and factoring the
     * operator's coefficients and splitting M by unknown is the same work for each. One entry,
     * softly held, so memory stays bounded; the sum is compared by identity (values are immutable).
     */
    private record LastBuilt(WeakReference<ShiftedSum> sum, List<String> unknowns, Set<String> extra, ShiftedPieces pieces) { }

    private static volatile SoftReference<LastBuilt> lastBuilt = new SoftReference<>(null);

    private static ShiftedPieces build(ShiftedSum sum, List<String> unknowns, Set<String> extra) {
        if (!sum.coefficientsFreeOf(Set.copyOf(unknowns)) || !linearDenominators(sum.argument())
                || !sum.blocks().stream().allMatch(b -> linearDenominators(b.coefficient()))) {
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
                Cancellation.check();
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
            Cancellation.check();
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
        return piece(i, true);
    }

    /**
     * Kept pieces stay for the next condition; a piece asked for the last time is handed out and
     * forgotten (at p = 512 the pieces of one application are over 300 MB the collector would
     * otherwise keep tracing while the equations are built).
     */
    @Override
    public Piece piece(int i, boolean keep) {
        if (!keep) {
            Piece done = built.getAndSet(i, null);
            return done != null ? done : compute(i);
        }
        Piece done = built.get(i);
        if (done == null) {
            done = compute(i);
            built.set(i, done);
        }
        return done;
    }

    private Piece compute(int i) {
        List<Monomial> ms = new ArrayList<>();
        List<FactoredTerm> ts = new ArrayList<>();
        argumentPieces.get(i).terms().forEach((ym, yf) -> {
            FactoredTerm y = Piece.factored(yf, vars);
            if (y == null) {
                return;
            }
            for (Block b : blocks) {
                FactoredTerm moved = y.translated(b.amounts, b.substitution);
                for (int j = 0; j < b.terms.size(); j++) {
                    FactoredTerm t = b.terms.get(j).times(moved);
                    if (t != null) {
                        ms.add(b.monomials.get(j).multiply(ym));
                        ts.add(t);
                    }
                }
            }
        });
        return new Piece(columns.get(i), ms, ts);
    }
}
