package org.spectralsieve.store;

import java.util.Objects;

/** What the store keeps of a material: enough to filter, tie-break and name a result row. */
public record StoredMaterial(long id, String name, String materialClass) {

    public StoredMaterial {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(materialClass, "materialClass");
    }
}
