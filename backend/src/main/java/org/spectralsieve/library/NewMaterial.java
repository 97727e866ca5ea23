package org.spectralsieve.library;

import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;
import org.spectralsieve.optics.RefractiveIndex;

/** A material to be stored; the database gives it its id. */
public record NewMaterial(String slug, String name, MaterialClass materialClass, String description,
                          List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex,
                          StatedThicknesses thicknesses) {

    public NewMaterial(String slug, String name, MaterialClass materialClass, String description,
                       List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex) {
        this(slug, name, materialClass, description, tags, scaling, refractiveIndex, StatedThicknesses.NONE);
    }

    /** The lengths of the material table's columns (V1 migration). */
    public static final int MAX_NAME = 200;
    public static final int MAX_DESCRIPTION = 4000;
    public static final int MAX_TAGS = 1000;

    private static final Pattern SLUG = Pattern.compile("[a-z0-9][a-z0-9\\-]{0,118}[a-z0-9]");

    public NewMaterial {
        if (slug == null || !SLUG.matcher(slug).matches()) {
            throw new IllegalArgumentException("slug '" + slug + "' must be 2-120 lower-case letters, digits or hyphens");
        }
        if (name == null || name.isBlank()) {
            throw new FieldException("name", "must not be blank");
        }
        StoredText.line("name", name, MAX_NAME);
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(scaling, "scaling");
        Objects.requireNonNull(refractiveIndex, "refractiveIndex");
        Objects.requireNonNull(thicknesses, "thicknesses");
        description = StoredText.paragraph("description", Objects.requireNonNullElse(description, ""), MAX_DESCRIPTION);
        tags = List.copyOf(tags);
        for (String tag : tags) {
            if (tag.isBlank() || tag.contains(",")) {
                throw new FieldException("tags", "'" + tag + "' must be non-blank and contain no comma");
            }
            StoredText.line("tags", tag, MAX_TAGS);
        }
        if (String.join(",", tags).length() > MAX_TAGS) {
            throw new FieldException("tags", "must be at most " + MAX_TAGS + " characters together, with a comma between");
        }
    }
}
