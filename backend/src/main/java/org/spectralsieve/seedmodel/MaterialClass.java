package org.spectralsieve.seedmodel;

/** The material classes of the catalogue, with the exact strings the catalogue file uses. */
public enum MaterialClass {
    WINDOW_GLASS("window glass"),
    OPTICAL_GLASS("optical glass"),
    FUSED_SILICA("fused silica"),
    PLASTIC_SHEET("plastic sheet"),
    FILM("film"),
    COATING("coating"),
    RESIN_TANK_SHEET("resin-tank sheet"),
    MASK_FILM("mask film"),
    LAMINATE("laminate"),
    OTHER("other");

    private final String label;

    MaterialClass(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }
}
