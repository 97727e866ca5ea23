package org.spectralsieve.requirement;

/**
 * Which clauses are about seeing through a part, and so need regular (direct-beam) transmittance.
 *
 * <p>Luminous transmittance τv is a see-through figure: it rates what an eye sees through a window, lens or
 * visor (ISO 12312-1 / ISO 8980-3 define it for lenses, which are judged in the direct beam). A diffuser's
 * total transmittance (integrating sphere) counts light scattered through every angle, so an opal sheet
 * that passes 80 % of the light but shows no image would "meet" a see-through clause. Such a sample is
 * therefore UNVERIFIED for these clauses, with the reason, unless the requirement accepts total
 * transmittance ({@link Requirement#acceptsTotalTransmittance()}: {@code geometry total} or
 * {@code geometry any}). Every other clause (band transmittance, cutoffs, UV-weighted figures) asks how
 * much light of a band gets through, which total transmittance answers for exposure and curing; for a
 * block clause it is also the safe reading, because total T is never below regular T.
 */
public final class SeeThrough {

    /** The reason shown on a see-through clause judged on a diffuse sample. */
    public static final String REASON = "diffuse sample (total transmittance includes scattered light): a see-through"
            + " figure needs regular transmittance; write 'geometry any' to accept total transmittance";

    private SeeThrough() {
    }

    /** Whether the clause rates seeing through the part (today: luminous transmittance). */
    public static boolean needsRegular(Clause clause) {
        return clause instanceof WeightedClause w && w.weighting() instanceof Weighting.Luminous;
    }
}
