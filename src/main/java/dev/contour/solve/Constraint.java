package dev.contour.solve;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.function.IntFunction;
import java.util.function.UnaryOperator;

/**
 * A condition that an expression linear in the unknowns must satisfy, with the source place it was
 * written at (reported when constraints conflict).
 *
 * <p>The expression is held as pieces (see {@link Piece}), either split from an {@link Expression}
 * or produced on demand by a {@link PieceSource} for ansatze too large to hold as one expression.
 */
public final class Constraint {
    /** What must hold. */
    public sealed interface Condition permits Vanishes, PolynomialIn, ResiduesPolynomial, PolesOnlyAt, GrowthAtMost { }

    /** The expression is identically zero. */
    public record Vanishes() implements Condition { }

    /** The expression is a polynomial in these variables. */
    public record PolynomialIn(List<String> variables) implements Condition { }

    /** At each allowed pole the residue is polynomial in the other variables; simple: no higher poles there. */
    public record ResiduesPolynomial(List<Poles> poles, boolean simple) implements Condition { }

    /** Along lines form = c the expression has poles only for c in the allowed set. */
    public record PolesOnlyAt(Poles poles) implements Condition { }

    /** Scaling the variables by beta, the expression grows at most like beta^degree. */
    public record GrowthAtMost(List<String> variables, int degree) implements Condition { }

    /** Pole lines form = c (form linear, such as s or 4p - s - t) at the allowed levels c. */
    public record Poles(String name, Polynomial form, Set<Rational> allowed) {
        public Poles {
            allowed = Set.copyOf(allowed);
        }
    }

    /** Produces the pieces of a large expression one at a time (may be called from several threads). */
    public interface PieceSource {
        /** Inner variables the pieces' coefficients use. */
        List<String> variables();

        int count();

        /** The piece for index i in 0..count-1, built over variables(). */
        Piece piece(int i);

        /**
         * The piece for index i; {@code keep} false says no later condition asks for it, so a source
         * that keeps built pieces for reuse may let this one go (the default just builds it).
         */
        default Piece piece(int i, boolean keep) {
            return piece(i);
        }
    }

    final PieceSource source;
    final Condition condition;
    final Span span;
    final String label;

    private Constraint(PieceSource source, Condition condition, Span span, String label) {
        this.source = source;
        this.condition = condition;
        this.span = span == null ? Span.NONE : span;
        this.label = label;
    }

    public Condition condition() {
        return condition;
    }

    public Span span() {
        return span;
    }

    public String label() {
        return label;
    }

    /** A constraint on an expression linear in the named unknowns. */
    public static Constraint on(Expression target, List<String> unknowns, Condition condition, Span span, String label) {
        return new Constraint(split(List.of(target), unknowns, extraVariables(condition), !(condition instanceof Vanishes)),
                condition, span, label);
    }

    /**
     * A constraint on a value of the language. A shift operator applied to an ansatz is read piece
     * by piece without collecting the sum (see {@link ShiftedPieces}); the collected value is used
     * for anything else, and when the sum has another shape.
     */
    public static Constraint on(dev.contour.eval.ExprValue target, List<String> unknowns, Condition condition,
                                Span span, String label) {
        ShiftedPieces pieces = target.shiftedSum()
                .map(sum -> ShiftedPieces.of(sum, unknowns, extraVariables(condition))).orElse(null);
        return pieces != null ? new Constraint(pieces, condition, span, label)
                : on(target.value(), unknowns, condition, span, label);
    }

    /** Crossing: target equals map(target), where map is linear (a change of variables times monomials). */
    public static Constraint crossing(Expression target, UnaryOperator<Expression> map, List<String> unknowns,
                                      Span span, String label) {
        Map<Integer, Expression> pieces = pieceExpressions(target, unknowns);
        Map<Integer, Expression> diff = new LinkedHashMap<>();
        pieces.forEach((col, e) -> diff.put(col, e.subtract(map.apply(e))));
        return new Constraint(fromExpressions(diff, Set.of(), false), new Vanishes(), span, label);
    }

    /** A constraint on pieces produced by a source (the large-ansatz path). */
    public static Constraint onPieces(PieceSource source, Condition condition, Span span, String label) {
        return new Constraint(source, condition, span, label);
    }

    private static Set<String> extraVariables(Condition c) {
        Set<String> out = new TreeSet<>();
        if (c instanceof PolynomialIn p) {
            out.addAll(p.variables());
        } else if (c instanceof GrowthAtMost g) {
            out.addAll(g.variables());
        } else if (c instanceof ResiduesPolynomial r) {
            r.poles().forEach(p -> out.addAll(p.form().variables()));
        } else if (c instanceof PolesOnlyAt p) {
            out.addAll(p.poles().form().variables());
        }
        return out;
    }

    private static PieceSource split(List<Expression> targets, List<String> unknowns, Set<String> extra, boolean split) {
        Map<Integer, Expression> pieces = new LinkedHashMap<>();
        for (Expression t : targets) {
            pieceExpressions(t, unknowns).forEach((c, e) -> pieces.merge(c, e, Expression::add));
        }
        return fromExpressions(pieces, extra, split);
    }

    /** Splits an expression linear in the unknowns: column to coefficient expression (-1: the rest). */
    static Map<Integer, Expression> pieceExpressions(Expression target, List<String> unknowns) {
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < unknowns.size(); i++) {
            index.put(unknowns.get(i), i);
        }
        Map<Integer, Map<Monomial, RationalFunction>> parts = new TreeMap<>();
        target.terms().forEach((m, f) -> {
            Cancellation.check();
            int col = -1;
            Map<String, Integer> rest = new TreeMap<>();
            for (var e : m.exponents().entrySet()) {
                Integer u = index.get(e.getKey());
                if (u == null) {
                    rest.put(e.getKey(), e.getValue());
                } else if (col >= 0 || e.getValue() != 1) {
                    throw new ContourException("the unknowns must enter linearly, but the term " + m + " is not linear in them");
                } else {
                    col = u;
                }
            }
            parts.computeIfAbsent(col, c -> new LinkedHashMap<>()).merge(Monomial.of(rest), f, RationalFunction::add);
        });
        Map<Integer, Expression> out = new LinkedHashMap<>();
        parts.forEach((c, terms) -> out.put(c, Expression.of(terms)));
        return out;
    }

    /** Pieces of the expressions; numerators are split into linear factors when splitNumerators (see Piece.of). */
    private static PieceSource fromExpressions(Map<Integer, Expression> pieces, Set<String> extra, boolean splitNumerators) {
        TreeSet<String> vars = new TreeSet<>(extra);
        pieces.values().forEach(e -> vars.addAll(e.innerVariables()));
        List<String> varList = List.copyOf(vars);
        List<Integer> cols = new ArrayList<>(pieces.keySet());
        List<Expression> exprs = new ArrayList<>(pieces.values());
        IntFunction<Piece> make = i -> Piece.of(cols.get(i), exprs.get(i).terms(), varList, splitNumerators);
        return new PieceSource() {
            @Override
            public List<String> variables() {
                return varList;
            }

            @Override
            public int count() {
                return cols.size();
            }

            @Override
            public Piece piece(int i) {
                return make.apply(i);
            }
        };
    }
}
