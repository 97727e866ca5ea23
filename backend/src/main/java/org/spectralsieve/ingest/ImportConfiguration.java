package org.spectralsieve.ingest;

import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.search.BackgroundRefresh;
import org.spectralsieve.search.SearchService;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the import services; they themselves know nothing of Spring. */
@Configuration
class ImportConfiguration {

    @Bean
    ImportService importService(JooqLibraryRepository library, SearchService search, ImportProperties limits,
                                BackgroundRefresh refresh) {
        // not invalidate(): the import raised the change counter naming its material, so the refresh reads only that
        // material again; invalidate() would make it read the whole library (docs/search-under-load.md). On the
        // importing thread by default: -Dsieve.imports.refresh-in-background=true hands it to one background thread
        // (imports answered sooner, but searches then met the rebuild more often: measured, eighth pass)
        boolean background = "true".equals(System.getProperty("sieve.imports.refresh-in-background"));
        return new ImportService(library, background ? refresh : search::refresh, limits);
    }

    /** The search store's refresh after an import, on one background thread (closed with the context). */
    @Bean(destroyMethod = "close")
    BackgroundRefresh searchStoreRefresh(SearchService search) {
        return new BackgroundRefresh(search::refresh);
    }

    /** State curves refresh the search store as an import does: on the changing thread, naming the sample. */
    @Bean
    StateCurveService stateCurveService(ImportService imports, JooqLibraryRepository library, SearchService search) {
        return new StateCurveService(imports, library, search::refresh);
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
