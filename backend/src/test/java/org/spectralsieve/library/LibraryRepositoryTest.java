package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.time.LocalDate;
import java.util.List;
import java.util.Random;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.SellmeierIndex;
import org.spectralsieve.optics.TabulatedIndex;
import org.spectralsieve.spectrum.Curve;

/** The repository on a freshly migrated database, without Spring. */
class LibraryRepositoryTest {

    private DSLContext db;
    private JooqLibraryRepository library;

    @BeforeEach
    void migrateFreshDatabase() {
        db = freshDatabase();
        library = new JooqLibraryRepository(db);
    }

    /** A migrated, empty database per test; {@link PostgresLibraryRepositoryTest} gives one on PostgreSQL. */
    DSLContext freshDatabase() {
        return MigratedDatabase.freshH2();
    }

    @Test
    void fiveThousandPointCurveRoundTripsBitExact() {
        Random random = new Random(20261202);
        int n = 5000;
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        double x = 190;
        for (int i = 0; i < n; i++) {
            x += 0.01 + random.nextDouble() * 0.5; // irregular spacing, full-precision doubles
            nm[i] = x;
            t[i] = random.nextDouble();
            limits[i] = 1e-3 * (1 + random.nextDouble()); // per-point limits, as raw captures give
            below[i] = t[i] <= limits[i];
        }
        Curve curve = Curve.of(nm, t, below, limits);
        long materialId = library.insertMaterial(acrylic("round-trip"));
        long sampleId = library.insertSample(materialId, sample(3.0, curve, ""));

        Curve back = library.findCurve(sampleId).orElseThrow();

        for (int i = 0; i < n; i++) {
            assertThat(Double.doubleToRawLongBits(back.wavelengthNm(i))).isEqualTo(Double.doubleToRawLongBits(nm[i]));
            assertThat(Double.doubleToRawLongBits(back.transmittance(i))).isEqualTo(Double.doubleToRawLongBits(t[i]));
            assertThat(back.belowDetection(i)).isEqualTo(below[i]);
            assertThat(back.detectionLimit(i)).isEqualTo(limits[i]);
        }
        assertThat(back).isEqualTo(curve);
    }

    @Test
    void uniformDetectionLimitIsReadBackFromTheSample() {
        Curve curve = Curve.of(new double[] {300, 400, 500}, new double[] {0.0005, 0.5, 0.9}, 0.001);
        long sampleId = library.insertSample(library.insertMaterial(acrylic("uniform")), sample(2.0, curve, ""));

        Curve back = library.findCurve(sampleId).orElseThrow();

        assertThat(back.detectionLimits()).containsExactly(0.001, 0.001, 0.001);
        assertThat(back.belowDetectionFlags()).containsExactly(true, false, false);
        assertThat(db.select(CURVE.DETECTION_LIMITS).from(CURVE).fetchOne(CURVE.DETECTION_LIMITS)).isNull();
    }

