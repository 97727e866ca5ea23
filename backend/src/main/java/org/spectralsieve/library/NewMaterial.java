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

    private static final Pattern SLUG = Pattern.compile("[a-z0-9][a-z0-9\\-]{0,118}[a-z0-9]");

    public NewMaterial {
        if (slug == null || !SLUG.matcher(slug).matches()) {
            throw new IllegalArgumentException("slug '" + slug + "' must be 2-120 lower-case letters, digits or hyphens");
        }
        if (name == null || name.isBlank() || name.length() > 200) {
            throw new IllegalArgumentException("name must be 1-200 characters");
        }
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(scaling, "scaling");
        Objects.requireNonNull(refractiveIndex, "refractiveIndex");
        Objects.requireNonNull(thicknesses, "thicknesses");
        description = Objects.requireNonNullElse(description, "");
        tags = List.copyOf(tags);
        for (String tag : tags) {
            if (tag.isBlank() || tag.contains(",")) {
                throw new IllegalArgumentException("tag '" + tag + "' must be non-blank and contain no comma");
            }
        }
    }
}
