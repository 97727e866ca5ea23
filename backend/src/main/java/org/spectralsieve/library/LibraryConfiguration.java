package org.spectralsieve.library;

import org.jooq.DSLContext;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the persistence edge; the repository itself knows nothing of Spring. */
@Configuration
class LibraryConfiguration {

    @Bean
    JooqLibraryRepository libraryRepository(DSLContext db) {
        return new JooqLibraryRepository(db);
    }

    @Bean
    SampleCurves sampleCurves(JooqLibraryRepository library) {
        return new SampleCurves(library);
    }
}
