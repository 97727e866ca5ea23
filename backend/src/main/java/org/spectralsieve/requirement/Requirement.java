package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.optics.Illumination;

/**
 * What the light path must do: spectral clauses (all must hold), what is said about thickness, filters on
 * which samples count, and optionally a fixed part that stays in the path with every candidate.
 * {@code materialClass} is a class label as stored ("plastic sheet"); {@code geometry} is "regular" or
 * "total" (only samples measured so) or "any" (both, with total transmittance accepted for see-through
 * clauses, see {@link SeeThrough}); the thickness statement concerns the candidate, never the fixed layer.
 * {@code light} is how the light meets the path ({@link Illumination}): normal incidence unless the text says
 * "at 30° incidence", "over a 60° beam" or "under an LED with 120° beam angle".
 */
public record Requirement(List<Clause> clauses, ThicknessSpec thickness, Optional<String> materialClass,
                          Optional<String> geometry, Optional<FixedLayer> layer, String text, Illumination light) {

    public Requirement {
        clauses = List.copyOf(clauses);
        if (clauses.isEmpty()) {
            throw new IllegalArgumentException("a requirement needs at least one spectral clause");
        }
        RequirementLimits.checkClauseCount(clauses.size());
        Objects.requireNonNull(thickness, "thickness");
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(geometry, "geometry");
        Objects.requireNonNull(layer, "layer");
        text = Objects.requireNonNullElse(text, "");
        Objects.requireNonNull(light, "light");
    }

    /** A requirement for light at normal incidence. */
    public Requirement(List<Clause> clauses, ThicknessSpec thickness, Optional<String> materialClass,
                       Optional<String> geometry, Optional<FixedLayer> layer, String text) {
        this(clauses, thickness, materialClass, geometry, layer, text, Illumination.NORMAL);
    }

    /** Whether the light is not square to the surface: then every figure is computed at its angles. */
    public boolean oblique() {
        return !light.normal();
    }

    /** A requirement without a fixed layer. */
    public Requirement(List<Clause> clauses, ThicknessSpec thickness, Optional<String> materialClass,
                       Optional<String> geometry, String text) {
        this(clauses, thickness, materialClass, geometry, Optional.empty(), text);
    }

    /** The geometry word that admits both geometries and accepts total transmittance for see-through clauses. */
    public static final String ANY_GEOMETRY = "any";

    /** Whether a sample measured in this geometry ("regular" or "total") is admitted by the geometry filter. */
    public boolean admitsGeometry(String sampleGeometry) {
        return geometry.map(g -> g.equals(ANY_GEOMETRY) || g.equals(sampleGeometry)).orElse(true);
    }

    /**
     * Whether see-through clauses may be judged on total transmittance: when the user asked for total-geometry
     * samples ("geometry total") or for either geometry ("geometry any"); by default they need regular.
     */
    public boolean acceptsTotalTransmittance() {
        return geometry.map(g -> !g.equals("regular")).orElse(false);
    }

    /**
     * Whether a clause asks "with N% confidence": such a requirement is judged exactly on every sample, not
     * picked by the store's margins, since a confidence demand can turn a wide margin into an unverified row.
     */
    public boolean asksConfidence() {
        return clauses.stream().anyMatch(c -> c instanceof TransmittanceClause t && t.confidenceDemand().isPresent());
    }

    /**
     * Only transmittance and cutoff clauses on the candidate alone: what the in-memory store judges whole
     * and the closed-form thickness solver handles.
     */
    public boolean plain() {
        // at an angle the store's normal-incidence margins bound nothing: such requirements are judged exactly
        return layer.isEmpty() && light.normal() && clauses.stream().allMatch(Clause::plain);
    }

    /** Whether a clause reads a curve of another state than as supplied (aged, printed), so candidates need them. */
    public boolean namesStates() {
        return clauses.stream().anyMatch(Clause::readsStates);
    }
}
