package dev.contour.eval;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/** Runs scripts through the public interpreter API and captures their output. */
final class Scripts {
    final ByteArrayOutputStream buffer = new ByteArrayOutputStream();
    final Interpreter interpreter;

    Scripts() {
        this(OutputFormat.PLAIN, false);
    }

    Scripts(OutputFormat format, boolean checksOnly) {
        PrintStream out = new PrintStream(buffer, true, StandardCharsets.UTF_8);
        interpreter = new Interpreter(new InterpreterOptions(out, format, checksOnly, null, false));
    }

    /** Runs and returns what this run printed. */
    String run(String script) {
        buffer.reset();
        interpreter.run(script, "test.ctr");
        return buffer.toString(StandardCharsets.UTF_8);
    }

    static String output(String script) {
        return new Scripts().run(script);
    }
}
