package dev.contour.cli;

import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.io.OutputStream;
import java.io.PrintStream;

/** The interpreter's own workloads: parsing and the large ansatz sums of a toy amplitude. */
final class CoreBenchmarks {
    private CoreBenchmarks() { }

    /** A toy ansatz over i + j + k = p - 2 with three simple poles per term (our own scenario). */
    static String ansatzScript(int p) {
        return """
                vars s, t
                vars x, y collected
                let p = %d
                unknown c[i, j, k] with i + j + k = p - 2
                let A = sum i, j, k with i + j + k = p - 2 :
                    c[i, j, k] * x^i * y^j / ((s + 2*k + 1) * (t + 2*j + 1) * (s + t + 2*i + 3))
                let B = A at (s = t, t = s)
                """.formatted(p);
    }

    static void register(BenchRegistry r) {
        for (int p : new int[] {16, 64, 128}) {
            String script = ansatzScript(p);
            r.register(new BenchRegistry.Workload("ansatz-sum-p" + p,
                    "evaluate a toy ansatz sum over i + j + k = " + (p - 2) + " and swap s, t",
                    () -> quiet().run(script, "<bench>")));
        }
        String parseOnly = ansatzScript(8).repeat(50).replace("unknown c[", "# unknown c[");
        r.register(new BenchRegistry.Workload("parse", "parse a 350-line script",
                () -> dev.contour.lang.ScriptParser.parseScript(parseOnly, "<bench>")));
    }

    private static Interpreter quiet() {
        return new Interpreter(InterpreterOptions.to(new PrintStream(OutputStream.nullOutputStream())));
    }
}
