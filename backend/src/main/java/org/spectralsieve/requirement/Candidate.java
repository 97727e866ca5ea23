package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;
import org.spectralsieve.states.StateCurve;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * One measured sample offered to a requirement. {@code thicknessMm} is the measured thickness, NaN when
 * not recorded. {@code bulk}: the sample is a homogeneous absorber whose curve may be rescaled to another
 * thickness (Beer–Lambert); a coating or laminate is not bulk and is only ever judged as measured.
 * {@code index} is needed for bulk samples (surface reflection is stripped before rescaling), may be null
 * otherwise. {@code made}: the thicknesses the material exists in ({@link MadeThicknesses}); every judgement
 * at another thickness stays inside them.
 *
 * <p>{@code totalTransmittance}: the light judged includes diffusely scattered light (the sample, or a part
 * in its light path, was measured in total geometry), so clauses about seeing through ({@link SeeThrough})
 * cannot be judged on it unless the requirement accepts total transmittance. {@code notRescaledReason}:
 * why a sample of an otherwise rescalable material is held at its measured thickness (diffuse or scattering
 * samples: scatter is not absorption); null for the ordinary cases, where {@code bulk} alone decides. A
 * sample with a reason is never bulk. {@code states}: the sample's curves in other states (aged, printed; see
 * {@link org.spectralsieve.states}); {@code measured} is its as-supplied curve.
 */
public record Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                        boolean bulk, RefractiveIndex index, MadeThicknesses made, boolean totalTransmittance,
                        String notRescaledReason, List<StateCurve> states) {

    /** A sample without curves in other states (its own curve is its as-supplied state). */
    public Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                     boolean bulk, RefractiveIndex index, MadeThicknesses made, boolean totalTransmittance,
                     String notRescaledReason) {
        this(sampleId, materialId, materialName, measured, thicknessMm, bulk, index, made, totalTransmittance,
                notRescaledReason, List.of());
    }

    /** The same sample with its curves in other states (aged, printed), which state clauses read. */
    public Candidate withStates(List<StateCurve> stateCurves) {
        return new Candidate(sampleId, materialId, materialName, measured, thicknessMm, bulk, index, made,
                totalTransmittance, notRescaledReason, stateCurves);
    }

    /** A curve judged without a material record: no limit on thickness ({@link MadeThicknesses#UNLIMITED}). */
    public Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                     boolean bulk, RefractiveIndex index) {
        this(sampleId, materialId, materialName, measured, thicknessMm, bulk, index, MadeThicknesses.UNLIMITED);
    }

    /** A regular-geometry sample whose rescaling the material's scaling alone decides, within {@code made}. */
    public Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                     boolean bulk, RefractiveIndex index, MadeThicknesses made) {
        this(sampleId, materialId, materialName, measured, thicknessMm, bulk, index, made, false, null);
    }

    /** Without a material record's thicknesses ({@link MadeThicknesses#UNLIMITED}), geometry stated. */
    public Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                     boolean bulk, RefractiveIndex index, boolean totalTransmittance, String notRescaledReason) {
        this(sampleId, materialId, materialName, measured, thicknessMm, bulk, index, MadeThicknesses.UNLIMITED,
                totalTransmittance, notRescaledReason);
    }

    public Candidate {
        Objects.requireNonNull(materialName, "materialName");
        Objects.requireNonNull(measured, "measured");
        Objects.requireNonNull(made, "made");
        states = List.copyOf(Objects.requireNonNull(states, "states"));
        if (!Double.isNaN(thicknessMm) && !(thicknessMm > 0 && Double.isFinite(thicknessMm))) {
            throw new IllegalArgumentException("thicknessMm of sample " + sampleId
                    + " must be a finite thickness > 0 mm or NaN (not recorded), was " + thicknessMm);
        }
        if (bulk && index == null) {
            throw new IllegalArgumentException("bulk sample " + sampleId + " needs a refractive index to be rescaled");
        }
        if (bulk && notRescaledReason != null) {
            throw new IllegalArgumentException("sample " + sampleId + " is marked bulk but also not rescaled ("
                    + notRescaledReason + ")");
        }
    }

    public boolean thicknessKnown() {
        return !Double.isNaN(thicknessMm);
    }
}
