package org.spectralsieve.importers.jcamp;

/**
 * Reads one number from a char array by hand: JCAMP numbers can begin with a pseudo-digit (ASDF), and
 * a regex or a String per value would cost most of the decoding time.
 *
 * <p>Exactness: up to 15 significant digits and a decimal exponent within ±22 the value is
 * mantissa × or ÷ an exact power of ten, one correctly rounded IEEE operation (Clinger's fast path,
 * W. D. Clinger, "How to read floating point numbers accurately", PLDI 1990); anything longer goes
 * through {@link Double#parseDouble}. Either way the result equals what {@code Double.parseDouble}
 * gives for the same digits, which the writer's bit-exact round trip relies on.
 */
final class NumberScanner {

    private static final double[] POW10 = new double[23];
    private static final long FAST_MANTISSA_LIMIT = 1L << 53;

    static {
        double p = 1.0;
        for (int i = 0; i < POW10.length; i++) {
            POW10[i] = p;
            p *= 10.0;
        }
    }

    /** No exponent: the number ends before any letter (ASDF pseudo-digits). */
    static final int NO_EXPONENT = 0;
    /**
     * Only {@code E+nn}/{@code E-nn}: in an ASDF line a bare {@code E} is the SQZ digit +5, so
     * {@code 2771E227} is X=2771 followed by the ordinate 5227, never 2771×10²²⁷.
     */
    static final int SIGNED_EXPONENT = 1;
    /** Any exponent, as {@link Double#toString} writes it ({@code 1.0E10}): plain AFFN tables. */
    static final int ANY_EXPONENT = 2;

    /** The value just scanned. */
    double value;
    /** Index of the first character after it. */
    int end;
    /** Why the last scan failed, or null. */
    String problem;

    /**
     * Scans digits from {@code p}; the sign and the first digit come from the caller (who decoded a
     * pseudo-digit or a plain sign). Returns false with {@link #problem} set when there is no number.
     *
     * @param firstDigit 0–9, or −1 when no digit has been seen yet (a plain sign or nothing)
     * @param exponent {@link #NO_EXPONENT}, {@link #SIGNED_EXPONENT} or {@link #ANY_EXPONENT}
     */
    boolean scan(char[] c, int p, int limit, boolean negative, int firstDigit, int exponentRule) {
        problem = null;
        int start = p;
        long mantissa = firstDigit > 0 ? firstDigit : 0;
        int digits = firstDigit >= 0 ? 1 : 0;
        int significant = firstDigit > 0 ? 1 : 0;
        int fraction = 0;
        boolean point = false;
        while (p < limit) {
            char ch = c[p];
            if (ch >= '0' && ch <= '9') {
                digits++;
                if (significant > 0 || ch != '0') {
                    significant++;
                }
                if (significant <= 18) {
                    mantissa = mantissa * 10 + (ch - '0');
                    if (point) {
                        fraction++;
                    }
                } else if (!point) {
                    fraction--; // a digit beyond 18 significant ones: keep its place value only
                }
            } else if (ch == '.' && !point) {
                point = true;
            } else {
                break;
            }
            p++;
        }
        if (digits == 0) {
            problem = "a sign or a point without digits";
            return false;
        }
        int exponent = 0;
        if (exponentRule != NO_EXPONENT && p + 1 < limit && (c[p] == 'E' || c[p] == 'e')) {
            int q = p + 1;
            boolean expNegative = false;
            if (c[q] == '+' || c[q] == '-') {
                expNegative = c[q] == '-';
                q++;
            } else if (exponentRule == SIGNED_EXPONENT) {
                q = limit; // not an exponent: leave the E to the caller
            }
            if (q < limit && c[q] >= '0' && c[q] <= '9') {
                int e = 0;
                while (q < limit && c[q] >= '0' && c[q] <= '9') {
                    e = Math.min(e * 10 + (c[q] - '0'), 100_000);
                    q++;
                }
                exponent = expNegative ? -e : e;
                p = q;
            }
        }
        end = p;
        int scale = exponent - fraction;
        if (significant <= 15 && mantissa < FAST_MANTISSA_LIMIT && Math.abs(scale) <= 22) {
            double m = mantissa;
            value = scale >= 0 ? m * POW10[scale] : m / POW10[-scale];
        } else {
            value = slow(c, start, p, firstDigit);
        }
        if (negative) {
            value = -value;
        }
        if (!Double.isFinite(value)) {
            problem = "number out of range";
            return false;
        }
        return true;
    }

    /** Rare: many digits or a large exponent. Rebuilds the plain decimal text for the JDK parser. */
    private static double slow(char[] c, int start, int end, int firstDigit) {
        StringBuilder b = new StringBuilder(end - start + 2);
        if (firstDigit >= 0) {
            b.append((char) ('0' + firstDigit));
        }
        b.append(c, start, end - start);
        if (b.charAt(0) == '.') {
            b.insert(0, '0');
        }
        return Double.parseDouble(b.toString());
    }
}
