package org.spectralsieve.requirement;

import java.util.List;
import java.util.Optional;

/**
 * A requirement text that cannot be read, located to a character: what was expected there, what was
 * found, and — when the found word is close to one that fits — the word the user probably meant. Also
 * thrown for well-formed text whose values are out of range ("120%"), so callers handle one type.
 */
public final class RequirementSyntaxException extends IllegalArgumentException {

    private final int position;
    private final int length;
    private final String expected;
    private final String found;
    private final List<String> suggestions;
    private final boolean unknownSpectrum;

    /**
     * @param position   0-based character offset into the text
     * @param expected   what would have fitted there, in plain words
     * @param found      what stands there, already quoted ("'undr'") or described ("end of text")
     * @param suggestion a word that fits and is close to the found one, or null
     */
    public RequirementSyntaxException(int position, String expected, String found, String suggestion) {
        this(position, 0, expected, found, suggestion == null ? List.of() : List.of(suggestion), false);
    }

    /**
     * @param length          characters of the text the problem covers from {@code position} (0: the word there)
     * @param suggestions     fitting words close to the found ones, the likeliest first
     * @param unknownSpectrum the problem is an emitter or response name the lookup does not know, which
     *                        another lookup (one with imported spectra) might
     */
    public RequirementSyntaxException(int position, int length, String expected, String found,
                                      List<String> suggestions, boolean unknownSpectrum) {
        super("at position " + position + ": expected " + expected + ", found " + found
                + (suggestions.isEmpty() ? "" : " — did you mean '" + suggestions.get(0) + "'?"));
        this.position = position;
        this.length = Math.max(0, length);
        this.expected = expected;
        this.found = found;
        this.suggestions = List.copyOf(suggestions);
        this.unknownSpectrum = unknownSpectrum;
    }

    public int position() {
        return position;
    }

    /** How many characters from {@link #position} the problem covers; 0 when it is the word standing there. */
    public int length() {
        return length;
    }

    public String expected() {
        return expected;
    }

    public String found() {
        return found;
    }

    /** The likeliest fitting word, if any. */
    public Optional<String> suggestion() {
        return suggestions.stream().findFirst();
    }

    /** Every fitting word close to the found one, the likeliest first; empty when none is close. */
    public List<String> suggestions() {
        return suggestions;
    }

    /** Whether the problem is an emitter or response name unknown to the lookup the text was read with. */
    public boolean unknownSpectrum() {
        return unknownSpectrum;
    }
}
