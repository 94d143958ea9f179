package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.Parallel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

/**
 * Through the command line: a script that collects an operator application, checks its residues
 * pole by pole and solves an ansatz prints exactly the same text with {@code --threads} 1, 2 and 4,
 * for random weights and random coefficients; a bad thread count is a usage error.
 */
class ParallelCliProperties {
    @Property(tries = 6)
    void theOutputDoesNotDependOnTheThreadCount(@ForAll @IntRange(min = 9, max = 14) int p,
                                                @ForAll("coefficients") List<Integer> c) throws Exception {
        // an invented amplitude: coefficients c0*i + c1*j + c2 (not a physical one), and the
        // AdS5xS5 ansatz solve with enough unknowns for several chunks of equation building
        String script = "use \"ads5s5.ctr\"\n"
                + "let p = " + p + "\n"
                + "let N = (sum i, j, k with i + j + k = p - 2 :\n"
                + "    (" + c.get(0) + "*i + " + c.get(1) + "*j + " + c.get(2) + ") * sigma^i * tau^j"
                + " / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i))) at (utilde = 4*p - 4 - s - t)\n"
                + "let M = ward(p)(N)\n"
                + "show residue_check(M, full_measure(p))\n"
                + "show poles(M, full_measure(p))\n"
                + "show M at (s = " + c.get(3) + "/7, t = 1/3)\n"
                + "unknown a[i, j, k] with i + j + k = p - 2\n"
                + "let Mred = (sum i, j, k with i + j + k = p - 2 :\n"
                + "    a[i, j, k] * sigma^i * tau^j / ((s - 2*p + 2 + 2*k) * (t - 2*p + 2 + 2*j) * (utilde - 2*p + 2 + 2*i)))"
                + " at (utilde = 4*p - 4 - s - t)\n"
                + "let sol = solve supergravity_poles(ward(p)(Mred), p) for a\n"
                + "show free_unknowns(sol)\n"
                + "show Mred with sol\n";
        Path file = Files.createTempFile("parallel-", ".ctr");
        try {
            Files.writeString(file, script);
            int before = Parallel.threads();
            CliRunner one = CliRunner.run("run", "--threads", "1", file.toString());
            assertEquals(before, Parallel.threads(), "--threads applies to its own command only");
            assertEquals(0, one.exitCode(), one.err());
            assertTrue(one.out().contains("free_unknowns(sol) = {"), one.out());
            for (String n : List.of("2", "4")) {
                CliRunner many = CliRunner.run("run", "--threads=" + n, file.toString());
                assertEquals(0, many.exitCode(), many.err());
                assertEquals(one.out(), many.out(), "output with " + n + " threads");
            }
        } finally {
            Files.deleteIfExists(file);
        }
    }

    @Provide
    Arbitrary<List<Integer>> coefficients() {
        return Arbitraries.integers().between(-9, 9).filter(x -> x != 0).list().ofSize(4);
    }

    @net.jqwik.api.Example
    void aBadThreadCountIsAUsageError() {
        CliRunner r = CliRunner.run("run", "--threads", "0", "x.ctr");
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertEquals("contour: --threads must be between 1 and 256, not 0\n", r.err());
        CliRunner word = CliRunner.run("run", "--threads=many", "x.ctr");
        assertEquals(Main.BAD_INPUT, word.exitCode());
        assertEquals("contour: --threads needs a whole number of threads (1 to 256), not 'many'\n", word.err());
        CliRunner missing = CliRunner.run("bench", "--threads");
        assertEquals(Main.BAD_INPUT, missing.exitCode());
        assertTrue(missing.err().contains("--threads needs a whole number"), missing.err());
    }
}
