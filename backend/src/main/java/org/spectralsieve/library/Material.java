package org.spectralsieve.library;

import java.util.List;
import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;

/**
 * A kind of stock as stored, with its samples (ordered by thickness) and the thicknesses it is stated to
 * exist in ({@link StatedThicknesses#NONE} when its record states none).
 */
public record Material(long id, String slug, String name, MaterialClass materialClass, String description,
                       List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex, List<SampleInfo> samples,
                       StatedThicknesses thicknesses) {

    public Material(long id, String slug, String name, MaterialClass materialClass, String description,
                    List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex, List<SampleInfo> samples) {
        this(id, slug, name, materialClass, description, tags, scaling, refractiveIndex, samples, StatedThicknesses.NONE);
    }

    public Material {
        Objects.requireNonNull(slug, "slug");
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(scaling, "scaling");
        Objects.requireNonNull(refractiveIndex, "refractiveIndex");
        description = Objects.requireNonNullElse(description, "");
        tags = List.copyOf(tags);
        samples = List.copyOf(samples);
        Objects.requireNonNull(thicknesses, "thicknesses");
    }
}
