package org.spectralsieve.library;

import java.util.Arrays;
import java.util.Locale;

/** How the transmitted light was collected: the direct beam only, or everything including scatter. */
public enum Geometry {
    /** Regular (direct-beam) transmittance: small acceptance angle, what a window passes to a lens or mask. */
    REGULAR,
    /** Total transmittance including diffusely scattered light (integrating sphere). */
    TOTAL;

    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    public static Geometry parse(String text) {
        return Labels.parse(Geometry.class, values(), text, "geometry");
    }

    /** Shared strict parsing of lower-case enum labels, so every enum refuses bad input the same way. */
    static final class Labels {
        private Labels() {
        }

        static <E extends Enum<E>> E parse(Class<E> type, E[] values, String text, String what) {
            if (text != null) {
                for (E value : values) {
                    if (value.name().equalsIgnoreCase(text.trim())) {
                        return value;
                    }
                }
            }
            throw new IllegalArgumentException(what + " '" + text + "' is not one of "
                    + Arrays.stream(values).map(v -> v.name().toLowerCase(Locale.ROOT)).toList());
        }
    }
}
