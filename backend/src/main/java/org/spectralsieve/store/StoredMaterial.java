package org.spectralsieve.store;

import java.util.Objects;
import org.spectralsieve.requirement.MadeThicknesses;

/**
 * What the store keeps of a material: enough to filter, tie-break and name a result row, and the
 * thicknesses it exists in (which bound every rescaling, as in the exact judgement).
 */
public record StoredMaterial(long id, String name, String materialClass, MadeThicknesses made) {

    public StoredMaterial {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(made, "made");
    }

    /** A material whose thicknesses are not limited (curves judged on their own). */
    public StoredMaterial(long id, String name, String materialClass) {
        this(id, name, materialClass, MadeThicknesses.UNLIMITED);
    }
}
