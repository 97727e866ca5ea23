package org.spectralsieve.importers;

/**
 * Locale-independent decimal parsing straight from a range of a line, without a regular expression and,
 * for ordinary spectral numbers, without allocating a String.
 *
 * <p>Accepted syntax: optional sign, digits with an optional decimal mark (point, or comma when asked),
 * optional exponent ({@code e}/{@code E}, optional sign, digits). Nothing else: no hexadecimal, no
 * {@code d}/{@code f} suffixes, no thousands separators (which {@link Double#parseDouble} would partly accept).
 *
 * <p>Why the fast path is exact: when the significant digits form an integer m ≤ 2⁵³ and the decimal
 * exponent e satisfies |e| ≤ 22, both m and 10^|e| are exactly representable doubles, so the single
 * IEEE multiplication or division m·10^e is correctly rounded (Clinger 1990, "How to read floating
 * point numbers accurately", PLDI '90). Every other number goes through {@link Double#parseDouble}.
 */
final class NumberText {

    private static final double[] POWERS = {1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
        1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};
    private static final long EXACT_LIMIT = 1L << 53;
    private static final int MAX_DIGITS = 18; // a long holds 18 decimal digits without overflow

    private NumberText() {
    }

    /**
     * @param decimal '.' or ','; with ',' a point is also read as a decimal mark
     * @throws NumberFormatException when the text is not a decimal number (the message is the text)
     */
    static double parse(String s, int from, int to, char decimal) {
        int i = from;
        boolean negative = false;
        if (i < to && (s.charAt(i) == '+' || s.charAt(i) == '-')) {
            negative = s.charAt(i) == '-';
            i++;
        }
        long m = 0;
        int digits = 0;
        int exp10 = 0;
        boolean any = false;
        boolean dropped = false;
        char c;
        for (; i < to && (c = s.charAt(i)) >= '0' && c <= '9'; i++) {
            any = true;
            if (m == 0 && c == '0') {
                continue;
            }
            if (digits < MAX_DIGITS) {
                m = m * 10 + (c - '0');
                digits++;
            } else {
                exp10++;
                dropped = true;
            }
        }
        if (i < to && (s.charAt(i) == '.' || s.charAt(i) == decimal)) {
            i++;
            for (; i < to && (c = s.charAt(i)) >= '0' && c <= '9'; i++) {
                any = true;
                if (m == 0 && c == '0') {
                    exp10--;
                } else if (digits < MAX_DIGITS) {
                    m = m * 10 + (c - '0');
                    digits++;
                    exp10--;
                } else {
                    dropped = true;
                }
            }
        }
        if (!any) {
            throw new NumberFormatException(s.substring(from, to));
        }
        if (i < to && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
            i++;
            boolean negExp = false;
            if (i < to && (s.charAt(i) == '+' || s.charAt(i) == '-')) {
                negExp = s.charAt(i) == '-';
                i++;
            }
            int e = 0;
            boolean expDigits = false;
            for (; i < to && (c = s.charAt(i)) >= '0' && c <= '9'; i++) {
                expDigits = true;
                e = Math.min(e * 10 + (c - '0'), 1_000_000); // beyond this every double is 0 or infinite
            }
            if (!expDigits) {
                throw new NumberFormatException(s.substring(from, to));
            }
            exp10 += negExp ? -e : e;
        }
        if (i != to) {
            throw new NumberFormatException(s.substring(from, to));
        }
        if (m == 0) {
            return negative ? -0.0 : 0.0;
        }
        if (!dropped && m <= EXACT_LIMIT && exp10 >= -22 && exp10 <= 22) {
            double v = exp10 >= 0 ? m * POWERS[exp10] : m / POWERS[-exp10];
            return negative ? -v : v;
        }
        String text = s.substring(from, to);
        return Double.parseDouble(decimal == '.' ? text : text.replace(decimal, '.'));
    }

    /** Syntax check only (no value), for sniffing lines; "NaN", "inf" and "Infinity" count as numbers here. */
    static boolean isNumber(String s, int from, int to, char decimal) {
        if (from < to && s.charAt(from) == '<') {
            from++;
            while (from < to && s.charAt(from) == ' ') {
                from++;
            }
        }
        if (from >= to) {
            return false;
        }
        try {
            parse(s, from, to, decimal);
            return true;
        } catch (NumberFormatException e) {
            return isNonFiniteWord(s.substring(from, to));
        }
    }

    static boolean isNonFiniteWord(String text) {
        String t = text.startsWith("+") || text.startsWith("-") ? text.substring(1) : text;
        return t.equalsIgnoreCase("nan") || t.equalsIgnoreCase("infinity") || t.equalsIgnoreCase("inf");
    }
}
