package org.spectralsieve.backup;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * Reads an entry's JSON lines one at a time, refusing a line longer than a bound: an archive is an upload,
 * and one endless line must not take the heap. The bound is above the longest row the import limits let in
 * (a 20 MB original file is about 27 MB as base64).
 */
final class BoundedLines {

    static final int MAX_LINE_BYTES = 64 * 1024 * 1024;

    private final InputStream in;
    private final int maxBytes;
    private long lineNumber;

    BoundedLines(InputStream in, int maxBytes) {
        this.in = in;
        this.maxBytes = maxBytes;
    }

    /** The next line without its newline, or null at the end of the entry. */
    String next() throws IOException {
        ByteArrayOutputStream line = new ByteArrayOutputStream();
        int b;
        while ((b = in.read()) != -1 && b != '\n') {
            if (line.size() >= maxBytes) {
                throw new IOException("line " + (lineNumber + 1) + " is longer than " + maxBytes + " bytes");
            }
            line.write(b);
        }
        if (b == -1 && line.size() == 0) {
            return null;
        }
        lineNumber++;
        return line.toString(StandardCharsets.UTF_8);
    }

    long lineNumber() {
        return lineNumber;
    }
}
