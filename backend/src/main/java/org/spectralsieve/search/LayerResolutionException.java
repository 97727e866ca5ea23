package org.spectralsieve.search;

import java.util.List;
import java.util.Objects;

/**
 * A requirement's fixed layer that names no single usable library sample: no material matches its words,
 * several match equally well, or a fixed (not rescalable) material was not measured at the asked thickness.
 * A user's mistake: the API answers 400 with the choices, the command line prints them.
 */
public final class LayerResolutionException extends RuntimeException {

    /** Why the layer could not be resolved. */
    public enum Reason { UNKNOWN, AMBIGUOUS, THICKNESS }

    /** A material the user might have meant, with what to write for it. */
    public record Choice(String slug, String name, String detail) {
    }

    private final Reason reason;
    private final String words;
    private final List<Choice> choices;
    private final int position;
    private final int length;

    public LayerResolutionException(Reason reason, String words, String message, List<Choice> choices) {
        this(reason, words, message, choices, -1, 0);
    }

    private LayerResolutionException(Reason reason, String words, String message, List<Choice> choices, int position,
                                     int length) {
        super(message);
        this.reason = Objects.requireNonNull(reason, "reason");
        this.words = Objects.requireNonNull(words, "words");
        this.choices = List.copyOf(choices);
        this.position = position;
        this.length = length;
    }

    /** The same problem, located at the material words in the requirement text the user wrote. */
    public LayerResolutionException at(int position, int length) {
        return new LayerResolutionException(reason, words, getMessage(), choices, position, length);
    }

    /** 0-based offset of the material words in the requirement text, −1 when not known (structured form). */
    public int position() {
        return position;
    }

    /** Characters the material words span from {@link #position}. */
    public int length() {
        return length;
    }

    public Reason reason() {
        return reason;
    }

    /** The layer's material words as the requirement gives them. */
    public String words() {
        return words;
    }

    /** The materials to choose from (ambiguous), the closest names (unknown), or the measured thicknesses. */
    public List<Choice> choices() {
        return choices;
    }
}
