package org.spectralsieve.seedmodel;

/**
 * Cutoff made by a dissolved absorber (UV absorber in a polymer, dye in a tinted sheet): log α steps
 * logistically from {@code alphaBelowPerMm} (short wavelengths) to {@code alphaAbovePerMm} (long ones)
 * around {@code edgeNm}. Why log-logistic: absorber bands saturate at a finite α on the short side, and
 * the long-side tail falls by decades over a few tens of nm, so the transmittance edge still shifts with
 * thickness as Beer–Lambert demands.
 *
 * @param edgeNm          midpoint of the step in log α
 * @param alphaBelowPerMm α far below the edge, 1/mm
 * @param alphaAbovePerMm α far above the edge, 1/mm
 * @param widthNm         logistic width; the step spans about ±4 widths
 */
public record LogisticEdge(double edgeNm, double alphaBelowPerMm, double alphaAbovePerMm, double widthNm)
        implements AbsorptionPart {

    public LogisticEdge {
        AbsorptionPart.requirePositive("edgeNm", edgeNm);
        AbsorptionPart.requirePositive("alphaBelowPerMm", alphaBelowPerMm);
        AbsorptionPart.requirePositive("alphaAbovePerMm", alphaAbovePerMm);
        AbsorptionPart.requirePositive("widthNm", widthNm);
    }

    @Override
    public double alphaPerMm(double nm) {
        double step = 1.0 / (1.0 + Math.exp(Math.max(-50, Math.min(50, (nm - edgeNm) / widthNm))));
        double logAlpha = Math.log(alphaAbovePerMm) + (Math.log(alphaBelowPerMm) - Math.log(alphaAbovePerMm)) * step;
        return Math.min(ALPHA_CAP_PER_MM, Math.exp(logAlpha));
    }
}
