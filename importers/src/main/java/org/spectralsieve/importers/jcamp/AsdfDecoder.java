package org.spectralsieve.importers.jcamp;

import org.spectralsieve.importers.ImportException;

/**
 * Decodes {@code ##XYDATA=(X++(Y..Y))} lines in AFFN and in the ASDF compressed forms of JCAMP-DX 4.24
 * (McDonald &amp; Wilks 1988, section 5): SQZ (a pseudo-digit carries the sign and first digit:
 * {@code @}=0, {@code A}–{@code I}=1–9, {@code a}–{@code i}=−1…−9), DIF (a difference from the
 * previous ordinate: {@code %}=0, {@code J}–{@code R}=1–9, {@code j}–{@code r}=−1…−9), DUP (the
 * previous token repeated: {@code S}–{@code Z}=1–8, {@code s}=9, counting the original), PAC (a sign
 * separates values) — mixed freely on one line.
 *
 * <p>The DIF Y-check: when a line ends in difference form, the next line repeats its last ordinate
 * as an absolute value. The decoder verifies it and keeps one copy; a failed check refuses the file,
 * because it means a line was lost or garbled.
 *
 * <p>A hand-written state machine over the char array (no regex, no String per value): decoding
 * speed matters for large files.
 */
final class AsdfDecoder {

    private static final int NONE = 0;
    private static final int ABSOLUTE = 1;
    private static final int DIFFERENCE = 2;

    private final String source;
    private final String field;
    private final int limit;
    private final String limitField;
    private final NumberScanner number = new NumberScanner();

    final DoubleBuffer ordinates = new DoubleBuffer();
    /** Per data line: index of the first point it added (for error messages). */
    final IntBuffer newPointStart = new IntBuffer();
    /** Per data line: the X written at its start (unscaled), its first point, its 1-based line number. */
    final DoubleBuffer lineX = new DoubleBuffer();
    final IntBuffer lineFirstPoint = new IntBuffer();
    final IntBuffer lineNumbers = new IntBuffer();
    final IntBuffer newPointLine = new IntBuffer();

    private int lastKind = NONE;
    private double last;
    private double lastDelta;

    /**
     * @param limit      most ordinates accepted (a repeat count in a damaged file must not exhaust memory)
     * @param limitField the label that set the limit, named when it is exceeded
     */
    AsdfDecoder(String source, String field, int limit, String limitField) {
        this.source = source;
        this.field = field;
        this.limit = limit;
        this.limitField = limitField;
    }

    void line(char[] c, int start, int end, int lineNo) throws ImportException {
        int p = skipSeparators(c, start, end);
        if (p == end) {
            return;
        }
        p = absolute(c, p, end, lineNo, "the X value at the start of the line");
        double x = number.value;
        boolean expectCheck = lastKind == DIFFERENCE;
        int firstPoint = ordinates.size();
        newPointStart.add(firstPoint);
        newPointLine.add(lineNo);
        boolean any = false;
        while (true) {
            p = skipSeparators(c, p, end);
            if (p == end) {
                break;
            }
            char ch = c[p];
            if (isAbsoluteStart(ch)) {
                p = absolute(c, p, end, lineNo, "an ordinate");
                double v = number.value;
                if (!any && expectCheck) {
                    checkY(v, lineNo);
                    firstPoint = ordinates.size() - 1;
                } else {
                    append(v, lineNo);
                }
                last = v;
                lastKind = ABSOLUTE;
            } else if (isDif(ch)) {
                p = difference(c, p, end, lineNo, expectCheck && !any);
            } else if (isDup(ch)) {
                p = duplicate(c, p, end, lineNo, any);
            } else {
                throw error(lineNo, "unexpected character " + describe(ch) + " at column " + (p - start + 1));
            }
            any = true;
        }
        if (!any) {
            throw error(lineNo, "an X value but no ordinates");
        }
        lineX.add(x);
        lineFirstPoint.add(firstPoint);
        lineNumbers.add(lineNo);
    }

    private int difference(char[] c, int p, int end, int lineNo, boolean checkExpected) throws ImportException {
        if (lastKind == NONE) {
            throw error(lineNo, "a difference (" + describe(c[p]) + ") with no ordinate before it");
        }
        if (checkExpected) {
            throw error(lineNo, "DIF Y-check missing: the previous line ended in difference form, so this "
                    + "line must start with its last ordinate " + plain(last) + " as an absolute value");
        }
        char ch = c[p];
        boolean negative = ch >= 'j' && ch <= 'r';
        int digit = ch == '%' ? 0 : negative ? ch - 'j' + 1 : ch - 'J' + 1;
        scan(c, p + 1, end, negative, digit, NumberScanner.NO_EXPONENT, lineNo);
        lastDelta = number.value;
        last += lastDelta;
        append(last, lineNo);
        lastKind = DIFFERENCE;
        return number.end;
    }

