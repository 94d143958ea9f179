package dev.contour.bench;

import dev.contour.Span;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import dev.contour.eval.Values;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The sweep workload's script visits exactly the admissible weight tuples and its checks pass. */
class SweepBenchTest {
    /** Tuples 2 <= p4 <= p3 <= p2 <= p1 <= n with even sum and L >= 2, counted directly from L's definition. */
    static int admissible(int n) {
        int count = 0;
        for (int p1 = 2; p1 <= n; p1++) for (int p2 = 2; p2 <= p1; p2++) for (int p3 = 2; p3 <= p2; p3++) for (int p4 = 2; p4 <= p3; p4++) {
            int sum = p1 + p2 + p3 + p4;
            int ks = Math.abs(p3 + p4 - p1 - p2), kt = Math.abs(p1 + p4 - p2 - p3), ku = Math.abs(p2 + p4 - p1 - p3);
            if (sum % 2 == 0 && (sum - ks - kt - ku) / 4 >= 2) {
                count++;
            }
        }
        return count;
    }

    @Test
    void theTupleCountsAreThoseOfTheIssue() {
        // 216 correlators for N = 10 and 3,085 for N = 20 (the counts the sweep's goals are stated for)
        assertEquals(216, admissible(10));
        assertEquals(3085, admissible(20));
    }

    @Test
    void theScriptSolvesAndChecksEveryTupleUpToFour() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        Interpreter session = new Interpreter(InterpreterOptions.to(new PrintStream(bytes, true, StandardCharsets.UTF_8)));
        RunResult r = session.run(SweepBench.script(4), "sweep.ctr");
        String out = bytes.toString(StandardCharsets.UTF_8);
        assertTrue(r.ok(), out);
        int n = admissible(4);
        assertEquals(n, Values.integer(session.lookup("correlators"), Span.NONE, "correlators"));
        // per tuple: one function, the closed form, 24 relabellings
        assertEquals(26 * n, r.checksPassed(), out);
    }
}
