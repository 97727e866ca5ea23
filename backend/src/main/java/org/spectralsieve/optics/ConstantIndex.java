package org.spectralsieve.optics;

/** One n at every wavelength: enough when only the surface loss matters (a few tenths of a percent). */
public record ConstantIndex(double n) implements RefractiveIndex {

    public ConstantIndex {
        if (!Double.isFinite(n) || n < 1) {
            throw new IllegalArgumentException("refractive index n must be finite and >= 1, was " + n);
        }
    }

    @Override
    public double at(double wavelengthNm) {
        return n;
    }
}
