package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.eval.Arguments;
import dev.contour.eval.Builtin;
import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.ExprValue;
import dev.contour.eval.ListValue;
import dev.contour.eval.RangeValue;
import dev.contour.eval.StringValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.mellin.MeasureValue;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.function.Supplier;

/**
 * The language's built-ins from an amplitude to CFT data: small-U expansions, series in z, zbar,
 * conformal blocks, block decompositions and tables; found by the interpreter through
 * {@link java.util.ServiceLoader}.
 */
public final class CftBuiltins implements BuiltinProvider {
    @Override
    public void register(BuiltinRegistry r) {
        r.register(new Builtin("small_u", 2, 2, Set.of("contour", "through", "order", "sides"), false,
                "small_u(M, m, contour: {4/3, 4/3}, through: 6, order: 10, sides: \"channels\"): the exact top-log coefficients of"
                        + " U^a (log U)^k, closing the s-contour on the right, as series in w = 1 - V; with sides: \"channels\" each pole"
                        + " of M takes the side of the measure's Gamma function parallel to it", CftBuiltins::smallU));
        r.register(new Builtin("zseries", 1, 1, Set.of("order", "log", "times_u"), false,
                "zseries(X, order: 20, log: 1, times_u: 2): X (an expression in U, V, or the (log U)^k part of a small-U expansion)"
                        + " times U^times_u as an exact series in z, zbar to that total degree", CftBuiltins::zseries));
        r.register(new Builtin("block", 3, 3, Set.of("order"), false,
                "block(4, Delta, l, order: 20): the conformal block G_(Delta, l) in d = 2, 4 or 6 as a series in z, zbar,"
                        + " normalised as z^((Delta+l)/2) zbar^((Delta-l)/2) (1 + ...)", CftBuiltins::block));
        r.register(new Builtin("decompose", 1, 1, Set.of("d", "twists", "spins"), false,
                "decompose(F, d: 4, twists: 4..12 step 2, spins: 0..8): the exact coefficients of the blocks in the series F and the residual",
                CftBuiltins::decompose));
        r.register(Builtin.of("block_coefficient", 3,
                "block_coefficient(D, twist, spin): one entry of a block table", CftBuiltins::blockCoefficient));
        r.register(Builtin.of("residual", 1, "residual(D): what a decomposition left over, as a z, zbar series", CftBuiltins::residual));
        r.register(Builtin.of("rational_eigenvalues", 1,
                "rational_eigenvalues({{a, b}, {c, d}}): the eigenvalues of a square matrix of numbers, exactly, when all are rational",
                CftBuiltins::rationalEigenvalues));
        r.register(new Builtin("data_table", 1, 1, Set.of("title", "lowest_twist", "spins", "rows"), false,
                "data_table(D, title: \"gamma\", lowest_twist: 8, rows: 0..10, spins: 0..20 step 2): the table with rows n = (twist - lowest_twist)/2",
                CftBuiltins::dataTable));
    }

