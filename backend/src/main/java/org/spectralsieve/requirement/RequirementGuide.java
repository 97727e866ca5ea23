package org.spectralsieve.requirement;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * A short guide to the requirement language, for the page and for scripts: each clause form with one
 * example, the units and their ranges, and the names a text may use, taken from where the parser takes them
 * (the {@link SpectrumLookup} it reads names against, the library's classes, the provenance values
 * {@link RequirementWords} accepts and the limits of {@link RequirementLimits}). Every example is read by
 * {@link RequirementParser} in RequirementGuideTest, so the guide cannot promise what the parser refuses.
 *
 * @param forms           the clause forms in the order a user meets them
 * @param units           what each number is written in, and the range the parser accepts
 * @param joining         how clauses are joined
 * @param comparisons     the words that set the side of a level (over: at least, under: at most)
 * @param materialClasses the classes a {@code class …} filter may name: the library's own
 * @param emitters        the emitters a weighted clause may name (built-in and imported)
 * @param describedEmitters the name forms that describe an emitter not in the list
 * @param responses       the responses a {@code weighted by …} may name
 * @param provenances     the values of a {@code provenance …} term
 * @param geometries      the values of a {@code geometry …} filter
 */
public record RequirementGuide(List<ClauseForm> forms, List<UnitRange> units, String joining, List<String> comparisons,
        List<String> materialClasses, List<String> emitters, String describedEmitters, List<String> responses,
        List<String> provenances, List<String> geometries) {

    /**
     * One form of clause.
     *
     * @param name      what the clause asks, in a few words
     * @param example   a text the parser accepts (with {@code words} true: after RequirementWords splits off the
     *                  leading words and provenance terms, as the search does)
     * @param meaning   how the example is read
     * @param words     whether the example carries words or provenance terms beside its clauses
     */
    public record ClauseForm(String name, String example, String meaning, boolean words) {

        public ClauseForm {
            Objects.requireNonNull(example, "example");
        }
    }

    /**
     * @param range   what the parser accepts, as text
     * @param example a text the parser accepts that writes a number in this unit
     */
    public record UnitRange(String quantity, String written, String range, String example) {
    }

    public RequirementGuide {
        forms = List.copyOf(forms);
        units = List.copyOf(units);
        comparisons = List.copyOf(comparisons);
        materialClasses = List.copyOf(materialClasses);
        emitters = List.copyOf(emitters);
        responses = List.copyOf(responses);
        provenances = List.copyOf(provenances);
        geometries = List.copyOf(geometries);
    }

    /**
     * @param spectra         the names the parser reads a text against
     * @param materialClasses the library's classes, as {@link RequirementParser#parse(String, SpectrumLookup, Collection)} takes them
     * @param provenances     the provenance values, as {@link RequirementWords#split} takes them
     */
    public static RequirementGuide of(SpectrumLookup spectra, Collection<String> materialClasses,
                                      Collection<String> provenances) {
        List<String> classes = List.copyOf(materialClasses);
        List<String> comparisons = new ArrayList<>(SpectralClauseParser.HIGHER_WORDS);
        comparisons.addAll(SpectralClauseParser.LOWER_WORDS);
        return new RequirementGuide(forms(classes, List.copyOf(provenances)), unitList(), "Clauses are joined by 'and' or"
                + " commas; words are case-insensitive; '365nm' and '365 nm' are the same", comparisons, classes,
                spectra.emitters().stream().map(Emitter::name).toList(), EmitterCatalogue.PARAMETRIC_FORMS,
                spectra.responses().stream().map(Response::name).toList(), List.copyOf(provenances), List.of("regular", "total", Requirement.ANY_GEOMETRY));
    }

    /**
     * The examples name only built-in spectra (led-365, erythema), which every lookup holds; the class and
     * provenance examples take the first value the library offers, and are left out when it offers none.
     */
    private static List<ClauseForm> forms(List<String> classes, List<String> provenances) {
        List<ClauseForm> forms = new ArrayList<>(List.of(
                form("Lets light through at a wavelength", "passes over 80% at 365 nm",
                        "transmittance at least 80 % at 365 nm"),
                form("Keeps light out over a band", "blocks under 1% from 300 to 400 nm",
                        "transmittance at most 1 % at every point from 300 to 400 nm"),
                form("Share kept out", "blocks 99% at 405 nm",
                        "99 % kept out: transmittance at most 1 % (a 'blocks' level of 50 % or more is the share kept out)"),
                form("Neutral verb: the comparison decides", "transmits under 70% at 550 nm",
                        "transmittance at most 70 % at 550 nm"),
                form("Band mean", "mean over 85% from 360 to 370 nm", "the mean transmittance over the band at least 85 %"),
                form("Optical density", "OD 3 or more at 405 nm", "transmittance at most 10^-3 (OD = -log10 T)"),
                form("UV rating", "UV400", "transmittance at most 1 % from 290 nm up to 400 nm"),
                form("Cutoff window", "cutoff between 380 and 395 nm", "the 50 % point of the curve lies in the window"),
                form("Weighted by an emitter", "passes over 85% of led 365 weighted by erythema",
                        "the emitter's light, weighted by the response, at least 85 % transmitted"),
                form("Preset weighted figure", "erythemal under 1%", "erythemally weighted transmittance at most 1 %"),
                form("Visible (luminous) transmittance", "visible over 70%", "luminous transmittance (D65, V(lambda)) at least 70 %"),
                form("Critical wavelength", "critical wavelength over 370 nm", "the critical wavelength (290-400 nm) at least 370 nm"),
                form("Relative to its own value", "at 380 nm under 1% of its 550 nm value",
                        "T at 380 nm at most 1 % of the same curve's T at 550 nm ('half' also reads as a share)"),
                form("After ageing", "after 1000 h passes over 80% at 365 nm",
                        "judged on the sample's aged curves (hours, or 'after 50 J/cm² at 365 nm'); between two stored"
                                + " exposures it must hold on both, past the last it is unverified"),
                form("Printed black and clear base", "printed black blocks to OD 3 or more from 350 to 420 nm and base"
                                + " passes over 80% from 350 to 420 nm",
                        "a film's printed-black curve and its own unprinted curve"),
                form("One state against another", "from 350 to 420 nm the printed black under 0.1% of the base",
                        "at every wavelength of the band, the printed black at most 0.1 % of the base"),
                form("Confidence demand", "passes over 80% at 365 nm with 95% confidence",
                        "meets only when at least 95 % likely to hold"),
                form("Thickness range to solve for", "passes over 80% at 365 nm, thickness 1 to 6 mm",
                        "the thickness is a design variable in 1-6 mm"),
                form("One thickness", "blocks under 1% at 405 nm, 3 mm thick", "judged at 3 mm"),
                form("Geometry", "passes over 80% at 365 nm, geometry total", "only samples measured with total geometry"),
                form("Fixed part in the light path", "passes over 80% at 365 nm, behind 4 mm clear float glass",
                        "judged behind that part (its material is looked up in the library)"),
                form("Light at an angle", "passes over 80% at 365 nm, at 30° incidence",
                        "a collimated beam 30° from the normal ('30 deg' also reads); without it, normal incidence"),
                form("Light spread over a beam", "passes over 80% at 365 nm, over a 60° beam",
                        "uniform light within ±30°, the figure averaged over angle"),
                form("Under an LED", "passes over 80% at 365 nm, under an LED with 120° beam angle",
                        "cos^m intensity with half intensity at ±60° ('under a Lambertian source': cos over ±90°);"
                                + " coated and scattering parts are not judged at an angle")));
        if (!classes.isEmpty()) {
            forms.add(form("Material class", "passes over 80% at 365 nm, class " + classes.get(0),
                    "only materials of that class (one of the library's classes)"));
        }
        forms.add(new ClauseForm("Words beside the clauses", "clear sheet passes over 80% at 400 nm",
                "the library's text index admits materials named by the leading words; the clauses judge those", true));
        if (!provenances.isEmpty()) {
            forms.add(new ClauseForm("Provenance", "provenance " + provenances.get(0) + " and passes over 80% at 365 nm",
                    "only samples of that provenance", true));
        }
        return forms;
    }

    private static ClauseForm form(String name, String example, String meaning) {
        return new ClauseForm(name, example, meaning, false);
    }

    private static List<UnitRange> unitList() {
        return List.of(
                new UnitRange("wavelength", "nm or µm (um)", range(RequirementLimits.MIN_WAVELENGTH_NM) + " to "
                        + range(RequirementLimits.MAX_WAVELENGTH_NM) + " nm", "passes over 80% at 0.365 µm"),
                new UnitRange("level", "% or a fraction, or OD n", "0 to 100 % (0 to 1); OD above 0 up to "
                        + range(RequirementLimits.MAX_OPTICAL_DENSITY), "passes over 0.8 at 365 nm"),
                new UnitRange("thickness", "mm", "above 0 up to " + range(RequirementLimits.MAX_THICKNESS_MM) + " mm",
                        "passes over 80% at 365 nm, at 3 mm"),
                new UnitRange("UV rating", "UV followed by nm", range(SpectralClauseParser.UV_RATING_MIN_NM) + " to "
                        + range(SpectralClauseParser.UV_RATING_MAX_NM), "UV420 under 0.5%"),
                new UnitRange("exposure", "h, or J/cm² at a wavelength", "above 0 up to 1000000",
                        "after 2000 h passes over 70% at 320 nm"),
                new UnitRange("share of another value", "% or a fraction, or 'half'", "above 0 up to 100 %",
                        "at 400 nm under half of its 550 nm value"),
                new UnitRange("angle", "° or deg", "incidence 0 to 89°; a beam's full angle above 0 up to 180°; an"
                        + " LED's beam angle above 0 up to 178°", "passes over 80% at 365 nm, over a 90° beam"),
                new UnitRange("confidence", "with N% confidence", percent(TransmittanceClause.MIN_CONFIDENCE) + " to "
                        + percent(TransmittanceClause.MAX_CONFIDENCE) + " %", "UV400 with 99% confidence"),
                new UnitRange("text", "characters, clauses", "at most " + RequirementLimits.MAX_TEXT_LENGTH + " characters and "
                        + RequirementLimits.MAX_CLAUSES + " clauses", "passes over 80% at 365 nm and blocks under 1% at 405 nm"));
    }

    private static String percent(double share) {
        return BigDecimal.valueOf(share).movePointRight(2).stripTrailingZeros().toPlainString();
    }

    private static String range(double value) {
        return SpectralClauseParser.plain(value);
    }
}
