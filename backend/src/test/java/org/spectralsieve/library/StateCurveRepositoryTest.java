package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;
import static org.spectralsieve.library.db.Tables.SAMPLE_STATE_CURVE;

import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.audit.AuditEntry;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.Printing;
import org.spectralsieve.states.StateCurve;
import org.spectralsieve.states.StateKind;

/** A sample's state curves (V13) stored, read, retired and restored by the repository, without Spring. */
class StateCurveRepositoryTest {

    private DSLContext db;
    private JooqLibraryRepository library;
    private long sampleId;

    @BeforeEach
    void migrateFreshDatabaseWithOneSample() {
        db = freshDatabase();
        library = new JooqLibraryRepository(db);
        long materialId = library.insertMaterial(new NewMaterial("lamp-cover", "Illustrative lamp cover",
                MaterialClass.of("plastic sheet"), "", List.of(), Scaling.BULK, new ConstantIndex(1.49)));
        Curve own = ramp(0.0, 0.9, 0.001);
        sampleId = library.insertSample(materialId, new NewSample(3.0, Geometry.REGULAR, Provenance.MEASURED, "bench",
                LocalDate.of(2026, 3, 1), "FH-1", "", 0.001, own, "new.csv", "0".repeat(64)));
    }

    /** A migrated, empty database per test; {@link PostgresStateCurveRepositoryTest} gives one on PostgreSQL. */
    DSLContext freshDatabase() {
        return MigratedDatabase.freshH2();
    }

