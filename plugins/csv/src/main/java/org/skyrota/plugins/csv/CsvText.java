package org.skyrota.plugins.csv;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/** A CSV file read whole, with a way to turn a character offset into a 1-based line number. */
final class CsvText {

    /** Request and condition files are typed by people; anything larger is a mistake. */
    static final int MAX_BYTES = 16 * 1024 * 1024;

    final String text;
    private final int[] lineStarts;

    private CsvText(String text) {
        this.text = text;
        int[] starts = new int[16];
        int n = 0;
        starts[n++] = 0;
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                if (n == starts.length) {
                    starts = Arrays.copyOf(starts, n * 2);
                }
                starts[n++] = i + 1;
            }
        }
        this.lineStarts = Arrays.copyOf(starts, n);
    }

    /**
     * Reads UTF-8 text, dropping a byte-order mark.
     *
     * @throws CsvTextException when the file is too large or not UTF-8
     */
    static CsvText read(InputStream in) throws IOException, CsvTextException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        byte[] buffer = new byte[65536];
        int n;
        while ((n = in.read(buffer)) >= 0) {
            bytes.write(buffer, 0, n);
            if (bytes.size() > MAX_BYTES) {
                throw new CsvTextException("the file is larger than " + MAX_BYTES / (1024 * 1024) + " MiB");
            }
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes.toByteArray())).toString();
        } catch (CharacterCodingException e) {
            throw new CsvTextException("the file is not UTF-8 text");
        }
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        return new CsvText(text);
    }

    /** The 1-based line holding the character at {@code offset}. */
    int lineAt(long offset) {
        int i = Arrays.binarySearch(lineStarts, (int) Math.min(offset, Integer.MAX_VALUE));
        return (i >= 0 ? i : -i - 2) + 1;
    }

    static final class CsvTextException extends Exception {
        CsvTextException(String message) {
            super(message);
        }
    }
}
