package org.spectralsieve.library;

import java.util.Locale;

/** Whether a material's curve may be rescaled to another thickness. */
public enum Scaling {
    /** A homogeneous absorber: Beer–Lambert applies to its internal transmittance. */
    BULK,
    /** A coating, laminate or otherwise layered or scattering part: only usable as measured. */
    FIXED;

    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    public static Scaling parse(String text) {
        return Geometry.Labels.parse(Scaling.class, values(), text, "scaling");
    }
}
