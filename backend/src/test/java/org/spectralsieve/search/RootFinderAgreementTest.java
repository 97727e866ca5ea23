package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Random;
import java.util.function.Supplier;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.requirement.CrossingFinder;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.ThicknessInterval;
import org.spectralsieve.requirement.ThicknessSolver;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Thickness solves by the ITP root finder (the default) against bisection, the rule before it: not the same
 * last bits — each reports an end within {@link ThicknessSolver#TOLERANCE_MM} of the same crossing, on its
 * holding side — so the same materials and samples, in the same order, with the same verdicts, the same
 * binding clauses but where two tie at the recommended thickness, and every thickness and interval end within twice the tolerance of the other's. On the demo library
 * through the real {@link SearchService} (every kind of requirement) and on 300 seeded random materials and
 * requirements, a quarter behind a random plate (the cases of {@link JudgementPathEquivalenceTest}).
 */
class RootFinderAgreementTest {

    private static final double TWO_TOLERANCES = 2 * ThicknessSolver.TOLERANCE_MM;
    /**
     * Margins read at thicknesses within two tolerances of each other: a margin moves at most a few decades per
     * mm on these curves (absorbance is at most the code's ceiling, 6.55, over the thinnest range), so 1e-5.
     */
    private static final double TIE_DECADES = 1e-5;

    @AfterEach
    void backToTheDefault() {
        CrossingFinder.useBisection(false);
    }

    @Test
    void everyDemoSearchAnswersTheSameRowsToWithinTheToleranceEitherWay() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository demo = new JooqLibraryRepository(db);
        new DemoLibraryLoader(demo, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        SearchService service = new SearchService(demo);
        int solved = 0;
        for (String text : JudgementPathEquivalenceTest.DEMO_REQUIREMENTS) {
            Requirement requirement = RequirementParser.parse(text);
            Shortlist bisection = solvedBy(true, () -> service.search(requirement, 500));
            Shortlist itp = solvedBy(false, () -> service.search(requirement, 500));
            assertThat(itp.rows()).as(text).hasSameSizeAs(bisection.rows());
            assertThat(itp.judgedExactly()).as(text).isEqualTo(bisection.judgedExactly());
            for (int i = 0; i < itp.rows().size(); i++) {
                assertThat(itp.rows().get(i).materialId()).as(text).isEqualTo(bisection.rows().get(i).materialId());
                solved += agree(text + ", row " + i, itp.rows().get(i).evaluation(), bisection.rows().get(i).evaluation());
            }
        }
        assertThat(solved).as("rows whose thickness was solved").isGreaterThan(30);
    }

    @Test
    void randomMaterialsAreJudgedTheSameToWithinTheToleranceEitherWay() {
        Random random = new Random(20261205L);
        int solved = 0;
        for (int trial = 0; trial < 300; trial++) {
            JudgementPathEquivalenceTest.RandomCase c = JudgementPathEquivalenceTest.randomCase(random, trial);
            List<MaterialEvaluation> bisection = solvedBy(true, c::judge);
            List<MaterialEvaluation> itp = solvedBy(false, c::judge);
            assertThat(itp).hasSameSizeAs(bisection);
            for (int i = 0; i < itp.size(); i++) {
                solved += agree("trial " + trial + ": " + c.requirement().text(), itp.get(i).evaluation(),
                        bisection.get(i).evaluation());
            }
        }
        assertThat(solved).as("evaluations whose thickness was solved").isGreaterThan(30);
    }

    /** 1 when the thickness was solved (a feasible interval or a recommendation off the measured one), else 0. */
    private static int agree(String context, SampleEvaluation itp, SampleEvaluation bisection) {
        assertThat(itp.sampleId()).as(context).isEqualTo(bisection.sampleId());
        assertThat(itp.verdict()).as(context).isEqualTo(bisection.verdict());
        assertThat(itp.worstMarginDecades()).as(context).isCloseTo(bisection.worstMarginDecades(), within(TIE_DECADES));
        if (itp.bindingClauseIndex() != bisection.bindingClauseIndex()) {
            // at the recommended thickness the pass side's and the block side's worst margins are equal (that is
            // where it is put): which of the two is the binding clause is then a tie, decided by the last bits
            double one = itp.clauses().get(itp.bindingClauseIndex()).marginDecades();
            double other = itp.clauses().get(bisection.bindingClauseIndex()).marginDecades();
            assertThat(other).as(context + ": a tie for the binding clause").isCloseTo(one, within(TIE_DECADES));
        }
        assertThat(itp.thicknessMm()).as(context).isCloseTo(bisection.thicknessMm(), within(TWO_TOLERANCES));
        ThicknessInterval a = itp.feasibleMm();
        ThicknessInterval b = bisection.feasibleMm();
        assertThat(a == null).as(context).isEqualTo(b == null);
        if (a != null) {
            assertThat(a.loMm()).as(context).isCloseTo(b.loMm(), within(TWO_TOLERANCES));
            assertThat(a.hiMm()).as(context).isCloseTo(b.hiMm(), within(TWO_TOLERANCES));
        }
        return a != null || itp.thicknessMm() != bisection.thicknessMm() ? 1 : 0;
    }

    private static <T> T solvedBy(boolean bisection, Supplier<T> work) {
        CrossingFinder.useBisection(bisection);
        try {
            return work.get();
        } finally {
            CrossingFinder.useBisection(false);
        }
    }
}
