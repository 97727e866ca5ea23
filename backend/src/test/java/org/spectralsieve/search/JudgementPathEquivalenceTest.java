package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.function.Supplier;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SellmeierIndex;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.JudgementPath;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.SampleEvaluation;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.Verdict;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * The exact judgement formed only where read ({@link JudgementPath}, the default; docs/exact-judgement-speed.md)
 * gives the answers of the earlier way, which formed everything up front, bit for bit: every row, verdict,
 * value, margin, bound flag, confidence, explanation, thickness, feasible interval and stock advice compared
 * with {@code equals} (records of doubles: bit for bit, NaN equal to NaN). On the demo library through the
 * real {@link SearchService} and on every demo curve judged directly, and on 300 seeded random curves
 * (random grids, points below detection, clear readings at the lossless ceiling, measurement uncertainties)
 * against random requirements: plain points, bands and means, cutoffs, confidence demands, weighted figures,
 * one asked thickness, ranges with and without stock sizes, with and without a fixed layer. The reference is
 * the code path itself, kept (not numbers remembered), so no value here is from memory.
 */
class JudgementPathEquivalenceTest {

    private static JooqLibraryRepository demo;
    private static List<Curve> demoCurves;

    /** Requirements of every kind the search answers; the demo library's own layer names resolve. */
    static final List<String> DEMO_REQUIREMENTS = List.of(
            "passes over 80% at 365 nm and blocks under 1% at 405 nm and passes at least 70% from 380 to 400 nm",
            "passes over 80% at 365 nm and blocks under 1% at 405 nm and passes at least 70% from 380 to 400 nm, thickness 1 to 6 mm",
            "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%",
            "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%, thickness 1 to 6 mm",
            "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%, behind 4 mm clear float glass",
            "passes over 85% of led 365 and uv hazard under 0.1% and luminous over 70%, thickness 1 to 6 mm, behind 4 mm clear float glass",
            "blocks under 1% at 405 nm, 3 mm thick",
            "mean over 85% from 360 to 370 nm and UV400, thickness 0.5 to 10 mm",
            "cutoff between 380 and 395 nm, thickness 1 to 8 mm",
            "passes over 80% at 365 nm with 95% confidence, thickness 1 to 6 mm",
            "erythemal under 1% and visible over 70%, thickness 2 to 12 mm",
            "critical wavelength over 370 nm, thickness 1 to 6 mm",
            "passes over 80% at 365 nm, 2 mm thick, behind 4 mm clear float glass");

