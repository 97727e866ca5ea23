package org.spectralsieve.seed;

import org.jooq.DSLContext;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.library.JooqLibraryRepository;
import org.springframework.boot.ApplicationRunner;
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

    @Bean
    ApplicationRunner loadDemoLibraryWhenEmpty(JooqLibraryRepository library, DemoLibraryLoader loader,
                                               SeedProperties properties) {
        return args -> {
            if (properties.loadOnEmpty() && library.countMaterials() == 0) {
                loader.load();
            } else {
                log.info("Library holds {} materials; demo library not loaded", library.countMaterials());
            }
        };
    }
}