    private static Value smallU(Arguments a, Span span) {
        if (!(a.get(1) instanceof MeasureValue mv)) {
            throw new ContourException("small_u: the second argument must be a Mellin measure (from mellin_measure), not a "
                    + a.get(1).kind(), a.spanOf(1));
        }
        ExprValue ev = a.expressionValue(0);
        if (!ev.value().isRational() || !ev.value().collectedVariables().isEmpty()) {
            throw new ContourException("small_u: the amplitude must be a rational function of the Mellin variables"
                    + " (take one coefficient in sigma, tau first)", a.spanOf(0));
        }
        Arguments.Argument c = required(a, "contour", span);
        List<Value> cs = c.value() instanceof ListValue l ? l.items() : List.of();
        if (cs.size() != 2) {
            throw new ContourException("small_u: contour is {Re s, Re t}, the contour of position_value", c.span());
        }
        Rational s0 = Values.rational(cs.get(0), c.span(), "small_u: the contour");
        Rational t0 = Values.rational(cs.get(1), c.span(), "small_u: the contour");
        Arguments.Argument th = required(a, "through", span);
        Rational through = Values.rational(th.value(), th.span(), "small_u: through");
        int order = nonNegative(a, "order", span, 1000);
        boolean byChannel = false;
        Optional<Arguments.Argument> sides = a.named("sides");
        if (sides.isPresent()) {
            String v = sides.get().value() instanceof StringValue sv ? sv.value() : "";
            if (!v.equals("channels") && !v.equals("contour")) {
                throw new ContourException("small_u: sides is \"channels\" (each pole of the amplitude on the side of its channel's"
                        + " Gamma function) or \"contour\" (the side of the straight contour, the default)", sides.get().span());
            }
            byChannel = v.equals("channels");
        }
        boolean channels = byChannel;
        return new UExpansionValue(at(span, () -> SmallUExpansion.expand(mv.measure(), ev.value().asRationalFunction(), s0, t0, through, order,
                channels)));
    }

    private static Value zseries(Arguments a, Span span) {
        int order = nonNegative(a, "order", span, DoubleSeries.MAX_ORDER);
        int log = a.named("log").map(x -> Values.integer(x.value(), x.span(), "zseries: log")).orElse(0);
        int shift = a.named("times_u").map(x -> Values.integer(x.value(), x.span(), "zseries: times_u")).orElse(0);
        Value x = a.get(0);
        if (x instanceof UExpansionValue u) {
            return new SeriesValue(at(a.spanOf(0), () -> CrossRatioSeries.of(u.result(), log, shift, order)));
        }
        if (a.named("log").isPresent()) {
            throw new ContourException("zseries: log: applies to a small-U expansion, not to a " + x.kind(), a.named("log").get().span());
        }
        Expression e = a.expression(0);
        return new SeriesValue(at(a.spanOf(0), () -> CrossRatioSeries.of(shift == 0 ? e : multiplyU(e, shift), "U", "V", order)));
    }

    private static Expression multiplyU(Expression e, int k) {
        boolean collected = e.collects("U");
        Expression u = collected ? Expression.collectedVariable("U") : Expression.variable("U");
        return e.multiply(u.pow(k));
    }

    private static Value block(Arguments a, Span span) {
        int d = a.integer(0);
        Rational delta = Values.rational(a.get(1), a.spanOf(1), "block: Delta");
        int spin = a.integer(2);
        int order = nonNegative(a, "order", span, DoubleSeries.MAX_ORDER);
        return new SeriesValue(at(span, () -> ConformalBlocks.block(d, delta, spin, order)));
    }

    private static Value decompose(Arguments a, Span span) {
        if (!(a.get(0) instanceof SeriesValue sv)) {
            throw new ContourException("decompose: the first argument must be a z, zbar series (from zseries), not a " + a.get(0).kind(), a.spanOf(0));
        }
        Arguments.Argument d = required(a, "d", span);
        int dim = Values.integer(d.value(), d.span(), "decompose: d");
        List<Integer> twists = integers(required(a, "twists", span), "decompose: twists");
        List<Integer> spins = integers(required(a, "spins", span), "decompose: spins");
        return new BlockTableValue(BlockTable.of(at(span, () -> BlockDecomposition.decompose(sv.series(), dim, twists, spins))));
    }

    private static Value blockCoefficient(Arguments a, Span span) {
        BlockTable t = BlockTableValue.of(a.get(0), a.spanOf(0), "block_coefficient: the first argument").table();
        int twist = a.integer(1);
        int spin = a.integer(2);
        Rational x = at(span, () -> t.entry(twist, spin));
        if (x == null) {
            throw new ContourException("block_coefficient: the entry for twist " + twist + " and spin " + spin
                    + " is missing (a quotient by zero)", span);
        }
        return new ExprValue(Expression.constant(x));
    }

