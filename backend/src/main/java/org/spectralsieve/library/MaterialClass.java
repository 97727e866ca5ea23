package org.spectralsieve.library;

import java.util.List;
import java.util.regex.Pattern;

/**
 * The kind of stock a material is. The known classes cover the shelf of a UV workshop; the set is
 * open, so a user can file a material under a new class without a code change.
 */
public record MaterialClass(String label) {

    public static final List<String> KNOWN = List.of(
            "window glass", "optical glass", "fused silica", "plastic sheet", "film", "coating",
            "resin-tank sheet", "mask film", "laminate", "other");

    private static final Pattern LABEL = Pattern.compile("[a-z][a-z0-9 \\-]{0,38}[a-z0-9]");

    public MaterialClass {
        if (label == null || !LABEL.matcher(label).matches()) {
            throw new IllegalArgumentException("material class '" + label
                    + "' must be 2-40 lower-case letters, digits, spaces or hyphens, e.g. one of " + KNOWN);
        }
    }

    public static MaterialClass of(String label) {
        return new MaterialClass(label == null ? null : label.trim().toLowerCase(java.util.Locale.ROOT));
    }

    @Override
    public String toString() {
        return label;
    }
}
