package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MaterialCorrection;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;
import org.spectralsieve.store.SyntheticCurves;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * A service keeping its exact judgements ({@link JudgementMemo}) answers exactly what the same service judging
 * every sample afresh answers, after every kind of write between searches: imports into existing materials,
 * new materials, sample corrections and their undoing, detection-limit corrections, retirements and restores
 * of samples and materials, material corrections (index, stock sizes). The reference is the service with the
 * memo switched off ({@code withoutJudgementMemo}), whose answers {@code SearchEqualsExactJudgementPropertyTest}
 * checks against judging every admitted sample. The requirements come from a small pool, so the same question
 * is asked again across changes (hits), as a shared lab does.
 *
 * <p>The check can fail: a memo keyed on the question, sample id and span alone
 * ({@link JudgementMemo#staleKeyedForTests}) answers differently after such writes, and the test requires it to.
 */
class JudgementMemoEquivalencePropertyTest {

    private static final String[] CLASSES = {"plastic sheet", "film", "window glass"};
    private static final String[] LAYERS = {"behind 4 mm clear float glass", "on 3 mm fused silica"};
    private static final WavelengthGrid GRID = new WavelengthGrid(250, 800, 2);

    @Test
    void rowsWithTheMemoEqualRowsWithoutItAfterEveryChange() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        JooqLibraryRevisions revisions = new JooqLibraryRevisions(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        Random random = new Random(20261205L);
        for (int i = 0; i < 12; i++) {
            addSynthetic(library, random, "synthetic-memo-" + i);
        }
        JudgementMemo memo = new JudgementMemo(JudgementMemo.DEFAULT_ENTRIES);
        SearchService remembering = new SearchService(library).withJudgementMemo(memo);
        SearchService afresh = new SearchService(library).withoutJudgementMemo();
        SearchService stale = new SearchService(library).withJudgementMemo(JudgementMemo.staleKeyedForTests(4096));

        List<String> pool = new ArrayList<>();
        for (int i = 0; i < 14; i++) {
            pool.add(requirement(i % 7, random));
        }
        Deque<SampleCorrected> undo = new ArrayDeque<>();
        List<Long> retiredSamples = new ArrayList<>();
        List<Long> retiredMaterials = new ArrayList<>();
        int staleDiffers = 0;
        int searches = 0;
        List<String> changes = new ArrayList<>();
        for (int step = 0; step < 36; step++) {
            changes.add(change(step, random, library, revisions, undo, retiredSamples, retiredMaterials));
            for (int k = 0; k < 3; k++) {
                String text = pool.get(random.nextInt(pool.size()));
                Requirement requirement = RequirementParser.parse(text);
                int limit = new int[] {3, 10, 20}[random.nextInt(3)];
                Shortlist expected = afresh.search(requirement, limit);
                Shortlist answer = remembering.search(requirement, limit);
                String why = "after " + changes.get(changes.size() - 1) + ": " + text + " (limit " + limit + ")";
                assertThat(answer.rows()).as(why).containsExactlyElementsOf(expected.rows());
                assertThat(answer.judgedExactly()).as(why).isEqualTo(expected.judgedExactly());
                assertThat(answer.evaluatedSamples()).as(why).isEqualTo(expected.evaluatedSamples());
                staleDiffers += stale.search(requirement, limit).rows().equals(expected.rows()) ? 0 : 1;
                searches++;
            }
        }
        JudgementMemo.Counts counts = memo.counts();
        System.out.printf("memo equivalence: %d searches, %s, stale key differed in %d%n", searches, counts, staleDiffers);
        // not vacuous: questions came back after changes and were answered from the memo, and a key blind to
        // the sample's record answered wrongly at least once
        assertThat(counts.hits()).as("memo hits of %s searches", searches).isGreaterThan(counts.misses() / 4);
        assertThat(staleDiffers).as("searches a stale key answered wrongly").isGreaterThan(0);
        assertThat(changes).contains("import", "new material", "thickness corrected", "correction undone",
                "detection limit corrected", "sample retired", "sample restored", "material retired",
                "material restored", "index corrected", "stock sizes corrected");
    }

    @Test
    void manyDistinctRequirementsStayWithinTheBudget() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        JudgementMemo memo = new JudgementMemo(150);
        SearchService service = new SearchService(library).withJudgementMemo(memo);
        Random random = new Random(5);
        long judged = 0;
        for (int i = 0; i < JudgementMemo.QUESTIONS + 60; i++) {
            // every requirement distinct: a new threshold each time, asked twice
            String text = String.format(Locale.ROOT, "passes over %.3f%% of led 365 and luminous over %.3f%%",
                    40 + 0.01 * i, 20 + 60 * random.nextDouble());
            // each asked twice: a question is kept from its second ask on
            judged += service.search(RequirementParser.parse(text), 10).judgedExactly();
            judged += service.search(RequirementParser.parse(text), 10).judgedExactly();
            JudgementMemo.Counts counts = memo.counts();
            assertThat(counts.entries()).isLessThanOrEqualTo(150);
            assertThat(counts.questions()).isLessThanOrEqualTo(JudgementMemo.QUESTIONS);
        }
        JudgementMemo.Counts counts = memo.counts();
        assertThat(counts.misses()).isGreaterThan(150); // the bound was reached, so eviction ran
        assertThat(counts.hits() + counts.misses() + counts.unkept()).isEqualTo(judged);
        assertThat(counts.unkept()).isPositive();
        assertThat(counts.entries()).isEqualTo(150);
    }

    /** A sample whose thickness was corrected, and the value it had before (what undoing restores). */
    private record SampleCorrected(long sampleId, double before) {
    }

    private static String change(int step, Random random, JooqLibraryRepository library, JooqLibraryRevisions revisions,
                                 Deque<SampleCorrected> undo, List<Long> retiredSamples, List<Long> retiredMaterials) {
        List<Material> materials = library.findMaterials(null, null);
        // the layers' materials stay as they are, so every layer requirement still names one
        List<Material> notLayers = materials.stream().filter(m -> !m.name().toLowerCase(Locale.ROOT).contains("float")
                && !m.name().toLowerCase(Locale.ROOT).contains("silica")).toList();
        Material material = notLayers.get(random.nextInt(notLayers.size()));
        List<SampleInfo> samples = material.samples();
        switch (step % 11) {
            case 0 -> {
                library.insertSample(material.id(), newSample(random, 0.5 + 8 * random.nextDouble(), step));
                return "import";
            }
            case 1 -> {
                addSynthetic(library, random, "synthetic-memo-new-" + step);
                return "new material";
            }
            case 2 -> {
                SampleInfo s = withThickness(samples, random);
                if (s == null) {
                    return "nothing";
                }
                revisions.correctSample(s.id(), new SampleCorrection(s.thicknessMm() * 1.3, null, null, null, null, null,
                        null, "re-measured (illustrative)"), (now, next, perPoint) -> { });
                undo.push(new SampleCorrected(s.id(), s.thicknessMm()));
                return "thickness corrected";
            }
            case 3 -> {
                if (undo.isEmpty()) {
                    return "nothing";
                }
                SampleCorrected c = undo.pop();
                revisions.correctSample(c.sampleId(), new SampleCorrection(c.before(), null, null, null, null, null, null,
                        "undo (illustrative)"), (now, next, perPoint) -> { });
                return "correction undone";
            }
            case 4 -> {
                Material synthetic = synthetic(materials, random);
                SampleInfo s = synthetic.samples().get(random.nextInt(synthetic.samples().size()));
                revisions.correctSample(s.id(), new SampleCorrection(null, null, null, null, null, null,
                        s.detectionLimit() * 30, "limit re-estimated (illustrative)"), (now, next, perPoint) -> { });
                return "detection limit corrected";
            }
            case 5 -> {
                SampleInfo s = samples.get(random.nextInt(samples.size()));
                revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s.id(), true);
                retiredSamples.add(s.id());
                return "sample retired";
            }
            case 6 -> {
                if (retiredSamples.isEmpty()) {
                    return "nothing";
                }
                revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, retiredSamples.remove(0), false);
                return "sample restored";
            }
            case 7 -> {
                revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, material.id(), true);
                retiredMaterials.add(material.id());
                return "material retired";
            }
            case 8 -> {
                revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retiredMaterials.remove(0), false);
                return "material restored";
            }
            case 9 -> {
                Material synthetic = synthetic(materials, random);
                revisions.correctMaterial(synthetic.id(), new MaterialCorrection(
                        new ConstantIndex(1.45 + 0.3 * random.nextDouble()), null, "index re-measured (illustrative)"), m -> { });
                return "index corrected";
            }
            default -> {
                Material synthetic = synthetic(materials, random);
                revisions.correctMaterial(synthetic.id(), new MaterialCorrection(null,
                        new StatedThicknesses(List.of(1.0, 2.0, 3.0 + step % 3), 0.5, 8.0), "stock listed (illustrative)"),
                        m -> { });
                return "stock sizes corrected";
            }
        }
    }

    private static SampleInfo withThickness(List<SampleInfo> samples, Random random) {
        List<SampleInfo> known = samples.stream().filter(s -> !Double.isNaN(s.thicknessMm())).toList();
        return known.isEmpty() ? null : known.get(random.nextInt(known.size()));
    }

    private static Material synthetic(List<Material> materials, Random random) {
        List<Material> synthetic = materials.stream().filter(m -> m.slug().startsWith("synthetic-memo-")).toList();
        return synthetic.get(random.nextInt(synthetic.size()));
    }

    /** Requirements of seven kinds: plain as measured, at a thickness, solved; weighted, solved; behind a layer, solved. */
    private static String requirement(int kind, Random random) {
        boolean plain = kind < 3;
        String clauses = plain ? plainClause(random) : weightedClause(random);
        if (random.nextBoolean()) {
            clauses += " and " + plainClause(random);
        }
        List<String> parts = new ArrayList<>(List.of(clauses));
        switch (kind) {
            case 1 -> parts.add("at " + (1 + random.nextInt(5)) + " mm");
            case 2, 4, 6 -> parts.add("thickness " + new String[] {"1 to 6", "0.5 to 3", "2 to 10"}[random.nextInt(3)] + " mm");
            default -> { }
        }
        if (kind >= 5) {
            parts.add(LAYERS[random.nextInt(LAYERS.length)]);
        }
        return String.join(", ", parts);
    }

    private static String plainClause(Random random) {
        int nm = 300 + 10 * random.nextInt(30);
        return random.nextBoolean()
                ? "passes over " + percent(40 + 50 * random.nextDouble()) + " at " + nm + " nm"
                : "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " at " + nm + " nm";
    }

    private static String weightedClause(Random random) {
        return switch (random.nextInt(4)) {
            case 0 -> "passes over " + percent(50 + 45 * random.nextDouble()) + " of led 365";
            case 1 -> "uv hazard under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
            case 2 -> "luminous over " + percent(20 + 70 * random.nextDouble());
            default -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " of led 405";
        };
    }

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }

    /** Illustrative synthetic stock: one to three samples of one substance at random thicknesses. */
    private static void addSynthetic(JooqLibraryRepository library, Random random, String slug) {
        SyntheticCurves curves = new SyntheticCurves(random.nextLong(), GRID);
        SyntheticCurves.Spec first = curves.next();
        long material = library.insertMaterial(new NewMaterial(slug, "Stock " + slug, MaterialClass.of(
                CLASSES[random.nextInt(CLASSES.length)]), "illustrative, generated", List.of(),
                random.nextInt(5) == 0 ? Scaling.FIXED : Scaling.BULK, SyntheticCurves.INDICES[first.index()]));
        int count = 1 + random.nextInt(3);
        for (int s = 0; s < count; s++) {
            double mm = s == 0 ? first.thicknessMm() : 0.5 + random.nextDouble() * 9.5;
            SyntheticCurves.Spec spec = new SyntheticCurves.Spec(first.edgeNm(), first.edgeWidthNm(), first.bandNm(),
                    first.bandPeakPerMm(), first.bandWidthNm(), first.backgroundPerMm(), mm, first.index(), first.floor());
            double[] nm = GRID.points();
            double[] t = new double[nm.length];
            for (int w = 0; w < nm.length; w++) {
                t[w] = SyntheticCurves.transmittance(spec, nm[w]);
            }
            Geometry geometry = random.nextInt(8) == 0 ? Geometry.TOTAL : Geometry.REGULAR;
            library.insertSample(material, new NewSample(mm, geometry, Provenance.MODELLED, "", null, "", "illustrative",
                    spec.floor(), Curve.of(nm, t, spec.floor()), slug + "-" + s + ".csv",
                    String.format(Locale.ROOT, "%064x", (long) slug.hashCode() * 16 + s)));
        }
    }

    /** A sheet with an edge at a random wavelength (illustrative), imported into an existing material. */
    private static NewSample newSample(Random random, double mm, int step) {
        double edge = 330 + 120 * random.nextDouble();
        double[] nm = GRID.points();
        double[] t = new double[nm.length];
        for (int w = 0; w < nm.length; w++) {
            t[w] = 0.9 / (1 + Math.exp(-(nm[w] - edge) / 6)) + 1e-4;
        }
        return new NewSample(mm, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "import " + step, 1e-3,
                Curve.of(nm, t, 1e-3), "import-" + step + ".csv", String.format(Locale.ROOT, "%064x", 7_000_000L + step));
    }
}
