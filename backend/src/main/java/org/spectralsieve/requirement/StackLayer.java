package org.spectralsieve.requirement;

import java.util.Objects;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;

/**
 * A requirement's {@link FixedLayer} resolved to one library sample, ready to sit in every candidate's
 * light path. {@code curve} is the layer as used: a bulk sample rescaled to the asked thickness, any other
 * sample as measured (only ever at its own thickness).
 */
public record StackLayer(FixedLayer spec, long materialId, String materialName, String materialSlug, long sampleId,
                         double measuredMm, boolean rescaled, Curve curve, RefractiveIndex index) {

    public StackLayer {
        Objects.requireNonNull(spec, "spec");
        Objects.requireNonNull(materialName, "materialName");
        Objects.requireNonNull(materialSlug, "materialSlug");
        Objects.requireNonNull(curve, "curve");
        Objects.requireNonNull(index, "index");
    }

    /**
     * @param bulk whether the material may be rescaled (Beer–Lambert); a fixed sample is used as measured,
     *             so the caller must have picked one measured at the asked thickness
     */
    public static StackLayer of(FixedLayer spec, long materialId, String materialName, String materialSlug,
                                long sampleId, Curve measured, double measuredMm, boolean bulk, RefractiveIndex index) {
        boolean rescale = bulk && Math.abs(measuredMm - spec.thicknessMm()) > SampleEvaluator.SAME_THICKNESS_MM;
        Curve used = rescale ? ThicknessRescaler.rescale(measured, measuredMm, spec.thicknessMm(), index) : measured;
        return new StackLayer(spec, materialId, materialName, materialSlug, sampleId, measuredMm, rescale, used, index);
    }

    /** The part as a layer of a light path. */
    Layer asLayer() {
        return Layer.fixed(curve, index);
    }

    /** "behind 4 mm Clear float glass, glazier offcuts (clear-float-glass, sample 7, measured at 4 mm)". */
    public String describe() {
        String how = rescaled ? "rescaled from its " + Wording.mm(measuredMm) + " measurement"
                : "measured at " + Wording.mm(measuredMm);
        return (spec.placement() == FixedLayer.Placement.BEHIND ? "behind " : "on ") + Wording.mm(spec.thicknessMm())
                + " " + materialName + " (" + materialSlug + ", sample " + sampleId + ", " + how + ")";
    }
}
