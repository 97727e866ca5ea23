package org.spectralsieve.library;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Objects;
import java.util.regex.Pattern;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.spectrum.Curve;

/** A sample with its curve, to be stored in one transaction; the source checksum traces it to its file. */
public record NewSample(double thicknessMm, Geometry geometry, Provenance provenance, String instrument,
                        LocalDate measuredOn, String lot, String notes, double detectionLimit, Curve curve,
                        String sourceFileName, String sourceSha256) {

    /** The lengths of the sample table's columns (V1 migration). */
    public static final int MAX_INSTRUMENT = 200;
    public static final int MAX_LOT = 100;
    public static final int MAX_NOTES = 4000;
    /** Before it, a measurement date is a slip (the first recording spectrophotometers are later still). */
    public static final LocalDate EARLIEST_MEASUREMENT = LocalDate.of(1900, 1, 1);

    private static final Pattern SHA256 = Pattern.compile("[0-9a-f]{64}");

    public NewSample {
        if (!PhysicalRanges.isThicknessMm(thicknessMm)) {
            throw new FieldException("thicknessMm", "must be from " + PhysicalRanges.MIN_THICKNESS_MM + " mm (1 µm) to "
                    + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm, was " + thicknessMm);
        }
        if (!(detectionLimit >= 0 && detectionLimit < 1)) {
            throw new FieldException("detectionLimit", "must be a fraction in [0, 1), was " + detectionLimit);
        }
        if (measuredOn != null && (measuredOn.isBefore(EARLIEST_MEASUREMENT)
                || measuredOn.isAfter(LocalDate.now(ZoneOffset.UTC).plusDays(1)))) {
            throw new FieldException("measuredOn", "must lie between " + EARLIEST_MEASUREMENT + " and today, was " + measuredOn);
        }
        Objects.requireNonNull(geometry, "geometry");
        Objects.requireNonNull(provenance, "provenance");
        Objects.requireNonNull(curve, "curve");
        if (sourceSha256 == null || !SHA256.matcher(sourceSha256).matches()) {
            throw new IllegalArgumentException("sourceSha256 must be 64 lower-case hex digits");
        }
        double[] nm = curve.wavelengthsNm();
        for (double end : new double[] {nm[0], nm[nm.length - 1]}) {
            if (!PhysicalRanges.isWavelengthNm(end)) {
                throw new FieldException("wavelength", "must be from " + (long) PhysicalRanges.MIN_WAVELENGTH_NM + " to "
                        + (long) PhysicalRanges.MAX_WAVELENGTH_NM + " nm, the curve holds " + end + " nm");
            }
        }
        instrument = StoredText.line("instrument", Objects.requireNonNullElse(instrument, ""), MAX_INSTRUMENT);
        lot = StoredText.line("lot", Objects.requireNonNullElse(lot, ""), MAX_LOT);
        notes = StoredText.paragraph("notes", Objects.requireNonNullElse(notes, ""), MAX_NOTES);
        sourceFileName = StoredText.line("sourceFileName", Objects.requireNonNullElse(sourceFileName, ""), SourceFile.MAX_NAME);
    }
}
