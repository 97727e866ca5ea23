package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import java.util.function.Supplier;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Verdict;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Whole judgements with the lean per-point arithmetic ({@link PerPointArithmetic}, the default) equal those of
 * the earlier arithmetic, kept as the reference: every row, verdict, value, margin, bound flag, confidence,
 * explanation, thickness, feasible interval and stock advice ({@code equals} on records of doubles, bit for bit),
 * on the demo library through the real {@link SearchService} (every kind of requirement, weighted solves and
 * stacks behind the demo glass among them) and on 300 seeded random materials and requirements, a quarter behind
 * a random plate (the cases of {@link JudgementPathEquivalenceTest}). The per-part checks are in
 * {@code optics.PerPointArithmeticEquivalenceTest}, with a check that the comparison can fail.
 */
class PerPointArithmeticSearchEquivalenceTest {

    @AfterEach
    void backToTheDefault() {
        PerPointArithmetic.useEarlier(false);
    }

    @Test
    void everyDemoSearchAnswersTheSameRowsWithEitherArithmetic() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository demo = new JooqLibraryRepository(db);
        new DemoLibraryLoader(demo, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        SearchService service = new SearchService(demo);
        int rows = 0;
        for (String text : JudgementPathEquivalenceTest.DEMO_REQUIREMENTS) {
            Requirement requirement = RequirementParser.parse(text);
            Shortlist earlier = both(() -> service.search(requirement, 500), true);
            Shortlist lean = both(() -> service.search(requirement, 500), false);
            assertThat(lean.rows()).as(text).isEqualTo(earlier.rows());
            assertThat(lean.judgedExactly()).as(text).isEqualTo(earlier.judgedExactly());
            rows += lean.rows().size();
        }
        assertThat(rows).isGreaterThan(200);
    }

    @Test
    void randomMaterialsAreJudgedTheSameWithEitherArithmetic() {
        Random random = new Random(20261205L);
        int meets = 0;
        int stacked = 0;
        for (int trial = 0; trial < 300; trial++) {
            JudgementPathEquivalenceTest.RandomCase c = JudgementPathEquivalenceTest.randomCase(random, trial);
            if (c.layer().isPresent()) {
                stacked++;
            }
            List<MaterialEvaluation> earlier = both(c::judge, true);
            List<MaterialEvaluation> lean = both(c::judge, false);
            assertThat(lean).as("trial " + trial + ": " + c.requirement().text()).isEqualTo(earlier);
            meets += (int) lean.stream().filter(e -> e.evaluation().verdict() == Verdict.MEETS).count();
        }
        assertThat(meets).isGreaterThan(20);
        assertThat(stacked).isGreaterThan(50);
    }

    private static <T> T both(Supplier<T> judge, boolean earlier) {
        PerPointArithmetic.useEarlier(earlier);
        try {
            return judge.get();
        } finally {
            PerPointArithmetic.useEarlier(false);
        }
    }
}
