package org.spectralsieve.export;

import java.util.LinkedHashMap;
import java.util.Map;
import org.spectralsieve.importers.jcamp.JcampWriter;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.StatedCurve;

/**
 * A sample's curve as JCAMP-DX 5.01 (transmittance over nanometres, {@link JcampWriter}), for programs that
 * read the open standard rather than the project's CSV. What the standard has no label for goes into private
 * {@code ##$SIEVE …} labels, which other readers skip: the sample's identity and thickness, whether it was
 * rescaled, and, when the curve has one, its measurement uncertainty ({@code ##$SIEVE ABSORBANCE SD=}, one
 * standard deviation of the absorbance per point). Numbers go through {@link StatedCurve}, as in the CSV.
 */
public final class SampleCurveJcamp {

    private SampleCurveJcamp() {
    }

    public static String write(SampleCurve result) {
        Map<String, String> metadata = new LinkedHashMap<>();
        metadata.put("TITLE", result.material().name() + ", " + result.thicknessMm() + " mm"
                + (result.rescaled() ? " (rescaled)" : ""));
        metadata.put("ORIGIN", "Spectral Sieve library, sample " + result.sample().id());
        metadata.put("OWNER", "see the library's sample record");
        metadata.put("$SIEVE MATERIAL", result.material().slug());
        metadata.put("$SIEVE SAMPLE ID", String.valueOf(result.sample().id()));
        metadata.put("$SIEVE SAMPLE REVISION", String.valueOf(result.sample().revision()));
        metadata.put("$SIEVE THICKNESS MM", String.valueOf(result.thicknessMm()));
        metadata.put("$SIEVE RESCALED", String.valueOf(result.rescaled()));
        metadata.put("$SIEVE GEOMETRY", result.sample().geometry().label());
        metadata.put("$SIEVE PROVENANCE", result.sample().provenance().label());
        Curve c = StatedCurve.of(result.curve());
        if (c.maxDetectionLimit() > 0) {
            metadata.put("$SIEVE DETECTION LIMIT", String.valueOf(c.maxDetectionLimit()));
        }
        return JcampWriter.write(metadata, c.wavelengthsNm(), c.transmittances(), c.belowDetectionFlags(),
                SampleCurveCsv.statedUncertainty(c));
    }

    /** The CSV's name with the JCAMP-DX extension. */
    public static String fileName(SampleCurve result) {
        return result.material().slug() + "-" + result.thicknessMm() + "mm.jdx";
    }
}
