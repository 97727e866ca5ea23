package org.spectralsieve.requirement;

import java.util.Locale;

/**
 * One lexical unit of a requirement text, with its character span {@code [start, end)} so that errors
 * and clause texts can point back into what the user typed.
 */
record Token(Kind kind, String text, int start, int end) {

    enum Kind {
        /** Letters, with inner hyphens ("cut-off", "resin-tank"); µ and μ count as letters. */
        WORD,
        /** ASCII digits with an optional fraction ("0.365", ".5"); never signed, never an exponent. */
        NUMBER,
        PERCENT,
        COMMA,
        /** "-" or "–" between two numbers of a range. */
        DASH,
        /** ">=", ">", "≥": the value must be at least the number. */
        AT_LEAST,
        /** "<=", "<", "≤": the value must be at most the number. */
        AT_MOST,
        END
    }

    /** The word in lower case, for keyword comparison; the original spelling stays in {@link #text}. */
    String lower() {
        return text.toLowerCase(Locale.ROOT);
    }

    boolean isWord(String keyword) {
        return kind == Kind.WORD && lower().equals(keyword);
    }

    /** How the token is quoted in an error message; long tokens are cut so a message stays one line. */
    String quoted() {
        if (kind == Kind.END) {
            return "end of text";
        }
        String shown = text.length() > 30 ? text.substring(0, 30) + "…" : text;
        return "'" + shown + "'";
    }
}
