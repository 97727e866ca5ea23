package org.spectralsieve.cli;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.UnusableRecordException;
import org.spectralsieve.optics.UnusableIndexException;
import org.spectralsieve.library.NotRescalableException;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.api.SampleAtAngle;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.RequirementSyntaxException;
import org.spectralsieve.requirement.RequirementTooLargeException;
import org.spectralsieve.search.PartInFront;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.FigureSheet;
import org.spectralsieve.weighting.FigureText;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SafetyCaution;
import org.spectralsieve.weighting.SpectrumLookup;
import org.spectralsieve.weighting.SunglassCategory;
import org.spectralsieve.weighting.UvBand;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code figures --sample ID}: the weighted figures of one sample (as measured or rescaled) for a source and
 * a response, the same numbers as {@code GET /api/samples/{id}/figures}, as a table with the caution.
 */
@Command(name = "figures", description = "Weighted figures of one sample: effective transmittance for a source ×"
        + " response, erythemal and UV-hazard protection factors, UPF under a named solar spectrum, luminous"
        + " transmittance and filter category, UV band means, critical wavelength, OD at lamp lines.")
final class FiguresCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--sample", required = true, paramLabel = "ID", description = "Sample id (see search and materials).")
    long sampleId;

    @Option(names = "--thickness-mm", paramLabel = "MM", description = "Rescale to this thickness first (bulk materials only).")
    Double thicknessMm;

    @Option(names = "--emitter", defaultValue = "flat", paramLabel = "NAME",
            description = "Source spectrum, built-in or imported (default: ${DEFAULT-VALUE}).")
    String emitterName;

    @Option(names = "--response", defaultValue = "erythema", paramLabel = "NAME",
            description = "Response (weighting), built-in or imported (default: ${DEFAULT-VALUE}).")
    String responseName;

    @Option(names = "--bands", defaultValue = "cie", paramLabel = "CONVENTION",
            description = "UV band limits: cie (280/315 nm) or dermatology (290/320 nm) (default: ${DEFAULT-VALUE}).")
    String conventionName;

    @Option(names = "--behind", paramLabel = "PART",
            description = "A library part in front of the sample (slug or words of its name): figures of the stack.")
    String behind;

    @Option(names = "--behind-mm", paramLabel = "MM", description = "Thickness of the --behind part.")
    Double behindMm;

    @Option(names = "--light", paramLabel = "WORDS", description = "How the light arrives, in the requirement's words:"
            + " 'at 30° incidence', 'over a 60° beam', 'under an LED with 120° beam angle', 'under a Lambertian source'"
            + " (default: normal incidence).")
    String lightText;

    private Illumination light = Illumination.NORMAL;

    @Option(names = "--solar", paramLabel = "NAME", description = "Emitter to use as the reference solar spectrum for the UPF.")
    String solarName;

    private String stackText;
    private Curve seenCurve;

    @Override
    public Integer call() {
        if (thicknessMm != null && !(thicknessMm > 0 && thicknessMm <= SampleCurves.MAX_THICKNESS_MM)) {
            throw new ParameterException(spec.commandLine(), "--thickness-mm must be above 0 and at most "
                    + Numbers.mm(SampleCurves.MAX_THICKNESS_MM) + ", got " + thicknessMm);
        }
        UvBand.Convention convention = UvBand.Convention.named(conventionName).orElseThrow(() ->
                new ParameterException(spec.commandLine(), "--bands: unknown convention '" + conventionName
                        + "'; known: " + String.join(", ", Arrays.stream(UvBand.Convention.values())
                                .map(UvBand.Convention::key).toList())));
        try {
            light = RequirementParser.parseLight(lightText);
        } catch (RequirementSyntaxException | RequirementTooLargeException e) {
            throw new ParameterException(spec.commandLine(), "--light: " + e.getMessage());
        }
        SampleCurve sample;
        FigureSheet sheet;
        try (LibraryServices library = LibraryContext.open(database.url)) {
            SpectrumLookup spectra = library.spectra();
            Emitter emitter = emitter(spectra, "--emitter", emitterName);
            Response response = spectra.response(responseName).orElseThrow(() -> new ParameterException(
                    spec.commandLine(), "--response: unknown response '" + responseName + "'; known: "
                            + String.join(", ", spectra.responses().stream().map(Response::name).toList())));
            Emitter solar = solarName == null ? null : emitter(spectra, "--solar", solarName);
            sample = library.sampleCurves().get(sampleId, thicknessMm, null);
            Curve seen = sample.curve();
            StackLayer part = null;
            if (behind != null || behindMm != null) {
                try {
                    part = PartInFront.resolve(library.search(), behind, behindMm);
                    seen = PartInFront.through(sample, part);
                    stackText = PartInFront.describe(part);
                } catch (PartInFront.Refused e) {
                    throw new ParameterException(spec.commandLine(), (e.aboutThickness() ? "--behind-mm: " : "--behind: ")
                            + e.getMessage());
                }
            }
            if (!light.normal()) {
                // the figures endpoint's rule and path (docs/oblique-incidence.md): coated and scattering parts refused
                String why = SampleAtAngle.whyNot(sample);
                if (why != null) {
                    throw new CliFailure(SieveCli.FAILED, why + "; not computed for " + light.describe());
                }
                LightPath path = SampleAtAngle.path(library.sampleCurves(), sample, part);
                String tooLong = SampleAtAngle.tooLong(path);
                if (tooLong != null) {
                    throw new CliFailure(SieveCli.FAILED, tooLong);
                }
                seen = path.transmittance(light);
            }
            sheet = FigureSheet.of(seen, emitter, response, convention, solar);
            seenCurve = seen;
        } catch (NotFoundException | NotRescalableException | UnusableRecordException | UnusableIndexException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        }
        print(sample, sheet);
        return SieveCli.OK;
    }

    private Emitter emitter(SpectrumLookup spectra, String option, String name) {
        return spectra.emitter(name).orElseThrow(() -> new ParameterException(spec.commandLine(), option
                + ": unknown emitter '" + name + "'; known: "
                + String.join(", ", spectra.emitters().stream().map(Emitter::name).toList())
                + "; or describe one: " + EmitterCatalogue.PARAMETRIC_FORMS));
    }

    private void print(SampleCurve sample, FigureSheet sheet) {
        var out = spec.commandLine().getOut();
        out.println("Sample " + sampleId + " at " + Numbers.mm(sample.thicknessMm()) + " mm"
                + (sample.rescaled() ? " (rescaled" : " (as measured") + ", " + sample.sample().geometry().label()
                + " geometry), " + emitterName + " × " + responseName);
        if (stackText != null) {
            out.println(stackText);
        }
        // every figure names the light it assumed, normal incidence included
        out.println("Light: " + light.describe() + (light.integration().isEmpty() ? "" : "; " + light.integration()));
        TextTable table = new TextTable(List.of("figure", ">value", "how"));
        for (Figure f : sheet.figures()) {
            table.add(List.of(f.name(), value(f), f.note()));
        }
        SunglassCategory.Rating rating = sheet.sunglassCategory();
        table.add(List.of("sunglassCategory", rating.category().map(c -> String.valueOf(c.number())).orElse("-"),
                rating.note()));
        addEdges(table, seenCurve);
        table.print(out);
        out.println("Caution: " + SafetyCaution.TEXT);
        out.flush();
    }

    /** The edges at 1, 10 and 50 %: the UV absorption edge (cutoff) and, for a band-pass curve, the band's end. */
    static void addEdges(TextTable table, Curve curve) {
        for (int percent : new int[] {1, 10, 50}) {
            Cutoffs.Edges edges = Cutoffs.edges(curve, percent / 100.0);
            table.add(List.of("cutoffAt" + percent + "Percent", nm(edges.absorptionEdgeNm()),
                    "UV absorption edge: where T rises through " + percent + " % out of the absorbing short-wavelength"
                            + " side (first pass band)"));
            edges.passBandEndNm().ifPresent(end -> table.add(List.of("passBandEndAt" + percent + "Percent",
                    nm(edges.passBandEndNm()), "band-pass: where that pass band falls back under " + percent + " %")));
        }
    }

    private static String nm(OptionalDouble value) {
        return value.isPresent() ? String.format(Locale.ROOT, "%.1f nm", value.getAsDouble()) : "none";
    }

    /**
     * The value with its unit and bound ("≥ 2.90", "383.8 nm", "OD ≥ 3.00"), a bounded transmittance by its
     * two ends as the search states it ("79.6 %", "between 12.1 % and 13 %", "at most 0.1 %"), or "not available".
     */
    static String value(Figure f) {
        if (!f.available()) {
            return "not available";
        }
        String stated = FigureText.stated(f);
        if (stated != null) {
            return stated;
        }
        double v = f.value().getAsDouble();
        String sign = switch (f.bound()) {
            case AT_MOST -> "≤ ";
            case AT_LEAST -> "≥ ";
            default -> "";
        };
        return switch (f.unit()) {
            case "fraction" -> sign + String.format(Locale.ROOT, "%.3g %%", 100 * v);
            case "nm" -> sign + String.format(Locale.ROOT, "%.1f nm", v);
            case "OD" -> "OD " + sign + String.format(Locale.ROOT, "%.2f", v);
            default -> sign + String.format(Locale.ROOT, "%.3g", v);
        };
    }
}
