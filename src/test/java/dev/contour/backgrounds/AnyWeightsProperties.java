package dev.contour.backgrounds;

import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.eval.RunResult;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * For random admissible weights (each at least 2, even sum, degree L >= 2), the amplitude the solver
 * finds from the general ansatz of backgrounds/ads5s5.ctr does not depend on the order of the
 * conditions or on widening the pole window (uniqueness as in arXiv:1710.05923).
 */
class AnyWeightsProperties {

    @Provide
    Arbitrary<List<Integer>> weights() {
        return Arbitraries.integers().between(2, 4).list().ofSize(4).filter(w -> {
            int sum = w.stream().mapToInt(Integer::intValue).sum();
            int ks = Math.abs(w.get(2) + w.get(3) - w.get(0) - w.get(1));
            int kt = Math.abs(w.get(0) + w.get(3) - w.get(1) - w.get(2));
            int ku = Math.abs(w.get(1) + w.get(3) - w.get(0) - w.get(2));
            return sum % 2 == 0 && (sum - ks - kt - ku) / 4 >= 2;
        });
    }

    private static String text(List<Integer> w) {
        return "{" + w.get(0) + ", " + w.get(1) + ", " + w.get(2) + ", " + w.get(3) + "}";
    }

    private static void passes(String script) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        RunResult r = new Interpreter(InterpreterOptions.to(new PrintStream(bytes, true, StandardCharsets.UTF_8)))
                .run("use \"ads5s5.ctr\"\n" + script, "property.ctr");
        assertTrue(r.ok() && r.checksPassed() > 0, bytes.toString(StandardCharsets.UTF_8));
    }

    @Property(tries = 6)
    void theOrderOfTheConditionsDoesNotMatter(@ForAll("weights") List<Integer> w) {
        passes(AnyWeightsTest.solved(text(w), 1) + """
                let sol2 = solve poles_allowed_of(M, w), residues_allowed_of(M, w) for c
                let F2 = item(function_basis(Mred, sol2), 1)
                check function_count(Mred, sol2) == 1
                check F * coefficient(F2, 1) == F2 * coefficient(F, 1)
                """);
    }

    @Property(tries = 4)
    void wideningThePoleWindowDoesNotMatter(@ForAll("weights") List<Integer> w) {
        passes(AnyWeightsTest.solved(text(w), 1) + """
                unknown d[i, j, x in -2..2, y in -2..2, z in -2..2] with i + j <= r_degree(w) - 2
                let Mred2 = general_ansatz(w, d, 2)
                let M2 = ward_of(w)(Mred2)
                let sol2 = solve residues_allowed_of(M2, w), poles_allowed_of(M2, w) for d
                check function_count(Mred2, sol2) == 1
                let F2 = item(function_basis(Mred2, sol2), 1)
                check F * coefficient(F2, 1) == F2 * coefficient(F, 1)
                """);
    }
}
