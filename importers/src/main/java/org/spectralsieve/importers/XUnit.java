package org.spectralsieve.importers;

/** Unit of the wavelength column as written in a file; everything downstream works in nanometres. */
public enum XUnit {
    NANOMETRE(1.0),
    MICROMETRE(1000.0),
    ANGSTROM(0.1);

    private final double nanometresPerUnit;

    XUnit(double nanometresPerUnit) {
        this.nanometresPerUnit = nanometresPerUnit;
    }

    /**
     * Converts a value in this unit to nanometres. Ångström divides by ten instead of multiplying by
     * 0.1 so that whole-ångström values land on the nearest double of the exact decimal result.
     */
    public double toNanometres(double value) {
        return this == ANGSTROM ? value / 10.0 : value * nanometresPerUnit;
    }
}
