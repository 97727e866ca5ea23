package org.spectralsieve.optics;

/** One n at every wavelength: enough when only the surface loss matters (a few tenths of a percent). */
public record ConstantIndex(double n) implements RefractiveIndex {

    /**
     * What a part whose material has no index recorded (a coating, a laminate) is taken to have: n = 1.5,
     * typical of window glass and clear plastics (common practice, no source).
     */
    public static final ConstantIndex WHEN_UNRECORDED = new ConstantIndex(1.5);

    public ConstantIndex {
        PhysicalRanges.requireIndex("refractive index n", n);
    }

    @Override
    public double at(double wavelengthNm) {
        return n;
    }
}
