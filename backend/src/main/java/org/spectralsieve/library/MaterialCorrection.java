package org.spectralsieve.library;

import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;

/**
 * What a correction changes in how a material's samples are interpreted; a null field stays as it is.
 *
 * @param reason why, in the user's words; kept with the revision
 */
public record MaterialCorrection(RefractiveIndex refractiveIndex, StatedThicknesses thicknesses, String reason) {

    public MaterialCorrection {
        Objects.requireNonNull(reason, "reason");
    }

    public RefractiveIndex indexFor(Material m) {
        return refractiveIndex == null ? m.refractiveIndex() : refractiveIndex;
    }

    public StatedThicknesses thicknessesFor(Material m) {
        return thicknesses == null ? m.thicknesses() : thicknesses;
    }

    public boolean changesNothing(Material m) {
        return indexFor(m).equals(m.refractiveIndex()) && thicknessesFor(m).equals(m.thicknesses());
    }
}
