package org.spectralsieve.library;

import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.jooq.conf.RenderQuotedNames;
import org.springframework.boot.jooq.autoconfigure.DefaultConfigurationCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the persistence edge; the repository itself knows nothing of Spring. */
@Configuration
public class LibraryConfiguration {

    /**
     * The generated classes come from H2, which stores unquoted names in upper case; PostgreSQL folds them
     * to lower case. Rendering names unquoted lets each database fold them its own way, so the same
     * generated code runs on both (none of our names is a reserved word in either).
     */
    @Bean
    DefaultConfigurationCustomizer unquotedNames() {
        return LibraryConfiguration::renderNamesUnquoted;
    }

    /** The same setting for a jOOQ configuration made without Spring (the command line's plain wiring). */
    public static void renderNamesUnquoted(org.jooq.Configuration configuration) {
        configuration.settings().withRenderQuotedNames(RenderQuotedNames.NEVER);
    }

    @Bean
    JooqLibraryRepository libraryRepository(DSLContext db, ActingUser actor) {
        return new JooqLibraryRepository(db, actor);
    }

    @Bean
    SampleCurves sampleCurves(JooqLibraryRepository library) {
        return new SampleCurves(library);
    }
}
