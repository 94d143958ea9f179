package dev.contour.lang;

import dev.contour.ContourException;
import dev.contour.Span;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Reads script and library files as UTF-8 text: a byte-order mark at the start is dropped (some
 * editors write one), and a byte sequence that is not UTF-8 is a located error naming the line and
 * column of the first bad byte, instead of the decoder's bare "Input length = 1".
 */
public final class SourceFiles {
    /** The byte-order mark as a character (U+FEFF), as it appears after decoding. */
    public static final char BYTE_ORDER_MARK = '\uFEFF';

    private SourceFiles() { }

    /**
     * The text of {@code file}; an {@link IOException} when it cannot be read, a located
     * {@link ContourException} when it is not UTF-8.
     */
    public static String read(Path file) throws IOException {
        return decode(Files.readAllBytes(file), file.toString());
    }

    /** {@code bytes} decoded strictly as UTF-8, labelled {@code name} in an error's location. */
    public static String decode(byte[] bytes, String name) {
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(bytes.length + 1);
        CoderResult result = decoder.decode(in, out, true);
        if (result.isError()) {
            throw badByte(bytes, in.position(), name);
        }
        result = decoder.flush(out);
        if (result.isError()) {
            throw badByte(bytes, in.position(), name);
        }
        out.flip();
        return withoutByteOrderMark(out.toString());
    }

    /**
     * The text of {@code file} for showing the line an error points at: bad bytes become U+FFFD
     * (one each, so columns stay those {@link #decode} reports), null when it cannot be read.
     */
    public static String readForDisplay(Path file) {
        try {
            return withoutByteOrderMark(new String(Files.readAllBytes(file), StandardCharsets.UTF_8));
        } catch (IOException | RuntimeException e) {
            return null;
        }
    }

    /** {@code text} without a leading byte-order mark. */
    public static String withoutByteOrderMark(String text) {
        return !text.isEmpty() && text.charAt(0) == BYTE_ORDER_MARK ? text.substring(1) : text;
    }

    private static ContourException badByte(byte[] bytes, int offset, String name) {
        int line = 1;
        int lineStart = 0;
        for (int i = 0; i < offset; i++) {
            if (bytes[i] == '\n') {
                line++;
                lineStart = i + 1;
            }
        }
        // The column counts characters, as every other location does: decode the valid part of the line.
        int column = 1;
        try {
            column = StandardCharsets.UTF_8.newDecoder()
                    .decode(ByteBuffer.wrap(bytes, lineStart, offset - lineStart)).length() + 1;
        } catch (CharacterCodingException e) {
            column = offset - lineStart + 1;
        }
        if (column == 1 && line == 1 && offset == 0 && bytes.length > 0 && (bytes[0] & 0xff) == 0xfe) {
            return new ContourException("the file is not UTF-8 (it starts like UTF-16 text): save it as UTF-8",
                    new Span(name, line, column, 1));
        }
        return new ContourException(String.format("the file is not valid UTF-8: byte 0x%02x here cannot be decoded;"
                + " save the file as UTF-8", bytes[offset] & 0xff), new Span(name, line, column, 1));
    }
}
