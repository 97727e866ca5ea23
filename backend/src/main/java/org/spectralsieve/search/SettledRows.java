package org.spectralsieve.search;

import static org.spectralsieve.search.Admission.admits;
import static org.spectralsieve.search.SearchService.made;

import java.util.Arrays;
import java.util.List;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.requirement.Requirement;
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
 *
 * <p>The checks on a library material ({@link #settledOverRange(Material, Requirement)}, {@link #settledAtThickness})
 * read these numbers from its records, or by row from the snapshot's index and store ({@link BoundedExactSearch}).
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

    /**
     * Whether every row {@link MaterialJudge} forms for the material over the requirement's range is "not judged",
     * from its admitted samples' thicknesses, rescaling and made thicknesses alone ({@link SettledRows#overRange}).
     */
    static boolean settledOverRange(Material material, Requirement requirement) {
        return settledOverRange(material, requirement, null);
    }

    /**
     * {@link #settledOverRange(Material, Requirement)} in a loop over a million samples: no stream, the admission from
     * its table, the made thicknesses the snapshot formed, and each sample's rescaling read from its store row where it
     * has one (the row was formed with {@link SampleRescaling#of} of these very records, {@link SnapshotReader}).
     */
    static boolean settledOverRangeByRow(Snapshot s, Material material, Requirement requirement, int firstSlot,
                                                 MadeThicknesses made, Admission admission) {
        if (requirement.thickness().kind() != ThicknessSpec.Kind.RANGE) {
            return false;
        }
        List<SampleInfo> samples = material.samples();
        double[] thicknessMm = new double[samples.size()];
        boolean[] rescalable = new boolean[samples.size()];
        int n = 0;
        boolean classAdmits = admission.material(material);
        for (int k = 0; k < samples.size(); k++) {
            SampleInfo sample = samples.get(k);
            if (classAdmits && admission.geometry(sample)) {
                int row = s.index().row(firstSlot + k);
                thicknessMm[n] = sample.thicknessMm();
                rescalable[n++] = row >= 0 ? s.store().isBulk(row) : SampleRescaling.of(material, sample).rescalable();
            }
        }
        return SettledRows.overRange(n == thicknessMm.length ? thicknessMm : Arrays.copyOf(thicknessMm, n),
                n == rescalable.length ? rescalable : Arrays.copyOf(rescalable, n), made, requirement.thickness());
    }

    /** {@link #settledOverRange(Material, Requirement)} with the material's made thicknesses, or null to form them. */
    private static boolean settledOverRange(Material material, Requirement requirement, MadeThicknesses madeOrNull) {
        if (requirement.thickness().kind() != ThicknessSpec.Kind.RANGE) {
            return false;
        }
        List<SampleInfo> admitted = material.samples().stream().filter(x -> admits(requirement, material, x)).toList();
        double[] thicknessMm = new double[admitted.size()];
        boolean[] rescalable = new boolean[admitted.size()];
        for (int i = 0; i < thicknessMm.length; i++) {
            thicknessMm[i] = admitted.get(i).thicknessMm();
            rescalable[i] = SampleRescaling.of(material, admitted.get(i)).rescalable();
        }
        return SettledRows.overRange(thicknessMm, rescalable, madeOrNull != null ? madeOrNull : made(material),
                requirement.thickness());
    }

    /**
     * Whether the row {@link MaterialJudge} forms for the sample alone at the requirement's one asked thickness is
     * "not judged", from its thickness, rescaling and its material's made thicknesses ({@link SettledRows#atThickness}).
     */
    static boolean settledAtThickness(Material material, SampleInfo sample, Requirement requirement) {
        // only at one asked thickness: the rescaling rule and the made thicknesses are not formed for other searches
        // (as measured this ran for every sample, a measurable part of a 10k search)
        return requirement.thickness().kind() == ThicknessSpec.Kind.FIXED
                && SettledRows.atThickness(sample.thicknessMm(), SampleRescaling.of(material, sample).rescalable(),
                made(material), requirement.thickness());
    }
}
