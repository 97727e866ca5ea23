package org.spectralsieve.library;

/**
 * The rule for every text the library stores: at most as many characters as its column holds, and no
 * character that could hide or disguise what is shown — no control characters (NUL, BEL, escape…; a
 * multi-line field may hold tab, line feed and carriage return) and none of the invisible bidirectional
 * controls (U+061C, U+200E, U+200F, U+202A–U+202E, U+2066–U+2069) with which a name can be made to read
 * differently from what it holds; no unpaired surrogate either (it is no character at all).
 * Lengths count UTF-16 units, never fewer than the characters a VARCHAR column counts.
 */
public final class StoredText {

    private StoredText() {
    }

    /** A one-line text: a name, a lot, an instrument, a file name. Null stays null. */
    public static String line(String field, String value, int maxLength) {
        return check(field, value, maxLength, false);
    }

    /** A text that may run over several lines: a description or notes. Null stays null. */
    public static String paragraph(String field, String value, int maxLength) {
        return check(field, value, maxLength, true);
    }

    private static String check(String field, String value, int maxLength, boolean multiLine) {
        if (value == null) {
            return null;
        }
        if (value.length() > maxLength) {
            throw new FieldException(field, "must be at most " + maxLength + " characters, was " + value.length());
        }
        String bad = firstRefused(value, multiLine);
        if (bad != null) {
            throw new FieldException(field, "must not hold " + bad);
        }
        return value;
    }

    /** A description of the first refused character and where it is (1-based), or null when there is none. */
    public static String firstRefused(String value, boolean multiLine) {
        for (int i = 0; i < value.length(); i++) {
            char c = value.charAt(i);
            String what = null;
            if (Character.isISOControl(c) && !(multiLine && (c == '\t' || c == '\n' || c == '\r'))) {
                what = "a control character";
            } else if (isBidiControl(c)) {
                what = "a bidirectional control character";
            } else if (Character.isHighSurrogate(c) && (i + 1 == value.length() || !Character.isLowSurrogate(value.charAt(i + 1)))
                    || Character.isLowSurrogate(c) && (i == 0 || !Character.isHighSurrogate(value.charAt(i - 1)))) {
                what = "an unpaired surrogate";
            }
            if (what != null) {
                return what + String.format(" (U+%04X at character %d)", (int) c, i + 1);
            }
        }
        return null;
    }

    static boolean isBidiControl(char c) {
        return c == '\u061C' || c == '\u200E' || c == '\u200F' || (c >= '\u202A' && c <= '\u202E')
                || (c >= '\u2066' && c <= '\u2069');
    }
}
