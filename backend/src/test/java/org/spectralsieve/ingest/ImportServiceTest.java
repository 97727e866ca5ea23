package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;
import static org.spectralsieve.library.db.Tables.SOURCE_FILE;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.atomic.AtomicInteger;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;

/** The import service on a freshly migrated database, without Spring. */
class ImportServiceTest {

    private DSLContext db;
    private final AtomicInteger invalidations = new AtomicInteger();

    @BeforeEach
    void migrateFreshDatabase() {
        db = MigratedDatabase.freshH2();
    }

    private ImportService service(JooqLibraryRepository library) {
        return new ImportService(library, invalidations::incrementAndGet, ImportProperties.defaults());
    }

    private static ImportTarget.NewMaterial newSheet(String name) {
        return new ImportTarget.NewMaterial(name, MaterialClass.of("plastic sheet"), Scaling.BULK, null, "");
    }

    private List<Integer> rowCounts() {
        return List.of(db.fetchCount(MATERIAL), db.fetchCount(SAMPLE), db.fetchCount(CURVE), db.fetchCount(SOURCE_FILE),
                db.fetchCount(AUDIT_ENTRY)); // one audit entry per stored sample, none for a refused import
    }

    @Test
    void failureAfterTheSampleAndCurveRowsLeavesNoRowBehind() {
        JooqLibraryRepository failing = new JooqLibraryRepository(db) {
            @Override
            protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
                // the sample and curve rows exist inside the transaction at this point
                assertThat(t.fetchCount(SAMPLE, SAMPLE.ID.eq(sampleId))).isEqualTo(1);
                throw new IllegalStateException("forced failure after the sample row");
            }
        };
        byte[] bytes = ImportFiles.percentCsv().getBytes(StandardCharsets.UTF_8);

        assertThatThrownBy(() -> service(failing).store("sheet.csv", bytes, ImportOptions.defaults(), newSheet("Illustrative atomic"),
                SampleFields.thickness(3))).hasMessageContaining("forced failure");

