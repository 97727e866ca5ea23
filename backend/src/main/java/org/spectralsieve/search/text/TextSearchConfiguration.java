package org.spectralsieve.search.text;

import org.spectralsieve.library.JooqLibraryRepository;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class TextSearchConfiguration {

    @Bean
    LibraryTextSearch libraryTextSearch(JooqLibraryRepository library) {
        return new LibraryTextSearch(library);
    }
}
