package org.spectralsieve.importers;

/**
 * The one checked error every importer throws. The message is always built here, from the parts, so
 * that every reader reports in the same shape: {@code acrylic-3mm.csv line 12, field 'transmittance':
 * not a number: 'abc'}, or {@code acrylic-3mm.csv: no data rows} when no line applies.
 */
public final class ImportException extends Exception {

    private static final long serialVersionUID = 1L;

    private final String sourceName;
    private final int line;
    private final String field;
    private final String problem;

    /**
     * @param sourceName file name or upload name shown to the user
     * @param line       1-based line number, or 0 when the problem is not tied to a line
     * @param field      column name or metadata key, or null
     * @param problem    what is wrong, quoting the bad value
     */
    public ImportException(String sourceName, int line, String field, String problem) {
        this(sourceName, line, field, problem, null);
    }

    public ImportException(String sourceName, int line, String field, String problem, Throwable cause) {
        super(format(sourceName, line, field, problem), cause);
        if (line < 0) {
            throw new IllegalArgumentException("line must be >= 0, was " + line);
        }
        this.sourceName = sourceName;
        this.line = line;
        this.field = field;
        this.problem = problem;
    }

    /** A problem with the whole source (no line, no field). */
    public static ImportException ofSource(String sourceName, String problem) {
        return new ImportException(sourceName, 0, null, problem);
    }

    private static String format(String sourceName, int line, String field, String problem) {
        StringBuilder where = new StringBuilder(String.valueOf(sourceName));
        if (line > 0) {
            where.append(" line ").append(line);
        }
        if (field != null) {
            where.append(line > 0 ? ", " : " ").append("field '").append(field).append('\'');
        }
        return where.append(": ").append(problem).toString();
    }

    public String sourceName() {
        return sourceName;
    }

    /** 1-based line number; 0 when the problem is not tied to a line. */
    public int line() {
        return line;
    }

    /** Column name or metadata key; null when no single field is at fault. */
    public String field() {
        return field;
    }

    /** The problem without the location prefix. */
    public String problem() {
        return problem;
    }
}
