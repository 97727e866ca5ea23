package org.spectralsieve.ingest;

import java.util.Optional;
import java.util.OptionalDouble;
import org.spectralsieve.importers.DecimalMark;
import org.spectralsieve.importers.Replicates;
import org.spectralsieve.importers.YKind;

/**
 * How to read one file. Everything is detected when left empty; an explicit value wins over detection.
 *
 * @param format          forces the format instead of extension and content sniffing
 * @param yKind           forces the meaning of the value column (percent, fraction, absorbance)
 * @param decimalMark     forces the decimal mark (a file like {@code 1,5 2,5} cannot tell by itself)
 * @param replicates      several value columns: first, mean or separate (separate stores the first)
 * @param mergeDuplicates average rows that repeat a wavelength instead of refusing the file
 * @param detectionLimit  transmittance fraction in [0, 1) at or below which a value is only an upper
 *                        bound; empty = the file's {@code detection_limit} metadata, else 0
 * @param strayLightFloor raw counts: the instrument's stray-light floor as a fraction in [0, 1)
 * @param fullScale       raw counts: the detector's maximum count (saturation); empty = unknown
 */
public record ImportOptions(Optional<ImportFormat> format, Optional<YKind> yKind, Optional<DecimalMark> decimalMark,
                            Replicates replicates, boolean mergeDuplicates, OptionalDouble detectionLimit,
                            OptionalDouble strayLightFloor, OptionalDouble fullScale) {

    public ImportOptions {
        format = format == null ? Optional.empty() : format;
        yKind = yKind == null ? Optional.empty() : yKind;
        decimalMark = decimalMark == null ? Optional.empty() : decimalMark;
        replicates = replicates == null ? Replicates.FIRST : replicates;
        detectionLimit = detectionLimit == null ? OptionalDouble.empty() : detectionLimit;
        strayLightFloor = strayLightFloor == null ? OptionalDouble.empty() : strayLightFloor;
        fullScale = fullScale == null ? OptionalDouble.empty() : fullScale;
        detectionLimit.ifPresent(v -> requireFraction("detectionLimit", v));
        strayLightFloor.ifPresent(v -> requireFraction("strayLightFloor", v));
        fullScale.ifPresent(v -> {
            if (!(v > 0) || !Double.isFinite(v)) {
                throw new IllegalArgumentException("fullScale must be a positive number of counts, got " + v);
            }
        });
    }

    private static void requireFraction(String name, double v) {
        if (!(v >= 0 && v < 1)) {
            throw new IllegalArgumentException(name + " must be a transmittance fraction in [0, 1), got " + v);
        }
    }

    /** Detect everything. */
    public static ImportOptions defaults() {
        return new ImportOptions(Optional.empty(), Optional.empty(), Optional.empty(), Replicates.FIRST, false,
                OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty());
    }

    public ImportOptions withFormat(ImportFormat f) {
        return new ImportOptions(Optional.of(f), yKind, decimalMark, replicates, mergeDuplicates, detectionLimit,
                strayLightFloor, fullScale);
    }

    public ImportOptions withDetectionLimit(double limit) {
        return new ImportOptions(format, yKind, decimalMark, replicates, mergeDuplicates, OptionalDouble.of(limit),
                strayLightFloor, fullScale);
    }
}
