package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import org.jooq.DSLContext;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;
import org.spectralsieve.store.SyntheticCurves;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Property: judging materials from the largest margin bound down and leaving out those that cannot beat a
 * full shortlist ({@link BoundedJudgement}, on one thread and in parallel) gives exactly the rows of judging
 * every admitted sample ({@link ExactReference}) and of the earlier judging loop, order included. The library
 * is the demo library plus illustrative synthetic stock (the invented Fernhollow workshop, curves of
 * {@link SyntheticCurves}: two bulk materials in three, the third a fixed part, thicknesses 0.5–10 mm), so
 * that many rows meet and the bounds of met rows decide; random weighted requirements from the trade's
 * wordings (common practice, no source), a fixed seed (jqwik is not available offline).
 */
class BoundedJudgementPropertyTest {

    private static final int SYNTHETIC_CURVES = 450;

    private static JooqLibraryRepository library;

    @BeforeAll
    static void demoLibraryAndSyntheticStock() {
        library = demoLibraryWithSyntheticStock(SYNTHETIC_CURVES, 20261204L);
    }

    /** A fresh in-memory database holding the demo library and {@link #addSynthetic} stock of this many curves. */
    static JooqLibraryRepository demoLibraryWithSyntheticStock(int curves, long seed) {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository repository = new JooqLibraryRepository(db);
        new DemoLibraryLoader(repository, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        addSynthetic(repository, curves, seed);
        return repository;
    }

    @Test
    void boundedJudgementGivesTheRowsOfJudgingEverySample() {
        Random random = new Random(20261214L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService parallel = new SearchService(library).parallelFrom(0);
        SearchService oneThread = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        SearchService earlier = new SearchService(library).judging(SearchService.Judging.EARLIER);
        int fewer = 0;
        int fullOfMet = 0;
        for (int trial = 0; trial < 18; trial++) {
            String text = randomRequirement(random);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            Shortlist answer = parallel.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, answer.layer(), materials, limit);

            assertThat(answer.rows()).as(text + " (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(oneThread.search(requirement, limit).rows()).as(text + " one thread").containsExactlyElementsOf(expected);
            Shortlist before = earlier.search(requirement, limit);
            assertThat(before.rows()).as(text + " earlier loop").containsExactlyElementsOf(expected);
            fewer += answer.judgedExactly() < before.judgedExactly() ? 1 : 0;
            fullOfMet += expected.size() == limit && expected.get(limit - 1).evaluation().standing() == Standing.MEETS ? 1 : 0;
        }
        // not vacuous: shortlists full of met rows, where the bounds of met rows leave materials out
        assertThat(fullOfMet).isGreaterThan(5);
        assertThat(fewer).isGreaterThan(5);
    }

    @Test
    void weightedBlocksBehindALayerLeaveOutOnlyMaterialsThatCannotEnter() {
        // as measured behind the demo glass, where the weighted blocks' lower bound on the stack applies
        // (docs/weighted-screening.md, "Weighted blocks behind a fixed layer"): the rows of judging every sample,
        // with and without those bounds, in parallel and on one thread; and fewer samples judged with them
        Random random = new Random(20261215L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService parallel = new SearchService(library).parallelFrom(0);
        SearchService oneThread = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        SearchService without = new SearchService(library).withEarlierLayerBounds();
        int fewer = 0;
        for (int trial = 0; trial < 10; trial++) {
            String text = "passes over " + RandomWeightedClauses.percent(40 + 50 * random.nextDouble()) + " of led "
                    + new String[] {"365", "385", "405"}[random.nextInt(3)]
                    + (random.nextBoolean() ? " and uv hazard under " + RandomWeightedClauses.percent(Math.pow(10, 0.5 - 2.5 * random.nextDouble())) : "")
                    + (random.nextBoolean() || trial % 3 == 0 ? " and erythemal under " + RandomWeightedClauses.percent(Math.pow(10, 1 - 3 * random.nextDouble()))
                    : " and uv hazard under " + RandomWeightedClauses.percent(Math.pow(10, -1.5 * random.nextDouble())))
                    + (random.nextBoolean() ? " and luminous over " + RandomWeightedClauses.percent(30 + 50 * random.nextDouble()) : "")
                    + ", behind 4 mm clear float glass" + (random.nextInt(4) == 0 ? ", geometry any" : "");
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            Shortlist answer = parallel.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, answer.layer(), materials, limit);

            assertThat(answer.rows()).as(text + " (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(oneThread.search(requirement, limit).rows()).as(text + " one thread").containsExactlyElementsOf(expected);
            Shortlist before = without.search(requirement, limit);
            assertThat(before.rows()).as(text + " with the layer bounds before").containsExactlyElementsOf(expected);
            fewer += answer.judgedExactly() < before.judgedExactly() ? 1 : 0;
        }
        assertThat(fewer).as("not vacuous: the bounds leave materials out").isGreaterThan(1);
    }

    @Test
    void theRowsDoNotDependOnWhereTheParallelLoopStarts() {
        Requirement requirement = RequirementParser.parse("passes over 70% of led 405 and luminous over 50%");
        List<RankedRow> byDefault = new SearchService(library).search(requirement, 5).rows();
        assertThat(new SearchService(library).parallelFrom(0).search(requirement, 5).rows()).containsExactlyElementsOf(byDefault);
        assertThat(new SearchService(library).parallelFrom(Integer.MAX_VALUE).search(requirement, 5).rows())
                .containsExactlyElementsOf(byDefault);
    }

    @Test
    void theSameAnswerWhateverTheThreadsAndHowOftenAsked() {
        Requirement requirement = RequirementParser.parse(
                "passes over 80% of led 365 and uv hazard under 0.5% and luminous over 60%, thickness 1 to 6 mm");
        SearchService parallel = new SearchService(library).parallelFrom(0);
        List<RankedRow> first = parallel.search(requirement, 10).rows();
        for (int i = 0; i < 3; i++) {
            assertThat(parallel.search(requirement, 10).rows()).containsExactlyElementsOf(first);
        }
        assertThat(new SearchService(library).judging(SearchService.Judging.BOUNDED).search(requirement, 10).rows())
                .containsExactlyElementsOf(first);
    }

    private static String randomRequirement(Random random) {
        String clauses = RandomWeightedClauses.ledPassHazardLuminous(random);
        if (random.nextInt(4) == 0) {
            clauses += " and erythemal under " + RandomWeightedClauses.percent(Math.pow(10, 1 - 2 * random.nextDouble()));
        }
        String thickness = new String[] {"", ", at 3 mm", ", thickness 1 to 6 mm", ", thickness 0.5 to 3 mm",
                ", thickness 2 to 10 mm"}[random.nextInt(5)];
        String layer = random.nextInt(5) == 0 ? ", behind 4 mm clear float glass" : "";
        String geometry = random.nextInt(6) == 0 ? ", geometry any" : "";
        return clauses + thickness + layer + geometry;
    }


    /** Synthetic curves as library samples, three per material, two materials in three bulk, the third fixed. */
    static void addSynthetic(JooqLibraryRepository library, int n, long seed) {
        addSynthetic(library, n, seed, m -> false);
    }

    /** {@link #addSynthetic(JooqLibraryRepository, int, long)} with the samples of material m in total geometry where asked. */
    static void addSynthetic(JooqLibraryRepository library, int n, long seed, java.util.function.IntPredicate totalGeometry) {
        SyntheticCurves specs = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, n);
        SyntheticCurves.Spec[] all = new SyntheticCurves.Spec[n];
        for (int i = 0; i < n; i++) {
            all[i] = specs.next();
            builder.addEncoded(i + 1L, new StoredMaterial(i / 3 + 1L, "material " + i / 3, "plastic sheet"),
                    all[i].thicknessMm(), (i / 3) % 3 != 2, false, SyntheticCurves.INDICES[all[i].index()],
                    specs.codes(all[i]));
        }
        SpectralStore store = builder.build();
        long material = 0;
        for (int i = 0; i < n; i++) {
            if (i % 3 == 0) {
                int m = i / 3;
                material = library.insertMaterial(new NewMaterial("fernhollow-bounded-" + m,
                        "Fernhollow bounded stock " + m, MaterialClass.of("plastic sheet"), "Illustrative synthetic stock",
                        List.of(), m % 3 != 2 ? Scaling.BULK : Scaling.FIXED, SyntheticCurves.INDICES[all[i].index()],
                        new StatedThicknesses(List.of(), Double.NaN, Double.NaN)));
            }
            byte[] bytes = ("bounded synthetic " + i).getBytes(StandardCharsets.UTF_8);
            library.insertSample(material, new NewSample(store.thicknessMm(i),
                    totalGeometry.test(i / 3) ? Geometry.TOTAL : Geometry.REGULAR, Provenance.MODELLED,
                    "", null, "", "", 1e-3, store.curve(i), "synthetic.csv", Checksums.sha256(bytes)));
        }
    }
}
