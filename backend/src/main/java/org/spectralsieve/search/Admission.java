package org.spectralsieve.search;

import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.requirement.Requirement;

/**
 * {@link #admits} for one search, split so a loop over a million samples reads a table: the material's class
 * compared once per material, each geometry's admission formed once (its label is formed per call).
 */
final class Admission {

    /** The asked class label, null when any class is admitted. */
    private final String materialClass;
    private final boolean[] byGeometry = new boolean[Geometry.values().length];

    Admission(Requirement requirement) {
        this.materialClass = requirement.materialClass().orElse(null);
        for (Geometry g : Geometry.values()) {
            byGeometry[g.ordinal()] = requirement.admitsGeometry(g.label());
        }
    }

    /** The material's part of {@link #admits}. */
    boolean material(Material m) {
        return materialClass == null || materialClass.equals(m.materialClass().label());
    }

    /** The material's part of {@link #admits} for each class label, in the labels' order. */
    boolean[] classes(String[] labels) {
        boolean[] out = new boolean[labels.length];
        for (int c = 0; c < labels.length; c++) {
            out[c] = materialClass == null || materialClass.equals(labels[c]);
        }
        return out;
    }

    /** The sample's part of {@link #admits}, by its geometry's ordinal. */
    boolean geometry(int ordinal) {
        return byGeometry[ordinal];
    }

    /** The sample's part of {@link #admits}. */
    boolean geometry(SampleInfo s) {
        return geometry(s.geometry());
    }

    /** The sample's part of {@link #admits}, from its geometry. */
    boolean geometry(Geometry g) {
        return byGeometry[g.ordinal()];
    }

    /** Whether the requirement admits the sample: its material's class and its geometry. */
    static boolean admits(Requirement r, Material m, SampleInfo s) {
        return r.materialClass().map(c -> c.equals(m.materialClass().label())).orElse(true)
                && r.admitsGeometry(s.geometry().label());
    }
}
