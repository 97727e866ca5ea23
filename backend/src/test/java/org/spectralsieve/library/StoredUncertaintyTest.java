package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.CURVE;

import java.time.LocalDate;
import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/** A curve's absorbance uncertainty in curve.absorbance_uncertainty (V8), on a freshly migrated database. */
class StoredUncertaintyTest {

    private DSLContext db;
    private JooqLibraryRepository library;

    @BeforeEach
    void migrateFreshDatabase() {
        db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
    }

    @Test
    void aCurvesUncertaintyRoundTripsBitExactWithItsUnknownPoints() {
        double[] sigma = {Double.NaN, 0.1 / 3, 0.0021};
        Curve curve = Curve.of(new double[] {300, 310, 320}, new double[] {0.0005, 0.3, 0.8}, 0.001)
                .withAbsorbanceUncertainty(sigma);
        long sampleId = library.insertSample(library.insertMaterial(sheet("kept")), sample(curve));

        Curve back = library.findCurve(sampleId).orElseThrow();

        assertThat(back.hasUncertainty()).isTrue();
        assertThat(Double.isNaN(back.absorbanceUncertainty(0))).isTrue();
        assertThat(Double.doubleToRawLongBits(back.absorbanceUncertainty(1))).isEqualTo(Double.doubleToRawLongBits(0.1 / 3));
        assertThat(back).isEqualTo(curve);
    }

    @Test
    void aCurveWithoutUncertaintyStoresNull() {
        Curve curve = Curve.of(new double[] {300, 310}, new double[] {0.3, 0.8}, 0.001);
        long sampleId = library.insertSample(library.insertMaterial(sheet("none")), sample(curve));

        assertThat(db.select(CURVE.ABSORBANCE_UNCERTAINTY).from(CURVE).fetchOne(CURVE.ABSORBANCE_UNCERTAINTY)).isNull();
        assertThat(library.findCurve(sampleId).orElseThrow().hasUncertainty()).isFalse();
    }

    @Test
    void aStoredNegativeUncertaintyIsRefusedOnReadLikeTheOtherArrays() {
        Curve curve = Curve.of(new double[] {300, 310}, new double[] {0.3, 0.8}, 0.001)
                .withAbsorbanceUncertainty(new double[] {0.01, 0.02});
        long sampleId = library.insertSample(library.insertMaterial(sheet("bad")), sample(curve));
        db.update(CURVE).set(CURVE.ABSORBANCE_UNCERTAINTY, PackedArrays.pack(new double[] {0.01, -0.02})).execute();

        assertThatThrownBy(() -> library.findCurve(sampleId)).isInstanceOf(CurveException.class)
                .hasMessageContaining("absorbance uncertainty").hasMessageContaining("310.0 nm");
        assertThat(library.findAllCurves()).doesNotContainKey(sampleId); // the store leaves the bad row out
    }

    @Test
    void aStoredUncertaintyOfTheWrongLengthIsRefusedNamingTheColumn() {
        Curve curve = Curve.of(new double[] {300, 310}, new double[] {0.3, 0.8}, 0.001)
                .withAbsorbanceUncertainty(new double[] {0.01, 0.02});
        long sampleId = library.insertSample(library.insertMaterial(sheet("short")), sample(curve));
        db.update(CURVE).set(CURVE.ABSORBANCE_UNCERTAINTY, PackedArrays.pack(new double[] {0.01})).execute();

        assertThatThrownBy(() -> library.findCurve(sampleId)).hasMessageContaining("curve.absorbance_uncertainty");
    }

    @Test
    void aPointARaisedDetectionLimitMakesABoundLosesItsStandardDeviation() {
        Curve curve = Curve.of(new double[] {300, 310}, new double[] {0.0008, 0.8}, 0.0001)
                .withAbsorbanceUncertainty(new double[] {0.2, 0.002});
        long sampleId = library.insertSample(library.insertMaterial(sheet("raised")), sample(curve));
        // a corrected limit (docs/undo.md) of 0.001 puts T = 0.0008 under it: now only an upper bound
        db.update(org.spectralsieve.library.db.Tables.SAMPLE).set(org.spectralsieve.library.db.Tables.SAMPLE.DETECTION_LIMIT, 0.001)
                .execute();

        Curve back = library.findCurve(sampleId).orElseThrow();

        assertThat(back.belowDetection(0)).isTrue();
        assertThat(back.absorbanceUncertainty(0)).isNaN();
        assertThat(back.absorbanceUncertainty(1)).isEqualTo(0.002);
    }

    private static NewMaterial sheet(String slug) {
        return new NewMaterial(slug, "Fernhollow test sheet " + slug + " (illustrative)", MaterialClass.of("plastic sheet"),
                "", List.of("test"), Scaling.BULK, new ConstantIndex(1.49));
    }

    private static NewSample sample(Curve curve) {
        return new NewSample(3.0, Geometry.REGULAR, Provenance.MEASURED, "test bench", LocalDate.of(2026, 1, 5),
                "lot 1", "", curve.detectionLimit(0), curve, "", "0".repeat(64));
    }
}
