package org.spectralsieve.api;

import org.spectralsieve.api.MaterialResponses.CurveResponse;
import org.spectralsieve.export.SampleCurveCsv;
import org.spectralsieve.export.SampleCurveJcamp;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.StatedCurve;
import org.spectralsieve.spectrum.WavelengthGrid;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** One sample's curve, as JSON or as the project's own CSV, optionally rescaled and resampled. */
@RestController
@RequestMapping("/api/samples/{id}")
class SampleController {

    static final double MAX_THICKNESS_MM = SampleCurves.MAX_THICKNESS_MM;
    static final double MIN_STEP_NM = 0.01;
    /** A resampling grid lies within 0 to 100 µm: far beyond any stored curve, yet finite. */
    static final double MAX_GRID_NM = 100_000;
    /** Points of a resampled curve: as many as an import may store, so an answer is never larger than a file. */
    static final int MAX_GRID_POINTS = 200_000;

    private final SampleCurves curves;

    SampleController(SampleCurves curves) {
        this.curves = curves;
    }

    @GetMapping("/curve")
    CurveResponse curve(@PathVariable("id") long id,
                        @RequestParam(name = "thicknessMm", required = false) Double thicknessMm,
                        @RequestParam(name = "from", required = false) Double from,
                        @RequestParam(name = "to", required = false) Double to,
                        @RequestParam(name = "step", required = false) Double step) {
        SampleCurve result = fetch(id, thicknessMm, from, to, step);
        Curve c = StatedCurve.of(result.curve()); // nothing beneath OD 12, as the CSV
        java.time.Instant retired = result.sample().retired() ? result.sample().retiredAt() : result.material().retiredAt();
        return new CurveResponse(id, result.sample().revision(), result.material().revision(),
                MaterialResponses.instant(retired), result.thicknessMm(), result.rescaled(), c.wavelengthsNm(),
                c.transmittances(), c.belowDetectionFlags(), c.maxDetectionLimit(), UncertaintyJson.of(c));
    }

    @GetMapping("/curve.csv")
    ResponseEntity<String> curveCsv(@PathVariable("id") long id,
                                    @RequestParam(name = "thicknessMm", required = false) Double thicknessMm,
                                    @RequestParam(name = "from", required = false) Double from,
                                    @RequestParam(name = "to", required = false) Double to,
                                    @RequestParam(name = "step", required = false) Double step) {
        SampleCurve result = fetch(id, thicknessMm, from, to, step);
        String csv = SampleCurveCsv.write(result);
        String fileName = SampleCurveCsv.fileName(result);
        return ResponseEntity.ok()
                .contentType(new MediaType("text", "csv", java.nio.charset.StandardCharsets.UTF_8))
                .header(HttpHeaders.CONTENT_DISPOSITION, "attachment; filename=\"" + fileName + "\"")
                .body(csv);
    }

    /** The same curve as JCAMP-DX 5.01 ({@link SampleCurveJcamp}), its uncertainty in a private label. */
    @GetMapping("/curve.jdx")
    ResponseEntity<String> curveJcamp(@PathVariable("id") long id,
                                      @RequestParam(name = "thicknessMm", required = false) Double thicknessMm,
                                      @RequestParam(name = "from", required = false) Double from,
                                      @RequestParam(name = "to", required = false) Double to,
                                      @RequestParam(name = "step", required = false) Double step) {
        SampleCurve result = fetch(id, thicknessMm, from, to, step);
        return ResponseEntity.ok()
                .contentType(new MediaType("chemical", "x-jcamp-dx", java.nio.charset.StandardCharsets.UTF_8))
                .header(HttpHeaders.CONTENT_DISPOSITION, "attachment; filename=\"" + SampleCurveJcamp.fileName(result) + "\"")
                .body(SampleCurveJcamp.write(result));
    }

    private SampleCurve fetch(long id, Double thicknessMm, Double from, Double to, Double step) {
        if (thicknessMm != null && !(thicknessMm > 0 && thicknessMm <= MAX_THICKNESS_MM)) {
            throw new BadParameterException("thicknessMm", "must be above 0 and at most " + MAX_THICKNESS_MM
                    + " mm, got " + thicknessMm);
        }
        return curves.get(id, thicknessMm, grid(from, to, step));
    }

    private static WavelengthGrid grid(Double from, Double to, Double step) {
        if (from == null && to == null && step == null) {
            return null;
        }
        if (from == null || to == null) {
            throw new BadParameterException(from == null ? "from" : "to",
                    "resampling needs both 'from' and 'to' (and optionally 'step', default 1 nm)");
        }
        double stepNm = step == null ? 1.0 : step;
        wavelengthParameter("from", from);
        wavelengthParameter("to", to);
        if (!(stepNm >= MIN_STEP_NM && stepNm <= MAX_GRID_NM)) {
            throw new BadParameterException("step", "must be from " + MIN_STEP_NM + " to " + MAX_GRID_NM + " nm, got " + stepNm);
        }
        if (!(from < to)) {
            throw new BadParameterException("to", "must be greater than 'from' (" + from + " nm), got " + to);
        }
        if ((to - from) / stepNm > MAX_GRID_POINTS) {
            throw new BadParameterException("step", "would give more than " + MAX_GRID_POINTS + " points from " + from
                    + " to " + to + " nm; give a step of at least " + (to - from) / MAX_GRID_POINTS + " nm");
        }
        try {
            return new WavelengthGrid(from, to, stepNm);
        } catch (IllegalArgumentException e) {
            throw new BadParameterException("step", e.getMessage());
        }
    }

    private static void wavelengthParameter(String name, double nm) {
        if (!(nm >= 0 && nm <= MAX_GRID_NM)) {
            throw new BadParameterException(name, "must be a wavelength from 0 to " + MAX_GRID_NM + " nm, got " + nm);
        }
    }
}
