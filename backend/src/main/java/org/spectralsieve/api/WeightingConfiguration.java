package org.spectralsieve.api;

import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The emitters and responses names resolve to: the built-in catalogues, then the imported spectra. */
@Configuration
public class WeightingConfiguration {

    @Bean
    ImportedSpectrumLookup spectrumLookup(ReferenceSpectrumRepository importedSpectra) {
        return newSpectrumLookup(importedSpectra);
    }

    /** Built-in names first, then the imported spectra: the bean above, and the command line's plain wiring. */
    public static ImportedSpectrumLookup newSpectrumLookup(ReferenceSpectrumRepository importedSpectra) {
        return new ImportedSpectrumLookup(importedSpectra, SpectrumLookup.builtIn());
    }
}