    @Test
    void failedCurveInsertLeavesNoSampleBehind() {
        long materialId = library.insertMaterial(acrylic("atomic"));
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.1, 0.9}, 0.001);
        String tooLongFileName = "x".repeat(401); // the curve row refuses it after the sample row was written

        assertThatThrownBy(() -> library.insertSample(materialId, sample(3.0, curve, tooLongFileName)))
                .isInstanceOf(RuntimeException.class);

        assertThat(db.fetchCount(SAMPLE)).isZero();
        assertThat(db.fetchCount(CURVE)).isZero();
    }

    @Test
    void refractiveIndexModelsRoundTrip() {
        List<Double> b = List.of(0.6961663, 0.4079426, 0.8974794);
        List<Double> c = List.of(0.00467914826, 0.0135120631, 97.9340025);
        long silica = library.insertMaterial(new NewMaterial("silica", "Fused silica", MaterialClass.of("fused silica"),
                "", List.of("uv-grade"), Scaling.BULK, new SellmeierIndex(b, c, 210, 3710)));
        long table = library.insertMaterial(new NewMaterial("tabled", "Tabled", MaterialClass.of("other"), "",
                List.of(), Scaling.FIXED, new TabulatedIndex(List.of(400.0, 700.0), List.of(1.52, 1.51))));

        assertThat(library.findMaterial(silica).orElseThrow().refractiveIndex())
                .isEqualTo(new SellmeierIndex(b, c, 210, 3710));
        assertThat(library.findMaterial(table).orElseThrow().refractiveIndex())
                .isEqualTo(new TabulatedIndex(List.of(400.0, 700.0), List.of(1.52, 1.51)));
        assertThat(library.findMaterial(table).orElseThrow().scaling()).isEqualTo(Scaling.FIXED);
    }

    @Test
    void aMaterialReadWithoutItsSamplesIsTheWholeReadButForTheSamples() {
        long materialId = library.insertMaterial(acrylic("many-samples"));
        Curve curve = Curve.of(new double[] {300, 400, 500}, new double[] {0.01, 0.5, 0.9}, 0.001);
        for (int i = 0; i < 5; i++) {
            library.insertSample(materialId, sample(1.0 + i, curve, "sheet-" + i + ".csv"));
        }
        new JooqLibraryRevisions(db).setRetired(JooqLibraryRevisions.Kind.MATERIAL, materialId, true);

        Material whole = library.findMaterial(materialId).orElseThrow();
        Material alone = library.findMaterialWithoutSamples(materialId).orElseThrow();

        assertThat(whole.samples()).hasSize(5);
        assertThat(alone.samples()).isEmpty();
        assertThat(alone.retired()).isTrue(); // retired or not, as findMaterial
        assertThat(alone).isEqualTo(new Material(whole.id(), whole.slug(), whole.name(), whole.materialClass(),
                whole.description(), whole.tags(), whole.scaling(), whole.refractiveIndex(), List.of(),
                whole.thicknesses(), whole.revision(), whole.retiredAt()));
        assertThat(library.findMaterialWithoutSamples(materialId + 1000)).isEmpty();
    }

    @Test
    void aSampleReadWithItsMaterialAndCurveInOneQueryEqualsTheThreeReads() {
        Random random = new Random(20261205);
        long kept = library.insertMaterial(acrylic("kept"));
        long retiredMaterial = library.insertMaterial(new NewMaterial("retired-film", "Retired film",
                MaterialClass.of("film"), "", List.of("scattering"), Scaling.FIXED,
                new TabulatedIndex(List.of(400.0, 700.0), List.of(1.52, 1.51))));
        List<Long> samples = new java.util.ArrayList<>();
        for (int i = 0; i < 6; i++) {
            double[] nm = {300, 350, 400, 450, 500};
            double[] t = new double[nm.length];
            double[] limits = new double[nm.length];
            boolean[] below = new boolean[nm.length];
            for (int k = 0; k < nm.length; k++) {
                t[k] = random.nextDouble();
                limits[k] = i % 2 == 0 ? 0.001 : 0.001 * (1 + random.nextDouble()); // uniform and per-point limits
                below[k] = t[k] <= limits[k];
            }
            long material = i < 4 ? kept : retiredMaterial;
            samples.add(library.insertSample(material, sample(1.0 + i, Curve.of(nm, t, below, limits), "s" + i + ".csv")));
        }
        JooqLibraryRevisions revisions = new JooqLibraryRevisions(db);
        revisions.setRetired(JooqLibraryRevisions.Kind.SAMPLE, samples.get(1), true);
        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, retiredMaterial, true);

        for (long id : samples) {
            JooqLibraryRepository.SampleWithCurve read = library.findSampleWithCurve(id).orElseThrow();
            SampleInfo sample = library.findSample(id).orElseThrow();
            assertThat(read.sample()).isEqualTo(sample);
            assertThat(read.material()).isEqualTo(library.findMaterialWithoutSamples(sample.materialId()).orElseThrow());
            assertThat(read.curve()).isEqualTo(library.findCurve(id));
        }
        long missing = samples.get(samples.size() - 1) + 1000;
        assertThat(library.findSampleWithCurve(missing)).isEmpty();
    }

    @Test
    void textFilterMatchesEveryWordInNameDescriptionOrTags() {
        library.insertMaterial(new NewMaterial("clear-sheet", "Clear sheet", MaterialClass.of("plastic sheet"),
                "cast, passes 365 nm", List.of("window"), Scaling.BULK, new ConstantIndex(1.49)));
        library.insertMaterial(new NewMaterial("amber-sheet", "Amber sheet", MaterialClass.of("resin-tank sheet"),
                "blocks 405 nm", List.of("lid"), Scaling.BULK, new ConstantIndex(1.49)));

        assertThat(library.findMaterials(null, "sheet lid")).extracting(Material::slug).containsExactly("amber-sheet");
        assertThat(library.findMaterials("plastic sheet", null)).extracting(Material::slug).containsExactly("clear-sheet");
        assertThat(library.findMaterials(null, "365")).extracting(Material::slug).containsExactly("clear-sheet");
        assertThat(library.findMaterials(null, null)).hasSize(2);
    }

    private static NewMaterial acrylic(String slug) {
        return new NewMaterial(slug, "Test acrylic " + slug, MaterialClass.of("plastic sheet"), "", List.of("test"),
                Scaling.BULK, new ConstantIndex(1.49));
    }

    private static NewSample sample(double thicknessMm, Curve curve, String fileName) {
        return new NewSample(thicknessMm, Geometry.REGULAR, Provenance.MEASURED, "test bench", LocalDate.of(2026, 1, 5),
                "lot 1", "", curve.detectionLimit(0), curve, fileName,
                "0".repeat(64));
    }
}
