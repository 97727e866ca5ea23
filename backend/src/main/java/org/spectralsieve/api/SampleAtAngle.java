package org.spectralsieve.api;

import java.util.ArrayList;
import java.util.List;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.requirement.RequirementTooLargeException;
import org.spectralsieve.requirement.StackLayer;

/**
 * A sample (and the part in front of it) as a light path for light at an angle, for the figures and the angles
 * endpoints: the same rules the search judges by (docs/oblique-incidence.md). Only a bulk, rescalable sample has a
 * figure at an angle: a coating's spectrum shifts with angle in a way its normal-incidence curve cannot show, and
 * scatter does not follow the slant path's Beer–Lambert law.
 */
public final class SampleAtAngle {

    private SampleAtAngle() {
    }

    /** The {@code light} request parameter: "normal" (or absent), "at 30° incidence", "over a 60° beam", … */
    static Illumination light(String text) {
        try {
            return RequirementParser.parseLight(text);
        } catch (RequirementSyntaxException | RequirementTooLargeException e) {
            throw new BadParameterException("light", e.getMessage());
        }
    }

    /**
     * Why the sample has no figure at an angle, or null when it has one. The same wording as the search's rows
     * ({@code SampleEvaluator.notAtAngle}), so the page and the shortlist say the same thing.
     */
    public static String whyNot(SampleCurve sample) {
        SampleRescaling rescaling = SampleRescaling.of(sample.material(), sample.sample());
        if (rescaling.rescalable()) {
            return null;
        }
        if (rescaling.reason() != null && rescaling.reason().startsWith(SampleRescaling.NOT_COMPUTABLE)) {
            return rescaling.reason();
        }
        // the search rows' own wording (SampleEvaluator), so a row and a figure give the same reason
        return org.spectralsieve.requirement.SampleEvaluator.whyNotAtAngle(rescaling.reason());
    }

    /** Refuses a sample {@link #whyNot} names, naming {@code parameter} (what asked for the angle). */
    static void requireAtAngle(SampleCurve sample, String parameter, String forWhat) {
        String why = whyNot(sample);
        if (why != null) {
            throw new NotAtAngleException(parameter, why + "; not computed for " + forWhat);
        }
    }

    /**
     * The most wavelengths × parts a figure at an angle is computed over: the angle work grows with the points (about
     * 43 ns per point and angle, 48 angles under a spread source, docs/benchmarks.md), so a few hundred milliseconds at
     * most; {@code ObliquePath} keeps its angle tables only for curves of up to 4,096 points. The demo curves have
     * about a thousand points and a spectrometer's array gives a few thousand (common practice, no source).
     */
    public static final int MAX_POINTS_AT_ANGLE = 50_000;

    /** Refuses (naming {@code light}) a path too long to compute at an angle within {@link #MAX_POINTS_AT_ANGLE}. */
    static void requireBounded(LightPath path) {
        String why = tooLong(path);
        if (why != null) {
            throw new NotAtAngleException("light", why);
        }
    }

    /** Why the path is too long to compute at an angle ({@link #MAX_POINTS_AT_ANGLE}), or null when it is not. */
    public static String tooLong(LightPath path) {
        long cells = (long) path.sharedWavelengths().length * path.layers().size();
        return cells <= MAX_POINTS_AT_ANGLE ? null : "the light path has " + cells + " wavelength points (counted once"
                + " per part); light at an angle is computed over at most " + MAX_POINTS_AT_ANGLE
                + " (each point adds tables for every angle); figures at normal incidence are available";
    }

    /**
     * The sample as a bulk layer at the asked thickness (its measured curve read again when {@code sample} was
     * rescaled), followed by the part in front as a fixed layer when one is given.
     */
    public static LightPath path(SampleCurves curves, SampleCurve sample, StackLayer part) {
        SampleCurve measured = sample.rescaled() ? curves.get(sample.sample().id(), null, null) : sample;
        RefractiveIndex index = sample.material().refractiveIndex() == null ? ConstantIndex.WHEN_UNRECORDED
                : sample.material().refractiveIndex();
        List<Layer> layers = new ArrayList<>();
        layers.add(Layer.bulk(measured.curve(), measured.thicknessMm(), sample.thicknessMm(), index));
        if (part != null) {
            layers.add(Layer.fixed(part.curve(), part.index()));
        }
        return LightPath.of(layers);
    }
}
