package org.spectralsieve.importers.jcamp;

import org.spectralsieve.importers.ImportException;

/**
 * Decodes {@code (XY..XY)} tables ({@code ##XYPOINTS}, {@code ##PEAK TABLE}): AFFN numbers separated by
 * blanks, commas or semicolons, grouped into tuples of the width the variable list declares
 * ({@code (XYW..XYW)} has three); only the first two members are kept.
 */
final class TupleDecoder {

    private final String source;
    private final String field;
    private final int width;
    private final int limit;
    private final NumberScanner number = new NumberScanner();

    final DoubleBuffer x = new DoubleBuffer();
    final DoubleBuffer y = new DoubleBuffer();
    /** Per data line: index of the first tuple begun on it, and its line number. */
    final IntBuffer newPointStart = new IntBuffer();
    final IntBuffer lineNumbers = new IntBuffer();
    private int member;
    private int openLine;

    TupleDecoder(String source, String field, int width, int limit) {
        this.source = source;
        this.field = field;
        this.width = width;
        this.limit = limit;
    }

    void line(char[] c, int start, int end, int lineNo) throws ImportException {
        newPointStart.add(x.size());
        lineNumbers.add(lineNo);
        int p = AsdfDecoder.skipSeparators(c, start, end);
        while (p < end) {
            char ch = c[p];
            boolean ok;
            if (ch == '+' || ch == '-') {
                ok = number.scan(c, p + 1, end, ch == '-', -1, NumberScanner.ANY_EXPONENT);
            } else if ((ch >= '0' && ch <= '9') || ch == '.') {
                ok = number.scan(c, p, end, false, -1, NumberScanner.ANY_EXPONENT);
            } else {
                throw new ImportException(source, lineNo, field, "unexpected character "
                        + AsdfDecoder.describe(ch) + " at column " + (p - start + 1));
            }
            if (!ok) {
                throw new ImportException(source, lineNo, field, number.problem + " at column " + (p - start + 1));
            }
            take(number.value, lineNo);
            p = number.end;
            if (p < end && !isSeparator(c[p])) {
                throw new ImportException(source, lineNo, field, "unexpected character "
                        + AsdfDecoder.describe(c[p]) + " at column " + (p - start + 1));
            }
            p = AsdfDecoder.skipSeparators(c, p, end);
        }
    }

    private static boolean isSeparator(char ch) {
        return ch == ' ' || ch == '\t' || ch == ',' || ch == ';';
    }

    private void take(double v, int lineNo) throws ImportException {
        if (member == 0) {
            if (x.size() >= limit) {
                throw new ImportException(source, lineNo, field, "more than " + limit + " points");
            }
            openLine = lineNo;
            x.add(v);
        } else if (member == 1) {
            y.add(v);
        }
        member = (member + 1) % width;
    }

    /** Throws when the table stops inside a tuple (a truncated file, or a lost number). */
    void finish() throws ImportException {
        if (member != 0) {
            throw new ImportException(source, openLine, field,
                    "incomplete tuple: " + member + " of " + width + " numbers");
        }
    }
}
