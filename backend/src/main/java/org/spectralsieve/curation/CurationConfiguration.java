package org.spectralsieve.curation;

import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.search.SearchService;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the curation service; it knows nothing of Spring. */
@Configuration
class CurationConfiguration {

    @Bean
    JooqLibraryRevisions libraryRevisions(DSLContext db, ActingUser actor) {
        return new JooqLibraryRevisions(db, actor);
    }

    @Bean
    LibraryCuration libraryCuration(JooqLibraryRevisions revisions, SearchService search) {
        // as after an import: each change raised the counter naming its material (docs/search-under-load.md)
        return new LibraryCuration(revisions, search::refresh);
    }
}
