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
 * Property: a search's first bounds kept in arrays by store row ({@link FirstBounds#byRow}, the default) and in the
 * maps keyed by sample id kept from before ({@code -Dsieve.search.row-arrays=false}) give the same rows as judging
 * every admitted sample ({@link ExactReference}), order included, and judge the same number of samples on one thread
 * (the same bounds, so the same contenders, order and leave-outs: docs/weighted-screening.md, "The service at a million
 * curves"). The library is the demo library plus the illustrative synthetic stock of
 * {@link BoundedJudgementPropertyTest} (the invented Fernhollow workshop); random requirements mixing weighted and
 * every-point clauses (the every-point screen's proven misses go into the same bounds), as measured, at one thickness,
 * over a range, behind the demo glass, from the trade's wordings (common practice, no source); a small reserve cut, so
 * the reserve formed on demand is reached; a fixed seed (jqwik is not available offline).
 */
class RowArraysEquivalenceTest {

    private static final int SYNTHETIC_CURVES = 450;

    private static JooqLibraryRepository library;

    @BeforeAll
    static void demoLibraryAndSyntheticStock() {
        library = BoundedJudgementPropertyTest.demoLibraryWithSyntheticStock(SYNTHETIC_CURVES, 20261205L);
    }

    @Test
    void boundsByRowAndBySampleIdGiveTheExactRowsWithTheSameJudgements() {
        Random random = new Random(20261205L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService byRow = new SearchService(library).withRowArrays(true)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        SearchService bySampleId = new SearchService(library).withRowArrays(false)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        SearchService byRowInParallel = new SearchService(library).withRowArrays(true).parallelFrom(0);
        int judgedSome = 0;
        for (int trial = 0; trial < 24; trial++) {
            String text = randomRequirement(random, trial);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            Shortlist rows = byRow.search(requirement, limit);
            Shortlist ids = bySampleId.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, rows.layer(), materials, limit);

            assertThat(rows.rows()).as(text + " by row (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(ids.rows()).as(text + " by sample id").containsExactlyElementsOf(expected);
            assertThat(rows.judgedExactly()).as(text + ": the same bounds judge the same samples")
                    .isEqualTo(ids.judgedExactly());
            assertThat(byRowInParallel.search(requirement, limit).rows()).as(text + " by row, in parallel")
                    .containsExactlyElementsOf(expected);
            judgedSome += rows.judgedExactly() < rows.evaluatedSamples() ? 1 : 0;
        }
        // not vacuous: the bounds left samples out (else any bounds would judge the same samples)
        assertThat(judgedSome).isGreaterThan(8);
    }

    /**
     * Property: as measured over the whole library, the sweep over the snapshot index's slots with the screen's bounds
     * read in place ({@link SlotSweep}, {@link FirstBounds#screenAlone}: the default) forms the same contenders and
     * reserve as the eleventh pass's loop ({@code -Dsieve.search.slot-sweep=false}): the same rows as judging every
     * admitted sample, the same admitted count, the same count of judged samples on one thread (a contender or
     * reserve bound that differed would change which samples are judged), also with the sweep in two halves on two
     * threads. Random weighted requirements as measured — some with an every-point clause (the bounds then copied by
     * row), a class of the demo library, geometry any (diffuse rows then compete: the regular flags), a small reserve
     * cut (the reserve is formed or left out) — on the demo library plus the illustrative Fernhollow stock.
     */
    @Test
    void theSlotSweepFormsTheContendersOfTheLoopBeforeIt() {
        Random random = new Random(20261206L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService sweep = new SearchService(library).withSlotSweep(true)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        SearchService loop = new SearchService(library).withSlotSweep(false)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        SearchService sweepInTwo = new SearchService(library).withSlotSweep(true).parallelFrom(0).sweepInTwoFrom(0)
                .reserveAfter(4);
        String[] classes = {"plastic sheet", "window glass", "film", "fused silica"};
        long sweeps = SlotSweep.SWEEPS.get();
        long inTwo = SlotSweep.SWEEPS_IN_TWO.get();
        long reserves = BoundedJudgement.RESERVES_FORMED.get() + BoundedJudgement.RESERVES_LEFT.get();
        int leftOut = 0;
        for (int trial = 0; trial < 30; trial++) {
            String text = randomRequirement(random, 0).replace(", geometry any", "")
                    + (random.nextInt(4) == 0 ? ", class " + classes[random.nextInt(classes.length)] : "")
                    + (random.nextInt(3) == 0 ? ", geometry any" : "");
            text = text.replace(", behind 4 mm clear float glass", ""); // as measured without a layer: the sweep's case
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            Shortlist swept = sweep.search(requirement, limit);
            Shortlist before = loop.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, swept.layer(), materials, limit);

            assertThat(swept.rows()).as(text + " swept (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(before.rows()).as(text + " the loop before").containsExactlyElementsOf(expected);
            assertThat(swept.evaluatedSamples()).as(text + ": the same admitted samples").isEqualTo(before.evaluatedSamples());
            assertThat(swept.judgedExactly()).as(text + ": the same contenders judge the same samples")
                    .isEqualTo(before.judgedExactly());
            assertThat(sweepInTwo.search(requirement, limit).rows()).as(text + " swept in two halves")
                    .containsExactlyElementsOf(expected);
            leftOut += swept.judgedExactly() < swept.evaluatedSamples() ? 1 : 0;
        }
        // not vacuous: the sweep served every search, in two halves too, reserves were reached, and samples left out
        assertThat(SlotSweep.SWEEPS.get() - sweeps).isGreaterThanOrEqualTo(60);
        assertThat(SlotSweep.SWEEPS_IN_TWO.get() - inTwo).isGreaterThanOrEqualTo(30);
        assertThat(BoundedJudgement.RESERVES_FORMED.get() + BoundedJudgement.RESERVES_LEFT.get() - reserves).isGreaterThan(10);
        assertThat(leftOut).isGreaterThan(15);
    }

    /**
     * Property: the same as {@link #theSlotSweepFormsTheContendersOfTheLoopBeforeIt} where diffuse rows are ranked apart
     * and decide the answer: the demo library plus the illustrative Fernhollow stock with every other synthetic
     * material measured in total geometry, and requirements with a luminous clause (a see-through figure: total rows
     * go after the regular ones), so whether a swept material has a regular sample decides which rows it competes
     * with: the same rows as judging every sample and, on one thread, the same judged count as the loop before.
     */
    @Test
    void theSlotSweepKeepsWhichMaterialsCompeteWithTheRegularRows() {
        JooqLibraryRepository mixed = demoLibraryWithDiffuseStock();
        Random random = new Random(20261208L);
        List<Material> materials = mixed.findMaterials(null, null);
        SearchService sweep = new SearchService(mixed).withSlotSweep(true)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        SearchService loop = new SearchService(mixed).withSlotSweep(false)
                .judging(SearchService.Judging.BOUNDED).reserveAfter(4);
        int leftOut = 0;
        for (int trial = 0; trial < 20; trial++) {
            String text = "passes over " + RandomWeightedClauses.percent(40 + 45 * random.nextDouble()) + " of led "
                    + new String[] {"365", "385", "405"}[random.nextInt(3)] + " and luminous over "
                    + RandomWeightedClauses.percent(10 + 60 * random.nextDouble());
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {5, 10, 20, 40}[random.nextInt(4)];
            Shortlist swept = sweep.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(mixed, requirement, swept.layer(), materials, limit);

            Shortlist before = loop.search(requirement, limit);
            assertThat(swept.rows()).as(text + " swept (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(before.rows()).as(text + " the loop before").containsExactlyElementsOf(expected);
            assertThat(swept.judgedExactly()).as(text + ": the same contenders judge the same samples")
                    .isEqualTo(before.judgedExactly());
            leftOut += swept.judgedExactly() < swept.evaluatedSamples() ? 1 : 0;
        }
        // not vacuous: the bounds left samples out, so which rows a contender competes with decided work
        assertThat(leftOut).isGreaterThan(10);
    }

    private static JooqLibraryRepository demoLibraryWithDiffuseStock() {
        org.jooq.DSLContext db = org.spectralsieve.library.MigratedDatabase.freshH2();
        JooqLibraryRepository repository = new JooqLibraryRepository(db);
        new org.spectralsieve.seed.DemoLibraryLoader(repository, db, new org.springframework.core.io.DefaultResourceLoader(),
                "classpath:seed-materials/").load();
        BoundedJudgementPropertyTest.addSynthetic(repository, SYNTHETIC_CURVES, 20261208L, m -> m % 2 == 1);
        return repository;
    }

    private static String randomRequirement(Random random, int trial) {
        String clauses = RandomWeightedClauses.ledPassHazardLuminous(random);
        if (random.nextInt(3) == 0) {
            clauses += " and blocks under " + RandomWeightedClauses.percent(Math.pow(10, 1 - 2 * random.nextDouble())) + " at "
                    + new String[] {"300", "320", "350"}[random.nextInt(3)] + " nm";
        }
        String thickness = switch (trial % 3) {
            case 0 -> "";
            case 1 -> new String[] {", at 3 mm", ", at 1.5 mm", ", at 6 mm"}[random.nextInt(3)];
            default -> ", thickness 1 to 6 mm";
        };
        String layer = random.nextInt(5) == 0 ? ", behind 4 mm clear float glass" : "";
        String geometry = random.nextInt(4) == 0 ? ", geometry any" : "";
        return clauses + thickness + layer + geometry;
    }

}
