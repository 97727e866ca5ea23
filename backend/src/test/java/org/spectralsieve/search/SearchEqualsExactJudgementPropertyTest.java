package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.NewStateCurve;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.Printing;
import org.spectralsieve.store.SyntheticCurves;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * Property: the search service's answer — the store's pick for plain requirements, exact judgement with
 * the store's proven misses held back for the rest, curves read from the snapshot's cache — equals judging
 * every admitted sample exactly and ranking the judgements: same rows, same order, same verdicts and values.
 * For plain requirements (as measured, at a fixed thickness, thickness solved), weighted ones, behind a
 * layer, and solved weighted ones, on the demo library plus random synthetic materials ({@link SyntheticCurves}:
 * absorption edges, dye bands, Fresnel surfaces, detection floors) in a fresh database, fixed seed.
 *
 * <p>The reference is built from the public core only ({@link MaterialJudge}, {@link Ranking}) on curves read
 * from the database, never through the service. The requirement wordings and their thresholds are drawn
 * from the trade's usual ranges (common practice, no source). Three services answer each requirement: one
 * whose cache holds the whole library, one whose budget holds a few curves (so curves are read, cached and
 * evicted during the search), and one without a cache (every curve read from the database).
 */
class SearchEqualsExactJudgementPropertyTest {

    private static final String[] LAYERS = {"behind 4 mm clear float glass", "on 3 mm fused silica",
            "behind 0.112 mm amber masking film", "on 2 mm borosilicate"};
    private static final String[] CLASSES = {"plastic sheet", "film", "window glass"};

    private enum Kind { PLAIN_AS_MEASURED, PLAIN_FIXED, PLAIN_SOLVE, WEIGHTED, STACKED, SOLVED, STACKED_SOLVED, RELATIVE,
        RELATIVE_SOLVED, STATE, STATE_SOLVED, ANGLED, ANGLED_SOLVED, ANGLED_STACKED }

    /** How the light arrives (docs/oblique-incidence.md): angles and beams a curing rig or a tilted window sees. */
    private static final String[] LIGHTS = {"at 30° incidence", "at 60° incidence", "over a 60° beam",
            "under an LED with 120° beam angle", "under a Lambertian source", "at 45 deg incidence"};

    private static JooqLibraryRepository library;
    private static SearchService cached;
    private static SearchService tinyCache;
    private static SearchService uncached;

    @BeforeAll
    static void library() {
        DSLContext db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        addSyntheticMaterials(new Random(20261204L), 30);
        spoilSomeStoredRecords(db);
        cached = new SearchService(library);
        tinyCache = new SearchService(library, 120_000); // about a dozen curves of 911 points
        uncached = new SearchService(library, 0);
    }

    @Test
    void everyKindOfSearchEqualsJudgingEverySampleExactly() {
        Random random = new Random(20261204L);
        List<Material> materials = library.findMaterials(null, null);
        Map<Kind, Integer> nonEmpty = new EnumMap<>(Kind.class);
        int held = 0;
        int stateJudged = 0;
        for (int trial = 0; trial < 70; trial++) {
            Kind kind = Kind.values()[trial % Kind.values().length];
            String text = requirement(kind, random);
            Requirement requirement = RequirementParser.parse(text);
            int limit = new int[] {1, 3, 5, 10, 40}[random.nextInt(5)];

            Shortlist answer = cached.search(requirement, limit);
            List<RankedRow> expected = judgeEverySample(requirement, answer.layer(), materials, limit);

            assertThat(answer.rows()).as(kind + ": " + text + " (limit " + limit + ")").containsExactlyElementsOf(expected);
            assertThat(tinyCache.search(requirement, limit).rows()).as("few curves cached: " + text)
                    .containsExactlyElementsOf(expected);
            if (trial % 3 == 0) {
                assertThat(uncached.search(requirement, limit).rows()).as("no cache: " + text)
                        .containsExactlyElementsOf(expected);
            }
            assertThat(requirement.plain()).isEqualTo(kind.name().startsWith("PLAIN"));
            nonEmpty.merge(kind, expected.isEmpty() ? 0 : 1, Integer::sum);
            stateJudged += (int) expected.stream().flatMap(row -> row.evaluation().clauses().stream())
                    .filter(c -> c.clause().readsStates() && c.verdict() != org.spectralsieve.requirement.Verdict.UNVERIFIED)
                    .count();
            held += answer.judgedExactly() < answer.evaluatedSamples() ? 1 : 0;
        }
        // not vacuous: every kind found rows, and the store spared exact judgements in some searches
        assertThat(nonEmpty.values()).allMatch(n -> n >= 3);
        assertThat(held).isGreaterThan(5);
        // and state clauses were decided on stored state curves, not only left unverified
        assertThat(stateJudged).isGreaterThan(3);
    }

