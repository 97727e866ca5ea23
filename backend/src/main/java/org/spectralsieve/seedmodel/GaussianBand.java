package org.spectralsieve.seedmodel;

/**
 * An absorption band, Gaussian in absorbance (α) against wavelength: a dye, a UV filter or a colour
 * centre. Why Gaussian: it is the usual first model of an electronic band, and it keeps the band's
 * absorbance — not its transmittance — additive and proportional to thickness.
 *
 * @param centreNm       band centre
 * @param peakAlphaPerMm α at the centre, 1/mm
 * @param fwhmNm         full width at half maximum
 */
public record GaussianBand(double centreNm, double peakAlphaPerMm, double fwhmNm) implements AbsorptionPart {

    private static final double FOUR_LN_2 = 4 * Math.log(2);

    public GaussianBand {
        AbsorptionPart.requirePositive("centreNm", centreNm);
        AbsorptionPart.requireNonNegative("peakAlphaPerMm", peakAlphaPerMm);
        AbsorptionPart.requirePositive("fwhmNm", fwhmNm);
    }

    @Override
    public double alphaPerMm(double nm) {
        double x = (nm - centreNm) / fwhmNm;
        return Math.min(ALPHA_CAP_PER_MM, peakAlphaPerMm * Math.exp(-FOUR_LN_2 * x * x));
    }
}
