package dev.contour.repl;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Writes a text file whole or not at all: the text goes to a temporary file beside the target,
 * is forced to disk, and is then moved over the target in one step.
 */
final class AtomicWrite {
    private AtomicWrite() { }

    static void text(Path target, String text) throws IOException {
        Path absolute = target.toAbsolutePath();
        Path folder = absolute.getParent();
        // Beside the target, so the move stays on one file system and can be atomic.
        Path temporary = Files.createTempFile(folder, "." + absolute.getFileName() + ".", ".tmp");
        try {
            Files.write(temporary, text.getBytes(StandardCharsets.UTF_8), StandardOpenOption.WRITE,
                    StandardOpenOption.TRUNCATE_EXISTING, StandardOpenOption.SYNC);
            try {
                Files.move(temporary, absolute, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temporary, absolute, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(temporary);
        }
    }
}
