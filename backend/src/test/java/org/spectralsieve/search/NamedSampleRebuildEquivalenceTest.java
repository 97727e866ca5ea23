package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.search.StoreRebuildReuseTest.assertSameStore;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.UUID;
import java.util.function.Function;
import java.util.stream.Collectors;
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
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MaterialCorrection;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleCorrection;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * A rebuild that reads again only the samples the change log names ({@link MaterialsRead#withSamples}) gives exactly
 * what reading the whole library gives: the same materials with the same sample records in the same order, the same
 * store row for row, the same answers. Checked under a seeded random sequence of writes on the illustrative demo
 * library (imports into existing materials, often at a thickness some sample already has; samples added without a
 * file; sample corrections that move a sample in the thickness order; sample retirements and restores; material
 * retirements, restores and corrections; a new material; a file of several blocks), one to three writes between
 * rebuilds. The reference is the same code's whole read, made independently from the database after each step; the
 * service rebuilding what changed alone is also compared with one rebuilding the way before
 * ({@link SearchService#withEarlierRebuild}).
 */
class NamedSampleRebuildEquivalenceTest {

    private static final List<Requirement> REQUIREMENTS = List.of(
            RequirementParser.parse("passes over 80% at 365 nm and blocks under 1% at 405 nm"),
            RequirementParser.parse("passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm"),
            RequirementParser.parse("passes over 85% of led 365"));

    private JooqLibraryRepository library;
    private JooqLibraryRevisions revisions;

    @BeforeEach
    void loadDemoLibrary() {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        DSLContext db = DSL.using(dataSource, SQLDialect.H2);
        library = new JooqLibraryRepository(db);
        revisions = new JooqLibraryRevisions(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
    }

    @Test
    void materialsUpdatedFromTheirNamedSamplesEqualTheWholeLibraryReadAfterEveryRandomWrite() {
        Random random = new Random(20261205L);
        List<Material> previous = MaterialsRead.everything(library);
        long previousGeneration = library.generation();
        int samplesOnlySteps = 0;
        for (int step = 0; step < 60; step++) {
            List<String> done = new ArrayList<>();
            int writes = 1 + random.nextInt(3);
            for (int w = 0; w < writes; w++) {
                done.add(randomWrite(random, step * 10 + w));
            }
            long generation = library.generation();
            List<Material> updated = MaterialsRead.after(library, previous, previousGeneration, generation, true)
                    .orElseThrow();
            List<Material> whole = MaterialsRead.everything(library);
            assertThat(updated).as("step %d after %s", step, done).containsExactlyElementsOf(whole);
            if (keptEarlierRecords(previous, updated, library.changesSince(previousGeneration, generation).orElseThrow())) {
                samplesOnlySteps++;
            }
            previous = updated;
            previousGeneration = generation;
        }
        // not vacuous: most steps updated a material from its named samples, keeping its other records as they were
        assertThat(samplesOnlySteps).isGreaterThan(20);
    }

    @Test
    void aServiceRefreshedAfterRandomWritesHoldsTheStoreAndAnswersOfAWholeBuild() {
        Random random = new Random(20261206L);
        SearchService kept = new SearchService(library);
        SearchService earlier = new SearchService(library).withEarlierRebuild();
        kept.store();
        earlier.store();
        for (int step = 0; step < 25; step++) {
            List<String> done = new ArrayList<>();
            int writes = 1 + random.nextInt(3);
            for (int w = 0; w < writes; w++) {
                done.add(randomWrite(random, 1000 + step * 10 + w));
            }
            if (random.nextBoolean()) {
                kept.refresh(); // what the import and curation services do after a commit; else the next search rebuilds
                earlier.refresh();
            }
            SearchService whole = new SearchService(library);
            assertSameStore(kept.store(), whole.store());
            assertSameStore(earlier.store(), whole.store());
            // as many curves cached (the shared arrays' pool of a partial rebuild may hold more, by design)
            assertThat(kept.curveCacheUse().curves()).as("step %d: the same curves cached", step)
                    .isEqualTo(whole.curveCacheUse().curves()).isEqualTo(earlier.curveCacheUse().curves());
            if (step % 5 == 4) {
                for (Requirement r : REQUIREMENTS) {
                    assertThat(kept.search(r, 40).rows()).as("step %d after %s: %s", step, done, r)
                            .isEqualTo(whole.search(r, 40).rows());
                }
                assertThat(kept.materialClasses()).isEqualTo(whole.materialClasses());
            }
        }
    }

    /** Whether some material of {@code updated} changed by named samples alone kept an unchanged sample's very record. */
    private static boolean keptEarlierRecords(List<Material> previous, List<Material> updated,
                                              org.spectralsieve.library.LibraryChanges.Changes changes) {
        Map<Long, Material> before = previous.stream().collect(Collectors.toMap(Material::id, Function.identity()));
        for (Material m : updated) {
            Material earlier = before.get(m.id());
            if (earlier == null || !changes.samplesOnly().containsKey(m.id())) {
                continue;
            }
            Map<Long, SampleInfo> earlierSamples = earlier.samples().stream()
                    .collect(Collectors.toMap(SampleInfo::id, Function.identity()));
            for (SampleInfo s : m.samples()) {
                if (!changes.samplesOnly().get(m.id()).contains(s.id()) && s == earlierSamples.get(s.id())) {
                    return true;
                }
            }
        }
        return false;
    }

    /** One write chosen at random; returns what it did, for the failure message. */
    private String randomWrite(Random random, int n) {
        List<Material> inUse = library.findMaterials(null, null);
        Material m = inUse.get(random.nextInt(Math.min(inUse.size(), 8))); // a few materials, so they grow
        int kind = random.nextInt(100);
        if (kind < 35) {
            // an import, often at a thickness one of the material's samples has (ties ordered by id)
            double mm = !m.samples().isEmpty() && random.nextBoolean()
                    ? m.samples().get(random.nextInt(m.samples().size())).thicknessMm() : 0.5 + random.nextInt(12) * 0.5;
            SourceFile file = file("import " + n, random);
            library.storeImport(m.id(), null, sample(mm, file, random), file);
            return "import into " + m.id() + " at " + mm;
        }
        if (kind < 45) {
            SourceFile file = file("added " + n, random);
            long id = library.insertSample(m.id(), sample(1 + random.nextInt(5), file, random));
            return "sample " + id + " added to " + m.id();
        }
        if (kind < 62 && !m.samples().isEmpty()) {
            SampleInfo s = m.samples().get(random.nextInt(m.samples().size()));
            Double mm = random.nextBoolean() ? s.thicknessMm() * (0.5 + random.nextDouble()) : null;
            revisions.correctSample(s.id(), new SampleCorrection(mm, null, null, null, null, "note " + n, null,
                    "illustrative correction"), (now, next, perPoint) -> { });
            return "sample " + s.id() + " corrected to " + mm;
        }
        if (kind < 75 && m.samples().size() > 1) {
            SampleInfo s = m.samples().get(random.nextInt(m.samples().size()));
            revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s.id(), true);
            return "sample " + s.id() + " retired";
        }
        if (kind < 85) {
            List<Long> retired = retiredSamples();
            if (!retired.isEmpty()) {
                long id = retired.get(random.nextInt(retired.size()));
                revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, id, false);
                return "sample " + id + " restored";
            }
        }
        if (kind < 90) {
            revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, m.id(), true);
            if (random.nextBoolean()) {
                revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, m.id(), false);
                return "material " + m.id() + " retired and restored";
            }
            return "material " + m.id() + " retired";
        }
        if (kind < 94) {
            revisions.correctMaterial(m.id(), new MaterialCorrection(new ConstantIndex(1.45 + random.nextInt(10) * 0.01),
                    null, "illustrative index correction"), now -> { });
            return "material " + m.id() + " corrected";
        }
        if (kind < 97) {
            SourceFile file = file("new material " + n, random);
            NewMaterial created = new NewMaterial("illustrative-" + n, "Illustrative sheet " + n,
                    MaterialClass.of("plastic sheet"), "illustrative", List.of(), Scaling.BULK, new ConstantIndex(1.5),
                    org.spectralsieve.library.StatedThicknesses.NONE);
            library.storeImport(null, created, sample(2, file, random), file);
            return "new material " + n;
        }
        SourceFile file = file("blocks " + n, random);
        library.storeBlocks(m.id(), null, List.of(sample(1, file, random), sample(3, file, random)), file);
        return "two blocks into " + m.id();
    }

    private List<Long> retiredSamples() {
        List<Long> out = new ArrayList<>();
        for (Material m : library.findMaterials(null, null)) {
            for (SampleInfo s : m.samples()) {
                out.add(s.id());
            }
        }
        // a retired sample is read by id: look among ids below the largest in use for those no listing holds
        long max = out.stream().mapToLong(Long::longValue).max().orElse(0);
        List<Long> retired = new ArrayList<>();
        for (long id = 1; id <= max; id++) {
            var s = library.findSample(id);
            if (s.isPresent() && s.get().retired()) {
                retired.add(id);
            }
        }
        return retired;
    }

    private static SourceFile file(String note, Random random) {
        byte[] bytes = ("wavelength_nm,T\n300,0.02\n350," + (0.3 + random.nextInt(60) / 100.0) + "\n400,0.9\n# " + note
                + " (illustrative)\n").getBytes(StandardCharsets.UTF_8);
        return new SourceFile(note.replace(' ', '-') + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
    }

    private static NewSample sample(double thicknessMm, SourceFile file, Random random) {
        double mid = 0.3 + random.nextInt(60) / 100.0;
        Curve curve = Curve.of(new double[] {300, 350, 400}, new double[] {0.02, mid, 0.9}, 1e-3);
        return new NewSample(thicknessMm, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "illustrative", 1e-3,
                curve, file.fileName(), file.sha256());
    }
}
