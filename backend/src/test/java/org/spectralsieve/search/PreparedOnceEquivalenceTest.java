package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.function.Supplier;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * A search that prepares a sample alone without checking every other sample of its material, with the material's
 * made thicknesses formed once per snapshot ({@code sieve.search.prepared-once}, docs/search-under-load.md, eighth
 * pass), answers exactly what the same service preparing the way before answers: rows, judged counts, evaluated
 * samples. The library is the demo library plus one illustrative material that grows by imports between searches
 * and has no made thicknesses recorded, so its made range is formed from its samples' measured thicknesses and moves
 * with every import and thickness correction (what a made range kept too long would get wrong). Both services judge
 * every sample afresh (no memo), so only the preparation differs; the reference is the earlier preparation, whose
 * answers {@code SearchEqualsExactJudgementPropertyTest} checks against judging every admitted sample.
 */
class PreparedOnceEquivalenceTest {

    private static final WavelengthGrid GRID = new WavelengthGrid(250, 800, 2);

    @Test
    void rowsPreparedOnceEqualRowsPreparedPerSampleWhileAMaterialGrows() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        JooqLibraryRevisions revisions = new JooqLibraryRevisions(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        long grown = library.insertMaterial(new NewMaterial("grown-by-imports", "Grown workshop sheet (illustrative)",
                MaterialClass.of("plastic sheet"), "illustrative, generated", List.of(), Scaling.BULK,
                new ConstantIndex(1.49)));
        SearchService once = new SearchService(library).withoutJudgementMemo();
        SearchService perSample = withProperty("sieve.search.prepared-once", "false",
                () -> new SearchService(library).withoutJudgementMemo());
        Random random = new Random(20261205L);
        List<String> requirements = List.of(
                "passes over 60% at 420 nm",
                "blocks under 5% at 360 nm",
                "passes over 50% at 450 nm, at 3 mm",
                "passes over 40% at 430 nm and blocks under 10% at 370 nm, thickness 1 to 6 mm",
                "passes over 50% of led 405",
                "uv hazard under 5%",
                "luminous over 60%, at 2 mm",
                "blocks under 2% at 380 nm, behind 4 mm clear float glass");
        int rowsOfGrown = 0;
        List<MadeThicknesses> madeSeen = new ArrayList<>();
        for (int step = 0; step < 30; step++) {
            library.insertSample(grown, newSample(random, 0.5 + 8 * random.nextDouble(), step));
            if (step % 5 == 4) {
                // a measured thickness corrected: the made range formed from the samples moves
                SampleInfo s = sampleOf(library, grown, random);
                revisions.correctSample(s.id(), new SampleCorrection(s.thicknessMm() * 1.7, null, null, null, null, null,
                        null, "re-measured (illustrative)"), (now, next, perPoint) -> { });
            }
            madeSeen.add(SearchService.made(material(library, grown)));
            for (String text : requirements) {
                Requirement requirement = RequirementParser.parse(text);
                int limit = new int[] {3, 10, 40}[random.nextInt(3)];
                Shortlist expected = perSample.search(requirement, limit);
                Shortlist answer = once.search(requirement, limit);
                String why = "after step " + step + ": " + text + " (limit " + limit + ")";
                assertThat(answer.rows()).as(why).containsExactlyElementsOf(expected.rows());
                assertThat(answer.judgedExactly()).as(why).isEqualTo(expected.judgedExactly());
                assertThat(answer.evaluatedSamples()).as(why).isEqualTo(expected.evaluatedSamples());
                rowsOfGrown += (int) answer.rows().stream().filter(r -> r.materialId() == grown).count();
            }
        }
        // not vacuous: the grown material was in answers, and its made range moved while it grew
        assertThat(rowsOfGrown).isPositive();
        assertThat(madeSeen.stream().distinct().count()).isGreaterThan(3);
    }

    private static <T> T withProperty(String key, String value, Supplier<T> make) {
        String before = System.getProperty(key);
        System.setProperty(key, value);
        try {
            return make.get();
        } finally {
            if (before == null) {
                System.clearProperty(key);
            } else {
                System.setProperty(key, before);
            }
        }
    }

    private static Material material(JooqLibraryRepository library, long id) {
        return library.findMaterials(null, null).stream().filter(m -> m.id() == id).findFirst().orElseThrow();
    }

    private static SampleInfo sampleOf(JooqLibraryRepository library, long material, Random random) {
        List<SampleInfo> samples = material(library, material).samples();
        return samples.get(random.nextInt(samples.size()));
    }

    /** A sheet with an edge at a random wavelength (illustrative), imported into the grown material. */
    private static NewSample newSample(Random random, double mm, int step) {
        double edge = 330 + 120 * random.nextDouble();
        double[] nm = GRID.points();
        double[] t = new double[nm.length];
        for (int w = 0; w < nm.length; w++) {
            t[w] = 0.9 / (1 + Math.exp(-(nm[w] - edge) / 6)) + 1e-4;
        }
        return new NewSample(mm, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "import " + step, 1e-3,
                Curve.of(nm, t, 1e-3), "grown-" + step + ".csv", String.format(Locale.ROOT, "%064x", 9_000_000L + step));
    }
}
