package org.spectralsieve.spectra;

import java.util.List;

/**
 * A stored spectrum with what its import noted.
 *
 * @param usedFromNm where the spectrum counts: an emitter is cut to the tool's 100–1100 nm
 * @param usedToNm   likewise the upper end
 */
public record ImportedSpectrum(ReferenceSpectrum spectrum, double usedFromNm, double usedToNm, List<String> warnings) {

    public ImportedSpectrum {
        warnings = List.copyOf(warnings);
    }
}
