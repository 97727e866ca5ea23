package org.spectralsieve.ingest;

import java.util.Arrays;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/**
 * Turns a parsed file into a core curve: converts the file's y kind to a transmittance fraction and
 * applies the detection limit, so that any value at or below it becomes an upper bound.
 */
public final class CurveIngest {

    private CurveIngest() {
    }

    /**
     * @throws IngestException naming the file when the values cannot form a curve (e.g. T above 1.5)
     */
    public static Curve toCurve(ParsedSpectrum parsed, double detectionLimit) {
        if (!(detectionLimit >= 0 && detectionLimit < 1)) {
            throw new IngestException(parsed.sourceName(), "detection_limit",
                    "detection limit must be a fraction in [0, 1), got " + detectionLimit);
        }
        double[] t = parsed.transmittanceFractions();
        boolean[] below = parsed.upperBounds();
        for (int i = 0; i < t.length; i++) {
            below[i] = below[i] || t[i] <= detectionLimit;
        }
        double[] limits = new double[t.length];
        Arrays.fill(limits, detectionLimit);
        try {
            return Curve.of(parsed.wavelengthsNm(), t, below, limits);
        } catch (CurveException e) {
            throw new IngestException(parsed.sourceName(), "transmittance", e.getMessage());
        }
    }
}
