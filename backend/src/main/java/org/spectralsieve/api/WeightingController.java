package org.spectralsieve.api;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.search.PartInFront;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.FigureSheet;
import org.spectralsieve.weighting.FigureText;
import org.spectralsieve.weighting.SafetyCaution;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;
import org.spectralsieve.weighting.SunglassCategory;
import org.spectralsieve.weighting.UvBand;
import org.spectralsieve.weighting.WeightedFigures;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The emitter and response catalogues, and a sample's weighted figures. */
@RestController
class WeightingController {

    /** Carried by every answer here: these numbers screen materials, they do not certify equipment. */
    static final String CAUTION = SafetyCaution.TEXT;

    private final SampleCurves curves;
    private final SpectrumLookup spectra;
    private final SearchService search;

    WeightingController(SampleCurves curves, SpectrumLookup spectra, SearchService search) {
        this.curves = curves;
        this.spectra = spectra;
        this.search = search;
    }

    /**
     * origin: "built-in" (a catalogue spectrum) or "imported" (see ReferenceSpectrumController). solar: whether
     * the spectrum is offered as the UPF's reference solar spectrum ({@link #isSolar}).
     */
    record EmitterJson(String name, String kind, Map<String, Double> parameters, double[] rangeNm,
            double integrationStepNm, String description, String origin, boolean solar) {

        static EmitterJson of(Emitter e) {
            return new EmitterJson(e.name(), e.kind(), e.parameters(), new double[] {e.minNm(), e.maxNm()},
                    e.stepNm(), e.description(), originOf(SpectrumLookup.builtIn().emitter(e.name()).isPresent()),
                    isSolar(e));
        }
    }

    /** Words that mark an imported table as sunlight (ASTM G173 "AM1.5", "global tilt", …). */
    private static final java.util.regex.Pattern SUNLIGHT =
            java.util.regex.Pattern.compile("sun|solar|daylight|g173|am ?1\\.5|global tilt", java.util.regex.Pattern.CASE_INSENSITIVE);

    /**
     * A spectrum of daylight, offered as the UPF's reference: the CIE daylight illuminant D65, or a tabulated
     * (imported) spectrum whose name or description speaks of the sun. LEDs, lamps, the equal-energy "flat"
     * source and illuminant A are never offered; the {@code solar} parameter still takes any emitter by name.
     */
    static boolean isSolar(Emitter e) {
        if ("d65".equals(e.name())) {
            return true;
        }
        return "tabulated".equals(e.kind())
                && (SUNLIGHT.matcher(e.name()).find() || SUNLIGHT.matcher(String.valueOf(e.description())).find());
    }

    record ResponseJson(String name, double[] rangeNm, String description, String origin) {

        static ResponseJson of(Response r) {
            return new ResponseJson(r.name(), new double[] {r.minNm(), r.maxNm()}, r.description(),
                    originOf(SpectrumLookup.builtIn().response(r.name()).isPresent()));
        }
    }

    /** Imported spectra never take a built-in name, so the name tells the origin. */
    static String originOf(boolean builtIn) {
        return builtIn ? "built-in" : "imported";
    }

    record EmittersJson(List<EmitterJson> emitters, String caution) {
    }

    record ResponsesJson(List<ResponseJson> responses, String caution) {
    }

    /**
     * value is null when the figure is not available; note then says why. A bounded figure may carry
     * otherEnd (the figure with points below the detection limit at 0 instead of at their limit) and, for a
     * transmittance, stated: both ends as the search's explanations print them ("79.6 %", "between 12.1 % and
     * 13 %", "at most 0.1 %"). outsideShare is the share of the weighted power left out (outside the curve or
     * the response's table), 0 when none.
     */
    record FigureJson(String name, Double value, String unit, String bound, boolean available, String note,
            Double otherEnd, String stated, double outsideShare) {

        static FigureJson of(Figure f) {
            return new FigureJson(f.name(), f.available() ? f.value().getAsDouble() : null, f.unit(),
                    f.bound().name().toLowerCase(Locale.ROOT).replace('_', '-'), f.available(), f.note(),
                    f.otherEnd().isPresent() ? f.otherEnd().getAsDouble() : null, FigureText.stated(f),
                    f.outsideShare());
        }

        static List<FigureJson> all(List<Figure> figures) {
            return figures.stream().map(FigureJson::of).collect(Collectors.toList());
        }
    }

    /** category is null when τv is unknown or at most 3 %; range then is null too and note says why. */
    record SunglassCategoryJson(Integer category, String description, String range, String standard, String bound,
            String note) {

        static SunglassCategoryJson of(SunglassCategory.Rating r) {
            return new SunglassCategoryJson(r.category().map(SunglassCategory::number).orElse(null),
                    r.category().map(SunglassCategory::description).orElse(null),
                    r.category().map(SunglassCategory::rangeText).orElse(null), SunglassCategory.STANDARD,
                    r.bound().name().toLowerCase(Locale.ROOT).replace('_', '-'), r.note());
        }
    }

