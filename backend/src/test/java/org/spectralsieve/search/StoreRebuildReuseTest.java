package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SpectralStore;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * A store rebuilt after writes by carrying unchanged rows over from the previous store (StoreRowSource) is
 * row for row the store a fresh service builds from the whole database, and answers the same: checked on the
 * illustrative demo library after an import into an existing material, a new material, a corrected sample
 * and a retired one. The reference is the same code's whole build, read independently from the database.
 */
class StoreRebuildReuseTest {

    private static final Requirement PLAIN = RequirementParser.parse("passes over 80% at 365 nm and blocks under 1% at 405 nm");
    private static final Requirement SOLVED = RequirementParser.parse(
            "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm");
    /** A weighted clause: the store screens it with per-curve bounds, which a carried row must keep. */
    private static final Requirement WEIGHTED = RequirementParser.parse("passes over 85% of led 365");

    private JooqLibraryRepository library;
    private JooqLibraryRevisions revisions;
    private DSLContext db;

    @BeforeEach
    void loadDemoLibrary() {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        db = DSL.using(dataSource, SQLDialect.H2);
        library = new JooqLibraryRepository(db);
        revisions = new JooqLibraryRevisions(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
    }

    @Test
    void aStoreRebuiltAfterWritesEqualsOneBuiltFromTheWholeDatabase() {
        SearchService kept = new SearchService(library);
        kept.search(PLAIN, 20); // the first build reads everything

        Material first = library.findMaterials(null, null).get(0);
        importInto(first.id(), 3.5, "one more");
        assertSameStore(kept.store(), new SearchService(library).store());

        Material other = library.findMaterials(null, null).get(3);
        SampleInfo corrected = other.samples().get(0);
        revisions.correctSample(corrected.id(), new SampleCorrection(corrected.thicknessMm() * 2, null, null, null, null,
                null, null, "thickness was misread"), (now, next, perPoint) -> { });
        SampleInfo retired = library.findMaterials(null, null).get(5).samples().get(0);
        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, retired.id(), true);
        importInto(first.id(), 0.7, "thinner still");

        SpectralStore rebuilt = kept.store();
        SpectralStore whole = new SearchService(library).store();
        assertSameStore(rebuilt, whole);
        assertThat(indexOf(rebuilt, retired.id())).isEqualTo(-1);
        assertThat(rebuilt.thicknessMm(indexOf(rebuilt, corrected.id()))).isEqualTo((float) (corrected.thicknessMm() * 2));
        for (Requirement r : List.of(PLAIN, SOLVED, WEIGHTED)) {
            assertThat(kept.search(r, 20).rows()).isEqualTo(new SearchService(library).search(r, 20).rows());
        }
    }

    @Test
    void aStoreRebuiltFromTheChangedMaterialsAloneEqualsOneBuiltFromTheWholeDatabase() {
        SearchService kept = new SearchService(library);
        kept.search(PLAIN, 20);

        // a new material (named to sort between existing ones), a retired one, and one given a new sample
        long added = library.insertMaterial(new org.spectralsieve.library.NewMaterial("m-clear-test", "M clear test sheet",
                org.spectralsieve.library.MaterialClass.of("plastic sheet"), "illustrative", List.of(),
                org.spectralsieve.library.Scaling.BULK, new org.spectralsieve.optics.ConstantIndex(1.49)));
        importInto(added, 2.0, "first of a new material");
        Material retired = library.findMaterials(null, null).get(7);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retired.id(), true);
        Material grown = library.findMaterials(null, null).get(2);
        importInto(grown.id(), 5.0, "thicker");

        SpectralStore rebuilt = kept.store();
        assertSameStore(rebuilt, new SearchService(library).store());
        assertThat(retired.samples()).allSatisfy(x -> assertThat(indexOf(rebuilt, x.id())).isEqualTo(-1));
        for (Requirement r : List.of(PLAIN, SOLVED, WEIGHTED)) {
            assertThat(kept.search(r, 20).rows()).isEqualTo(new SearchService(library).search(r, 20).rows());
        }
        assertThat(kept.materialClasses()).isEqualTo(new SearchService(library).materialClasses());

