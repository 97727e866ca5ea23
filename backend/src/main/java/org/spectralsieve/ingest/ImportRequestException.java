package org.spectralsieve.ingest;

/** An import asked for something that cannot be done as given; names the request field to change. */
public final class ImportRequestException extends RuntimeException {

    private final String field;

    public ImportRequestException(String field, String message) {
        super("'" + field + "': " + message);
        this.field = field;
    }

    public String field() {
        return field;
    }
}
