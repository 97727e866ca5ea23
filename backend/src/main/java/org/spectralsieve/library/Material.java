package org.spectralsieve.library;

import java.util.List;
import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;

/** A kind of stock as stored, with its samples (thickest last is not implied: ordered by thickness). */
public record Material(long id, String slug, String name, MaterialClass materialClass, String description,
                       List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex, List<SampleInfo> samples) {

    public Material {
        Objects.requireNonNull(slug, "slug");
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(scaling, "scaling");
        Objects.requireNonNull(refractiveIndex, "refractiveIndex");
        description = Objects.requireNonNullElse(description, "");
        tags = List.copyOf(tags);
        samples = List.copyOf(samples);
    }
}
