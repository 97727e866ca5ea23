package org.spectralsieve.ingest;

/**
 * An upload beyond one of the configured limits (size, points, zip entries) or a zip entry whose path
 * leaves the upload. Names the setting that sets the limit, so an administrator knows what to change.
 */
public final class ImportLimitException extends RuntimeException {

    /**
     * What kind of limit: the HTTP layer answers 413 for {@link #SIZE} and {@link #RATIO} (a zip entry that
     * would inflate far beyond its compressed size), 400 for the others.
     */
    public enum Kind { SIZE, COUNT, PATH, RATIO }

    private final String sourceName;
    private final Kind kind;
    private final String setting;

    public ImportLimitException(String sourceName, Kind kind, String setting, String message) {
        super(sourceName + ": " + message);
        this.sourceName = sourceName;
        this.kind = kind;
        this.setting = setting;
    }

    public String sourceName() {
        return sourceName;
    }

    public Kind kind() {
        return kind;
    }

    /** The property that sets the limit, e.g. {@code sieve.imports.max-points}; null for path refusals. */
    public String setting() {
        return setting;
    }
}
