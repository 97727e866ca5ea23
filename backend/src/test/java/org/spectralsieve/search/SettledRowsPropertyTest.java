package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Random;
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
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.spectralsieve.store.StoredMaterial;
import org.spectralsieve.store.SyntheticCurves;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Rows settled by thickness ({@link SettledRows}, docs/weighted-screening.md "Rows settled by thickness"): a
 * material or sample the search calls settled gets from the exact judgement ({@link MaterialJudge}, the public core,
 * every curve read from the database) only rows that say "not judged"; and searches over a library full of parts that
 * are never rescaled, measured outside the asked thicknesses, give exactly the rows of judging every admitted sample
 * ({@link ExactReference}), order included, with limits large enough that the not-judged rows themselves enter.
 *
 * <p>The library: the demo library, the illustrative synthetic stock of {@link BoundedJudgementPropertyTest}, and the
 * invented Quillmere film shop's stock (illustrative): films and coated parts (never rescaled) measured at 0.05–0.9 mm
 * or 7–25 mm, some with one sample inside 1–6 mm; bulk sheets measured only in total geometry (diffuse, held at their
 * thickness); bulk foils stated to be made only 0.025–0.125 mm thick. Thicknesses and rules are common practice, no
 * source; random requirements from the trade's wordings, a fixed seed (jqwik is not available offline).
 */
class SettledRowsPropertyTest {

    private static final String[] THICKNESSES = {
        ", thickness 1 to 6 mm", ", thickness 0.5 to 2 mm", ", thickness 3 to 12 mm", ", at 3 mm", ", at 0.1 mm", ", at 8 mm"};

    private static JooqLibraryRepository library;

    @BeforeAll
    static void demoLibrarySyntheticStockAndFilmsOutsideTheRange() {
        DSLContext db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        BoundedJudgementPropertyTest.addSynthetic(library, 150, 20261205L);
        addFilmShopStock(library, 90, 20261207L);
    }

    @Test
    void everyRowSettledByThicknessIsANotJudgedRowOfTheExactJudgement() {
        List<Material> materials = library.findMaterials(null, null);
        int settledMaterials = 0;
        int settledSamples = 0;
        int judgedRowsAmongUnsettled = 0;
        for (String thickness : THICKNESSES) {
            Requirement requirement = RequirementParser.parse("passes over 80% of led 365 and uv hazard under 1%" + thickness);
            for (Material m : materials) {
                List<Candidate> candidates = candidates(m, requirement);
                if (candidates.isEmpty()) {
                    continue;
                }
                if (SettledRows.settledOverRange(m, requirement)) {
                    List<MaterialEvaluation> rows = MaterialJudge.evaluate(candidates, requirement, Optional.empty());
                    assertThat(rows).as(m.name() + thickness).isNotEmpty()
                            .allSatisfy(e -> assertThat(e.evaluation().standing()).as(m.name() + thickness)
                                    .isEqualTo(Standing.NOT_JUDGED));
                    settledMaterials++;
                } else if (requirement.thickness().kind() == org.spectralsieve.requirement.ThicknessSpec.Kind.RANGE) {
                    judgedRowsAmongUnsettled += MaterialJudge.evaluate(candidates, requirement, Optional.empty()).stream()
                            .anyMatch(e -> e.evaluation().standing() != Standing.NOT_JUDGED) ? 1 : 0;
                }
                for (MaterialJudge.Judged j : MaterialJudge.choose(candidates, requirement.thickness())) {
                    SampleInfo sample = m.samples().stream().filter(x -> x.id() == j.candidate().sampleId()).findFirst()
                            .orElseThrow();
                    if (SettledRows.settledAtThickness(m, sample, requirement)) {
                        List<MaterialEvaluation> one = MaterialJudge.evaluateOne(candidates, requirement, Optional.empty(),
                                sample.id());
                        assertThat(one).as(m.name() + " sample " + sample.id() + thickness).hasSize(1);
                        assertThat(one.get(0).evaluation().standing()).as(m.name() + " sample " + sample.id() + thickness)
                                .isEqualTo(Standing.NOT_JUDGED);
                        settledSamples++;
                    }
                }
            }
        }
        // not vacuous: many settled, and materials of the same shop left unsettled do get judged rows
        assertThat(settledMaterials).isGreaterThan(60);
        assertThat(settledSamples).isGreaterThan(60);
        assertThat(judgedRowsAmongUnsettled).isGreaterThan(60);
    }

