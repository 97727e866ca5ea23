package org.spectralsieve.library;

import java.text.Normalizer;
import java.util.Locale;

/** URL-safe identifiers made from a material's name ("Cast acrylic, UV-T" → "cast-acrylic-uv-t"). */
final class Slugs {

    /** Leaves room for a "-NNN" suffix inside the 120 characters a slug may have. */
    private static final int MAX_BASE = 110;

    private Slugs() {
    }

    static String fromName(String name) {
        String ascii = Normalizer.normalize(name, Normalizer.Form.NFD).replaceAll("\\p{M}+", "");
        String slug = ascii.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "-").replaceAll("^-+|-+$", "");
        if (slug.length() > MAX_BASE) {
            slug = slug.substring(0, MAX_BASE).replaceAll("-+$", "");
        }
        return slug.length() < 2 ? "material" + (slug.isEmpty() ? "" : "-" + slug) : slug;
    }
}
