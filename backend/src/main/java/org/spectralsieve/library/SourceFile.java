package org.spectralsieve.library;

import java.util.Arrays;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * The original bytes of an imported file, stored beside its sample so that a curve can be traced to
 * what was imported. The bytes are copied in and out: an instance never changes.
 *
 * @param fileName  the name the user gave (no directories), at most 400 characters
 * @param mediaType e.g. {@code text/csv}, {@code chemical/x-jcamp-dx}
 * @param format    the format it was read as (an import format label)
 * @param sha256    64 lower-case hex digits of the bytes' SHA-256
 */
public record SourceFile(String fileName, String mediaType, String format, byte[] bytes, String sha256) {

    public static final int MAX_NAME = 400;
    private static final Pattern SHA256 = Pattern.compile("[0-9a-f]{64}");

    public SourceFile {
        Objects.requireNonNull(fileName, "fileName");
        if (fileName.length() > MAX_NAME) {
            throw new IllegalArgumentException("file name has " + fileName.length() + " characters, at most "
                    + MAX_NAME + " are kept");
        }
        mediaType = Objects.requireNonNullElse(mediaType, "application/octet-stream");
        Objects.requireNonNull(format, "format");
        bytes = Objects.requireNonNull(bytes, "bytes").clone();
        if (sha256 == null || !SHA256.matcher(sha256).matches()) {
            throw new IllegalArgumentException("sha256 must be 64 lower-case hex digits, was '" + sha256 + "'");
        }
    }

    @Override
    public byte[] bytes() {
        return bytes.clone();
    }

    public int size() {
        return bytes.length;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SourceFile f && fileName.equals(f.fileName) && mediaType.equals(f.mediaType)
                && format.equals(f.format) && Arrays.equals(bytes, f.bytes) && sha256.equals(f.sha256);
    }

    @Override
    public int hashCode() {
        return Objects.hash(fileName, mediaType, format, sha256);
    }

    @Override
    public String toString() {
        return "SourceFile[" + fileName + ", " + mediaType + ", " + format + ", " + bytes.length + " bytes, " + sha256 + "]";
    }
}