    @Test
    void agedCurveWithItsFileRoundTripsWithItsExposureAndEveryPointBitExact() {
        double[] nm = {280.5, 300.25, 320.125, 360.0, 400.0};
        double[] t = {0.0004, 0.0123456789, 0.3333333333333333, 0.71, 0.9};
        double[] limits = {0.001, 0.002, 0.001, 0.001, 0.001}; // per point, as raw counts give
        boolean[] below = {true, false, false, false, false};
        Curve curve = Curve.of(nm, t, below, limits).withAbsorbanceUncertainty(new double[] {Double.NaN, 0.01, 0.002, 0.001, 0.001});
        byte[] bytes = "wavelength_nm,transmittance\n280.5,0.0004\n".getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile("aged-2000h.csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        MaterialState aged = MaterialState.aged(Exposure.hours(2000, "lamp bank B"));

        long id = library.storeStateCurve(sampleId, NewStateCurve.fromFile(aged, curve, 3.0, 0.001, "after the run", file));

        StoredStateCurve back = library.findStateCurve(id).orElseThrow();
        assertThat(back.sampleId()).isEqualTo(sampleId);
        assertThat(back.stateCurve().state()).isEqualTo(aged);
        assertThat(back.stateCurve().thicknessMm()).isEqualTo(3.0);
        assertThat(back.notes()).isEqualTo("after the run");
        assertThat(back.hasSourceFile()).isTrue();
        assertThat(back.retiredAt()).isNull();
        Curve c = back.stateCurve().curve();
        for (int i = 0; i < nm.length; i++) {
            assertThat(Double.doubleToRawLongBits(c.wavelengthNm(i))).isEqualTo(Double.doubleToRawLongBits(nm[i]));
            assertThat(Double.doubleToRawLongBits(c.transmittance(i))).isEqualTo(Double.doubleToRawLongBits(t[i]));
            assertThat(c.detectionLimit(i)).isEqualTo(limits[i]);
            assertThat(c.belowDetection(i)).isEqualTo(below[i]);
        }
        assertThat(c.absorbanceUncertainties()[2]).isEqualTo(0.002);
        assertThat(library.findStateCurveSourceFile(id)).contains(file);
        assertThat(library.findStateCurves(sampleId)).extracting(StateCurve::id).containsExactly(id);
    }

    @Test
    void doseAndPrintedStatesRoundTripAndAreListedInOrderOfId() {
        MaterialState dose = MaterialState.aged(Exposure.dose(50, 365));
        MaterialState inkOnly = MaterialState.printed(new Printing(100, Double.NaN));
        MaterialState densityOnly = MaterialState.printed(new Printing(Double.NaN, 4.0));
        long a = library.storeStateCurve(sampleId, modelled(dose, Double.NaN));
        long b = library.storeStateCurve(sampleId, modelled(inkOnly, 0.1));
        long c = library.storeStateCurve(sampleId, modelled(densityOnly, 0.1));

        List<StateCurve> states = library.findStateCurves(sampleId);

        assertThat(states).extracting(StateCurve::id).containsExactly(a, b, c);
        assertThat(states).extracting(StateCurve::state).containsExactly(dose, inkOnly, densityOnly);
        assertThat(states.get(0).thicknessMm()).isNaN();
        assertThat(library.findStateCurveSourceFile(a)).isEmpty();
    }

    @Test
    void retiredStateCurveIsLeftOutOfUseAndRestoredWithItsIdWhileNewOnesNeverTakeAnOldId() {
        MaterialState aged = MaterialState.aged(Exposure.hours(500, "lamp bank B"));
        long first = library.storeStateCurve(sampleId, modelled(aged, 3.0));
        long generation = library.generation();

        var retired = library.setStateCurveRetired(first, true);

        assertThat(retired.changed()).isTrue();
        assertThat(retired.retiredAt()).isNotNull();
        assertThat(library.generation()).isGreaterThan(generation);
        assertThat(library.findStateCurves(sampleId)).isEmpty();
        assertThat(library.findStoredStateCurves(sampleId, true)).extracting(StoredStateCurve::id).containsExactly(first);
        assertThat(library.setStateCurveRetired(first, true).changed()).isFalse();

        long second = library.storeStateCurve(sampleId, modelled(aged, 3.0));
        assertThat(second).isGreaterThan(first);

        var restored = library.setStateCurveRetired(first, false);
        assertThat(restored.changed()).isTrue();
        assertThat(restored.retiredAt()).isNull();
        assertThat(library.findStateCurves(sampleId)).extracting(StateCurve::id).containsExactly(first, second);
        assertThat(db.fetchCount(SAMPLE_STATE_CURVE)).isEqualTo(2);
    }

    @Test
    void everyWriteLeavesOneAuditEntryNamingTheStateCurveAndItsMaterial() {
        long id = library.storeStateCurve(sampleId, modelled(MaterialState.printed(new Printing(100, Double.NaN)), 0.1));
        library.setStateCurveRetired(id, true);
        library.setStateCurveRetired(id, false);

        var entries = db.selectFrom(AUDIT_ENTRY).where(AUDIT_ENTRY.SUBJECT_KIND.eq(AuditEntry.SUBJECT_STATE_CURVE))
                .orderBy(AUDIT_ENTRY.ID).fetch();
        assertThat(entries).extracting(r -> r.getAction()).containsExactly(AuditEntry.ACTION_IMPORT,
                AuditEntry.ACTION_RETIRE, AuditEntry.ACTION_RESTORE);
        assertThat(entries).allSatisfy(r -> {
            assertThat(r.getSubjectId()).isEqualTo(id);
            assertThat(r.getMaterialId()).isEqualTo(library.findSample(sampleId).orElseThrow().materialId());
        });
        assertThat(entries.get(0).getSummary()).contains("printed black, 100 % ink");
    }

    @Test
    void unknownOrRetiredSampleTakesNoStateCurveAndNothingIsWritten() {
        NewStateCurve c = modelled(MaterialState.aged(Exposure.hours(10, "")), 3.0);
        assertThatThrownBy(() -> library.storeStateCurve(sampleId + 1000, c)).isInstanceOf(NotFoundException.class);
        new JooqLibraryRevisions(db).setRetired(JooqLibraryRevisions.Kind.SAMPLE, sampleId, true);
        long generation = library.generation();

        assertThatThrownBy(() -> library.storeStateCurve(sampleId, c)).isInstanceOf(RetiredException.class);

        assertThat(db.fetchCount(SAMPLE_STATE_CURVE)).isZero();
        assertThat(library.generation()).isEqualTo(generation);
        assertThatThrownBy(() -> library.setStateCurveRetired(99, true)).isInstanceOf(NotFoundException.class);
    }

    @Test
    void asSuppliedIsNeverAStateCurveRow() {
        assertThatThrownBy(() -> modelled(MaterialState.AS_SUPPLIED, 3.0)).isInstanceOf(FieldException.class)
                .hasMessageContaining("as-supplied");
        assertThat(StateKind.fromWord("aged")).isEqualTo(StateKind.AGED);
    }

    private static NewStateCurve modelled(MaterialState state, double thicknessMm) {
        return new NewStateCurve(state, ramp(0.0, 0.8, 0.001), thicknessMm, 0.001, "", null, "modelled",
                "a".repeat(64));
    }

    private static Curve ramp(double from, double to, double limit) {
        double[] nm = new double[31];
        double[] t = new double[31];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = 280 + 4 * i;
            t[i] = from + (to - from) * i / (nm.length - 1);
        }
        return Curve.of(nm, t, limit);
    }
}
