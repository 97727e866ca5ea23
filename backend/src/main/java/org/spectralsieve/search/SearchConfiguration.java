package org.spectralsieve.search;

import org.spectralsieve.library.JooqLibraryRepository;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
public class SearchConfiguration {

    @Bean
    SearchService searchService(JooqLibraryRepository library,
                                @Value("${sieve.search.curve-cache-mb:128}") long curveCacheMb,
                                @Value("${sieve.search.judgement-lanes:-1}") int judgementLanes) {
        return newSearchService(library, curveCacheMb, judgementLanes);
    }

    /** The search service from its two settings: the bean above, and the command line's plain wiring. */
    public static SearchService newSearchService(JooqLibraryRepository library, long curveCacheMb, int judgementLanes) {
        if (curveCacheMb < 0) {
            throw new IllegalArgumentException("sieve.search.curve-cache-mb must be >= 0 (0 reads every judged curve"
                    + " from the database), was " + curveCacheMb);
        }
        // -1 (the default): one lane per core; 0: no bound (docs/search-under-load.md)
        int lanes = judgementLanes < 0 ? Runtime.getRuntime().availableProcessors() : judgementLanes;
        return new SearchService(library, curveCacheMb << 20).limitConcurrentJudgements(lanes);
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
