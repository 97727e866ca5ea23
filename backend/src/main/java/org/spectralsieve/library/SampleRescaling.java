package org.spectralsieve.library;

import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.optics.UnusableIndex;

/**
 * Whether one stored sample may be rescaled to another thickness by Beer–Lambert, and why not: the one rule
 * the search, the store's screening, fixed layers and the curve and figures endpoints share.
 *
 * <p>Beer–Lambert scales an absorption: T_internal(d) = T_internal(d0)^(d/d0). Light a sample scatters is not
 * absorbed, and thickness changes it in ways the measurement does not tell (multiple scattering in a
 * diffuser, a surface haze that does not grow with thickness at all), so thickness conversion is not valid
 * for filled, pigmented or diffuse materials (PRACTICE.md [S47]). A sample is held at its measured thickness,
 * as a fixed layer is, when
 * <ul>
 *   <li>its material is not bulk (a coating or laminate): no reason here, the callers' usual wording;</li>
 *   <li>it was measured in total geometry (integrating sphere, scattered light included): {@link #DIFFUSE};</li>
 *   <li>its material carries a tag that says it scatters ({@link #SCATTER_TAGS}, e.g. a vat film fogged by
 *       use, stored in regular geometry): the direct beam it lost went astray, not into absorption.</li>
 * </ul>
 *
 * @param reason why a sample of a bulk material is not rescaled; null when it is rescalable or its material
 *               is simply not bulk
 */
public record SampleRescaling(boolean rescalable, String reason) {

    public static final String DIFFUSE = "diffuse sample (total transmittance): scatter is not absorption, so it is not rescaled";

    /** Material tags that mark a scattering sample (lower case, compared ignoring case). */
    public static final Set<String> SCATTER_TAGS = Set.of("scattering", "diffuser", "diffusing", "fogged", "hazy", "frosted");

    public SampleRescaling {
        if (rescalable && reason != null) {
            throw new IllegalArgumentException("a rescalable sample has no reason not to be rescaled: " + reason);
        }
    }

    public static SampleRescaling of(Material material, SampleInfo sample) {
        Objects.requireNonNull(material, "material");
        Objects.requireNonNull(sample, "sample");
        Optional<String> unusable = unusable(material, sample);
        if (unusable.isPresent()) {
            return new SampleRescaling(false, unusable.get());
        }
        if (material.scaling() != Scaling.BULK) {
            return new SampleRescaling(false, null);
        }
        if (sample.geometry() == Geometry.TOTAL) {
            return new SampleRescaling(false, DIFFUSE);
        }
        return scatterTag(material)
                .map(tag -> new SampleRescaling(false, "scattering material (tagged '" + tag
                        + "'): scatter is not absorption, so it is not rescaled"))
                .orElse(new SampleRescaling(true, null));
    }

    /** Begins the reason of a sample whose stored record fails today's checks (docs/validation.md). */
    public static final String NOT_COMPUTABLE = "could not be computed: ";

    /**
     * Why a stored sample cannot be rescaled or stacked at all, when its stored record fails today's checks:
     * a thickness outside {@link PhysicalRanges}, or an index model that was refused on reading
     * ({@link UnusableIndex}). Such a sample is still shown and judged as measured where nothing else is needed.
     */
    public static Optional<String> unusable(Material material, SampleInfo sample) {
        if (!PhysicalRanges.isThicknessMm(sample.thicknessMm())) {
            return Optional.of(NOT_COMPUTABLE + "the stored thickness " + sample.thicknessMm() + " mm lies outside "
                    + PhysicalRanges.MIN_THICKNESS_MM + "–" + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm");
        }
        if (material.refractiveIndex() instanceof UnusableIndex u) {
            return Optional.of(NOT_COMPUTABLE + u.explanation());
        }
        return Optional.empty();
    }

    private static Optional<String> scatterTag(Material material) {
        return material.tags().stream().filter(t -> SCATTER_TAGS.contains(t.trim().toLowerCase(Locale.ROOT))).findFirst();
    }
}
