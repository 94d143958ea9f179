package dev.contour.picture;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Rational;
import dev.contour.eval.Arguments;
import dev.contour.eval.Builtin;
import dev.contour.eval.BuiltinProvider;
import dev.contour.eval.BuiltinRegistry;
import dev.contour.eval.ListValue;
import dev.contour.eval.StringValue;
import dev.contour.eval.Value;
import dev.contour.eval.Values;
import dev.contour.mellin.MeasureValue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/** The language's built-ins for pictures: {@code pole_map} and {@code draw}; found through {@link java.util.ServiceLoader}. */
public final class PictureBuiltins implements BuiltinProvider {
    @Override
    public void register(BuiltinRegistry r) {
        r.register(new Builtin("pole_map", 2, 2, Set.of("contour", "window", "title"), false,
                "pole_map(M, m, contour: {3/2, 7/2}, window: {-2, 12}, title: \"M\"): the poles of M and of measure m in the real s, t plane",
                PictureBuiltins::poleMap));
        r.register(Builtin.of("draw", 2,
                "draw(P, \"poles.svg\"): writes the pole map P as SVG or PNG (by the name's ending), whole or not at all",
                PictureBuiltins::draw));
    }

    private static Value poleMap(Arguments a, Span span) {
        if (!(a.get(1) instanceof MeasureValue m)) {
            throw new ContourException("pole_map: argument 2 must be a measure (made by mellin_measure(...)), not a "
                    + a.get(1).kind(), a.spanOf(1));
        }
        Rational[] contour = pair(a, "contour");
        Rational[] window = pair(a, "window");
        String title = "the amplitude";
        Optional<Arguments.Argument> t = a.named("title");
        if (t.isPresent()) {
            if (!(t.get().value() instanceof StringValue sv)) {
                throw new ContourException("pole_map: title is a string such as \"M\"", t.get().span());
            }
            title = sv.value();
        }
        try {
            return new PictureValue(PoleMapBuilder.build(title, a.expression(0), m.measure(), window, contour), List.of());
        } catch (ContourException e) {
            Span at = e.span() != null ? e.span() : a.named("contour").map(Arguments.Argument::span).orElse(span);
            throw e.at(at);
        }
    }

    private static Rational[] pair(Arguments a, String name) {
        Optional<Arguments.Argument> x = a.named(name);
        if (x.isEmpty()) {
            return null;
        }
        if (!(x.get().value() instanceof ListValue l) || l.items().size() != 2) {
            throw new ContourException("pole_map: " + name + " is a pair of numbers such as {3/2, 7/2}", x.get().span());
        }
        return new Rational[] {Values.rational(l.items().get(0), x.get().span(), name),
                Values.rational(l.items().get(1), x.get().span(), name)};
    }

    private static Value draw(Arguments a, Span span) {
        if (!(a.get(0) instanceof PictureValue p)) {
            throw new ContourException("draw: argument 1 must be a pole map (made by pole_map(...)), not a " + a.get(0).kind(), a.spanOf(0));
        }
        if (!(a.get(1) instanceof StringValue name)) {
            throw new ContourException("draw: argument 2 is the file name, a string such as \"poles.svg\"", a.spanOf(1));
        }
        Path file = Path.of(name.value());
        try {
            PictureFiles.write(p.map(), file);
        } catch (ContourException e) {
            throw e.at(a.spanOf(1));
        }
        List<Path> written = new ArrayList<>(p.written());
        written.add(file);
        return new PictureValue(p.map(), written);
    }
}
