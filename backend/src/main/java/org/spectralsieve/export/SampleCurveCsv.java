package org.spectralsieve.export;

import java.util.LinkedHashMap;
import java.util.Map;
import org.spectralsieve.importers.DelimitedTextWriter;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.StatedCurve;

/**
 * A sample's curve in the project's own CSV, with the metadata that lets the file stand alone (which
 * material, which thickness, whether it was rescaled, how it was measured). Written the same way for
 * the HTTP download and the command line, so a file from either reads back through the same importer.
 * Numbers go through {@link StatedCurve}: nothing beneath OD 12 (a curve rescaled to a thick part would
 * otherwise write limits of 1e-236), and no {@code detection_limit} line when none is recorded (0).
 */
public final class SampleCurveCsv {

    private SampleCurveCsv() {
    }

    public static String write(SampleCurve result) {
        Map<String, String> metadata = new LinkedHashMap<>();
        metadata.put("material", result.material().slug());
        metadata.put("material_name", result.material().name());
        metadata.put("sample_id", String.valueOf(result.sample().id()));
        // the revisions the curve is read through: a corrected thickness or limit changes what the numbers mean
        metadata.put("sample_revision", String.valueOf(result.sample().revision()));
        metadata.put("material_revision", String.valueOf(result.material().revision()));
        if (result.sample().retired() || result.material().retired()) {
            metadata.put("retired_at", String.valueOf(result.sample().retired() ? result.sample().retiredAt()
                    : result.material().retiredAt()));
        }
        metadata.put("thickness_mm", String.valueOf(result.thicknessMm()));
        metadata.put("rescaled", String.valueOf(result.rescaled()));
        metadata.put("geometry", result.sample().geometry().label());
        metadata.put("provenance", result.sample().provenance().label());
        Curve c = StatedCurve.of(result.curve());
        if (c.maxDetectionLimit() > 0) {
            metadata.put("detection_limit", String.valueOf(c.maxDetectionLimit()));
        }
        if (!result.sample().notes().isBlank()) {
            metadata.put("note", result.sample().notes());
        }
        // the measurement uncertainty, when the curve has one, as an absorbance_sd column (empty where unknown)
        return DelimitedTextWriter.write(metadata, c.wavelengthsNm(), c.transmittances(), c.belowDetectionFlags(),
                statedUncertainty(c));
    }

    /**
     * The curve's absorbance standard deviations as the exports write them, NaN (unknown) at every upper
     * bound — a bound has no standard deviation, and a rescaled or stated curve may have made new ones; null
     * when the curve carries none.
     */
    static double[] statedUncertainty(Curve c) {
        if (!c.hasUncertainty()) {
            return null;
        }
        double[] sigma = c.absorbanceUncertainties();
        for (int i = 0; i < sigma.length; i++) {
            sigma[i] = c.belowDetection(i) ? Double.NaN : sigma[i];
        }
        return sigma;
    }

    /** A file name that says what is inside: material slug and thickness. */
    public static String fileName(SampleCurve result) {
        return result.material().slug() + "-" + result.thicknessMm() + "mm.csv";
    }
}
