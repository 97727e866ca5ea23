package org.spectralsieve.backup;

/**
 * An archive that cannot be restored as it is: not a zip, no manifest, another format or schema version,
 * or an entry whose checksum, row count or content does not match the manifest. Raised before anything is
 * written; names the entry (and line) at fault where there is one.
 */
public class ArchiveRefusedException extends RuntimeException {

    private final String entry;
    private final long line;

    public ArchiveRefusedException(String entry, long line, String message) {
        super(message);
        this.entry = entry;
        this.line = line;
    }

    public ArchiveRefusedException(String entry, String message) {
        this(entry, 0, message);
    }

    /** The archive entry at fault, or null when the fault is the archive as a whole. */
    public String entry() {
        return entry;
    }

    /** The 1-based line of the entry at fault, or 0. */
    public long line() {
        return line;
    }
}
