package dev.contour.solve;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** LaTeX of a solution lists the determined unknowns and names the free ones once, without c = c rows. */
class SolutionLatexTest {
    @Test
    void freeUnknownsAreNamedOnceNotAsCEqualsCRows() {
        ByteArrayOutputStream buffer = new ByteArrayOutputStream();
        Interpreter in = new Interpreter(InterpreterOptions.to(new PrintStream(buffer, true, StandardCharsets.UTF_8)));
        in.run("""
                vars s
                unknown c[k] with k <= 2
                let F = sum k with k <= 2 : c[k] / (s + 2*k)
                let sol = solve polynomial_in((s + 6)*(F at s = s + 2) - s*F, s) for c
                show sol as latex
                """, "test.ctr");
        assertEquals("""
                % sol
                \\begin{aligned}
                  c_{1} &= -2\\,c_{0} \\\\
                  c_{2} &= c_{0} \\\\
                  \\text{free:} &\\quad c_{0} \\\\
                \\end{aligned}
                """, buffer.toString(StandardCharsets.UTF_8));
    }
}