    @Test
    void searchesOverFilmsOutsideTheRangeGiveTheRowsOfJudgingEverySampleAndJudgeFewer() {
        Random random = new Random(20261208L);
        List<Material> materials = library.findMaterials(null, null);
        SearchService parallel = new SearchService(library).parallelFrom(0);
        SearchService oneThread = new SearchService(library).judging(SearchService.Judging.BOUNDED);
        SearchService unsettled = new SearchService(library).withoutSettledRows().judging(SearchService.Judging.BOUNDED);
        SearchService everySecond = new SearchService(library).withEverySecondBound().parallelFrom(0);
        int fewer = 0;
        int notJudgedEntered = 0;
        for (int trial = 0; trial < 14; trial++) {
            String text = randomRequirement(random) + THICKNESSES[trial % THICKNESSES.length];
            Requirement requirement = RequirementParser.parse(text);
            // large limits too: the rows then run out of judged rows and the not-judged ones enter, ranked by name
            int limit = new int[] {1, 5, 20, 60, 150, 400}[random.nextInt(6)];
            Shortlist answer = parallel.search(requirement, limit);
            List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, answer.layer(), materials, limit);

            assertThat(answer.rows()).as(text + " (limit " + limit + ")").containsExactlyElementsOf(expected);
            Shortlist alone = oneThread.search(requirement, limit);
            assertThat(alone.rows()).as(text + " one thread").containsExactlyElementsOf(expected);
            Shortlist before = unsettled.search(requirement, limit);
            assertThat(before.rows()).as(text + " without settled rows").containsExactlyElementsOf(expected);
            assertThat(everySecond.search(requirement, limit).rows()).as(text + " every second bound")
                    .containsExactlyElementsOf(expected);
            fewer += alone.judgedExactly() < before.judgedExactly() ? 1 : 0;
            notJudgedEntered += expected.stream().anyMatch(r -> r.evaluation().standing() == Standing.NOT_JUDGED) ? 1 : 0;
        }
        assertThat(notJudgedEntered).as("searches whose rows hold not-judged rows").isGreaterThan(2);
        assertThat(fewer).as("searches that left settled rows out").isGreaterThan(5);
    }

    /** Candidates as {@link ExactReference} makes them (the shared rescaling rule), for the requirement's filters. */
    private static List<Candidate> candidates(Material m, Requirement requirement) {
        List<Candidate> out = new ArrayList<>();
        for (SampleInfo s : m.samples()) {
            if (requirement.admitsGeometry(s.geometry().label())) {
                SampleRescaling rescaling = SampleRescaling.of(m, s);
                out.add(new Candidate(s.id(), m.id(), m.name(), library.findCurve(s.id()).orElseThrow(), s.thicknessMm(),
                        rescaling.rescalable(), m.refractiveIndex(), SearchService.made(m),
                        s.geometry() == Geometry.TOTAL, rescaling.reason()));
            }
        }
        return out;
    }

    /**
     * The invented Quillmere film shop (illustrative): n materials of one to three samples with synthetic curves.
     * Kinds by turn: films and coated parts measured outside 1–6 mm (one in four with a sample inside), bulk sheets
     * measured in total geometry outside it, bulk foils stated to be made only 0.025–0.125 mm thick.
     */
    static void addFilmShopStock(JooqLibraryRepository library, int n, long seed) {
        Random random = new Random(seed);
        SyntheticCurves specs = new SyntheticCurves(seed, SpectralStore.DEFAULT_GRID);
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 3 * n);
        SyntheticCurves.Spec[] all = new SyntheticCurves.Spec[3 * n];
        for (int i = 0; i < all.length; i++) {
            all[i] = specs.next();
            builder.addEncoded(i + 1L, new StoredMaterial(i / 3 + 1L, "film " + i / 3, "film"), all[i].thicknessMm(),
                    false, false, SyntheticCurves.INDICES[all[i].index()], specs.codes(all[i]));
        }
        SpectralStore store = builder.build();
        for (int m = 0; m < n; m++) {
            int kind = m % 4;
            boolean bulk = kind >= 2;
            StatedThicknesses stated = kind == 3 ? new StatedThicknesses(List.of(), 0.025, 0.125)
                    : new StatedThicknesses(List.of(), Double.NaN, Double.NaN);
            long material = library.insertMaterial(new NewMaterial("quillmere-film-" + m, "Quillmere film " + m,
                    MaterialClass.of("plastic sheet"), "Illustrative film shop stock", List.of(),
                    bulk ? Scaling.BULK : Scaling.FIXED, SyntheticCurves.INDICES[all[3 * m].index()], stated));
            int samples = 1 + random.nextInt(3);
            for (int k = 0; k < samples; k++) {
                double mm = kind == 3 ? 0.025 + 0.1 * random.nextDouble()
                        : random.nextBoolean() ? 0.05 + 0.85 * random.nextDouble() : 7 + 18 * random.nextDouble();
                if (kind <= 1 && k == 0 && m % 8 == 1) {
                    mm = 1.5 + 3 * random.nextDouble(); // a part measured inside the range: judged as measured
                }
                mm = Math.round(mm * 1000) / 1000.0;
                Curve curve = store.curve(3 * m + k);
                byte[] bytes = ("quillmere film " + m + " " + k).getBytes(StandardCharsets.UTF_8);
                library.insertSample(material, new NewSample(mm, kind == 2 ? Geometry.TOTAL : Geometry.REGULAR,
                        Provenance.MODELLED, "", null, "", "", 1e-3, curve, "film.csv", Checksums.sha256(bytes)));
            }
        }
    }

    private static String randomRequirement(Random random) {
        String clauses = "passes over " + percent(40 + 45 * random.nextDouble()) + " of led "
                + new String[] {"365", "385", "405"}[random.nextInt(3)];
        if (random.nextBoolean()) {
            clauses += " and uv hazard under " + percent(Math.pow(10, 0.5 - 2 * random.nextDouble()));
        }
        if (random.nextInt(3) == 0) {
            clauses += " and luminous over " + percent(30 + 50 * random.nextDouble());
        }
        return clauses + (random.nextInt(4) == 0 ? ", geometry any" : "");
    }

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }
}