    private int duplicate(char[] c, int p, int end, int lineNo, boolean anyOnLine) throws ImportException {
        if (!anyOnLine) {
            throw error(lineNo, "a repeat count (" + describe(c[p]) + ") with nothing before it on the line");
        }
        char ch = c[p];
        long count = ch == 's' ? 9 : ch - 'S' + 1;
        int q = p + 1;
        while (q < end && c[q] >= '0' && c[q] <= '9') {
            count = count * 10 + (c[q] - '0');
            if (count > limit) {
                throw new ImportException(source, lineNo, limitField,
                        "repeat count at column " + (q + 1 - p) + " gives more than " + limit + " ordinates");
            }
            q++;
        }
        // DUP counts the original too: "T" (2) means one more copy of the previous token's effect
        for (long i = 1; i < count; i++) {
            if (lastKind == DIFFERENCE) {
                last += lastDelta;
            }
            append(last, lineNo);
        }
        return q;
    }

    private int absolute(char[] c, int p, int end, int lineNo, String what) throws ImportException {
        char ch = c[p];
        if (ch == '+' || ch == '-') {
            scan(c, p + 1, end, ch == '-', -1, NumberScanner.SIGNED_EXPONENT, lineNo);
        } else if ((ch >= '0' && ch <= '9') || ch == '.') {
            scan(c, p, end, false, -1, NumberScanner.SIGNED_EXPONENT, lineNo);
        } else if (ch == '@') {
            scan(c, p + 1, end, false, 0, NumberScanner.NO_EXPONENT, lineNo);
        } else if (ch >= 'A' && ch <= 'I') {
            scan(c, p + 1, end, false, ch - 'A' + 1, NumberScanner.NO_EXPONENT, lineNo);
        } else if (ch >= 'a' && ch <= 'i') {
            scan(c, p + 1, end, true, ch - 'a' + 1, NumberScanner.NO_EXPONENT, lineNo);
        } else {
            throw error(lineNo, "expected " + what + ", found " + describe(ch));
        }
        return number.end;
    }

    private void scan(char[] c, int p, int end, boolean negative, int digit, int exponent, int lineNo)
            throws ImportException {
        if (!number.scan(c, p, end, negative, digit, exponent)) {
            throw error(lineNo, number.problem + " at '" + new String(c, Math.max(0, p - 1),
                    Math.min(end, p + 12) - Math.max(0, p - 1)) + "'");
        }
    }

    private void checkY(double v, int lineNo) throws ImportException {
        double tolerance = 1e-9 * Math.max(1.0, Math.max(Math.abs(v), Math.abs(last)));
        if (!(Math.abs(v - last) <= tolerance)) {
            throw error(lineNo, "DIF Y-check failed: the line starts with " + plain(v)
                    + " but the previous line ended with " + plain(last));
        }
    }

    private void append(double v, int lineNo) throws ImportException {
        if (ordinates.size() >= limit) {
            throw new ImportException(source, lineNo, limitField, "more than " + limit + " ordinates");
        }
        ordinates.add(v);
    }

    private ImportException error(int lineNo, String problem) {
        return new ImportException(source, lineNo, field, problem);
    }

    static boolean isAbsoluteStart(char ch) {
        return (ch >= '0' && ch <= '9') || ch == '.' || ch == '+' || ch == '-' || ch == '@'
                || (ch >= 'A' && ch <= 'I') || (ch >= 'a' && ch <= 'i');
    }

    private static boolean isDif(char ch) {
        return ch == '%' || (ch >= 'J' && ch <= 'R') || (ch >= 'j' && ch <= 'r');
    }

    private static boolean isDup(char ch) {
        return (ch >= 'S' && ch <= 'Z') || ch == 's';
    }

    static int skipSeparators(char[] c, int p, int end) {
        while (p < end && (c[p] == ' ' || c[p] == '\t' || c[p] == ',' || c[p] == ';')) {
            p++;
        }
        return p;
    }

    static String describe(char ch) {
        return ch >= 0x20 && ch < 0x7F ? "'" + ch + "'" : String.format("U+%04X", (int) ch);
    }

    /** Integers print without ".0" so messages quote what the file wrote. */
    static String plain(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }
}
