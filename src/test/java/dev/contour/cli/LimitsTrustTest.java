package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Runaway work through the command line: sizes are estimated before expanding, products of linear
 * factors stay factored, every statement has a budget of time and memory (a derivation's within
 * clause included), and flat sums and products of any length do not deepen the stack.
 */
class LimitsTrustTest {
    @TempDir
    Path dir;

    private String script(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p.toString();
    }

    @Test
    void aPowerTooLargeToExpandIsRefusedBeforeExpanding() throws IOException {
        String file = script("big.ctr", "vars s, t\nlet x = (s + t + 1)^1000\n");
        CliRunner r = CliRunner.run("run", file);
        assertEquals(Main.BAD_INPUT, r.exitCode(), r.err());
        assertTrue(r.err().startsWith(file + ":2:9: the power ^1000 would expand to up to 501,501 terms, and its last step"
                + " alone would take about 1.6e+10 coefficient products"), r.err());
        // under the work limit, the memory estimate decides: (s + t + 1)^500 needs about 27 MiB
        String smaller = script("smaller.ctr", "vars s, t\nlet x = (s + t + 1)^500\n");
        CliRunner m = CliRunner.run("run", "--memory-budget", "100", smaller);
        assertEquals(Main.BAD_INPUT, m.exitCode(), m.err());
        assertTrue(m.err().startsWith(smaller + ":2:9: the power ^500 would expand to up to 125,751 terms"), m.err());
        assertTrue(m.err().contains("raise it with --memory-budget MIB"), m.err());
    }

    @Test
    void nestedPowersCannotEscapeTheNumberLimit() throws IOException {
        String file = script("nested.ctr", "let x = ((2^1000)^1000)^1000\n");
        CliRunner r = CliRunner.run("run", file);
        assertEquals(Main.BAD_INPUT, r.exitCode(), r.err());
        assertTrue(r.err().startsWith(file + ":1:9: the power ^1000 would build exact numbers of about"), r.err());
        assertTrue(r.err().contains("--max-digits DIGITS"), r.err());
        CliRunner product = CliRunner.run("run", "--max-digits", "700", script("product.ctr",
                "let x = 2^1000\nlet y = x*x*x\n"));
        assertTrue(product.err().contains(":2:9: this product would build exact numbers of about 904 digits, past the limit"
                + " of 700 digits"), product.err());
        assertEquals(Main.OK, CliRunner.run("run", script("fine.ctr", "let x = (2^1000)^1000\nshow 1\n")).exitCode());
    }

    @Test
    void productsOfManyLinearFactorsStayCheap() throws IOException {
        // 1/poch(s, 400) and Gamma(s)/Gamma(s + 400) are 1/(s (s + 1) ... (s + 399)): exact identities
        // of the Pochhammer symbol (common practice); (s + t)^400 at s = t = 1 is 2^400.
        String file = script("linear.ctr", """
                vars s, t
                let a = 1/poch(s, 400)
                let b = Gamma(s)/Gamma(s + 400)
                check a == b
                check a*poch(s, 400) == 1
                check a at (s = 1) == 1/factorial(400)
                let c = (s + t)^400
                check c at (s = 1, t = 1) == 2^400
                """);
        CliRunner r = CliRunner.run("run", "--time-budget", "120", file);
        assertEquals(Main.OK, r.exitCode(), r.err() + r.out());
        assertEquals(4, r.out().lines().filter(l -> l.endsWith("  ok")).count(), r.out());
    }

    @Test
    void aStatementPastItsTimeBudgetStopsWithTheBudgetNamed() throws IOException {
        String file = script("slow.ctr", "vars s, t\nshow 1\nlet x = (s + t + 1)^500\nshow 2\n");
        long start = System.nanoTime();
        CliRunner r = CliRunner.run("run", "--time-budget", "1", file);
        assertEquals(Main.BAD_INPUT, r.exitCode(), r.err());
        assertEquals("1\n", r.out());
        assertTrue(r.err().startsWith(file + ":3:1: this statement ran past its time budget of 1 seconds; raise it with"
                + " --time-budget SECONDS"), r.err());
        assertTrue(System.nanoTime() - start > 0);
        CliRunner bad = CliRunner.run("run", "--time-budget", "soon", file);
        assertEquals(Main.BAD_INPUT, bad.exitCode());
        assertTrue(bad.err().contains("--time-budget needs a whole number, not 'soon'"), bad.err());
    }

    @Test
    void aDerivationsWithinClauseCoversTheWholeStatement() throws IOException {
        // the expansion happens while the derivation's argument is evaluated, before any rule runs
        String file = script("derive.ctr", "use \"gamma.ctr\"\nvars s, t\nderive (s + t + 1)^500 within 1 seconds\n");
        CliRunner r = CliRunner.run("run", file);
        assertEquals(Main.BAD_INPUT, r.exitCode(), r.err());
        assertTrue(r.err().startsWith(file + ":3:1: this statement ran past its limit of 1 second"), r.err());
        assertTrue(r.err().contains("'within 1 seconds' at " + file + ":3:"), r.err());
    }

    @Test
    void flatSumsAndProductsOfAnyLengthNeedNoDeepStack() throws Exception {
        String sum = "vars s\nshow " + String.join(" + ", java.util.Collections.nCopies(10_000, "s")) + "\n";
        String product = "vars s\nlet p = " + String.join(" * ", java.util.Collections.nCopies(5_000, "s")) + "\n"
                + "check p == (s^1000)^5\nshow 1/(" + String.join("*", java.util.Collections.nCopies(3_000, "(s + 1)"))
                + ") at (s = 0)\n";
        String sumFile = script("sum.ctr", sum);
        String productFile = script("product.ctr", product);
        AtomicReference<CliRunner> sumRun = new AtomicReference<>();
        AtomicReference<CliRunner> productRun = new AtomicReference<>();
        // a small stack, as a thread of an embedding application might have
        Thread t = new Thread(null, () -> {
            sumRun.set(CliRunner.run("run", sumFile));
            productRun.set(CliRunner.run("run", productFile));
        }, "small-stack", 512 * 1024);
        t.start();
        t.join();
        assertEquals(Main.OK, sumRun.get().exitCode(), sumRun.get().err());
        assertTrue(sumRun.get().out().endsWith(" = 10000*s\n"), sumRun.get().out().substring(Math.max(0, sumRun.get().out().length() - 200)));
        assertEquals(Main.OK, productRun.get().exitCode(), productRun.get().err());
        assertTrue(productRun.get().out().contains("check p == (s^1000)^5  ok"), productRun.get().out());
        assertTrue(productRun.get().out().endsWith(" = 1\n"), productRun.get().out().substring(Math.max(0, productRun.get().out().length() - 200)));
    }
}
