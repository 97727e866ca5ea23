package org.spectralsieve.importers;

/** Unit of the wavelength column as written in a file; everything downstream works in nanometres. */
public enum XUnit {
    NANOMETRE(1.0),
    MICROMETRE(1000.0),
    ANGSTROM(0.1),
    /**
     * Wavenumber in cm⁻¹ (infrared and JCAMP-DX {@code 1/CM}): λ/nm = 10⁷ / ν̃. Not a length, so the
     * conversion is a reciprocal and reverses the order of the points.
     */
    WAVENUMBER_PER_CM(Double.NaN);

    private final double nanometresPerUnit;

    XUnit(double nanometresPerUnit) {
        this.nanometresPerUnit = nanometresPerUnit;
    }

    /**
     * Converts a value in this unit to nanometres. Ångström divides by ten instead of multiplying by
     * 0.1 so that whole-ångström values land on the nearest double of the exact decimal result. A
     * wavenumber of zero gives infinity; callers check the result is finite.
     */
    public double toNanometres(double value) {
        if (this == WAVENUMBER_PER_CM) {
            return 1e7 / value;
        }
        return this == ANGSTROM ? value / 10.0 : value * nanometresPerUnit;
    }
}
