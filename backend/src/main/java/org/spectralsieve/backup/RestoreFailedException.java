package org.spectralsieve.backup;

/**
 * The database refused a row of an archive that passed every check (a constraint the rows break, a
 * connection lost). The restore's one transaction was rolled back, so the library is as empty as before.
 */
public class RestoreFailedException extends RuntimeException {

    private final String entry;
    private final long line;

    public RestoreFailedException(String entry, long line, String message, Throwable cause) {
        super(message, cause);
        this.entry = entry;
        this.line = line;
    }

    public String entry() {
        return entry;
    }

    public long line() {
        return line;
    }
}
