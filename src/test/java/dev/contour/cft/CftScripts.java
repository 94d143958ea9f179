package dev.contour.cft;

import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/** Runs scripts through the public interpreter and returns what they printed. */
final class CftScripts {
    private CftScripts() { }

    static String run(String script) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8);
        new Interpreter(InterpreterOptions.to(out)).run(script, "test.ctr");
        return bytes.toString(StandardCharsets.UTF_8);
    }

    /** The exact number after " = " on the one line that starts with the given text. */
    static dev.contour.algebra.Rational number(String output, String lineStart) {
        String line = output.lines().filter(l -> l.startsWith(lineStart)).findFirst()
                .orElseThrow(() -> new AssertionError("no line starting with " + lineStart + " in\n" + output));
        return dev.contour.algebra.Rational.parse(line.substring(line.lastIndexOf(" = ") + 3).strip());
    }
}
