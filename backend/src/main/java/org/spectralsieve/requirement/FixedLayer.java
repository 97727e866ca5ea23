package org.spectralsieve.requirement;

import java.util.Objects;

/**
 * A part that stays in the light path with every candidate: "behind 4 mm float glass", "on 3 mm fused
 * silica". {@code material} names a library material in the user's words (lower case, single spaces); it is
 * resolved to a material and sample where the library is known (the search service), never here.
 *
 * <p>Two parts across an air gap transmit the same whichever comes first (symmetric slabs, incoherent
 * reflections), so {@link Placement} only keeps the user's wording.
 */
public record FixedLayer(Placement placement, double thicknessMm, String material, String text) {

    /** "behind": the candidate sits behind the part; "on": it is laid on the part. */
    public enum Placement { BEHIND, ON }

    public FixedLayer {
        Objects.requireNonNull(placement, "placement");
        if (!RequirementLimits.isThickness(thicknessMm)) {
            throw new IllegalArgumentException("layer thickness must be above 0 and at most "
                    + RequirementLimits.MAX_THICKNESS_MM + " mm, got " + thicknessMm);
        }
        if (!RequirementLimits.isMaterialWords(material)) {
            throw new IllegalArgumentException("layer material must be 1 to " + RequirementLimits.MAX_MATERIAL_WORDS_LENGTH
                    + " characters of letters, digits, spaces or hyphens, got '" + material + "'");
        }
        text = Objects.requireNonNullElse(text, "");
    }
}