        // the material comes back: the change log names it, so it is read again
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retired.id(), false);
        assertSameStore(kept.store(), new SearchService(library).store());
    }

    @Test
    void aChangeConcerningNoMaterialKeepsTheStoreAndStillCountsAsSeen() {
        SearchService kept = new SearchService(library);
        SpectralStore before = kept.store();
        db.transaction(t -> { org.spectralsieve.library.LibraryGeneration.bumpConcerningNoMaterial(t.dsl()); });
        assertThat(kept.store()).as("the same store, carried to the new number").isSameAs(before);

        // a material change after it is still seen
        importInto(library.findMaterials(null, null).get(0).id(), 3.5, "after the emitter");
        assertSameStore(kept.store(), new SearchService(library).store());
        assertThat(kept.store().size()).isEqualTo(before.size() + 1);
    }

    @Test
    void onlyNewAndChangedSamplesAreReadAgain() {
        SpectralStore before = new SearchService(library).store();
        long generation = library.generation();
        java.util.Map<Long, SampleInfo> samples = new java.util.HashMap<>();
        library.findMaterials(null, null).forEach(m -> m.samples().forEach(x -> samples.put(x.id(), x)));
        Material first = library.findMaterials(null, null).get(0);
        importInto(first.id(), 3.5, "one more");
        SampleInfo corrected = library.findMaterials(null, null).get(3).samples().get(0);
        revisions.correctSample(corrected.id(), new SampleCorrection(null, null, null, null, null, "re-measured",
                null, "note added"), (now, next, perPoint) -> { });

        StoreRowSource source = StoreRowSource.after(library, before, samples, generation, library.generation());
        SpectralStore.Builder builder = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 16);
        int inUse = 0;
        for (Material m : library.findMaterials(null, null)) {
            for (SampleInfo x : m.samples()) {
                source.add(builder, x, new org.spectralsieve.store.StoredMaterial(m.id(), m.name(), "film",
                        SearchService.made(m)), 1, true, false, m.refractiveIndex());
                inUse++;
            }
        }
        assertThat(source.read()).isEqualTo(2); // the import and the corrected sample
        assertThat(source.reused()).isEqualTo(inUse - 2);
    }

    @Test
    void rowsCarriedInRunsAreTheRowsTheirCurvesGiveWhenAddedAgain() {
        // curves of varied ranges, steps and detection limits (fixed seed), in a store grown from a small capacity
        java.util.Random random = new java.util.Random(20261204L);
        List<Curve> curves = new ArrayList<>();
        for (int k = 0; k < 40; k++) {
            curves.add(randomCurve(random));
        }
        org.spectralsieve.store.StoredMaterial[] materials = {
                new org.spectralsieve.store.StoredMaterial(1, "A sheet", "plastic sheet", org.spectralsieve.requirement.MadeThicknesses.assumed(List.of(1.0, 2.0))),
                new org.spectralsieve.store.StoredMaterial(2, "B film", "film", org.spectralsieve.requirement.MadeThicknesses.assumed(List.of(0.1)))};
        org.spectralsieve.optics.ConstantIndex index = new org.spectralsieve.optics.ConstantIndex(1.5);
        SpectralStore.Builder first = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 3);
        for (int k = 0; k < curves.size(); k++) {
            first.add(100 + k, materials[k % 2], 1 + k % 4, k % 3 != 0, k % 5 == 0, index, curves.get(k));
        }
        SpectralStore previous = first.build();

        // a rebuild's order: runs of consecutive rows, rows skipped (retired), a row moved (its material renamed),
        // new curves between carried rows; built again with capacity 1 so the arrays grow while a run is pending
        SpectralStore.Builder carried = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 1);
        SpectralStore.Builder reference = SpectralStore.builder(SpectralStore.DEFAULT_GRID, 1);
        List<Curve> fresh = new ArrayList<>();
        int[] order = new int[curves.size() + 8];
        int n = 0;
        for (int row = 0; row < curves.size(); row++) {
            if (row == 7 || row == 21 || row == 22) {
                continue; // retired
            }
            if (row == 30) {
                order[n++] = -1; // a new curve between carried rows
            }
            order[n++] = row == 12 ? 35 : row == 35 ? 12 : row; // two rows swapped
        }
        order[n++] = -1;
        for (int j = 0; j < n; j++) {
            int row = order[j];
            if (row < 0) {
                Curve added = randomCurve(random);
                fresh.add(added);
                carried.add(900 + j, materials[0], 2.5, true, false, index, added);
                reference.add(900 + j, materials[0], 2.5, true, false, index, added);
            } else {
                double mm = 1 + row % 4;
                carried.addCarried(100 + row, materials[row % 2], mm, row % 3 != 0, row % 5 == 0, index, previous, row);
                reference.add(100 + row, materials[row % 2], mm, row % 3 != 0, row % 5 == 0, index, curves.get(row));
            }
        }
        assertThat(fresh).hasSize(2);
        SpectralStore rebuilt = carried.build();
        assertSameStore(rebuilt, reference.build());
        assertThat(rebuilt.size()).isEqualTo(curves.size() - 3 + 2);
    }

    /** A curve over a random part of 200–1100 nm, random steps, T between 0 and 0.95, some points below detection. */
    private static Curve randomCurve(java.util.Random random) {
        double from = 200 + random.nextInt(200);
        double to = 500 + random.nextInt(600);
        double step = 0.5 + random.nextInt(8);
        int points = (int) ((to - from) / step) + 1;
        double[] nm = new double[points];
        double[] t = new double[points];
        boolean[] below = new boolean[points];
        double[] limits = new double[points];
        double edge = from + random.nextDouble() * (to - from);
        for (int p = 0; p < points; p++) {
            nm[p] = from + p * step;
            t[p] = 0.95 / (1 + Math.exp(-(nm[p] - edge) / (2 + random.nextDouble() * 20)));
            limits[p] = 1e-3;
            if (t[p] < 1e-3) {
                t[p] = 1e-3;
                below[p] = true;
            }
        }
        return Curve.of(nm, t, below, limits);
    }

    @Test
    void aStoreRefreshedAfterEachWriteHoldsItBeforeTheNextSearchAndEqualsAWholeBuild() {
        java.util.concurrent.atomic.AtomicInteger builds = new java.util.concurrent.atomic.AtomicInteger();
        SearchService kept = new SearchService(library, generation -> builds.incrementAndGet());
        kept.search(PLAIN, 20);
        assertThat(builds.get()).isEqualTo(1);

        // what the import and curation services do after each commit
        Material first = library.findMaterials(null, null).get(0);
        long imported = library.storeImport(first.id(), null, newSample(3.5, "refreshed"), file("refreshed")).sampleId();
        kept.refresh();
        assertThat(builds.get()).as("the writer's refresh rebuilt the store").isEqualTo(2);
        assertThat(indexOf(kept.store(), imported)).isNotNegative();
        assertThat(builds.get()).as("so the next search found it up to date").isEqualTo(2);
        assertSameStore(kept.store(), new SearchService(library).store());

        SampleInfo corrected = library.findMaterials(null, null).get(4).samples().get(0);
        revisions.correctSample(corrected.id(), new SampleCorrection(corrected.thicknessMm() * 1.5, null, null, null, null,
                null, null, "re-measured"), (now, next, perPoint) -> { });
        kept.refresh();
        Material retired = library.findMaterials(null, null).get(6);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retired.id(), true);
        kept.refresh();
        assertThat(builds.get()).isEqualTo(4);
        assertSameStore(kept.store(), new SearchService(library).store());
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retired.id(), false);
        kept.refresh();
        assertSameStore(kept.store(), new SearchService(library).store());
        kept.refresh();
        assertThat(builds.get()).as("nothing changed: no rebuild").isEqualTo(5);

        SearchService fresh = new SearchService(library);
        for (Requirement r : List.of(PLAIN, SOLVED, WEIGHTED)) {
            assertThat(kept.search(r, 20).rows()).isEqualTo(fresh.search(r, 20).rows());
        }
        assertThat(kept.curveCacheUse().curves()).isEqualTo(fresh.curveCacheUse().curves());
    }

    private void importInto(long materialId, double thicknessMm, String note) {
        library.storeImport(materialId, null, newSample(thicknessMm, note), file(note));
    }

    private static SourceFile file(String note) {
        byte[] bytes = ("wavelength_nm,T\n300,0.02\n350,0.6\n400,0.9\n# " + note + "\n").getBytes(StandardCharsets.UTF_8);
        return new SourceFile(note + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
    }

    private static NewSample newSample(double thicknessMm, String note) {
        SourceFile file = file(note);
        Curve curve = Curve.of(new double[] {300, 350, 400}, new double[] {0.02, 0.6, 0.9}, 1e-3);
        return new NewSample(thicknessMm, Geometry.REGULAR, Provenance.MEASURED, "", null, "", note, 1e-3, curve,
                file.fileName(), file.sha256());
    }

    static void assertSameStore(SpectralStore actual, SpectralStore expected) {
        assertThat(actual.size()).isEqualTo(expected.size());
        List<String> a = new ArrayList<>();
        List<String> e = new ArrayList<>();
        for (int i = 0; i < expected.size(); i++) {
            a.add(row(actual, i));
            e.add(row(expected, i));
        }
        assertThat(a).containsExactlyElementsOf(e);
        // the weighted screen too: a carried row keeps the bounds a fresh build computes from its curve
        org.spectralsieve.requirement.WeightedClause clause =
                (org.spectralsieve.requirement.WeightedClause) WEIGHTED.clauses().get(0);
        assertThat(actual.weightedScreen().marginBounds(clause, java.util.Optional.empty()))
                .containsExactly(expected.weightedScreen().marginBounds(clause, java.util.Optional.empty()));
    }

    private static String row(SpectralStore s, int i) {
        return s.sampleId(i) + " " + s.material(i) + " " + s.thicknessMm(i) + " " + s.isBulk(i) + " "
                + s.isTotalGeometry(i) + " " + Arrays.toString(s.codes(i));
    }

    static int indexOf(SpectralStore s, long sampleId) {
        for (int i = 0; i < s.size(); i++) {
            if (s.sampleId(i) == sampleId) {
                return i;
            }
        }
        return -1;
    }
}
