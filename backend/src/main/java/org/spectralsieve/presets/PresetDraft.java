package org.spectralsieve.presets;

import java.util.Locale;
import java.util.regex.Pattern;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.requirement.RequirementLimits;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.requirement.RequirementTooLargeException;

/**
 * What a user gives for a preset of their own: a name, the requirement text and a note. {@link #checked} holds the
 * rules every way in (API, file import, command line) shares.
 */
public record PresetDraft(String name, String text, String note) {

    public static final int MAX_NAME = 64;
    public static final int MAX_NOTE = 500;
    public static final int MAX_TEXT = RequirementLimits.MAX_TEXT_LENGTH;

    /**
     * Letters, digits, spaces, dots, dashes and underscores, starting with a letter or digit: safe in a link and on
     * a command line. Not digits alone, so a name never reads as an id.
     */
    private static final Pattern NAME = Pattern.compile("[\\p{L}\\p{N}][\\p{L}\\p{N} ._-]*");
    private static final Pattern DIGITS = Pattern.compile("[0-9]+");

    /** Reads a requirement text; throws {@link RequirementSyntaxException} where it is not understood. */
    @FunctionalInterface
    public interface TextReader {
        void read(String text);
    }

    /**
     * The draft with its name and text stripped and its note defaulted, or an exception naming the field (as
     * {@code prefix + "name"}, e.g. {@code presets[2].name}): {@link FieldException} for a bad name or note,
     * {@link PresetTextException} for a text the language does not read.
     */
    public PresetDraft checked(String prefix, TextReader reader) {
        String n = name == null ? "" : name.strip();
        if (n.isEmpty() || n.length() > MAX_NAME) {
            throw new FieldException(prefix + "name", "must be 1 to " + MAX_NAME + " characters, got " + n.length());
        }
        if (!NAME.matcher(n).matches() || DIGITS.matcher(n).matches()) {
            throw new FieldException(prefix + "name", "must start with a letter or digit and hold only letters, digits,"
                    + " spaces, '.', '-' and '_' (not digits alone), got '" + n + "'");
        }
        String t = text == null ? "" : text.strip();
        if (t.isEmpty()) {
            throw new FieldException(prefix + "text", "must hold a requirement, e.g. 'passes over 80% at 365 nm'");
        }
        if (t.length() > MAX_TEXT) {
            throw new FieldException(prefix + "text", "must be at most " + MAX_TEXT + " characters, got " + t.length());
        }
        try {
            reader.read(t);
        } catch (RequirementSyntaxException e) {
            throw new PresetTextException(prefix + "text", e);
        } catch (RequirementTooLargeException e) {
            throw new FieldException(prefix + "text", e.getMessage());
        }
        String o = note == null ? "" : note.strip();
        if (o.length() > MAX_NOTE) {
            throw new FieldException(prefix + "note", "must be at most " + MAX_NOTE + " characters, got " + o.length());
        }
        return new PresetDraft(n, t, o);
    }

    /** The key that makes live names unique per owner: case does not tell two presets apart. */
    static String nameKey(String name) {
        return name.strip().toLowerCase(Locale.ROOT);
    }
}
