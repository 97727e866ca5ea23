package org.spectralsieve.seedmodel;

/** Whether a material can be rescaled to another thickness (bulk) or is a fixed construction. */
public enum Scaling {
    BULK("bulk"),
    FIXED("fixed");

    private final String label;

    Scaling(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }
}