        assertThat(rowCounts()).containsExactly(0, 0, 0, 0, 0);
        assertThat(invalidations.get()).isZero();
    }

    @Test
    void storedImportInvalidatesTheSearchStoreOnceAndADuplicateDoesNot() throws ImportException {
        ImportService imports = service(new JooqLibraryRepository(db));
        byte[] bytes = ImportFiles.percentCsv().getBytes(StandardCharsets.UTF_8);
        ImportResult first = imports.store("sheet.csv", bytes, ImportOptions.defaults(), newSheet("Illustrative once"),
                SampleFields.thickness(3));

        ImportResult again = imports.store("sheet.csv", bytes, ImportOptions.defaults(),
                new ImportTarget.ExistingMaterial(first.materialId()), SampleFields.thickness(3));

        assertThat(again.duplicate()).isTrue();
        assertThat(again.sampleId()).isEqualTo(first.sampleId());
        assertThat(invalidations.get()).isEqualTo(1);
        assertThat(rowCounts()).containsExactly(1, 1, 1, 1, 1);
    }

    @Test
    void aSecondNewMaterialOfTheSameNameIsRefusedNamingTheExistingOne() throws ImportException {
        ImportService imports = service(new JooqLibraryRepository(db));
        byte[] bytes = ImportFiles.percentCsv().getBytes(StandardCharsets.UTF_8);
        long id = imports.store("a.csv", bytes, ImportOptions.defaults(), newSheet("Illustrative twin"), SampleFields.thickness(3))
                .materialId();

        assertThatThrownBy(() -> imports.store("a.csv", bytes, ImportOptions.defaults(), newSheet("illustrative TWIN"),
                SampleFields.thickness(3)))
                .isInstanceOf(ImportRequestException.class).hasMessageContaining("materialId=" + id);
    }

    @Test
    void rawCountsKeepTheirPerPointDetectionLimitsWhenStored() throws ImportException {
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        ImportResult r = service(library).store("capture.csv", ImportFiles.rawCounts().getBytes(StandardCharsets.UTF_8),
                ImportOptions.defaults(), newSheet("Illustrative captured"), SampleFields.thickness(2));

        var curve = library.findCurve(r.sampleId()).orElseThrow();
        assertThat(curve).isEqualTo(r.preview().curve());
        assertThat(r.sample().provenance().label()).isEqualTo("measured");
    }

    /**
     * Mutated files through the service: each attempt either stores one complete sample (as many curve
     * points as the preview parsed, the original bytes kept under the file's checksum) or stores
     * nothing and throws one of the exceptions the API answers with a 4xx. Any other exception would be
     * a 500 and fails the test.
     */
    @Test
    void everyMutatedFileIsStoredWholeOrNotAtAll() {
        JooqLibraryRepository library = new JooqLibraryRepository(db);
        ImportService imports = service(library);
        Random random = new Random(20261202);
        List<String> seeds = List.of(ImportFiles.percentCsv(), ImportFiles.jcamp(), ImportFiles.datasheetPoints(),
                ImportFiles.rawCounts(), ImportFiles.csvWithThickness(2));
        int stored = 0;
        int refused = 0;
        List<String> unexpected = new ArrayList<>();
        for (int attempt = 0; attempt < 400; attempt++) {
            String seed = seeds.get(attempt % seeds.size());
            byte[] bytes = mutate(seed.getBytes(StandardCharsets.UTF_8), random);
            List<Integer> before = rowCounts();
            String name = "fuzz-" + attempt + (attempt % 7 == 0 ? ".jdx" : ".csv");
            try {
                ImportResult r = imports.store(name, bytes, ImportOptions.defaults(), newSheet("Illustrative fuzz " + attempt),
                        SampleFields.thickness(1 + attempt % 5));
                assertThat(db.select(CURVE.POINT_COUNT).from(CURVE).where(CURVE.SAMPLE_ID.eq(r.sampleId()))
                        .fetchOne(CURVE.POINT_COUNT)).as(name).isEqualTo(r.preview().pointCount());
                SourceFile kept = library.findSourceFile(r.sampleId()).orElseThrow();
                assertThat(kept.bytes()).as(name).isEqualTo(bytes);
                assertThat(kept.sha256()).isEqualTo(Checksums.sha256(bytes));
                assertThat(rowCounts().get(1)).isEqualTo(before.get(1) + 1);
                stored++;
            } catch (ImportException | IngestException | ImportLimitException | ImportRequestException e) {
                assertThat(rowCounts()).as(name + " refused: " + e.getMessage()).isEqualTo(before);
                assertThat(e.getMessage()).as(name).isNotBlank();
                refused++;
            } catch (RuntimeException e) {
                unexpected.add(name + ": " + e);
            }
        }
        assertThat(unexpected).isEmpty();
        // both branches must have been exercised for the property to mean anything
        assertThat(stored).isGreaterThan(20);
        assertThat(refused).isGreaterThan(20);
    }

    private static final String NOISE = "0123456789.,-;#%\n\t eE+xX<";

    private static byte[] mutate(byte[] seed, Random random) {
        byte[] b = seed.clone();
        int edits = 1 + random.nextInt(4);
        for (int e = 0; e < edits; e++) {
            int at = random.nextInt(b.length);
            switch (random.nextInt(6)) {
                case 0 -> b[at] = (byte) NOISE.charAt(random.nextInt(NOISE.length()));
                case 1 -> b[at] = (byte) random.nextInt(256);
                case 2 -> b = cut(b, at, Math.min(b.length, at + 1 + random.nextInt(20)));
                case 3 -> b = duplicateLine(b, at);
                case 4 -> b = java.util.Arrays.copyOf(b, Math.max(1, at));
                default -> b[at] = (byte) Character.toUpperCase((char) b[at]);
            }
            if (b.length == 0) {
                b = new byte[] {'\n'};
            }
        }
        return b;
    }

    private static byte[] cut(byte[] b, int from, int to) {
        byte[] out = new byte[b.length - (to - from)];
        System.arraycopy(b, 0, out, 0, from);
        System.arraycopy(b, to, out, from, b.length - to);
        return out;
    }

    private static byte[] duplicateLine(byte[] b, int at) {
        String s = new String(b, StandardCharsets.ISO_8859_1);
        int start = s.lastIndexOf('\n', Math.max(0, at - 1)) + 1;
        int end = s.indexOf('\n', at);
        end = end < 0 ? s.length() : end + 1;
        String line = s.substring(start, end);
        return (s.substring(0, end) + line + s.substring(end)).getBytes(StandardCharsets.ISO_8859_1);
    }
}
