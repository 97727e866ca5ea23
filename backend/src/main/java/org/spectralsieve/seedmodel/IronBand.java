package org.spectralsieve.seedmodel;

/**
 * Iron in soda-lime glass, scaled by {@code relativeIron} (1 = ordinary clear float, 0.1 = low-iron, which
 * has about a tenth of the iron — PRACTICE.md [S1]). Three parts, common practice, no source for the
 * exact shapes: the broad Fe²⁺ band near 1000–1100 nm that gives edge-on float glass its green; a weak
 * Fe³⁺ band near 380 nm; and the Fe³⁺ charge-transfer tail that sets the UV edge near 320–340 nm.
 *
 * @param relativeIron iron content relative to ordinary clear float glass
 */
public record IronBand(double relativeIron) implements AbsorptionPart {

    private static final GaussianBand FERROUS_NEAR_IR = new GaussianBand(1050, 0.030, 600);
    private static final GaussianBand FERRIC_380 = new GaussianBand(380, 0.008, 30);
    private static final UrbachEdge FERRIC_UV_TAIL = new UrbachEdge(330, 0.30, 0.16);

    public IronBand {
        AbsorptionPart.requireNonNegative("relativeIron", relativeIron);
    }

    @Override
    public double alphaPerMm(double nm) {
        double sum = FERROUS_NEAR_IR.alphaPerMm(nm) + FERRIC_380.alphaPerMm(nm) + FERRIC_UV_TAIL.alphaPerMm(nm);
        return Math.min(ALPHA_CAP_PER_MM, relativeIron * sum);
    }
}
