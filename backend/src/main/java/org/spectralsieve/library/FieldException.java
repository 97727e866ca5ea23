package org.spectralsieve.library;

/**
 * A value of a record to be stored lies outside what may be stored; names the record's field (e.g.
 * {@code name}, {@code notes}, {@code thicknessMm}) so that an edge can name its own parameter for it.
 */
public final class FieldException extends IllegalArgumentException {

    private final String field;

    public FieldException(String field, String message) {
        super(field + " " + message);
        this.field = field;
    }

    public String field() {
        return field;
    }
}
