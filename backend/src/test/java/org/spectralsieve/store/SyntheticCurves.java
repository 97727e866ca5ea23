package org.spectralsieve.store;

import java.util.Random;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.spectrum.WavelengthGrid;

/**
 * Physically plausible synthetic transmittance curves for tests and benchmarks: an Urbach-like
 * absorption edge (α grows exponentially toward short wavelengths), an optional dye band, a flat
 * background, Fresnel surfaces and a detection floor. Deterministic for a seed.
 */
public final class SyntheticCurves {

    public static final RefractiveIndex[] INDICES = {
            new ConstantIndex(1.46), new ConstantIndex(1.49), new ConstantIndex(1.52), new ConstantIndex(1.585)};

    private final Random random;
    private final double[] gridNm;

    public SyntheticCurves(long seed, WavelengthGrid grid) {
        this.random = new Random(seed);
        this.gridNm = grid.points();
    }

    /** One random sample's description. */
    public record Spec(double edgeNm, double edgeWidthNm, double bandNm, double bandPeakPerMm, double bandWidthNm,
                       double backgroundPerMm, double thicknessMm, int index, double floor) {
    }

    public Spec next() {
        double edge = 220 + random.nextDouble() * 260;                 // edges from deep UV to blue
        double width = 4 + random.nextDouble() * 20;                   // steep glass edges to soft dyed plastics
        boolean dyed = random.nextDouble() < 0.3;
        double band = dyed ? 380 + random.nextDouble() * 300 : 0;
        double peak = dyed ? random.nextDouble() * 3 : 0;
        double bandWidth = 20 + random.nextDouble() * 60;
        double background = random.nextDouble() * 0.01;
        double thickness = 0.5 + random.nextDouble() * 9.5;
        int index = random.nextInt(INDICES.length);
        double floor = random.nextDouble() < 0.8 ? 1e-3 : 1e-4;
        return new Spec(edge, width, band, peak, bandWidth, background, thickness, index, floor);
    }

    /** Internal absorption coefficient α(λ) in 1/mm (natural log). */
    public static double alphaPerMm(Spec s, double nm) {
        double edge = 1.0 * Math.exp((s.edgeNm() - nm) / s.edgeWidthNm()); // α = 1/mm at the edge wavelength
        double band = s.bandPeakPerMm() == 0 ? 0
                : s.bandPeakPerMm() * Math.exp(-0.5 * Math.pow((nm - s.bandNm()) / (s.bandWidthNm() / 2.355), 2));
        return edge + band + s.backgroundPerMm();
    }

    /** T(λ) of the sample at its thickness, and whether it is at or below the floor. */
    public static double transmittance(Spec s, double nm) {
        double internal = Math.exp(-Math.min(700, alphaPerMm(s, nm) * s.thicknessMm()));
        double r = Fresnel.reflectanceInAir(INDICES[s.index()].at(nm));
        return Slab.transmittance(internal, r);
    }

    /** The sample as store codes on the grid. */
    public short[] codes(Spec s) {
        short[] codes = new short[gridNm.length];
        for (int w = 0; w < gridNm.length; w++) {
            double t = transmittance(s, gridNm[w]);
            boolean below = t <= s.floor();
            codes[w] = OdCode.encode(below ? s.floor() : t, below);
        }
        return codes;
    }
}
