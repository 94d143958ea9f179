package dev.contour.picture;

import dev.contour.ContourException;
import dev.contour.cli.Subcommand;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import dev.contour.eval.Value;
import dev.contour.lang.Diagnostic;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * {@code contour draw SCRIPT EXPRESSION FILE}: runs the script without printing, evaluates the
 * expression (a pole map, such as {@code 'pole_map(M, m, contour: {5, 5/2})'}) in its session and
 * writes the picture to FILE (.svg or .png), whole or not at all.
 */
public final class DrawCommand implements Subcommand {
    private static final String USAGE = "usage: contour draw SCRIPT EXPRESSION FILE.svg|FILE.png\n"
            + "  e.g. contour draw examples/world_derivation.ctr 'pole_map(M, m, contour: {5, 5/2})' world.svg\n";

    @Override
    public String name() {
        return "draw";
    }

    @Override
    public String summary() {
        return "runs a script, then writes a pole map of its session as SVG or PNG";
    }

    @Override
    public int run(List<String> args, InputStream in, PrintStream out, PrintStream err) {
        List<String> operands = args.stream().filter(a -> !a.equals("--")).toList();
        if (operands.size() != 3 || operands.stream().anyMatch(a -> a.startsWith("--"))) {
            err.print(USAGE);
            return 2;
        }
        String file = operands.get(0);
        String text;
        try {
            text = Files.readString(Path.of(file), StandardCharsets.UTF_8);
        } catch (IOException | RuntimeException e) {
            err.println("contour: cannot read " + file + ": " + e.getMessage());
            return 2;
        }
        Interpreter session = new Interpreter(InterpreterOptions.to(new PrintStream(OutputStream.nullOutputStream())));
        RunResult result;
        try {
            result = session.run(text, file);
        } catch (ContourException e) {
            err.print(Diagnostic.render(e, e.span() == null || e.span().file().equals(file) ? text : null));
            return 2;
        }
        String expression = operands.get(1);
        try {
            Value v = session.evaluate(expression, "<expression>");
            if (!(v instanceof PictureValue p)) {
                err.println("contour: the expression gives a " + v.kind() + ", not a pole map (use pole_map(M, m, ...))");
                return 2;
            }
            Path target = Path.of(operands.get(2));
            PictureFiles.write(p.map(), target);
            out.println("wrote " + target + " (" + p.map().amplitudeLines().size() + " amplitude pole lines, "
                    + p.map().measureLines().size() + " measure pole lines)");
        } catch (ContourException e) {
            err.print(Diagnostic.render(e, e.span() != null && e.span().file().equals("<expression>") ? expression : null));
            return 2;
        }
        return result.ok() ? 0 : 1;
    }
}
