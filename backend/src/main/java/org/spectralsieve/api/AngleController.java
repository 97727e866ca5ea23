package org.spectralsieve.api;

import java.util.List;
import java.util.Map;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.optics.AngleSweep;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.search.PartInFront;
import org.spectralsieve.search.SearchService;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * A sample's transmittance against the angle of incidence at one wavelength ({@link AngleSweep}), for the material
 * page's "T against angle" chart. Only maps: the computation is the core's.
 */
@RestController
class AngleController {

    /** The UV-A LED line a curing rig is most often built around: the page's first question. */
    static final double DEFAULT_NM = 365;

    private final SampleCurves curves;
    private final SearchService search;

    AngleController(SampleCurves curves, SearchService search) {
        this.curves = curves;
        this.search = search;
    }

    /** The effective transmittance under one reference source; {@code light} as the requirement JSON names it. */
    record ReferenceJson(Map<String, Object> light, double transmittance, double errorBound, boolean upperBound) {

        static ReferenceJson of(AngleSweep.Reference r) {
            return new ReferenceJson(RequirementJson.light(r.light()), r.transmittance(), r.errorBound(), r.upperBound());
        }
    }

    /**
     * Parallel lists: {@code transmittance[i]} (unpolarised), {@code s[i]}, {@code p[i]} and {@code upperBound[i]}
     * at {@code anglesDeg[i]}. {@code index}: the sample's refractive index at the wavelength, whose Brewster angle
     * is {@code brewsterDeg}. {@code layer}: the part in front, as the figures answer names it, or null.
     */
    record AnglesJson(long sampleId, int sampleRevision, int materialRevision, double thicknessMm, boolean rescaled,
                      double wavelengthNm, double index, double brewsterDeg, double[] anglesDeg, double[] transmittance,
                      double[] s, double[] p, boolean[] upperBound, List<ReferenceJson> references, String model,
                      String layer) {
    }

    @GetMapping("/api/samples/{id}/angles")
    AnglesJson angles(@PathVariable("id") long id,
                      @RequestParam(name = "nm", required = false) Double nm,
                      @RequestParam(name = "thicknessMm", required = false) Double thicknessMm,
                      @RequestParam(name = "behind", required = false) String behind,
                      @RequestParam(name = "behindMm", required = false) Double behindMm) {
        double wavelength = nm == null ? DEFAULT_NM : nm;
        if (!Double.isFinite(wavelength)) {
            throw new BadParameterException("nm", "must be a wavelength in nm, got " + nm);
        }
        if (thicknessMm != null && !(thicknessMm > 0 && thicknessMm <= SampleCurves.MAX_THICKNESS_MM)) {
            throw new BadParameterException("thicknessMm", "must be above 0 and at most "
                    + SampleCurves.MAX_THICKNESS_MM + " mm, got " + thicknessMm);
        }
        SampleCurve sample = curves.get(id, thicknessMm, null);
        SampleAtAngle.requireAtAngle(sample, "id", "light at an angle");
        StackLayer part = null;
        String layerText = null;
        if (behind != null || behindMm != null) {
            try {
                part = PartInFront.resolve(search, behind, behindMm);
                layerText = PartInFront.describe(part);
            } catch (PartInFront.Refused e) {
                throw new BadParameterException(e.aboutThickness() ? "behindMm" : "behind", e.getMessage());
            }
        }
        LightPath path = SampleAtAngle.path(curves, sample, part);
        double[] range = AngleSweep.rangeNm(path);
        if (!(range[1] > range[0])) {
            throw new BadParameterException("behind", "the sample and " + part.materialSlug()
                    + " share no wavelength range (common part " + range[0] + "-" + range[1] + " nm)");
        }
        if (!(wavelength >= range[0] && wavelength <= range[1])) {
            throw new BadParameterException("nm", "must lie inside the measured range " + number(range[0]) + "-"
                    + number(range[1]) + " nm" + (part == null ? "" : " of the sample and the part in front")
                    + ", got " + number(wavelength) + " nm; curves are never extrapolated");
        }
        AngleSweep.Result r = AngleSweep.at(path, wavelength);
        return new AnglesJson(id, sample.sample().revision(), sample.material().revision(), sample.thicknessMm(),
                sample.rescaled(), r.wavelengthNm(), r.index(), r.brewsterDeg(), r.anglesDeg(), r.unpolarised(), r.s(),
                r.p(), r.upperBound(), r.references().stream().map(ReferenceJson::of).toList(), AngleSweep.MODEL,
                layerText);
    }

    private static String number(double x) {
        return x == Math.rint(x) && Math.abs(x) < 1e9 ? String.valueOf((long) x) : String.valueOf(x);
    }
}
