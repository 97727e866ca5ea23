package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Standing;

/**
 * Property: where each sample is a contender of its own (docs/weighted-screening.md, "Samples as contenders": as
 * measured and at one asked thickness, a material's row the best of its samples' rows each formed alone), the
 * search gives exactly the rows of judging every admitted sample ({@link ExactReference}), order included, in
 * parallel and on one thread, and the same as judging materials whole ({@link SearchService#withMaterialsWhole});
 * and it judges fewer samples. The library is the demo library plus the illustrative synthetic stock of
 * {@link BoundedJudgementPropertyTest} (the invented Fernhollow workshop, three samples per material at
 * thicknesses 0.5–10 mm, so an asked thickness picks one or two of them); random weighted requirements from the
 * trade's wordings (common practice, no source), a fixed seed (jqwik is not available offline).
 */
class SampleContendersPropertyTest {

    private static final int SYNTHETIC_CURVES = 450;

    private static JooqLibraryRepository library;

    @BeforeAll
    static void demoLibraryAndSyntheticStock() {
        library = BoundedJudgementPropertyTest.demoLibraryWithSyntheticStock(SYNTHETIC_CURVES, 20261205L);
    }

    @Test
    void samplesJudgedAloneGiveTheRowsOfJudgingEverySampleAndJudgeFewer() {
        Random random = new Random(20261216L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService parallel = new SearchService(library).parallelFrom(0);
        SearchService oneThread = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        SearchService whole = new SearchService(library).withMaterialsWhole();
        SearchService noSecond = new SearchService(library).withoutSecondStage();
        // the first bounds alone on one thread: one sample against its material, like with like
        SearchService samplesFirstOnly = new SearchService(library).withoutSecondStage()
                .judging(SearchService.Judging.BOUNDED);
        SearchService wholeFirstOnly = new SearchService(library).withMaterialsWhole().withoutSecondStage()
                .judging(SearchService.Judging.BOUNDED);
        int fewer = 0;
        int fullOfMet = 0;
        int atAThickness = 0;
        for (int trial = 0; trial < 16; trial++) {
            String text = randomRequirement(random, trial);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            Shortlist answer = parallel.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, answer.layer(), materials, limit);

            assertThat(answer.rows()).as(text + " (limit " + limit + ")").containsExactlyElementsOf(expected);
            Shortlist alone = oneThread.search(requirement, limit);
            assertThat(alone.rows()).as(text + " one thread").containsExactlyElementsOf(expected);
            assertThat(noSecond.search(requirement, limit).rows()).as(text + " without the second stage")
                    .containsExactlyElementsOf(expected);
            Shortlist materialsWhole = whole.search(requirement, limit);
            assertThat(materialsWhole.rows()).as(text + " materials whole").containsExactlyElementsOf(expected);
            fewer += samplesFirstOnly.search(requirement, limit).judgedExactly()
                    < wholeFirstOnly.search(requirement, limit).judgedExactly() ? 1 : 0;
            fullOfMet += expected.size() == limit && expected.get(limit - 1).evaluation().standing() == Standing.MEETS ? 1 : 0;
            atAThickness += text.contains(" mm") ? 1 : 0;
        }
        // not vacuous: full rows of met rows, where a sample's own bound leaves it out, at a thickness too
        assertThat(fullOfMet).isGreaterThan(4);
        assertThat(atAThickness).isGreaterThan(3);
        assertThat(fewer).as("samples left out that their materials' bounds would have judged").isGreaterThan(4);
    }

    /** As measured or at one asked thickness (where samples are contenders), sometimes behind the demo glass. */
    private static String randomRequirement(Random random, int trial) {
        String clauses = RandomWeightedClauses.ledPassHazardLuminous(random);
        if (random.nextInt(4) == 0) {
            clauses += " and erythemal under " + RandomWeightedClauses.percent(Math.pow(10, 1 - 2 * random.nextDouble()));
        }
        String thickness = trial % 2 == 0 ? "" : new String[] {", at 3 mm", ", at 1.5 mm", ", at 6 mm"}[random.nextInt(3)];
        String layer = random.nextInt(5) == 0 ? ", behind 4 mm clear float glass" : "";
        // see-through clauses rank diffuse rows apart unless total transmittance is accepted
        String geometry = random.nextInt(4) == 0 ? ", geometry any" : "";
        return clauses + thickness + layer + geometry;
    }

}
