package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.OffsetDateTime;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.jooq.Table;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.db.Tables;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.requirement.ClauseResult;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.Shortlist;
import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;
import org.springframework.context.ConfigurableApplicationContext;

/** The checks a restored library must pass against the library it was backed up from. */
final class RestoredLibrary {

    /**
     * Requirements of several kinds: spectral at a thickness, over a thickness range, weighted by built-in
     * figures, behind a fixed layer, and weighted by the imported emitter and response.
     */
    static final List<String> REQUIREMENTS = List.of(
            "passes over 80% at 365 nm and blocks under 1% at 405 nm, at 3 mm",
            "blocks under 1% from 350 to 405 nm, thickness 1 to 8 mm",
            "erythemal under 1% and passes over 80% of led 405, thickness 1 to 6 mm",
            "blocks under 1% at 405 nm and luminous over 70%, behind 4 mm clear float glass",
            "blocks under 5% of " + SourceLibrary.EMITTER,
            "passes over 50% of " + SourceLibrary.EMITTER + " weighted by " + SourceLibrary.RESPONSE);

    private RestoredLibrary() {
    }

    /** Every table row for row, every curve bit for bit, the same shortlists, the same imported spectra. */
    static void assertSameAs(ConfigurableApplicationContext source, ConfigurableApplicationContext restored) {
        assertSameAs(source, restored, 1);
    }

    /**
     * The same, for a library restored {@code restores} times in a row from archives of archives (H2 → PostgreSQL →
     * H2): the audit trail holds the source's entries, ids kept, then one entry of each restore.
     */
    static void assertSameAs(ConfigurableApplicationContext source, ConfigurableApplicationContext restored, int restores) {
        DSLContext from = source.getBean(DSLContext.class);
        DSLContext to = restored.getBean(DSLContext.class);
        for (Table<?> table : LibraryTables.inDependencyOrder()) {
            List<List<Object>> expected = rows(from, table);
            List<List<Object>> actual = rows(to, table);
            if (table.equals(Tables.AUDIT_ENTRY)) {
                // the archive's trail, ids kept, then each restore's own entry, whose id follows the highest before it
                assertThat(actual).as("audit_entry").hasSize(expected.size() + restores);
                long lastId = expected.isEmpty() ? 0L : (Long) expected.get(expected.size() - 1).get(0);
                for (List<Object> restore : actual.subList(expected.size(), actual.size())) {
                    assertThat(restore.get(0)).as("a restore's entry id").isEqualTo(++lastId);
                    assertThat(restore).as("a restore's entry").contains("restore-backup", "library");
                }
                actual = actual.subList(0, expected.size());
            }
            assertThat(actual).as(table.getName()).isEqualTo(expected);
        }
        assertCurvesBitIdentical(source.getBean(JooqLibraryRepository.class), restored.getBean(JooqLibraryRepository.class));
        assertSourceFilesIdentical(source.getBean(JooqLibraryRepository.class), restored.getBean(JooqLibraryRepository.class));
        assertSameSpectra(source.getBean(ImportedSpectrumLookup.class), restored.getBean(ImportedSpectrumLookup.class));
        for (String requirement : REQUIREMENTS) {
            assertThat(shortlist(restored, requirement)).as(requirement).isEqualTo(shortlist(source, requirement))
                    .isNotEmpty();
        }
    }

    /** Rows in key order, binary values as hex, timestamps as instants (PostgreSQL answers them in UTC). */
    static List<List<Object>> rows(DSLContext db, Table<?> table) {
        List<List<Object>> rows = new ArrayList<>();
        for (Record r : db.selectFrom(table).orderBy(LibraryTables.primaryKey(table)).fetch()) {
            List<Object> values = new ArrayList<>();
            for (Object v : r.intoArray()) {
                values.add(v instanceof byte[] b ? HexFormat.of().formatHex(b)
                        : v instanceof OffsetDateTime t ? t.toInstant() : v);
            }
            rows.add(values);
        }
        return rows;
    }