    @BeforeAll
    static void loadDemoLibrary() {
        DSLContext db = MigratedDatabase.freshH2();
        demo = new JooqLibraryRepository(db);
        new DemoLibraryLoader(demo, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        Map<Long, Curve> curves = demo.findAllCurves();
        demoCurves = new ArrayList<>(curves.values());
    }

    @AfterEach
    void backToTheDefault() {
        JudgementPath.useReference(false);
    }

    @Test
    void everyDemoSearchAnswersTheSameRowsBothWays() {
        SearchService service = new SearchService(demo);
        int rows = 0;
        for (String text : DEMO_REQUIREMENTS) {
            Requirement requirement = RequirementParser.parse(text);
            Shortlist earlier = both(() -> service.search(requirement, 500), true);
            Shortlist now = both(() -> service.search(requirement, 500), false);
            assertThat(now.rows()).as(text).isEqualTo(earlier.rows());
            assertThat(now.judgedExactly()).as(text).isEqualTo(earlier.judgedExactly());
            assertThat(now.layer()).as(text).isEqualTo(earlier.layer());
            rows += now.rows().size();
        }
        // not vacuous: the searches answer rows
        assertThat(rows).isGreaterThan(200);
    }

    @Test
    void everyDemoCurveIsJudgedTheSameBothWays() {
        assertThat(demoCurves).hasSizeGreaterThan(50);
        SearchService service = new SearchService(demo);
        Optional<StackLayer> glass = service.search(RequirementParser.parse(DEMO_REQUIREMENTS.get(4)), 1).layer();
        assertThat(glass).isPresent();
        RefractiveIndex[] indices = {new ConstantIndex(1.49), SellmeierIndex.CROWN_517642};
        long id = 0;
        int meets = 0;
        for (Curve curve : demoCurves) {
            for (String text : DEMO_REQUIREMENTS) {
                Requirement requirement = RequirementParser.parse(text);
                Optional<StackLayer> layer = requirement.layer().isPresent() ? glass : Optional.empty();
                Candidate candidate = new Candidate(++id, id, "demo curve " + id, curve, 1 + id % 5, true,
                        indices[(int) (id % 2)]);
                SampleEvaluation earlier = both(() -> SampleEvaluator.evaluate(candidate, requirement, layer), true);
                SampleEvaluation now = both(() -> SampleEvaluator.evaluate(candidate, requirement, layer), false);
                assertThat(now).as(text + " on demo curve " + candidate).isEqualTo(earlier);
                meets += now.verdict() == Verdict.MEETS ? 1 : 0;
            }
        }
        assertThat(meets).isGreaterThan(20);
    }

    @Test
    void randomCurvesAndRequirementsAreJudgedTheSameBothWays() {
        Random random = new Random(20261204L);
        int meets = 0;
        int stocks = 0;
        for (int trial = 0; trial < 300; trial++) {
            RandomCase c = randomCase(random, trial);
            List<MaterialEvaluation> earlier = both(c::judge, true);
            List<MaterialEvaluation> now = both(c::judge, false);
            assertThat(now).as("trial " + trial + ": " + c.requirement().text()).isEqualTo(earlier);
            meets += (int) now.stream().filter(e -> e.evaluation().verdict() == Verdict.MEETS).count();
            stocks += now.stream().mapToInt(e -> e.evaluation().stockAdvice().inside().size()).sum();
        }
        // not vacuous: some random samples meet, and stock sizes are judged
        assertThat(meets).isGreaterThan(20);
        assertThat(stocks).isGreaterThan(5);
    }

    private static <T> T both(Supplier<T> judge, boolean earlier) {
        JudgementPath.useReference(earlier);
        try {
            return judge.get();
        } finally {
            JudgementPath.useReference(false);
        }
    }

    /** One seeded random case: a material's samples, a requirement, and the plate it is judged behind, if any. */
    record RandomCase(List<Candidate> samples, Requirement requirement, Optional<StackLayer> layer) {
        List<MaterialEvaluation> judge() {
            return MaterialJudge.evaluate(samples, requirement, layer);
        }
    }

    /** A random material and requirement; a quarter of them behind a random 3 mm plate. */
    static RandomCase randomCase(Random random, int trial) {
        List<Candidate> samples = randomMaterial(random, trial);
        Requirement requirement = RequirementParser.parse(randomRequirement(random));
        if (random.nextInt(4) != 0) {
            return new RandomCase(samples, requirement, Optional.empty());
        }
        Requirement behind = RequirementParser.parse(requirement.text() + ", behind 3 mm synthetic plate");
        return new RandomCase(samples, behind, Optional.of(plate(random, behind.layer().orElseThrow())));
    }

    /** One to three samples of one material at different thicknesses; stock sizes in a third of the materials. */
    static List<Candidate> randomMaterial(Random random, int trial) {
        double step = 0.5 + random.nextInt(5);
        double start = 190 + 60 * random.nextDouble();
        int n = (int) Math.floor((1100 - start) / step) + 1;
        double[] nm = new double[n];
        double edge = 300 + 150 * random.nextDouble();
        double width = 2 + 25 * random.nextDouble();
        double kMax = random.nextInt(3) == 0 ? 1 : 0.8 + 0.2 * random.nextDouble();
        double kMin = Math.pow(10, -1 - 5 * random.nextDouble());
        double limit = random.nextInt(3) == 0 ? 0 : Math.pow(10, -2 - 3 * random.nextDouble());
        boolean uncertain = random.nextBoolean();
        RefractiveIndex index = random.nextBoolean() ? new ConstantIndex(1.45 + 0.15 * random.nextDouble())
                : (random.nextBoolean() ? SellmeierIndex.CROWN_517642 : SellmeierIndex.PMMA);
        List<Double> thicknesses = new ArrayList<>();
        int count = 1 + random.nextInt(3);
        for (int s = 0; s < count; s++) {
            thicknesses.add(0.5 + 0.5 * random.nextInt(12));
        }
        List<Double> stock = random.nextInt(3) == 0 ? List.of(1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 8.0) : List.of();
        MadeThicknesses made = MadeThicknesses.of(stock, Double.NaN, Double.NaN, thicknesses);
        List<Candidate> out = new ArrayList<>();
        for (int s = 0; s < count; s++) {
            double[] t = new double[n];
            double[] sigma = new double[n];
            double scale = thicknesses.get(s) / thicknesses.get(0);
            for (int i = 0; i < n; i++) {
                nm[i] = start + step * i;
                double k = kMin + (kMax - kMin) / (1 + Math.exp(-(nm[i] - edge) / width));
                // a dye band in some materials: not monotone, so cutoffs can cross twice
                k *= random.nextInt(4) == 0 ? 1 : 1 - 0.6 * Math.exp(-Math.pow((nm[i] - 560) / 30, 2));
                double r = Math.pow((1.5 - 1) / (1.5 + 1), 2);
                t[i] = Math.min(1, Slab.transmittance(Math.pow(k, scale), r) + 0.002 * (random.nextDouble() - 0.5));
                t[i] = Math.max(0, t[i]);
                sigma[i] = random.nextInt(10) == 0 ? Double.NaN : 0.001 + 0.02 * random.nextDouble();
            }
            Curve curve = Curve.of(nm.clone(), t, limit);
            if (uncertain) {
                curve = curve.withAbsorbanceUncertainty(sigma);
            }
            out.add(new Candidate(1000L * trial + s, trial, "synthetic " + trial, curve, thicknesses.get(s), true, index,
                    made));
        }
        return out;
    }

    private static final String[] LEDS = {"led 365", "led 385", "led 395", "led 405"};

    static String randomRequirement(Random random) {
        List<String> clauses = new ArrayList<>();
        int count = 1 + random.nextInt(3);
        for (int j = 0; j < count; j++) {
            int wl = 300 + random.nextInt(150);
            clauses.add(switch (random.nextInt(9)) {
                case 0 -> "passes over " + percent(20 + 70 * random.nextDouble()) + " at " + wl + " nm";
                case 1 -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " at " + wl + ".5 nm";
                case 2 -> "passes at least " + percent(20 + 60 * random.nextDouble()) + " from " + wl + " to " + (wl + 20) + " nm";
                case 3 -> "mean over " + percent(20 + 70 * random.nextDouble()) + " from " + wl + " to " + (wl + 35) + " nm";
                case 4 -> "cutoff between " + wl + " and " + (wl + 30) + " nm";
                case 5 -> "passes over " + percent(30 + 55 * random.nextDouble()) + " of " + LEDS[random.nextInt(LEDS.length)];
                case 6 -> "uv hazard under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
                case 7 -> "passes over " + percent(20 + 60 * random.nextDouble()) + " at " + wl + " nm with 90% confidence";
                default -> "luminous over " + percent(20 + 70 * random.nextDouble());
            });
        }
        String thickness = switch (random.nextInt(4)) {
            case 0 -> "";
            case 1 -> ", " + (1 + random.nextInt(8)) + " mm thick";
            default -> ", thickness " + (0.5 + random.nextInt(3)) + " to " + (3 + random.nextInt(8)) + " mm";
        };
        return String.join(" and ", clauses) + thickness;
    }

    /** A clear plate with a UV edge, as the requirement's resolved fixed layer (illustrative). */
    static StackLayer plate(Random random, FixedLayer spec) {
        int n = 800;
        double[] nm = new double[n];
        double[] t = new double[n];
        double edge = 250 + 100 * random.nextDouble();
        double start = 200 + random.nextInt(2) * 0.5;
        for (int i = 0; i < n; i++) {
            nm[i] = start + i;
            t[i] = Slab.transmittance(0.95 / (1 + Math.exp(-(nm[i] - edge) / 6)), 0.04);
        }
        return StackLayer.of(spec, 99, "synthetic plate", "synthetic-plate", 990, Curve.of(nm, t, 0.0001), 3, false,
                new ConstantIndex(1.5));
    }

    private static String percent(double p) {
        return String.format(java.util.Locale.ROOT, "%.3f%%", p);
    }
}
