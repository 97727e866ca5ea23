package org.spectralsieve.search;

import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.NominalThickness;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.requirement.ThicknessSpec;

/**
 * Rows known before any curve is read: where the exact judgement ({@code MaterialJudge}, {@code SampleEvaluator})
 * can only say "not judged at the asked thickness" ({@link Standing#NOT_JUDGED}), decided from the samples'
 * thicknesses, whether each may be rescaled, and the thicknesses the material is made in — the very tests the
 * judgement makes before it reads a curve (docs/weighted-screening.md, "Rows settled by thickness").
 *
 * <p>Not-judged rows rank after every other group and never push a judged row out, so the judging loop
 * ({@link BoundedJudgement}) keeps such a contender last and leaves it out once the rows are full of better
 * rows; when it could still enter it is judged exactly as any other, so the answer is unchanged.
 * {@code SettledRowsTest} checks every settled row against the exact judgement.
 */
final class SettledRows {

    private SettledRows() {
    }

    /**
     * Whether every row {@code MaterialJudge.evaluate} forms for a material over a solved range is not judged.
     * True when each admitted sample is one of: without a recorded thickness (NaN; judged only as measured); never
     * rescaled (a film, a coated part, a diffuse sample) and measured outside the range; rescalable but of a
     * material made in none of the range. Whichever samples the judgement then picks (the nearest, or a
     * rescalable one measured inside the range when the first sample is never rescaled), each row says why it
     * cannot be judged there.
     *
     * @param thicknessMm each admitted sample's measured thickness (NaN: not recorded)
     * @param rescalable  whether each may be rescaled ({@code SampleRescaling})
     * @param made        the thicknesses the material is made in ({@code SearchService.made})
     */
    static boolean overRange(double[] thicknessMm, boolean[] rescalable, MadeThicknesses made, ThicknessSpec spec) {
        if (spec.kind() != ThicknessSpec.Kind.RANGE || thicknessMm.length == 0) {
            return false;
        }
        boolean madeNone = made.within(spec.minMm(), spec.maxMm()) == null;
        for (int i = 0; i < thicknessMm.length; i++) {
            double d0 = thicknessMm[i];
            boolean settled = Double.isNaN(d0)
                    || (rescalable[i] ? madeNone : !NominalThickness.within(d0, spec.minMm(), spec.maxMm()));
            if (!settled) {
                return false;
            }
        }
        return true;
    }

    /**
     * Whether the row {@code SampleEvaluator} forms for one sample at one asked thickness is not judged: its
     * thickness is not recorded, or it was measured at another thickness ({@link NominalThickness#same}) and is
     * never rescaled, or the material is not made at the asked thickness.
     */
    static boolean atThickness(double thicknessMm, boolean rescalable, MadeThicknesses made, ThicknessSpec spec) {
        if (spec.kind() != ThicknessSpec.Kind.FIXED) {
            return false;
        }
        double asked = spec.minMm();
        if (Double.isNaN(thicknessMm)) {
            return true;
        }
        return !NominalThickness.same(thicknessMm, asked) && (!rescalable || !made.makes(asked));
    }
}