    /**
     * {@code sampleRevision}, {@code materialRevision}: the revisions the figures were computed with (docs/undo.md).
     * {@code light}: how the light met the sample (the {@code light} parameter; normal incidence unless asked),
     * named in every answer, as the requirement JSON names it.
     */
    record FiguresJson(long sampleId, int sampleRevision, int materialRevision, double thicknessMm, boolean rescaled, String emitter, String response,
            String solar, FigureJson effectiveTransmittance, FigureJson protectionFactor,
            FigureJson erythemalProtectionFactor, FigureJson actinicUvProtectionFactor, FigureJson upf,
            String bandConvention, List<FigureJson> bandMeans, FigureJson criticalWavelength,
            List<FigureJson> opticalDensities, FigureJson luminousTransmittance,
            SunglassCategoryJson sunglassCategory, String layer, Map<String, Object> light, String caution) {
    }

    @GetMapping("/api/emitters")
    EmittersJson emitters() {
        return new EmittersJson(spectra.emitters().stream().map(EmitterJson::of).toList(), CAUTION);
    }

    @GetMapping("/api/responses")
    ResponsesJson responses() {
        return new ResponsesJson(spectra.responses().stream().map(ResponseJson::of).toList(), CAUTION);
    }

    @GetMapping("/api/samples/{id}/figures")
    FiguresJson figures(@PathVariable("id") long id,
                        @RequestParam(name = "thicknessMm", required = false) Double thicknessMm,
                        @RequestParam(name = "emitter", required = false, defaultValue = "flat") String emitterName,
                        @RequestParam(name = "response", required = false, defaultValue = "erythema") String responseName,
                        @RequestParam(name = "convention", required = false, defaultValue = "cie") String conventionName,
                        @RequestParam(name = "solar", required = false) String solarName,
                        @RequestParam(name = "behind", required = false) String behind,
                        @RequestParam(name = "behindMm", required = false) Double behindMm,
                        @RequestParam(name = "light", required = false) String lightText) {
        Illumination light = SampleAtAngle.light(lightText);
        if (thicknessMm != null && !(thicknessMm > 0 && thicknessMm <= SampleCurves.MAX_THICKNESS_MM)) {
            throw new BadParameterException("thicknessMm", "must be above 0 and at most "
                    + SampleCurves.MAX_THICKNESS_MM + " mm, got " + thicknessMm);
        }
        Emitter emitter = spectra.emitter(emitterName).orElseThrow(() -> new BadParameterException("emitter",
                "unknown emitter '" + emitterName + "'; known: " + names(spectra.emitters().stream()
                        .map(Emitter::name).toList()) + "; or describe one: " + EmitterCatalogue.PARAMETRIC_FORMS));
        Response response = spectra.response(responseName).orElseThrow(() -> new BadParameterException("response",
                "unknown response '" + responseName + "'; known: " + names(spectra.responses().stream()
                        .map(Response::name).toList())));
        UvBand.Convention convention = UvBand.Convention.named(conventionName).orElseThrow(() ->
                new BadParameterException("convention", "unknown band convention '" + conventionName + "'; known: "
                        + names(Arrays.stream(UvBand.Convention.values()).map(UvBand.Convention::key)
                                .toList())));
        Emitter solar = solarName == null ? null : spectra.emitter(solarName).orElseThrow(() ->
                new BadParameterException("solar", "unknown emitter '" + solarName + "' as reference solar spectrum;"
                        + " known: " + names(spectra.emitters().stream().map(Emitter::name).toList())));
        SampleCurve sample = curves.get(id, thicknessMm, null);
        if (!light.normal()) {
            SampleAtAngle.requireAtAngle(sample, "light", light.describe());
        }
        Curve seen = sample.curve();
        String layerText = null;
        StackLayer part = null;
        if (behind != null || behindMm != null) {
            try {
                part = PartInFront.resolve(search, behind, behindMm);
                if (light.normal()) {
                    seen = PartInFront.through(sample, part);
                }
                layerText = PartInFront.describe(part);
            } catch (PartInFront.Refused e) {
                throw new BadParameterException(e.aboutThickness() ? "behindMm" : "behind", e.getMessage());
            }
        }
        if (!light.normal()) {
            // at an angle: the sample at its thickness (and the part in front) as one path under the light;
            // at normal incidence the curve above, today's numbers unchanged
            try {
                LightPath path = SampleAtAngle.path(curves, sample, part);
                SampleAtAngle.requireBounded(path);
                seen = path.transmittance(light);
            } catch (CurveException e) {
                if (part == null) {
                    throw e;
                }
                throw new BadParameterException("behind", "the sample and " + part.materialSlug()
                        + " share no wavelength range: " + e.getMessage());
            }
        }
        FigureSheet sheet = FigureSheet.of(seen, emitter, response, convention, solar);
        WeightedFigures.Report r = sheet.report();
        return new FiguresJson(id, sample.sample().revision(), sample.material().revision(), sample.thicknessMm(), sample.rescaled(), emitter.name(), response.name(),
                solar == null ? null : solar.name(),
                FigureJson.of(r.effectiveTransmittance()), FigureJson.of(r.protectionFactor()),
                FigureJson.of(r.erythemalProtectionFactor()), FigureJson.of(r.actinicUvProtectionFactor()),
                FigureJson.of(sheet.upf()), convention.description(), FigureJson.all(r.bandMeans()),
                FigureJson.of(r.criticalWavelength()), FigureJson.all(r.opticalDensities()),
                FigureJson.of(sheet.luminousTransmittance()), SunglassCategoryJson.of(sheet.sunglassCategory()),
                layerText, RequirementJson.light(light), CAUTION);
    }

    private static String names(List<String> names) {
        return String.join(", ", names);
    }
}