    @Test
    void theCacheIsReplacedWithTheSnapshotWhenACurveIsAdded() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository own = new JooqLibraryRepository(db);
        addSynthetic(own, new Random(7), 0);
        SearchService service = new SearchService(own);
        Requirement requirement = RequirementParser.parse("passes over 50% of led 395");
        int cachedBefore = service.curveCacheUse().curves();

        addSynthetic(own, new Random(8), 1); // raises the library's change counter

        Shortlist after = service.search(requirement, 40);
        List<Material> materials = own.findMaterials(null, null);
        assertThat(after.rows()).containsExactlyElementsOf(judgeEverySample(own, requirement, Optional.empty(), materials, 40));
        int samples = materials.stream().mapToInt(m -> m.samples().size()).sum();
        assertThat(service.curveCacheUse().curves()).isEqualTo(samples).isGreaterThan(cachedBefore);
    }

    private static String requirement(Kind kind, Random random) {
        List<String> parts = new ArrayList<>();
        boolean plain = kind.name().startsWith("PLAIN");
        boolean relative = kind.name().startsWith("RELATIVE");
        boolean state = kind.name().startsWith("STATE");
        boolean angled = kind.name().startsWith("ANGLED");
        String clauses = plain || angled && random.nextBoolean() ? plainClause(random) : relative ? relativeClause(random)
                : state ? stateClause(random) : weightedClause(random);
        if (random.nextBoolean()) {
            clauses += " and " + (plain ? plainClause(random) : random.nextBoolean() ? plainClause(random) : weightedClause(random));
        }
        parts.add(clauses);
        switch (kind) {
            case PLAIN_FIXED -> parts.add("at " + new String[] {"1", "2", "3", "4", "6"}[random.nextInt(5)] + " mm");
            case ANGLED -> parts.add(random.nextBoolean() ? "at " + new String[] {"1", "3", "6"}[random.nextInt(3)]
                    + " mm" : "thickness as measured");
            case PLAIN_SOLVE, SOLVED, STACKED_SOLVED, RELATIVE_SOLVED, STATE_SOLVED, ANGLED_SOLVED -> parts.add("thickness "
                    + new String[] {"1 to 6", "0.5 to 3", "2 to 10"}[random.nextInt(3)] + " mm");
            default -> { }
        }
        if (kind == Kind.STACKED || kind == Kind.STACKED_SOLVED || kind == Kind.ANGLED_STACKED) {
            parts.add(LAYERS[random.nextInt(LAYERS.length)]);
        }
        if (angled) {
            parts.add(LIGHTS[random.nextInt(LIGHTS.length)]);
        }
        if (random.nextInt(6) == 0) {
            parts.add("class " + CLASSES[random.nextInt(CLASSES.length)]);
        }
        return String.join(", ", parts);
    }

    private static String plainClause(Random random) {
        int nm = 250 + 10 * random.nextInt(40);
        return switch (random.nextInt(5)) {
            case 0 -> "passes over " + percent(50 + 45 * random.nextDouble()) + " at " + nm + " nm";
            case 1 -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " at " + nm + " nm";
            case 2 -> "passes over " + percent(40 + 50 * random.nextDouble()) + " from " + nm + " to " + (nm + 30) + " nm";
            case 3 -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " from " + nm + " to "
                    + (nm + 20) + " nm";
            default -> {
                int from = 300 + 10 * random.nextInt(15);
                yield "cutoff between " + from + " and " + (from + 10 + 10 * random.nextInt(5)) + " nm";
            }
        };
    }

    /** Levels relative to the same curve: the archival-glazing shapes of PRACTICE.md §5 (19), thresholds varied. */
    private static String relativeClause(Random random) {
        int nm = 300 + 10 * random.nextInt(13);
        String reference = new String[] {"550", "600", "500"}[random.nextInt(3)];
        return switch (random.nextInt(4)) {
            case 0 -> "at " + nm + " nm under " + percent(Math.pow(10, 1 - 2 * random.nextDouble())) + " of its "
                    + reference + " nm value";
            case 1 -> "at " + (nm + 60) + " nm over " + percent(30 + 60 * random.nextDouble()) + " of its " + reference
                    + " nm value";
            case 2 -> "from " + nm + " to " + (nm + 30) + " nm under half of its " + reference + " nm value";
            default -> "at " + nm + " nm under " + percent(Math.pow(10, 1 - 2 * random.nextDouble())) + " of its "
                    + reference + " nm value and " + plainClause(random);
        };
    }

    /** Clauses naming a state (docs/requirement-language.md), on the synthetic aged and printed curves. */
    private static String stateClause(Random random) {
        int nm = 300 + 10 * random.nextInt(20);
        String hours = new String[] {"500", "1000", "2000", "3000"}[random.nextInt(4)];
        return switch (random.nextInt(5)) {
            case 0 -> "after " + hours + " h passes over " + percent(40 + 50 * random.nextDouble()) + " at " + nm + " nm";
            case 1 -> "after " + hours + " h blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()))
                    + " from " + nm + " to " + (nm + 20) + " nm";
            case 2 -> "printed black blocks under " + smallPercent(Math.pow(10, -1 - 2 * random.nextDouble())) + " from "
                    + nm + " to " + (nm + 40) + " nm";
            case 3 -> "from " + nm + " to " + (nm + 40) + " nm the printed black under "
                    + smallPercent(Math.pow(10, -1 - 2 * random.nextDouble())) + " of the base";
            default -> "after " + hours + " h at " + nm + " nm under " + percent(Math.pow(10, 1.5 - 2 * random.nextDouble()))
                    + " of its 600 nm value and " + plainClause(random);
        };
    }

    private static String weightedClause(Random random) {
        String led = "led " + new String[] {"365", "385", "395", "405"}[random.nextInt(4)];
        return switch (random.nextInt(6)) {
            case 0 -> "passes over " + percent(50 + 45 * random.nextDouble()) + " of " + led;
            case 1 -> "blocks under " + percent(Math.pow(10, 1 - 3 * random.nextDouble())) + " of " + led;
            case 2 -> "erythemal under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
            case 3 -> "uv hazard under " + percent(Math.pow(10, 1 - 3 * random.nextDouble()));
            case 4 -> "luminous over " + percent(20 + 70 * random.nextDouble());
            default -> "critical wavelength over " + (340 + random.nextInt(50)) + " nm";
        };
    }

    /** Down to 0.001 %: the levels a printed black is asked for. */
    private static String smallPercent(double p) {
        return String.format(Locale.ROOT, "%.4f%%", p);
    }

    private static String percent(double p) {
        return String.format(Locale.ROOT, "%.2f%%", p);
    }

    private static List<RankedRow> judgeEverySample(Requirement requirement, Optional<StackLayer> layer,
                                                    List<Material> materials, int limit) {
        return judgeEverySample(library, requirement, layer, materials, limit);
    }

    private static List<RankedRow> judgeEverySample(JooqLibraryRepository library, Requirement requirement,
                                                    Optional<StackLayer> layer, List<Material> materials, int limit) {
        return ExactReference.judgeEverySample(library, requirement, layer, materials, limit);
    }

    /**
     * Curves in other states for a synthetic sample (illustrative): aged after 1000 and 2500 h under a synthetic lamp,
     * losing most towards short wavelengths (the direction of PRACTICE.md §1, common practice), and a printed black
     * two to four decades below the base, at the sample's thickness (a printed one a little thicker, by the ink).
     */
    private static void addStates(JooqLibraryRepository into, Random random, long sample, int number, int s,
                                  double[] nm, double[] t, double mm, double floor) {
        double loss = 0.2 + 0.6 * random.nextDouble();
        for (double hours : new double[] {1000, 2500}) {
            double[] aged = new double[nm.length];
            for (int w = 0; w < nm.length; w++) {
                aged[w] = t[w] * (1 - loss * hours / 2500 * Math.exp(-(nm[w] - 250) / 80));
            }
            into.storeStateCurve(sample, new NewStateCurve(MaterialState.aged(Exposure.hours(hours, "synthetic lamp")),
                    Curve.of(nm, aged, floor), mm, floor, "illustrative", null, "synthetic-aged.csv",
                    String.format(Locale.ROOT, "%064x", (long) number * 16 + s + 4096 + (long) hours)));
        }
        double decades = 2 + 2 * random.nextDouble();
        double[] printed = new double[nm.length];
        for (int w = 0; w < nm.length; w++) {
            printed[w] = t[w] * Math.pow(10, -decades * (nm[w] < 600 ? 1 : 0.3));
        }
        into.storeStateCurve(sample, new NewStateCurve(MaterialState.printed(new Printing(100, Double.NaN)),
                Curve.of(nm, printed, floor), mm * 1.04, floor, "illustrative", null, "synthetic-printed.csv",
                String.format(Locale.ROOT, "%064x", (long) number * 16 + s + 8192)));
    }

    /**
     * Records today's checks refuse, written straight into the tables as an older database could hold them
     * ({@code SampleRescaling.unusable}): an index refused on reading, thicknesses outside the physical range,
     * one of them on a material of a valid but high index (the store holds all of these with n = 1.5).
     */
    private static void spoilSomeStoredRecords(DSLContext db) {
        List<Long> synthetic = db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.like("synthetic-stock-%"))
                .orderBy(MATERIAL.ID).fetch(MATERIAL.ID);
        db.update(MATERIAL).set(MATERIAL.INDEX_KIND, "constant").set(MATERIAL.INDEX_N, 1e16)
                .where(MATERIAL.ID.eq(synthetic.get(3))).execute();
        db.update(MATERIAL).set(MATERIAL.INDEX_KIND, "constant").set(MATERIAL.INDEX_N, 3.9)
                .where(MATERIAL.ID.eq(synthetic.get(7))).execute();
        db.update(SAMPLE).set(SAMPLE.THICKNESS_MM, 1e308).where(SAMPLE.MATERIAL_ID.eq(synthetic.get(7))).execute();
        db.update(SAMPLE).set(SAMPLE.THICKNESS_MM, 1e-300).where(SAMPLE.MATERIAL_ID.eq(synthetic.get(11))).execute();
    }

    private static void addSyntheticMaterials(Random random, int count) {
        for (int i = 0; i < count; i++) {
            addSynthetic(library, random, i);
        }
    }

    /**
     * One synthetic material with one to three samples at random thicknesses (illustrative, invented stock):
     * curves of {@link SyntheticCurves} on a 2 nm grid from 250 to 800 nm, a fifth of the materials fixed
     * parts, one sample in eight measured in total geometry.
     */
    private static void addSynthetic(JooqLibraryRepository into, Random random, int number) {
        SyntheticCurves curves = new SyntheticCurves(random.nextLong(), new WavelengthGrid(250, 800, 2));
        SyntheticCurves.Spec first = curves.next();
        boolean fixed = random.nextInt(5) == 0;
        long material = into.insertMaterial(new NewMaterial("synthetic-stock-" + number, "Synthetic stock " + number,
                MaterialClass.of(CLASSES[random.nextInt(CLASSES.length)]), "illustrative, generated", List.of(),
                fixed ? Scaling.FIXED : Scaling.BULK, SyntheticCurves.INDICES[first.index()]));
        int samples = 1 + random.nextInt(3);
        for (int s = 0; s < samples; s++) {
            // the same substance at another thickness: only the thickness of the first spec changes
            double mm = s == 0 ? first.thicknessMm() : 0.5 + random.nextDouble() * 9.5;
            SyntheticCurves.Spec spec = new SyntheticCurves.Spec(first.edgeNm(), first.edgeWidthNm(), first.bandNm(),
                    first.bandPeakPerMm(), first.bandWidthNm(), first.backgroundPerMm(), mm, first.index(), first.floor());
            double[] nm = new WavelengthGrid(250, 800, 2).points();
            double[] t = new double[nm.length];
            for (int w = 0; w < nm.length; w++) {
                t[w] = SyntheticCurves.transmittance(spec, nm[w]);
            }
            Geometry geometry = random.nextInt(8) == 0 ? Geometry.TOTAL : Geometry.REGULAR;
            long sample = into.insertSample(material, new NewSample(mm, geometry, Provenance.MODELLED, "", null, "", "illustrative",
                    spec.floor(), Curve.of(nm, t, spec.floor()), "synthetic-" + number + "-" + s + ".csv",
                    String.format(Locale.ROOT, "%064x", (long) number * 16 + s)));
            if (random.nextInt(3) == 0) {
                addStates(into, random, sample, number, s, nm, t, mm, spec.floor());
            }
        }
    }
}
