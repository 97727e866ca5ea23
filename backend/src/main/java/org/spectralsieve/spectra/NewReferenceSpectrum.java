package org.spectralsieve.spectra;

import java.util.Objects;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.library.SourceFile;

/**
 * A spectrum to store: its name and notes, the values the importer read, and the file they came from.
 *
 * @param name           already checked: a lower-case slug that is no built-in name
 * @param provenanceNote where the numbers came from, in the user's words ("" when not given)
 */
public record NewReferenceSpectrum(SpectrumKind kind, String name, String description, String provenanceNote,
                                   SpectrumValues values, SourceFile file) {

    public NewReferenceSpectrum {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(name, "name");
        description = Objects.requireNonNullElse(description, "");
        provenanceNote = Objects.requireNonNullElse(provenanceNote, "");
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(file, "file");
    }
}
