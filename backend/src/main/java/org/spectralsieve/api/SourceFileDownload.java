package org.spectralsieve.api;

import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.Charset;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.spectralsieve.library.SourceFile;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;

/**
 * A stored original file as a download, with the charset its text was read in.
 *
 * <p>The charset is not stored; it follows from the bytes by the rule the importers read them with
 * ({@code FileImport.decodeText}, {@code JcampReader}): strict UTF-8 when the bytes are valid UTF-8,
 * otherwise ISO-8859-1, which maps every byte. Applying the same rule again names exactly the text the
 * curve was read from, so an em dash in a UTF-8 file arrives as an em dash, and a Latin-1 degree sign
 * as a degree sign. (Browsers read the label ISO-8859-1 as windows-1252, which shows a Windows file's
 * curly quotes too.) A file that is not text (a NUL byte, or a stored type that is neither
 * {@code text/*} nor JCAMP-DX) keeps its type without a charset.
 */
final class SourceFileDownload {

    private static final String JCAMP = "chemical/x-jcamp-dx";

    private SourceFileDownload() {
    }

    static ResponseEntity<byte[]> of(SourceFile file) {
        byte[] bytes = file.bytes();
        MediaType stored = MediaType.parseMediaType(file.mediaType());
        MediaType type = textCharset(stored, bytes).map(c -> new MediaType(stored, c)).orElse(stored);
        return ResponseEntity.ok()
                .contentType(type)
                .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.attachment().filename(file.fileName()).build().toString())
                .header("X-Checksum-SHA256", file.sha256())
                // the user's text is never to be sniffed and run as a page
                .header("X-Content-Type-Options", "nosniff")
                .body(bytes);
    }

    /** The charset to label a text file with; empty for a binary one. */
    static Optional<Charset> textCharset(MediaType stored, byte[] bytes) {
        boolean text = stored.getType().equals("text") || stored.isCompatibleWith(MediaType.parseMediaType(JCAMP));
        // a UTF-16 file is read by its byte-order mark (FileImport.decodeText), so it is labelled by it too
        if (text && bytes.length >= 2 && (bytes[0] & 0xFF) == 0xFF && (bytes[1] & 0xFF) == 0xFE) {
            return Optional.of(StandardCharsets.UTF_16LE);
        }
        if (text && bytes.length >= 2 && (bytes[0] & 0xFF) == 0xFE && (bytes[1] & 0xFF) == 0xFF) {
            return Optional.of(StandardCharsets.UTF_16BE);
        }
        if (!text || containsNul(bytes)) {
            return Optional.empty();
        }
        try {
            StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes));
            return Optional.of(StandardCharsets.UTF_8);
        } catch (CharacterCodingException notUtf8) {
            return Optional.of(StandardCharsets.ISO_8859_1);
        }
    }

    private static boolean containsNul(byte[] bytes) {
        for (byte b : bytes) {
            if (b == 0) {
                return true;
            }
        }
        return false;
    }
}
