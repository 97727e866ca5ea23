package org.spectralsieve.ingest;

/** A file that parsed but cannot be stored as a curve; names the file and the field at fault. */
public class IngestException extends RuntimeException {

    private final String sourceName;
    private final String field;

    public IngestException(String sourceName, String field, String message) {
        super(sourceName + ", field '" + field + "': " + message);
        this.sourceName = sourceName;
        this.field = field;
    }

    public String sourceName() {
        return sourceName;
    }

    public String field() {
        return field;
    }
}
