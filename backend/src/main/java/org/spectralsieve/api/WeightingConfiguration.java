package org.spectralsieve.api;

import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The emitters and responses names resolve to: the built-in catalogues, then the imported spectra. */
@Configuration
class WeightingConfiguration {

    @Bean
    ImportedSpectrumLookup spectrumLookup(ReferenceSpectrumRepository importedSpectra) {
        return new ImportedSpectrumLookup(importedSpectra, SpectrumLookup.builtIn());
    }
}
