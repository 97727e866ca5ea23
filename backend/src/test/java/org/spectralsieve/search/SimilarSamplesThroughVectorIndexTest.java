package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.OptionalLong;
import java.util.Set;
import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.search.vector.VectorFilter;
import org.spectralsieve.similarity.ComparedBand;
import org.spectralsieve.similarity.ShapeMetric;
import org.spectralsieve.store.SpectralStore;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * With the vector index forced on (threshold 0), the similar samples of every demo sample are the exact
 * ranking's, hit for hit: the demo library is smaller than the candidates nominated, so this checks the wiring
 * (index built from the store, ids mapped back, the query left out), not the graph's recall
 * (CurveVectorRecallTest does that).
 */
class SimilarSamplesThroughVectorIndexTest {

    private static final VectorFilter FILMS = new VectorFilter(Set.of("film"), Set.of(), Set.of());

    @Test
    void everyDemoSampleGetsTheExactHitsThroughTheVectorIndex() {
        JdbcDataSource ds = new JdbcDataSource();
        ds.setURL("jdbc:h2:mem:similar-vector-" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(ds).load().migrate();
        DSLContext db = DSL.using(ds, SQLDialect.H2);
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        SearchService search = new SearchService(library);
        SimilarSamples exact = new SimilarSamples(search, library, Integer.MAX_VALUE);
        SimilarSamples vector = new SimilarSamples(search, library, 0);
        SpectralStore store = search.store();
        assertThat(store.size()).isGreaterThan(50);
        for (int curve = 0; curve < store.size(); curve++) {
            long sample = store.sampleId(curve);
            for (ShapeMetric metric : ShapeMetric.values()) {
                assertThat(vector.similarTo(sample, metric, 10)).as("sample %d by %s", sample, metric)
                        .isEqualTo(exact.similarTo(sample, metric, 10))
                        .noneMatch(hit -> hit.sampleId() == sample);
                // narrowed by a facet, the graph search is filtered as the exact ranking is
                assertThat(vector.similarTo(vector.signatureOf(sample), OptionalLong.of(sample), metric,
                        ComparedBand.WHOLE_GRID, FILMS, 5)).as("films like sample %d by %s", sample, metric)
                        .isEqualTo(exact.similarTo(exact.signatureOf(sample), OptionalLong.of(sample), metric,
                                ComparedBand.WHOLE_GRID, FILMS, 5))
                        .allMatch(hit -> hit.materialClass().equals("film"));
            }
        }
    }
}
