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

/**
 * Property: a solve over a range whose screen leaves the bins unread where the figure codes prove no miss, and reads
 * them in full for the contenders it forms or for a reserve it forms ({@code WeightedMisses.screenWithBinsDeferred},
 * the default), gives the rows of judging every admitted sample ({@link ExactReference}), order included, and on one
 * thread judges exactly the samples the screen reading every curve's bins judges ({@code -Dsieve.search.deferred-bins=false}):
 * every contender judged or compared carries the very bound of the full screen (docs/weighted-screening.md, "Wired into
 * the service"). The library is the demo library plus the illustrative synthetic stock of
 * {@link BoundedJudgementPropertyTest} (the invented Fernhollow workshop); random solved requirements from the trade's
 * wordings (common practice, no source) over random ranges, some with a class or geometry any, limits 1–20, a small
 * reserve cut so that materials wait in a reserve and the reserve is reached; a fixed seed (jqwik is not available
 * offline).
 */
class DeferredBinsSearchEquivalenceTest {

    private static final int SYNTHETIC_CURVES = 450;

    private static JooqLibraryRepository library;

    @BeforeAll
    static void demoLibraryAndSyntheticStock() {
        library = BoundedJudgementPropertyTest.demoLibraryWithSyntheticStock(SYNTHETIC_CURVES, 20261209L);
    }

    @Test
    void aSolveWithItsBinsDeferredJudgesTheSameSamplesAndGivesTheExactRows() {
        Random random = new Random(20261209L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService deferred = new SearchService(library).withDeferredBins(true)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        SearchService everyBin = new SearchService(library).withDeferredBins(false)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        // a cut of one: nearly every waiting material in the reserve, which the loop then forms
        SearchService deferredTightCut = new SearchService(library).withDeferredBins(true)
                .judging(SearchService.Judging.BOUNDED).reserveCut(1);
        SearchService deferredInParallel = new SearchService(library).withDeferredBins(true).parallelFrom(0);
        long waited = BoundedExactSearch.BINS_UNREAD_MATERIALS.get();
        long inReserve = BoundedExactSearch.BINS_UNREAD_IN_RESERVE.get();
        long reservesFormed = BoundedJudgement.RESERVES_FORMED.get();
        long reservesLeft = BoundedJudgement.RESERVES_LEFT.get();
        int leftOut = 0;
        int withRows = 0;
        for (int trial = 0; trial < 30; trial++) {
            String text = randomSolve(random);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            Shortlist fromCodes = deferred.search(requirement, limit);
            Shortlist fromBins = everyBin.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, fromCodes.layer(), materials, limit);

            assertThat(fromCodes.rows()).as(text + " bins deferred (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(fromBins.rows()).as(text + " every bin read").containsExactlyElementsOf(expected);
            assertThat(fromCodes.evaluatedSamples()).as(text + ": the same admitted samples")
                    .isEqualTo(fromBins.evaluatedSamples());
            assertThat(fromCodes.judgedExactly()).as(text + ": the same bounds judge the same samples")
                    .isEqualTo(fromBins.judgedExactly());
            Shortlist tightCut = deferredTightCut.search(requirement, limit);
            assertThat(tightCut.rows()).as(text + " bins deferred, cut of one").containsExactlyElementsOf(expected);
            assertThat(tightCut.judgedExactly()).as(text + ": cut of one, the same samples judged")
                    .isEqualTo(fromBins.judgedExactly());
            assertThat(deferredInParallel.search(requirement, limit).rows()).as(text + " bins deferred, in parallel")
                    .containsExactlyElementsOf(expected);
            leftOut += fromCodes.judgedExactly() < fromCodes.evaluatedSamples() ? 1 : 0;
            withRows += expected.isEmpty() ? 0 : 1;
        }
        // not vacuous: materials waited for their bins, some of them in a reserve, samples were left out, rows found
        assertThat(BoundedExactSearch.BINS_UNREAD_MATERIALS.get() - waited).isGreaterThan(100);
        assertThat(BoundedExactSearch.BINS_UNREAD_IN_RESERVE.get() - inReserve).isGreaterThan(20);
        assertThat(BoundedJudgement.RESERVES_FORMED.get() - reservesFormed).as("reserves formed").isGreaterThan(5);
        assertThat(BoundedJudgement.RESERVES_LEFT.get() - reservesLeft).as("reserves left out").isGreaterThan(0);
        assertThat(leftOut).isGreaterThan(10);
        assertThat(withRows).isGreaterThan(10);
    }

    private static String randomSolve(Random random) {
        String clauses = RandomWeightedClauses.ledPassHazardLuminous(random);
        String range = new String[] {", thickness 1 to 6 mm", ", thickness 2 to 4 mm", ", thickness 0.5 to 3 mm",
                ", thickness 3 to 10 mm"}[random.nextInt(4)];
        String[] classes = {"plastic sheet", "window glass", "film"};
        String extra = random.nextInt(5) == 0 ? ", class " + classes[random.nextInt(classes.length)]
                : random.nextInt(4) == 0 ? ", geometry any" : "";
        return clauses + range + extra;
    }

}
