package org.spectralsieve.ingest;

import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.search.SearchService;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the import services; they themselves know nothing of Spring. */
@Configuration
class ImportConfiguration {

    @Bean
    ImportService importService(JooqLibraryRepository library, SearchService search, ImportProperties limits) {
        // not invalidate(): the import raised the change counter naming its material, so the refresh reads only that
        // material again; invalidate() would make it read the whole library (docs/search-under-load.md)
        return new ImportService(library, search::refresh, limits);
    }

    @Bean
    BatchImport batchImport(ImportService imports, JooqLibraryRepository library, ImportProperties limits) {
        return new BatchImport(imports, library, limits);
    }

    /** One gate for every import endpoint, so that their memory is bounded together. */
    @Bean
    ImportGate importGate(ImportProperties limits) {
        return ImportGate.of(limits);
    }
}
