package dev.contour.picture;

import dev.contour.ContourException;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import javax.imageio.ImageIO;

/**
 * Writes pictures whole or not at all: the bytes go to a temporary file beside the target and are
 * moved over it in one step. The format follows the file's extension: {@code .svg} or {@code .png}.
 */
public final class PictureFiles {
    private PictureFiles() { }

    /** Image pixels per SVG pixel in a PNG (sharp in print at the figure's usual width). */
    public static final double PNG_SCALE = 2.0;

    /** Which format a file name asks for: "svg" or "png"; a ContourException for any other ending. */
    public static String format(Path file) {
        String name = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
        if (name.endsWith(".svg")) {
            return "svg";
        }
        if (name.endsWith(".png")) {
            return "png";
        }
        throw new ContourException("a picture is written as .svg or .png, not '" + file + "'");
    }

    /** Writes the pole map to {@code file} in the format its extension names. */
    public static void write(PoleMap map, Path file) {
        PoleMapDrawing drawing = new PoleMapDrawing(map);
        byte[] bytes = format(file).equals("svg") ? drawing.svg().getBytes(StandardCharsets.UTF_8) : png(drawing);
        try {
            atomically(file, bytes);
        } catch (IOException | RuntimeException e) {
            throw new ContourException("cannot write " + file + ": " + e.getMessage());
        }
    }

    static byte[] png(PoleMapDrawing drawing) {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true"); // no display is needed to paint into an image
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            ImageIO.write(drawing.image(PNG_SCALE), "png", out);
        } catch (IOException e) {
            throw new ContourException("cannot encode the PNG: " + e.getMessage());
        }
        return out.toByteArray();
    }

    static void atomically(Path target, byte[] bytes) throws IOException {
        Path absolute = target.toAbsolutePath();
        Path folder = absolute.getParent();
        if (folder == null || !Files.isDirectory(folder)) {
            throw new IOException("no such folder: " + folder);
        }
        Path temporary = Files.createTempFile(folder, "." + absolute.getFileName() + ".", ".tmp");
        try {
            Files.write(temporary, bytes, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING, StandardOpenOption.SYNC);
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
