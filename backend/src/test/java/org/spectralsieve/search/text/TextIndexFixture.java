package org.spectralsieve.search.text;

import static org.spectralsieve.library.db.Tables.MATERIAL;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.Set;
import javax.sql.DataSource;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
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
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * A small library of illustrative stock (the invented Fernhollow Print & Cure Workshop) and the changes a
 * library sees (import, new material, retire, restore, revisions), for the tests of the index on disk and
 * the child process of the kill test. Answers are compared whole, less the generation, against a fresh
 * in-memory rebuild: the rebuild is the reference, not a number written here.
 */
final class TextIndexFixture {

    /** Words, prefixes, stems and facets: every part of an answer an update could get wrong. */
    static final List<LibraryQuery> QUERIES = List.of(
            LibraryQuery.words("", LibraryQuery.MAX_LIMIT),
            LibraryQuery.words("acryl", 20),
            LibraryQuery.words("sheets", 20),
            LibraryQuery.words("fernhollow", 3),
            LibraryQuery.words("bench spectrometer", 20),
            LibraryQuery.words("revised", 20),
            new LibraryQuery("", Set.of("plastic sheet"), Set.of(), Set.of(Provenance.MEASURED), Set.of(), 20),
            new LibraryQuery("fern", Set.of(), Set.of(Geometry.TOTAL), Set.of(), Set.of("3-6 mm"), 20));

    private static final String[] WORDS = {"acrylic", "polycarbonate", "polyester", "glass", "quartz", "mask"};
    private static final String[] CLASSES = {"plastic sheet", "film", "window glass"};

    private final DataSource dataSource;
    private final DSLContext db;
    private final JooqLibraryRepository library;
    private final JooqLibraryRevisions revisions;
    private int files;

    TextIndexFixture(DataSource dataSource) {
        this.dataSource = dataSource;
        this.db = DSL.using(dataSource, SQLDialect.H2);
        this.library = new JooqLibraryRepository(db);
        this.revisions = new JooqLibraryRevisions(db);
    }

    static JdbcDataSource migrated(String url) {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL(url);
        Flyway.configure().dataSource(dataSource).load().migrate();
        return dataSource;
    }

    DataSource dataSource() {
        return dataSource;
    }

    DSLContext db() {
        return db;
    }

    JooqLibraryRepository library() {
        return library;
    }

    JooqLibraryRevisions revisions() {
        return revisions;
    }

    /** Four materials, five samples: the starting library. */
    void storeCorpus() {
        long acrylic = store(null, material("Fernhollow clear acrylic sheet", "plastic sheet", List.of("cast")),
                sample(3, Geometry.REGULAR, Provenance.MEASURED, "bench spectrometer")).materialId();
        store(acrylic, null, sample(6, Geometry.REGULAR, Provenance.DATASHEET, ""));
        store(null, material("Fernhollow UV-blocking polycarbonate", "plastic sheet", List.of()),
                sample(4, Geometry.TOTAL, Provenance.MEASURED, "sphere spectrometer"));
        store(null, material("Fernhollow polyester film", "film", List.of("mask")),
                sample(0.1, Geometry.REGULAR, Provenance.MEASURED, "bench spectrometer"));
        store(null, material("Fernhollow float glass", "window glass", List.of()),
                sample(4, Geometry.REGULAR, Provenance.MODELLED, ""));
    }

    /** One change of a random kind, as a user or another process makes it; returns what it did. */
    String randomChange(Random random) {
        List<Material> inUse = library.findMaterials(null, null);
        int kind = random.nextInt(7);
        if (inUse.isEmpty() || kind == 0) {
            String name = "Fernhollow " + WORDS[random.nextInt(WORDS.length)] + " stock " + random.nextInt(1000);
            store(null, material(name, CLASSES[random.nextInt(CLASSES.length)], List.of()),
                    sample(0.5 + random.nextInt(12), random.nextBoolean() ? Geometry.REGULAR : Geometry.TOTAL,
                            Provenance.MEASURED, "bench spectrometer"));
            return "new material " + name;
        }
        Material m = inUse.get(random.nextInt(inUse.size()));
        switch (kind) {
            case 1 -> {
                store(m.id(), null, sample(1 + random.nextInt(9), Geometry.REGULAR, Provenance.DATASHEET, ""));
                return "import into " + m.id();
            }
            case 2 -> {
                revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, m.id(), true);
                return "retire material " + m.id();
            }
            case 3 -> {
                if (m.samples().size() < 2) {
                    return "nothing";
                }
                SampleInfo s = m.samples().get(random.nextInt(m.samples().size()));
                revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, s.id(), true);
                return "retire sample " + s.id();
            }
            case 4 -> {
                Long retired = anyRetiredMaterial(random);
                if (retired == null) {
                    return "nothing";
                }
                revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retired, false);
                return "restore material " + retired;
            }
            case 5 -> {
                SampleInfo s = m.samples().get(random.nextInt(m.samples().size()));
                revisions.correctSample(s.id(), new SampleCorrection(2.0 + random.nextInt(8), Geometry.TOTAL, null, null,
                        null, "revised note " + random.nextInt(100), null, "remeasured"), (now, next, limits) -> { });
                return "revise sample " + s.id();
            }
            default -> {
                revisions.correctMaterial(m.id(), new MaterialCorrection(null,
                        new StatedThicknesses(List.of(1.0 + random.nextInt(10)), Double.NaN, Double.NaN), "stock list"),
                        now -> { });
                return "revise material " + m.id();
            }
        }
    }

    private Long anyRetiredMaterial(Random random) {
        List<Long> retired = db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.RETIRED_AT.isNotNull())
                .orderBy(MATERIAL.ID).fetch(MATERIAL.ID);
        return retired.isEmpty() ? null : retired.get(random.nextInt(retired.size()));
    }

    /** Every answer to {@link #QUERIES}, less the generation, as one comparable text. */
    static List<String> answers(LibraryTextSearch search) {
        List<String> out = new ArrayList<>();
        for (LibraryQuery q : QUERIES) {
            LibraryAnswer a = search.search(q);
            out.add(q.words() + " " + q.classes() + " → total " + a.total() + " hits " + a.hits()
                    + " facets " + new java.util.TreeMap<>(a.facets()));
        }
        return out;
    }

    /** The reference: what a fresh in-memory index of the database as it is now answers. */
    List<String> freshAnswers() {
        LibraryTextSearch fresh = new LibraryTextSearch(library);
        try {
            return answers(fresh);
        } finally {
            fresh.close();
        }
    }

    private static NewMaterial material(String name, String materialClass, List<String> tags) {
        return new NewMaterial(JooqLibraryRepository.slugFor(name), name, MaterialClass.of(materialClass),
                "Illustrative stock of the Fernhollow workshop", tags, Scaling.BULK, new ConstantIndex(1.5),
                new StatedThicknesses(List.of(), Double.NaN, Double.NaN));
    }

    private NewSample sample(double mm, Geometry geometry, Provenance provenance, String instrument) {
        files++;
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3);
        return new NewSample(mm, geometry, provenance, instrument, null, "", "", 1e-3, curve,
                "file" + files + ".csv", Checksums.sha256(bytes(files)));
    }

    private static byte[] bytes(int file) {
        return ("wavelength_nm,T\n300,0.3\n400,0.8\n# file " + file + "\n").getBytes(StandardCharsets.UTF_8);
    }

    private org.spectralsieve.library.StoredImport store(Long materialId, NewMaterial m, NewSample s) {
        byte[] bytes = bytes(files);
        SourceFile file = new SourceFile(s.sourceFileName(), "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        return library.storeImport(materialId, m, s, file);
    }
}
