package org.spectralsieve.library;

import java.time.Instant;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;

/**
 * A kind of stock as stored, with its samples in use (ordered by thickness) and the thicknesses it is stated
 * to exist in ({@link StatedThicknesses#NONE} when its record states none). Index and thicknesses are those
 * of its current {@code revision}; {@code retiredAt} is when it was retired, null while in use (see
 * docs/undo.md).
 */
public record Material(long id, String slug, String name, MaterialClass materialClass, String description,
                       List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex, List<SampleInfo> samples,
                       StatedThicknesses thicknesses, int revision, Instant retiredAt) {

    public Material(long id, String slug, String name, MaterialClass materialClass, String description,
                    List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex, List<SampleInfo> samples,
                    StatedThicknesses thicknesses) {
        this(id, slug, name, materialClass, description, tags, scaling, refractiveIndex, samples, thicknesses, 1, null);
    }

    public Material(long id, String slug, String name, MaterialClass materialClass, String description,
                    List<String> tags, Scaling scaling, RefractiveIndex refractiveIndex, List<SampleInfo> samples) {
        this(id, slug, name, materialClass, description, tags, scaling, refractiveIndex, samples, StatedThicknesses.NONE);
    }

    public boolean retired() {
        return retiredAt != null;
    }

    public Material {
        if (revision < 1) {
            throw new IllegalArgumentException("revision must be 1 or more, got " + revision);
        }
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
