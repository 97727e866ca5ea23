package org.spectralsieve.search;

import java.util.Locale;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/**
 * A sample seen through a library part in front of it, for figures of the stack (the figures endpoint and
 * the {@code figures} command): the part is resolved exactly as a requirement's layer, and the two are
 * combined across an air gap on both curves' own wavelengths.
 */
public final class PartInFront {

    /** A refused stack, naming the parameter ("part" for its words, "thickness" for its thickness). */
    public static final class Refused extends RuntimeException {
        private final boolean aboutThickness;

        Refused(boolean aboutThickness, String message) {
            super(message);
            this.aboutThickness = aboutThickness;
        }

        public boolean aboutThickness() {
            return aboutThickness;
        }
    }

    private PartInFront() {
    }

    /** The part named by {@code words} (a slug or words of a name) at {@code mm}; both are required. */
    public static StackLayer resolve(SearchService search, String words, Double mm) {
        if (words == null || words.isBlank() || mm == null) {
            throw new Refused(words != null && !words.isBlank(),
                    "a stack needs both the part (its slug or words of its name) and its thickness in mm");
        }
        FixedLayer spec;
        try {
            spec = new FixedLayer(FixedLayer.Placement.BEHIND, mm, words.strip().toLowerCase(Locale.ROOT), "");
        } catch (IllegalArgumentException e) {
            throw new Refused(!(mm > 0 && mm <= 1000), e.getMessage());
        }
        try {
            return search.resolveLayer(spec);
        } catch (LayerResolutionException e) {
            throw new Refused(e.reason() == LayerResolutionException.Reason.THICKNESS, e.getMessage());
        }
    }

    /** The sample (as measured or rescaled) behind the part. */
    public static Curve through(SampleCurve sample, StackLayer part) {
        RefractiveIndex index = sample.material().refractiveIndex() == null ? ConstantIndex.WHEN_UNRECORDED
                : sample.material().refractiveIndex();
        try {
            return LightPath.of(Layer.fixed(sample.curve(), index), Layer.fixed(part.curve(), part.index()))
                    .transmittance();
        } catch (CurveException e) {
            throw new Refused(false, "the sample and " + part.materialSlug() + " share no wavelength range: "
                    + e.getMessage());
        }
    }

    /** How the answer names the stack. */
    public static String describe(StackLayer part) {
        return "figures of the stack: the sample " + part.describe() + ", with an air gap between the parts";
    }
}
