package org.spectralsieve.spectra;

import java.text.Normalizer;
import java.util.Locale;
import java.util.regex.Pattern;
import org.spectralsieve.ingest.ImportRequestException;

/**
 * Names of imported spectra: lower-case slugs ({@code bench-lamp-365}), because they travel in URLs,
 * query parameters and requirement text. Surrounding blanks and upper case are forgiven; anything else
 * is refused with the slug it could be.
 */
final class ImportedNames {

    static final int MAX_LENGTH = 60;
    private static final Pattern SLUG = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");

    private ImportedNames() {
    }

    /** @throws ImportRequestException naming {@code field} when the name is missing or not a slug */
    static String check(String field, String raw) {
        if (raw == null || raw.isBlank()) {
            throw new ImportRequestException(field, "required: a lower-case name such as 'bench-lamp-365'");
        }
        String name = raw.strip().toLowerCase(Locale.ROOT);
        if (name.length() < 2 || name.length() > MAX_LENGTH) {
            throw new ImportRequestException(field, "'" + raw.strip() + "' has " + name.length()
                    + " characters; a name has 2 to " + MAX_LENGTH);
        }
        if (!SLUG.matcher(name).matches()) {
            String suggestion = suggest(name);
            throw new ImportRequestException(field, "'" + raw.strip() + "' is not a name of lower-case letters, digits"
                    + " and single dashes" + (suggestion.length() >= 2 ? "; try '" + suggestion + "'" : ""));
        }
        return name;
    }

    /** Lower case, accents dropped, every other run of characters a dash: "Bench lamp (365)" → "bench-lamp-365". */
    static String suggest(String text) {
        String ascii = Normalizer.normalize(text, Normalizer.Form.NFD).replaceAll("\\p{M}+", "");
        String slug = ascii.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("^-+|-+$", "");
        return slug.length() > MAX_LENGTH ? slug.substring(0, MAX_LENGTH).replaceAll("-+$", "") : slug;
    }
}
