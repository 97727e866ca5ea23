package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.UnusableIndex;
import org.spectralsieve.spectrum.Curve;

/** The records to be stored refuse what may not be stored, naming the field (docs/validation.md). */
class StoredValuesTest {

    private static final Curve CURVE = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.7}, 0);
    private static final String SHA = "0".repeat(64);

    private static NewSample sample(double mm, String instrument, String notes, Curve curve) {
        return new NewSample(mm, Geometry.REGULAR, Provenance.MEASURED, instrument, LocalDate.of(2026, 1, 5), "A1", notes,
                0, curve, "sheet.csv", SHA);
    }

    private static NewMaterial material(String name, String description) {
        return new NewMaterial("illustrative-sheet", name, MaterialClass.of("plastic sheet"), description, List.of(),
                Scaling.BULK, new ConstantIndex(1.49));
    }

    @ParameterizedTest(name = "U+{0}")
    @ValueSource(ints = {0x00, 0x07, 0x1B, 0x7F, 0x0A, 0x061C, 0x200E, 0x200F, 0x202A, 0x202E, 0x2066, 0x2069})
    void aNameHoldingAControlOrBidirectionalControlCharacterIsRefused(int codePoint) {
        String name = "Illustrative " + Character.toString(codePoint) + "sheet";
        assertThatThrownBy(() -> material(name, "")).isInstanceOf(FieldException.class)
                .hasMessageContaining(String.format("U+%04X", codePoint))
                .satisfies(e -> assertThat(((FieldException) e).field()).isEqualTo("name"));
    }

    @Test
    void aNameWithAccentsAndCharactersBeyondTheBasicPlaneIsAccepted() {
        assertThat(material("Illustrative Glasplatte \u00e9 \uD83D\uDD06", "").name()).contains("\uD83D\uDD06");
    }

    @Test
    void anUnpairedSurrogateIsRefused() {
        assertThatThrownBy(() -> material("Illustrative \uD83D sheet", "")).hasMessageContaining("unpaired surrogate");
    }

    @Test
    void aNameLongerThanItsColumnIsRefusedAndOneThatFitsIsAccepted() {
        assertThat(material("x".repeat(200), "").name()).hasSize(200);
        assertThatThrownBy(() -> material("x".repeat(201), "")).hasMessageContaining("at most 200 characters");
    }

    @Test
    void aDescriptionMayRunOverLinesButHoldNoOtherControlCharacter() {
        assertThat(material("Illustrative sheet", "first\tline\r\nsecond").description()).contains("\t");
        assertThatThrownBy(() -> material("Illustrative sheet", "bell \u0007"))
                .satisfies(e -> assertThat(((FieldException) e).field()).isEqualTo("description"));
    }

    @ParameterizedTest(name = "{0} mm")
    @ValueSource(doubles = {1e-300, 1e308, 0.0005, 1500})
    void aSampleThicknessOutsideOneMicrometreToOneMetreIsRefusedNamingTheField(double mm) {
        assertThatThrownBy(() -> sample(mm, "bench", "", CURVE))
                .satisfies(e -> assertThat(((FieldException) e).field()).isEqualTo("thicknessMm"));
    }

    @Test
    void anInstrumentWithABidirectionalOverrideIsRefusedNamingTheField() {
        assertThatThrownBy(() -> sample(3, "bench \u202Eevil", "", CURVE))
                .satisfies(e -> assertThat(((FieldException) e).field()).isEqualTo("instrument"));
    }

    @Test
    void aCurveReachingBeyondTheToolsWavelengthsIsRefused() {
        Curve far = Curve.of(new double[] {300, 1e300}, new double[] {0.3, 0.7}, 0);
        assertThatThrownBy(() -> sample(3, "bench", "", far))
                .satisfies(e -> assertThat(((FieldException) e).field()).isEqualTo("wavelength"));
    }

    @Test
    void aMeasurementDateInTheFutureIsRefused() {
        assertThatThrownBy(() -> new NewSample(3, Geometry.REGULAR, Provenance.MEASURED, "", LocalDate.now().plusYears(1),
                "", "", 0, CURVE, "", SHA)).satisfies(e -> assertThat(((FieldException) e).field()).isEqualTo("measuredOn"));
    }

    @Test
    void stockAndMadeThicknessesOutsideTheRangeAreRefused() {
        assertThatThrownBy(() -> new StatedThicknesses(List.of(3.0, 1e308), Double.NaN, Double.NaN))
                .hasMessageContaining("stock thickness");
        assertThatThrownBy(() -> new StatedThicknesses(List.of(), 1e-300, 5)).hasMessageContaining("thinnest end");
    }

    @Test
    void aStoredSampleOfAnAbsurdThicknessCannotBeRescaledAndSaysWhy() {
        Material m = new Material(1, "illustrative-sheet", "Illustrative sheet", MaterialClass.of("plastic sheet"), "",
                List.of(), Scaling.BULK, new ConstantIndex(1.49), List.of());
        SampleInfo s = new SampleInfo(2, 1, 1e308, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "", 0);
        SampleRescaling r = SampleRescaling.of(m, s);
        assertThat(r.rescalable()).isFalse();
        assertThat(r.reason()).startsWith("could not be computed: the stored thickness 1.0E308 mm");
    }

    @Test
    void aStoredSampleOfAMaterialWithAnUnusableIndexCannotBeRescaledAndSaysWhy() {
        Material m = new Material(1, "illustrative-sheet", "Illustrative sheet", MaterialClass.of("plastic sheet"), "",
                List.of(), Scaling.BULK, new UnusableIndex("constant n = 1.0E16", "out of range"), List.of());
        SampleInfo s = new SampleInfo(2, 1, 3, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "", 0);
        assertThat(SampleRescaling.of(m, s).reason()).contains("could not be computed", "constant n = 1.0E16");
    }
}
