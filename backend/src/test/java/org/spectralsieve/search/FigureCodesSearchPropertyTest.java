package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeMap;
import java.util.Locale;
import java.util.Random;
import java.util.function.Supplier;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.RandomEdgeCurves;
import org.spectralsieve.weighting.BelowDetectionAs;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Figure;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Property (docs/weighted-screening.md, "Figures in the store"): as measured, the search with the store's figure codes
 * and the contenders below the cut formed on demand gives exactly the rows of judging every admitted sample
 * ({@link ExactReference}), order included, in parallel and on one thread; the reserve changes no judgement (the
 * same number of samples judged on one thread as with every contender formed first); and with the first bounds alone
 * the codes judge fewer samples than the bins in many trials. The library: the demo library plus the invented Larkspur Lane film and
 * sheet shop (illustrative): 160 materials of one to three samples whose curves start at 190–430 nm and end at
 * 600–1100 nm (so figures are often unavailable or cut to the curve's span), with stretches below detection at limits
 * up to 5 % (so the two ends of a figure differ), points at 0, readings up to 1.5 and some samples in total geometry.
 * Random weighted requirements from the trade's wordings (common practice, no source), some on figures the store
 * keeps no code for; a fixed seed (jqwik is not available offline).
 */
class FigureCodesSearchPropertyTest {

    private static JooqLibraryRepository library;

    @BeforeAll
    static void demoLibraryAndRandomStock() {
        DSLContext db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        Random random = new Random(20261207L);
        for (int m = 0; m < 160; m++) {
            long material = library.insertMaterial(new NewMaterial("larkspur-" + m, "Larkspur Lane stock " + m,
                    MaterialClass.of("plastic sheet"), "Illustrative random stock", List.of(),
                    m % 4 == 3 ? Scaling.FIXED : Scaling.BULK, new ConstantIndex(1.45 + 0.15 * random.nextDouble()),
                    new StatedThicknesses(List.of(), Double.NaN, Double.NaN)));
            int samples = 1 + random.nextInt(3);
            for (int k = 0; k < samples; k++) {
                byte[] bytes = ("larkspur " + m + " " + k).getBytes(StandardCharsets.UTF_8);
                library.insertSample(material, new NewSample(0.5 + 9.5 * random.nextDouble(),
                        random.nextInt(8) == 0 ? Geometry.TOTAL : Geometry.REGULAR, Provenance.MODELLED, "", null, "",
                        "", 1e-3, randomCurve(random), "larkspur.csv", Checksums.sha256(bytes)));
            }
        }
    }

    @Test
    void asMeasuredTheCodesGiveTheRowsOfJudgingEverySampleAndJudgeFewer() {
        Random random = new Random(20261208L);
        List<Material> materials = library.findMaterials(null, null);
        // a reserve after 4 materials per row asked (reserveAfter(0)): this small library's reserve is reached often
        SearchService parallel = new SearchService(library).reserveAfter(0).parallelFrom(0);
        SearchService oneThread = new SearchService(library).reserveAfter(0).judging(SearchService.Judging.BOUNDED);
        // one material formed before the reserve: the loop reaches it in nearly every search
        SearchService tinyCut = new SearchService(library).reserveCut(1).judging(SearchService.Judging.BOUNDED);
        SearchService everyContender = new SearchService(library).withoutContenderReserve()
                .judging(SearchService.Judging.BOUNDED);
        SearchService binsOnly = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        // with the bins' looser bounds the reserve is reached against full rows more often
        SearchService binsTinyCut = new SearchService(library).reserveCut(1).judging(SearchService.Judging.BOUNDED);
        SearchService binsFormedFirst = new SearchService(library).withoutContenderReserve()
                .judging(SearchService.Judging.BOUNDED);
        // the first bounds alone (no second stage, which reads the exact figures on the curve either way): like with like
        SearchService firstOnly = new SearchService(library).withoutSecondStage().judging(SearchService.Judging.BOUNDED);
        long formedBefore = BoundedJudgement.RESERVES_FORMED.get();
        long leftBefore = BoundedJudgement.RESERVES_LEFT.get();
        int fewer = 0;
        int more = 0;
        int fullOfMet = 0;
        for (int trial = 0; trial < 24; trial++) {
            String text = randomRequirement(random);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, java.util.Optional.empty(),
                    materials, limit);

            assertThat(parallel.search(requirement, limit).rows()).as(text + " (limit " + limit + ")")
                    .containsExactlyElementsOf(expected);
            Shortlist alone = oneThread.search(requirement, limit);
            assertThat(alone.rows()).as(text + " one thread").containsExactlyElementsOf(expected);
            Shortlist formedFirst = everyContender.search(requirement, limit);
            assertThat(formedFirst.rows()).as(text + " every contender formed first").containsExactlyElementsOf(expected);
            assertThat(alone.judgedExactly()).as(text + ": the reserve changes no judgement")
                    .isEqualTo(formedFirst.judgedExactly());
            Shortlist tiny = tinyCut.search(requirement, limit);
            assertThat(tiny.rows()).as(text + " one material before the reserve").containsExactlyElementsOf(expected);
            assertThat(tiny.judgedExactly()).as(text + ": a reserve after one material changes no judgement")
                    .isEqualTo(formedFirst.judgedExactly());
            Shortlist bins = withoutFigureCodes(() -> binsOnly.search(requirement, limit));
            assertThat(bins.rows()).as(text + " bins alone").containsExactlyElementsOf(expected);
            Shortlist binsTiny = withoutFigureCodes(() -> binsTinyCut.search(requirement, limit));
            assertThat(binsTiny.rows()).as(text + " bins, one material before the reserve").containsExactlyElementsOf(expected);
            assertThat(binsTiny.judgedExactly()).as(text + ": bins, the reserve changes no judgement")
                    .isEqualTo(withoutFigureCodes(() -> binsFormedFirst.search(requirement, limit)).judgedExactly());
            Shortlist codesFirst = firstOnly.search(requirement, limit);
            Shortlist binsFirst = withoutFigureCodes(() -> firstOnly.search(requirement, limit));
            assertThat(codesFirst.rows()).as(text + " codes, first bounds alone").containsExactlyElementsOf(expected);
            assertThat(binsFirst.rows()).as(text + " bins, first bounds alone").containsExactlyElementsOf(expected);
            fewer += codesFirst.judgedExactly() < binsFirst.judgedExactly() ? 1 : 0;
            more += codesFirst.judgedExactly() > binsFirst.judgedExactly() ? 1 : 0;
            fullOfMet += expected.size() == limit && expected.get(limit - 1).evaluation().standing() == Standing.MEETS ? 1 : 0;
        }
        assertThat(fullOfMet).as("trials whose rows are full of met rows").isGreaterThan(4);
        // not vacuous: the loop both reached a reserve and formed it, and kept one out whole
        assertThat(BoundedJudgement.RESERVES_FORMED.get() - formedBefore).as("reserves formed").isGreaterThan(2);
        assertThat(BoundedJudgement.RESERVES_LEFT.get() - leftBefore).as("reserves kept out").isGreaterThan(2);
        assertThat(fewer).as("trials where the codes judge fewer than the bins").isGreaterThan(5);
        assertThat(more).as("trials where they judge more").isLessThan(fewer);
    }

    /**
     * Property (docs/weighted-screening.md, "Bounds over thickness from the figure codes"): solved over a range, the
     * search whose P(x) and Q(x) also read the figure codes' bounds over thickness, split around their crossing, gives
     * exactly the rows of judging every admitted sample ({@link ExactReference}), in parallel, on one thread, with the
     * first bounds alone and with those bounds switched off ({@code -Dsieve.store.solve-from-codes=false}); with the
     * first bounds alone the codes judge fewer samples than without them in several trials and more in none.
     */
    @Test
    void solvedOverARangeTheCodesBoundsOverThicknessGiveTheRowsOfJudgingEverySample() {
        Random random = new Random(20261213L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService parallel = new SearchService(library).parallelFrom(0);
        SearchService oneThread = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        SearchService firstOnly = new SearchService(library).withoutSecondStage().judging(SearchService.Judging.BOUNDED);
        int fewer = 0;
        int more = 0;
        for (int trial = 0; trial < 16; trial++) {
            double lo = 0.4 + 3 * random.nextDouble();
            double hi = lo * (1 + 6 * random.nextDouble());
            String text = randomRequirement(random) + String.format(Locale.ROOT, ", thickness %.2f to %.2f mm", lo, hi);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 20}[random.nextInt(5)];
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, Optional.empty(),
                    materials, limit);

            assertThat(parallel.search(requirement, limit).rows()).as(text + " (limit " + limit + ")")
                    .containsExactlyElementsOf(expected);
            assertThat(oneThread.search(requirement, limit).rows()).as(text + " one thread")
                    .containsExactlyElementsOf(expected);
            Shortlist codesFirst = firstOnly.search(requirement, limit);
            Shortlist binsFirst = withoutSolveFromCodes(() -> firstOnly.search(requirement, limit));
            assertThat(codesFirst.rows()).as(text + " first bounds alone").containsExactlyElementsOf(expected);
            assertThat(binsFirst.rows()).as(text + " first bounds alone, no bounds over thickness from the codes")
                    .containsExactlyElementsOf(expected);
            assertThat(withoutSolveFromCodes(() -> oneThread.search(requirement, limit)).rows())
                    .as(text + " no bounds over thickness from the codes").containsExactlyElementsOf(expected);
            fewer += codesFirst.judgedExactly() < binsFirst.judgedExactly() ? 1 : 0;
            more += codesFirst.judgedExactly() > binsFirst.judgedExactly() ? 1 : 0;
        }
        assertThat(fewer).as("trials where the codes' bounds over thickness judge fewer").isGreaterThan(2);
        assertThat(more).as("trials where they judge more").isZero();
    }

    private static Shortlist withoutSolveFromCodes(Supplier<Shortlist> search) {
        System.setProperty("sieve.store.solve-from-codes", "false");
        try {
            return search.get();
        } finally {
            System.clearProperty("sieve.store.solve-from-codes");
        }
    }

    /**
     * Property: thresholds a hair from a stored curve's own figure (2·10⁻⁵ relative, under 10⁻⁵ decades: a tenth of one
     * code step) still give the rows of judging every sample. The threshold sits just under or just over one
     * material's largest figure for a built-in LED, so that material's row meets or misses by that hair, and a bound
     * on the code that is tighter than the code's proven step (one whole step either side) wrongly proves it missed.
     * Without the second stage too, which would read the exact figure on the curve and so hide a first bound's error.
     */
    @Test
    void thresholdsAHairFromAStoredFigureGiveTheRowsOfJudgingEverySample() {
        Random random = new Random(20261209L);
        List<Material> materials = library.findMaterials(null, null);
        Map<Long, Curve> curves = new TreeMap<>(library.findAllCurves());
        SearchService bounded = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        SearchService firstBoundsAlone = new SearchService(library).withoutSecondStage()
                .judging(SearchService.Judging.BOUNDED);
        int byAHair = 0;
        for (int trial = 0; trial < 16; trial++) {
            String led = new String[] {"365", "385", "395", "405"}[random.nextInt(4)];
            Weighting weighting = Weighting.of(EmitterCatalogue.named("led-" + led).orElseThrow(), Optional.empty());
            // each material's largest figure (the one its row reads when that sample is admitted), one of them picked
            List<Double> ownBest = new ArrayList<>();
            for (Material m : materials) {
                m.samples().stream()
                        .map(sample -> curves.get(sample.id()))
                        .filter(Objects::nonNull)
                        .map(c -> weighting.figureForMargin(c, BelowDetectionAs.LIMIT))
                        .filter(Figure::available)
                        .mapToDouble(f -> f.value().getAsDouble())
                        .max()
                        .ifPresent(f -> {
                            if (f > 0.01 && f < 0.99) {
                                ownBest.add(f);
                            }
                        });
            }
            double best = ownBest.get(random.nextInt(ownBest.size()));
            boolean meets = random.nextBoolean();
            double threshold = best * (meets ? 1 - 2e-5 : 1 + 2e-5);
            String text = String.format(Locale.ROOT, "passes over %.9f%% of led %s", 100 * threshold, led)
                    + (random.nextBoolean() ? ", geometry any" : "");
            Requirement requirement = RequirementParser.parse(text);
            // the shortlist ends at the picked material's row (or one after it): there a wrong proof of a miss would
            // drop it, where a longer list would judge every row anyway
            List<RankedRow> all = ExactReference.judgeEverySample(library, requirement, Optional.empty(), materials,
                    SearchService.MAX_LIMIT);
            int hair = 0;
            while (hair < all.size() - 1 && !(Math.abs(all.get(hair).evaluation().worstMarginDecades()) < 1e-4)) {
                hair++;
            }
            int limit = hair + 1 + random.nextInt(2);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, Optional.empty(),
                    materials, limit);

            assertThat(bounded.search(requirement, limit).rows()).as(text + " (limit " + limit + ")")
                    .containsExactlyElementsOf(expected);
            assertThat(firstBoundsAlone.search(requirement, limit).rows()).as(text + ", first bounds alone")
                    .containsExactlyElementsOf(expected);
            byAHair += expected.stream().anyMatch(r -> Math.abs(r.evaluation().worstMarginDecades()) < 1e-4) ? 1 : 0;
        }
        // not vacuous: the picked material's row met or missed by under a code step in most trials
        assertThat(byAHair).as("trials whose rows hold a margin under 1e-4 decades").isGreaterThan(8);
    }

    /**
     * Property (docs/weighted-screening.md, "The screen as measured, in one pass"): the bins of a block whose code leaves
     * its lower end unknown, read in the screen's pass over the codes curve by curve, give every curve exactly the
     * bound (bit for bit) of reading them in a pass of their own after it, block by block
     * ({@code -Dsieve.store.bins-in-the-code-pass=false}); on random curves of this class's kind (stretches below
     * detection, some in total geometry; 4,500 of them, so the screen's blocks of 2,048 curves end inside the store) and
     * random requirements with one or two such blocks. Not vacuous: on many curves the bins do lower a block's bound below 0 (a proven miss the codes
     * alone leave at 0), so a pass that left them out would differ.
     */
    @Test
    void theBinsOfAnUnknownLowerEndGiveTheSameBoundsInTheCodePassAsInAPassOfTheirOwn() {
        Random random = new Random(20261205L);
        org.spectralsieve.store.SpectralStore.Builder builder = org.spectralsieve.store.SpectralStore.builder(
                org.spectralsieve.store.SpectralStore.DEFAULT_GRID, 4500);
        for (int c = 0; c < 4500; c++) {
            builder.add(c + 1L, new org.spectralsieve.store.StoredMaterial(c / 3 + 1L, "Larkspur Lane stock " + c / 3,
                            "plastic sheet"), 0.5 + 9.5 * random.nextDouble(), c % 4 != 3, random.nextInt(8) == 0,
                    new ConstantIndex(1.45 + 0.15 * random.nextDouble()), randomCurve(random));
        }
        org.spectralsieve.store.SpectralStore store = builder.build();
        int lowered = 0;
        for (int trial = 0; trial < 40; trial++) {
            String text = randomRequirement(random) + (random.nextBoolean()
                    ? " and erythemal under " + percent(Math.pow(10, 1 - 2 * random.nextDouble())) : "")
                    + " and uv hazard under " + percent(Math.pow(10, 0.5 - 2.5 * random.nextDouble()));
            Requirement requirement = RequirementParser.parse(text);
            double[] inThePass = WeightedMisses.marginBounds(store, requirement, java.util.Optional.empty(), false, true);
            double[] apart = binsApart(() -> WeightedMisses.marginBounds(store, requirement, java.util.Optional.empty(),
                    false, true));
            assertThat(inThePass).as(text).hasSize(store.size());
            for (int c = 0; c < store.size(); c++) {
                assertThat(Double.doubleToRawLongBits(inThePass[c])).as(text + ", curve " + c + ": " + inThePass[c]
                        + " against " + apart[c]).isEqualTo(Double.doubleToRawLongBits(apart[c]));
            }
            for (org.spectralsieve.requirement.Clause clause : requirement.clauses()) {
                if (clause instanceof org.spectralsieve.requirement.WeightedClause w
                        && w.direction() == org.spectralsieve.requirement.Direction.BLOCK) {
                    var query = store.weightedScreen().query(store, w, java.util.Optional.empty());
                    for (int c = 0; query.readsBinsForUnknownLowerEnds() && c < store.size(); c++) {
                        lowered += query.binsForUnknownLowerEnd(c, 0, false) < 0 ? 1 : 0;
                    }
                }
            }
        }
        assertThat(lowered).as("curves and blocks whose bins lower the codes' bound below 0").isGreaterThan(1000);
    }

    private static double[] binsApart(Supplier<double[]> bounds) {
        System.setProperty("sieve.store.bins-in-the-code-pass", "false");
        try {
            return bounds.get();
        } finally {
            System.clearProperty("sieve.store.bins-in-the-code-pass");
        }
    }

    /** The search with the screen reading its bins alone ({@code -Dsieve.store.figure-codes=false}, read per query). */
    private static Shortlist withoutFigureCodes(Supplier<Shortlist> search) {
        System.setProperty("sieve.store.figure-codes", "false");
        try {
            return search.get();
        } finally {
            System.clearProperty("sieve.store.figure-codes");
        }
    }

    /** As measured: kept figures (LEDs, erythemal, UV hazard, τv) and, sometimes, one without a code. */
    private static String randomRequirement(Random random) {
        String clauses = "passes over " + percent(40 + 50 * random.nextDouble()) + " of led "
                + new String[] {"365", "385", "395", "405"}[random.nextInt(4)];
        if (random.nextInt(3) > 0) {
            clauses += " and uv hazard under " + percent(Math.pow(10, 0.5 - 2.5 * random.nextDouble()));
        }
        if (random.nextBoolean()) {
            clauses += " and luminous over " + percent(20 + 60 * random.nextDouble());
        }
        if (random.nextInt(4) == 0) {
            clauses += " and erythemal under " + percent(Math.pow(10, 1 - 2 * random.nextDouble()));
        }
        if (random.nextInt(5) == 0) {
            clauses += " and passes over " + percent(20 + 40 * random.nextDouble()) + " of led 395 weighted by blue-light";
        }
        return clauses + (random.nextInt(4) == 0 ? ", geometry any" : "");
    }

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }

    /** An edge with ripple from a random start to a random end; stretches below detection, zeros, readings above 1. */
    private static Curve randomCurve(Random random) {
        double step = new double[] {0.5, 1, 2, 5}[random.nextInt(4)];
        double start = 190 + random.nextInt(240);
        double end = 600 + random.nextInt(500);
        int n = (int) ((end - start) / step) + 1;
        double edge = 250 + 250 * random.nextDouble();
        double width = 2 + 30 * random.nextDouble();
        double top = 0.5 + 0.6 * random.nextDouble();
        double limit = new double[] {0, 1e-4, 1e-3, 0.05}[random.nextInt(4)];
        return RandomEdgeCurves.edge(random, start, step, n, edge, width, top, limit, 1.5, 300);
    }
}
