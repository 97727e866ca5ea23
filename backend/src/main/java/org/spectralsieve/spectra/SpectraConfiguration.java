package org.spectralsieve.spectra;

import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.ingest.ImportProperties;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the imported reference spectra; the lookup itself is defined with the weighting endpoints. */
@Configuration
class SpectraConfiguration {

    @Bean
    ReferenceSpectrumRepository referenceSpectrumRepository(DSLContext db, ActingUser actor) {
        return new ReferenceSpectrumRepository(db, actor);
    }

    @Bean
    SpectrumImportService spectrumImportService(ReferenceSpectrumRepository repository, ImportedSpectrumLookup lookup,
                                                ImportProperties limits) {
        return new SpectrumImportService(repository, lookup, limits);
    }
}
