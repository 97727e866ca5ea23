package org.spectralsieve.requirement;

import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * One measured sample offered to a requirement. {@code thicknessMm} is the measured thickness, NaN when
 * not recorded. {@code bulk}: the sample is a homogeneous absorber whose curve may be rescaled to another
 * thickness (Beer–Lambert); a coating or laminate is not bulk and is only ever judged as measured.
 * {@code index} is needed for bulk samples (surface reflection is stripped before rescaling), may be null
 * otherwise. {@code made}: the thicknesses the material exists in ({@link MadeThicknesses}); every judgement
 * at another thickness stays inside them.
 */
public record Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                        boolean bulk, RefractiveIndex index, MadeThicknesses made) {

    /** A curve judged without a material record: no limit on thickness ({@link MadeThicknesses#UNLIMITED}). */
    public Candidate(long sampleId, long materialId, String materialName, Curve measured, double thicknessMm,
                     boolean bulk, RefractiveIndex index) {
        this(sampleId, materialId, materialName, measured, thicknessMm, bulk, index, MadeThicknesses.UNLIMITED);
    }

    public Candidate {
        Objects.requireNonNull(materialName, "materialName");
        Objects.requireNonNull(measured, "measured");
        Objects.requireNonNull(made, "made");
        if (!Double.isNaN(thicknessMm) && !(thicknessMm > 0 && Double.isFinite(thicknessMm))) {
            throw new IllegalArgumentException("thicknessMm of sample " + sampleId
                    + " must be a finite thickness > 0 mm or NaN (not recorded), was " + thicknessMm);
        }
        if (bulk && index == null) {
            throw new IllegalArgumentException("bulk sample " + sampleId + " needs a refractive index to be rescaled");
        }
    }

    public boolean thicknessKnown() {
        return !Double.isNaN(thicknessMm);
    }
}
