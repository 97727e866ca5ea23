package org.spectralsieve.library;

import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;

/** Fetches a stored curve and applies what the user asked: rescaling to a thickness, then resampling. */
public class SampleCurves {

    /** Thicker than any sheet on a workshop shelf by far; beyond it a request is a typo, not a design. */
    public static final double MAX_THICKNESS_MM = 1000;

    private final JooqLibraryRepository library;

    public SampleCurves(JooqLibraryRepository library) {
        this.library = library;
    }

    /**
     * @param thicknessMm the thickness to rescale to, or null for the sample as measured
     * @param grid        the grid to resample onto, or null for the stored points
     */
    public SampleCurve get(long sampleId, Double thicknessMm, WavelengthGrid grid) {
        // the sample, its material's own row (scaling, index, tags, names; not its samples) and the curve, in one query
        JooqLibraryRepository.SampleWithCurve read = library.findSampleWithCurve(sampleId)
                .orElseThrow(() -> new NotFoundException("sample", sampleId));
        SampleInfo sample = read.sample();
        Material material = read.material();
        Curve curve = read.curve().orElseThrow(() -> new NotFoundException("curve of sample", sampleId));

        boolean rescale = thicknessMm != null && thicknessMm != sample.thicknessMm();
        SampleRescaling rescaling = SampleRescaling.of(material, sample);
        if (rescale && !rescaling.rescalable()) {
            throw rescaling.reason() == null ? new NotRescalableException(material.name(), sampleId)
                    : new NotRescalableException(material.name(), sampleId, rescaling.reason());
        }
        if (rescale) {
            curve = ThicknessRescaler.rescale(curve, sample.thicknessMm(), thicknessMm, material.refractiveIndex());
        }
        if (grid != null) {
            curve = curve.resample(grid);
        }
        return new SampleCurve(material, sample, curve, rescale ? thicknessMm : sample.thicknessMm(), rescale);
    }
}