    private static Value residual(Arguments a, Span span) {
        BlockTable t = BlockTableValue.of(a.get(0), a.spanOf(0), "residual: the argument").table();
        if (t.residual() == null) {
            throw new ContourException("residual: this table did not come straight from decompose, it has no residual", a.spanOf(0));
        }
        return new SeriesValue(t.residual());
    }

    private static Value dataTable(Arguments a, Span span) {
        BlockTable t = BlockTableValue.of(a.get(0), a.spanOf(0), "data_table: the first argument").table();
        String title = null;
        Optional<Arguments.Argument> ti = a.named("title");
        if (ti.isPresent()) {
            if (!(ti.get().value() instanceof StringValue sv)) {
                throw new ContourException("data_table: title must be a string", ti.get().span());
            }
            title = sv.value();
        }
        Integer lowest = a.named("lowest_twist").map(x -> Values.integer(x.value(), x.span(), "data_table: lowest_twist")).orElse(null);
        List<Integer> spins = a.named("spins").isPresent() ? integers(a.named("spins").get(), "data_table: spins") : null;
        List<Integer> rows = a.named("rows").isPresent() ? integers(a.named("rows").get(), "data_table: rows") : null;
        String ft = title;
        return new BlockTableValue(at(span, () -> t.relabel(ft, lowest, spins, rows)));
    }

    private static Value rationalEigenvalues(Arguments a, Span span) {
        if (!(a.get(0) instanceof ListValue rows)) {
            throw new ContourException("rational_eigenvalues: the argument is a matrix written as a list of rows, {{a, b}, {c, d}}, not a "
                    + a.get(0).kind(), a.spanOf(0));
        }
        List<List<Rational>> m = new ArrayList<>();
        for (Value row : rows.items()) {
            if (!(row instanceof ListValue r)) {
                throw new ContourException("rational_eigenvalues: each row must be a list of numbers, not a " + row.kind(), a.spanOf(0));
            }
            List<Rational> xs = new ArrayList<>();
            for (Value x : r.items()) {
                xs.add(Values.rational(x, a.spanOf(0), "rational_eigenvalues: an entry"));
            }
            m.add(xs);
        }
        List<Value> out = new ArrayList<>();
        at(a.spanOf(0), () -> RationalEigenvalues.of(m)).forEach(x -> out.add(new ExprValue(Expression.constant(x))));
        return new ListValue(out);
    }

    // ---------------------------------------------------------------------------------- helpers

    private static Arguments.Argument required(Arguments a, String name, Span span) {
        return a.named(name).orElseThrow(() -> new ContourException(a.function() + " needs the argument '" + name + ": ...'", span));
    }

    private static int nonNegative(Arguments a, String name, Span span, int max) {
        Arguments.Argument x = required(a, name, span);
        int n = Values.integer(x.value(), x.span(), a.function() + ": " + name);
        if (n < 0 || n > max) {
            throw new ContourException(a.function() + ": " + name + " must be between 0 and " + max + ", got " + n, x.span());
        }
        return n;
    }

    private static List<Integer> integers(Arguments.Argument arg, String what) {
        List<Integer> out = new ArrayList<>();
        if (arg.value() instanceof RangeValue r) {
            if (r.size() > 100_000) {
                throw new ContourException(what + ": at most 100000 values", arg.span());
            }
            r.members().forEach(x -> out.add(Math.toIntExact(x)));
        } else if (arg.value() instanceof ListValue l) {
            for (Value v : l.items()) {
                out.add(Values.integer(v, arg.span(), what));
            }
        } else {
            out.add(Values.integer(arg.value(), arg.span(), what));
        }
        return out;
    }

    /** Runs an algorithm, placing its errors at the call. */
    private static <T> T at(Span span, Supplier<T> body) {
        try {
            return body.get();
        } catch (ContourException e) {
            throw e.span() == null ? new ContourException(e.getMessage(), span, e) : e;
        }
    }
}
