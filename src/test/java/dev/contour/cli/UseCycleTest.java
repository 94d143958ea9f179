package dev.contour.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A file that loads, directly or through others, a file still loading it is an error naming the cycle. */
class UseCycleTest {
    @TempDir
    Path dir;

    private Path file(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    @Test
    void aFileThatUsesItselfIsAnErrorAtItsUse() throws IOException {
        Path self = file("self.ctr", "show \"once\"\nuse \"self.ctr\"\n");
        CliRunner r = CliRunner.run("run", self.toString());
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertEquals("once\n", r.out(), "the file runs once, up to the cycle");
        assertTrue(r.err().startsWith(self + ":2:1: 'use' cycle: self.ctr uses itself"), r.err());
        assertTrue(r.err().contains("\n    use \"self.ctr\"\n    ^"), r.err());
    }

    @Test
    void aLongerCycleIsNamedFileByFile() throws IOException {
        Path a = file("a.ctr", "use \"b.ctr\"\nlet from_a = from_b + 1\n");
        file("b.ctr", "let from_b = 1\nuse \"c.ctr\"\n");
        Path c = file("c.ctr", "# closes the loop\nuse \"a.ctr\"\n");
        CliRunner r = CliRunner.run("run", a.toString());
        assertEquals(Main.BAD_INPUT, r.exitCode());
        assertTrue(r.err().startsWith(c + ":2:1: 'use' cycle: a.ctr uses b.ctr, which uses c.ctr, which uses a.ctr"), r.err());
    }

    @Test
    void aLibraryUsedTwiceWithoutACycleLoadsOnce() throws IOException {
        file("base.ctr", "show \"base loads\"\nlet base = 1\n");
        file("left.ctr", "use \"base.ctr\"\nlet left = base + 1\n");
        file("right.ctr", "use \"base.ctr\"\nlet right = base + 2\n");
        Path top = file("top.ctr", "use \"left.ctr\"\nuse \"right.ctr\"\nshow left + right\n");
        CliRunner r = CliRunner.run("run", top.toString());
        assertEquals(Main.OK, r.exitCode(), r.err());
        assertEquals("base loads\nleft + right = 5\n", r.out());
    }
}
