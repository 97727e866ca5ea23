package org.spectralsieve.importers;

/** Unit of the wavelength column as written in a file; everything downstream works in nanometres. */
public enum XUnit {
    NANOMETRE(1.0),
    MICROMETRE(1000.0),
    ANGSTROM(0.1),
    /**
     * Wavenumber in cm⁻¹: λ[nm] = 10⁷ / ν̃[cm⁻¹]. The map is reciprocal, so a uniform wavenumber grid is a
     * non-uniform wavelength grid and an increasing wavenumber column becomes decreasing wavelengths.
     */
    WAVENUMBER_PER_CM(Double.NaN);

    private static final double NM_CM = 1e7;

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
        return switch (this) {
            case ANGSTROM -> value / 10.0;
            case WAVENUMBER_PER_CM -> NM_CM / value;
            default -> value * nanometresPerUnit;
        };
    }

    /** True when increasing values in this unit mean decreasing wavelengths. */
    public boolean isReciprocal() {
        return this == WAVENUMBER_PER_CM;
    }
}
