package org.spectralsieve.ingest;

import java.util.Objects;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.RefractiveIndex;

/** Where an imported curve goes: under a material already in the library, or under a new one. */
public sealed interface ImportTarget {

    record ExistingMaterial(long materialId) implements ImportTarget {
    }

    /**
     * @param refractiveIndex null when not known: a constant n = {@value ImportService#DEFAULT_INDEX} is
     *                        assumed, with a warning
     */
    /** As long as material.description may be (V1 migration). */
    int MAX_DESCRIPTION = 4000;

    record NewMaterial(String name, MaterialClass materialClass, Scaling scaling, RefractiveIndex refractiveIndex,
                       String description, StatedThicknesses thicknesses) implements ImportTarget {

        public NewMaterial(String name, MaterialClass materialClass, Scaling scaling, RefractiveIndex refractiveIndex,
                           String description) {
            this(name, materialClass, scaling, refractiveIndex, description, StatedThicknesses.NONE);
        }

        public NewMaterial {
            Objects.requireNonNull(thicknesses, "thicknesses");
            if (name == null || name.isBlank()) {
                throw new ImportRequestException("materialName", "a new material needs a name");
            }
            name = name.strip();
            Objects.requireNonNull(materialClass, "materialClass");
            Objects.requireNonNull(scaling, "scaling");
            description = Objects.requireNonNullElse(description, "");
            if (description.length() > MAX_DESCRIPTION) {
                throw new ImportRequestException("description", "at most " + MAX_DESCRIPTION + " characters, got "
                        + description.length());
            }
        }
    }
}
