package org.spectralsieve.api;

import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The emitters and responses names resolve to: for now the built-in catalogues. */
@Configuration
class WeightingConfiguration {

    @Bean
    SpectrumLookup spectrumLookup() {
        return SpectrumLookup.builtIn();
    }
}
