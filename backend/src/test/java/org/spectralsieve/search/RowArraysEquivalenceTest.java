package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Locale;
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

    private static String randomRequirement(Random random, int trial) {
        String clauses = "passes over " + percent(55 + 35 * random.nextDouble()) + " of led "
                + new String[] {"365", "385", "405"}[random.nextInt(3)];
        if (random.nextInt(3) > 0) {
            clauses += " and uv hazard under " + percent(Math.pow(10, 0.5 - 2 * random.nextDouble()));
        }
        if (random.nextBoolean()) {
            clauses += " and luminous over " + percent(30 + 50 * random.nextDouble());
        }
        if (random.nextInt(3) == 0) {
            clauses += " and blocks under " + percent(Math.pow(10, 1 - 2 * random.nextDouble())) + " at "
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

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }
}
