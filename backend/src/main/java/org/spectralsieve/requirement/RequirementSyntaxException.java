package org.spectralsieve.requirement;

import java.util.Optional;

/**
 * A requirement text that cannot be read, located to a character: what was expected there, what was
 * found, and — when the found word is close to one that fits — the word the user probably meant. Also
 * thrown for well-formed text whose values are out of range ("120%"), so callers handle one type.
 */
public final class RequirementSyntaxException extends IllegalArgumentException {

    private final int position;
    private final String expected;
    private final String found;
    private final String suggestion;

    /**
     * @param position   0-based character offset into the text
     * @param expected   what would have fitted there, in plain words
     * @param found      what stands there, already quoted ("'undr'") or described ("end of text")
     * @param suggestion a word that fits and is close to the found one, or null
     */
    public RequirementSyntaxException(int position, String expected, String found, String suggestion) {
        super("at position " + position + ": expected " + expected + ", found " + found
                + (suggestion == null ? "" : " — did you mean '" + suggestion + "'?"));
        this.position = position;
        this.expected = expected;
        this.found = found;
        this.suggestion = suggestion;
    }

    public int position() {
        return position;
    }

    public String expected() {
        return expected;
    }

    public String found() {
        return found;
    }

    public Optional<String> suggestion() {
        return Optional.ofNullable(suggestion);
    }
}
