package dev.contour.repl;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PipedInputStream;
import java.io.PipedOutputStream;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Predicate;
import java.util.regex.Pattern;
import org.jline.terminal.Terminal;
import org.jline.terminal.TerminalBuilder;

/**
 * A REPL session on a pseudo-terminal made of pipes: tests type into it, watch what it prints,
 * and raise signals on it, while the session runs on its own thread.
 */
final class TerminalHarness implements AutoCloseable {
    /** Cursor movement, modes and keypad switches: CSI sequences and the two-byte ESC = and ESC >. */
    private static final Pattern CONTROL = Pattern.compile("\u001b\\[[0-9;?]*[ -/]*[@-~]|\u001b[=>]");

    private final PipedOutputStream keyboard = new PipedOutputStream();
    private final ByteArrayOutputStream screen = new ByteArrayOutputStream();
    private final Terminal terminal;
    private final Thread session;
    private final AtomicInteger exitCode = new AtomicInteger(-1);

    TerminalHarness(ReplSettings settings) throws IOException {
        PipedInputStream in = new PipedInputStream(keyboard, 1 << 16);
        OutputStream out = new OutputStream() {
            @Override
            public void write(int b) {
                synchronized (screen) {
                    screen.write(b);
                }
            }

            @Override
            public void write(byte[] b, int off, int len) {
                synchronized (screen) {
                    screen.write(b, off, len);
                }
            }
        };
        terminal = TerminalBuilder.builder().name("test").streams(in, out).provider("exec").type("xterm").size(new org.jline.terminal.Size(160, 50)).encoding(StandardCharsets.UTF_8).build();
        session = new Thread(() -> exitCode.set(Repl.onTerminal(terminal, settings, s -> { })), "repl-under-test");
        session.setDaemon(true);
        session.start();
    }

    /** Types text (use \n for Enter, \t for Tab). */
    void type(String keys) throws IOException {
        keyboard.write(keys.getBytes(StandardCharsets.UTF_8));
        keyboard.flush();
    }

    void raise(Terminal.Signal signal) {
        terminal.raise(signal);
    }

    /** What the terminal printed, without control sequences and carriage returns. */
    String screen() {
        String raw;
        synchronized (screen) {
            raw = screen.toString(StandardCharsets.UTF_8);
        }
        return CONTROL.matcher(raw).replaceAll("").replace("\r", "");
    }

    /** Waits until the screen satisfies the condition; fails with the screen's text after the timeout. */
    String await(Predicate<String> condition, String what) throws InterruptedException {
        long until = System.nanoTime() + Duration.ofSeconds(10).toNanos();
        while (System.nanoTime() < until) {
            String s = screen();
            if (condition.test(s)) {
                return s;
            }
            Thread.sleep(10);
        }
        throw new AssertionError("timed out waiting for " + what + "; the screen shows:\n" + screen());
    }

    String awaitText(String text) throws InterruptedException {
        return await(s -> s.contains(text), "'" + text + "'");
    }

    /** Ends the session with Ctrl-D (end of input) and returns its exit code. */
    int finish() throws IOException, InterruptedException {
        keyboard.close();
        session.join(Duration.ofSeconds(30).toMillis());
        if (session.isAlive()) {
            throw new AssertionError("the session did not end; the screen shows:\n" + screen());
        }
        return exitCode.get();
    }

    @Override
    public void close() throws IOException {
        keyboard.close();
        terminal.close();
    }
}
