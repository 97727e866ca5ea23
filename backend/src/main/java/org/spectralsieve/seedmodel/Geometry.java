package org.spectralsieve.seedmodel;

/** How a sample's transmittance is collected: the direct beam only, or including forward-scattered light. */
public enum Geometry {
    REGULAR("regular"),
    TOTAL("total");

    private final String label;

    Geometry(String label) {
        this.label = label;
    }

    /** The word used in the catalogue and curve files. */
    public String label() {
        return label;
    }
}
