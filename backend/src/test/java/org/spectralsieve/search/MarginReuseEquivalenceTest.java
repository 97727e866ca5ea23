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
import org.spectralsieve.requirement.MarginReuse;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Reading each path condition's margin once per thickness in a solve ({@link MarginReuse}, the default) against
 * computing every margin asked (the rule before it): the same answers bit for bit — the same rows, thicknesses,
 * intervals, margins and explanations — on the demo library through the real {@link SearchService} (every kind of
 * requirement, the judgement memo off so each search judges afresh) and on 300 seeded random materials and
 * requirements, a quarter behind a random plate (the cases of {@link JudgementPathEquivalenceTest}). The
 * reference is the exact judgement itself, computed the earlier way.
 */
class MarginReuseEquivalenceTest {

    @AfterEach
    void backToTheDefault() {
        MarginReuse.use(true);
    }

    @Test
    void everyDemoSearchAnswersTheSameRowsWithOrWithoutReusedMargins() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository demo = new JooqLibraryRepository(db);
        new DemoLibraryLoader(demo, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        SearchService reusing = new SearchService(demo).withoutJudgementMemo();
        SearchService computing = new SearchService(demo).withoutJudgementMemo();
        int solvedRows = 0;
        for (String text : JudgementPathEquivalenceTest.DEMO_REQUIREMENTS) {
            Requirement requirement = RequirementParser.parse(text);
            Shortlist before = judgedWith(false, () -> computing.search(requirement, 500));
            Shortlist now = judgedWith(true, () -> reusing.search(requirement, 500));
            assertThat(now.rows()).as(text).isEqualTo(before.rows());
            solvedRows += (int) now.rows().stream().filter(r -> r.evaluation().feasibleMm() != null).count();
        }
        assertThat(solvedRows).as("rows with a solved thickness interval").isGreaterThan(10);
    }

    @Test
    void randomMaterialsAreJudgedTheSameWithOrWithoutReusedMargins() {
        Random random = new Random(20261205L);
        int weightedSolves = 0;
        for (int trial = 0; trial < 300; trial++) {
            JudgementPathEquivalenceTest.RandomCase c = JudgementPathEquivalenceTest.randomCase(random, trial);
            Requirement asked = c.requirement();
            List<MaterialEvaluation> before = judgedWith(false, c::judge);
            List<MaterialEvaluation> now = judgedWith(true, c::judge);
            assertThat(now).as("trial " + trial + ": " + asked.text()).isEqualTo(before);
            if (!asked.plain() && asked.thickness().kind() == ThicknessSpec.Kind.RANGE) {
                weightedSolves++;
            }
        }
        assertThat(weightedSolves).as("random requirements solved on the path over a range").isGreaterThan(30);
    }

    private static <T> T judgedWith(boolean reuse, Supplier<T> work) {
        MarginReuse.use(reuse);
        try {
            return work.get();
        } finally {
            MarginReuse.use(true);
        }
    }
}
