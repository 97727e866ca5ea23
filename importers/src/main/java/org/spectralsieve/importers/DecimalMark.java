package org.spectralsieve.importers;

/**
 * The character between the integer and fractional part of numbers in a file. Detected from the data
 * (a comma inside fields that are separated by semicolons, tabs or spaces means a decimal comma); set
 * it in {@link ReadOptions#decimalMark(DecimalMark)} when the data alone cannot tell.
 */
public enum DecimalMark {
    /** {@code 365.5}: the mark every program writes by default. */
    POINT('.'),
    /** {@code 365,5}: common in files from European locale settings. A point is still read as a decimal mark. */
    COMMA(',');

    private final char symbol;

    DecimalMark(char symbol) {
        this.symbol = symbol;
    }

    public char symbol() {
        return symbol;
    }
}
