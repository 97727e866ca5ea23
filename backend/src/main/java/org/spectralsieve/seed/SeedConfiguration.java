package org.spectralsieve.seed;

import org.jooq.DSLContext;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.library.JooqLibraryRepository;
import org.springframework.beans.factory.SmartInitializingSingleton;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.io.ResourceLoader;

/** Loads the demo library on the first start, when the library is still empty. */
@Configuration
class SeedConfiguration {

    private static final Logger log = LoggerFactory.getLogger(SeedConfiguration.class);

    @Bean
    DemoLibraryLoader demoLibraryLoader(JooqLibraryRepository library, DSLContext db, ResourceLoader resources,
                                        SeedProperties properties) {
        return new DemoLibraryLoader(library, db, resources, properties.location());
    }

    /**
     * Runs once every bean exists (so after the Flyway migration) but before the web server opens its port:
     * the first request already sees the demo library.
     */
    @Bean
    SmartInitializingSingleton loadDemoLibraryWhenEmpty(JooqLibraryRepository library, DemoLibraryLoader loader,
                                                        SeedProperties properties) {
        return () -> {
            if (properties.loadOnEmpty() && library.countMaterials() == 0) {
                loader.load();
            } else {
                log.info("Library holds {} materials; demo library not loaded", library.countMaterials());
            }
        };
    }
}