    private static void assertCurvesBitIdentical(JooqLibraryRepository from, JooqLibraryRepository to) {
        Map<Long, Curve> before = from.findAllCurves();
        Map<Long, Curve> after = to.findAllCurves();
        assertThat(after.keySet()).isEqualTo(before.keySet());
        before.forEach((sampleId, curve) -> {
            Curve back = after.get(sampleId);
            assertThat(doubleBits(back.wavelengthsNm())).as("wavelengths of sample " + sampleId)
                    .isEqualTo(doubleBits(curve.wavelengthsNm()));
            assertThat(doubleBits(back.transmittances())).as("transmittance of sample " + sampleId)
                    .isEqualTo(doubleBits(curve.transmittances()));
            assertThat(back).isEqualTo(curve);
        });
    }

    private static long[] doubleBits(double[] values) {
        return Arrays.stream(values).mapToLong(Double::doubleToRawLongBits).toArray();
    }

    private static void assertSourceFilesIdentical(JooqLibraryRepository from, JooqLibraryRepository to) {
        int files = 0;
        for (Material m : from.findMaterials(null, null)) {
            for (SampleInfo s : m.samples()) {
                var original = from.findSourceFile(s.id()).map(RestoredLibrary::describe);
                assertThat(to.findSourceFile(s.id()).map(RestoredLibrary::describe)).as("source file of sample " + s.id())
                        .isEqualTo(original);
                files += original.isPresent() ? 1 : 0;
            }
        }
        assertThat(files).isPositive();
    }

    private static List<String> describe(org.spectralsieve.library.SourceFile f) {
        return List.of(f.fileName(), f.mediaType(), f.format(), f.sha256(), HexFormat.of().formatHex(f.bytes()));
    }

    private static void assertSameSpectra(ImportedSpectrumLookup from, ImportedSpectrumLookup to) {
        to.refresh();
        assertThat(to.emitters().stream().map(Emitter::name).toList())
                .isEqualTo(from.emitters().stream().map(Emitter::name).toList()).contains(SourceLibrary.EMITTER);
        assertThat(to.responses().stream().map(Response::name).toList())
                .isEqualTo(from.responses().stream().map(Response::name).toList()).contains(SourceLibrary.RESPONSE);
        Emitter lamp = to.emitter(SourceLibrary.EMITTER).orElseThrow();
        Emitter original = from.emitter(SourceLibrary.EMITTER).orElseThrow();
        for (double nm = 350; nm <= 380; nm += 0.5) {
            assertThat(lamp.powerAt(nm)).isEqualTo(original.powerAt(nm));
        }
    }

    /** What a user reads off a shortlist: rows, samples, verdicts, values and explanations. */
    static List<String> shortlist(ConfigurableApplicationContext context, String text) {
        SearchService search = context.getBean(SearchService.class);
        Requirement requirement = RequirementParser.parse(text, context.getBean(ImportedSpectrumLookup.class),
                search.materialClasses());
        Shortlist shortlist = search.search(requirement, 15);
        List<String> lines = new ArrayList<>();
        for (RankedRow row : shortlist.rows()) {
            var e = row.evaluation();
            StringBuilder line = new StringBuilder(row.position() + " " + row.materialId() + " " + row.materialName()
                    + " sample " + e.sampleId() + " at " + e.thicknessMm() + " mm " + e.feasibleMm() + " " + e.verdict()
                    + " margin " + e.worstMarginDecades() + " binding " + e.bindingClauseIndex() + " " + e.stockAdvice());
            for (ClauseResult c : e.clauses()) {
                line.append(" | ").append(c.value()).append(' ').append(c.threshold()).append(' ')
                        .append(c.marginDecades()).append(' ').append(c.verdict()).append(' ').append(c.explanation());
            }
            lines.add(line.toString());
        }
        return lines;
    }

    /** The highest id in a table (0 when empty). */
    static long highestId(DSLContext db, Table<?> table) {
        Object max = db.select(org.jooq.impl.DSL.max(table.getIdentity().getField())).from(table).fetchOne(0);
        return max == null ? 0 : ((Number) max).longValue();
    }

    static long count(DSLContext db) {
        long rows = 0;
        for (Table<?> table : LibraryTables.inDependencyOrder()) {
            rows += db.fetchCount(table);
        }
        return rows;
    }
}
