package org.spectralsieve.requirement;

/**
 * A requirement longer or with more clauses than {@link RequirementLimits} allow. Refused before any
 * parsing or search work, so an oversized request costs milliseconds whatever its size.
 */
public final class RequirementTooLargeException extends IllegalArgumentException {

    /** What was counted: the text's characters or the requirement's clauses. */
    public enum Measure { CHARACTERS, CLAUSES }

    private final Measure measure;
    private final long actual;
    private final int limit;

    public RequirementTooLargeException(Measure measure, long actual, int limit) {
        super(measure == Measure.CHARACTERS
                ? "the requirement has " + actual + " characters; at most " + limit + " are read"
                : "the requirement has " + actual + " clauses; at most " + limit + " are judged in one search");
        this.measure = measure;
        this.actual = actual;
        this.limit = limit;
    }

    public Measure measure() {
        return measure;
    }

    public long actual() {
        return actual;
    }

    public int limit() {
        return limit;
    }
}
