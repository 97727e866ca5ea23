package org.spectralsieve.search;

import org.spectralsieve.library.JooqLibraryRepository;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class SearchConfiguration {

    @Bean
    SearchService searchService(JooqLibraryRepository library) {
        return new SearchService(library);
    }

    @Bean
    SimilarSamples similarSamples(SearchService searchService, JooqLibraryRepository library) {
        return new SimilarSamples(searchService, library);
    }

    @Bean
    SimilarQuestions similarQuestions(SimilarSamples similarSamples, SearchService searchService) {
        return new SimilarQuestions(similarSamples, searchService);
    }
}
