package org.spectralsieve.spectra;

import java.util.Objects;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StoredText;
import org.spectralsieve.optics.PhysicalRanges;

/**
 * A spectrum to store: its name and notes, the values the importer read, and the file they came from.
 *
 * @param name           already checked: a lower-case slug that is no built-in name
 * @param provenanceNote where the numbers came from, in the user's words ("" when not given)
 */
public record NewReferenceSpectrum(SpectrumKind kind, String name, String description, String provenanceNote,
                                   SpectrumValues values, SourceFile file) {

    /** The lengths of the reference_spectrum table's columns (V3 migration). */
    public static final int MAX_NAME = 60;
    public static final int MAX_TEXT = 4000;
    public static final int MAX_VALUE_COLUMN = 200;

    public NewReferenceSpectrum {
        Objects.requireNonNull(kind, "kind");
        StoredText.line("name", Objects.requireNonNull(name, "name"), MAX_NAME);
        description = StoredText.paragraph("description", Objects.requireNonNullElse(description, ""), MAX_TEXT);
        provenanceNote = StoredText.paragraph("provenance", Objects.requireNonNullElse(provenanceNote, ""), MAX_TEXT);
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(file, "file");
        StoredText.line("valueColumn", values.valueColumn(), MAX_VALUE_COLUMN);
        double[] nm = values.wavelengthsNm();
        for (double end : new double[] {nm[0], nm[nm.length - 1]}) {
            if (!PhysicalRanges.isWavelengthNm(end)) {
                throw new FieldException("wavelength", "must be from " + (long) PhysicalRanges.MIN_WAVELENGTH_NM + " to "
                        + (long) PhysicalRanges.MAX_WAVELENGTH_NM + " nm, the file holds " + end + " nm");
            }
        }
    }
}
