package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.function.IntToDoubleFunction;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * An instrument's floor read as a detection limit, on generated files. The floor of 0.01 %T (about
 * OD 4) is the value a diode-array spectrophotometer reports below its range (SOURCES.md §8 of the
 * shared reference data shows it in measured files); how many points make a floor is our rule
 * (common practice, no source; see {@link InstrumentFloor}).
 */
class InstrumentFloorTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    @Test
    void aClampedFloorBecomesTheDetectionLimitWithAWarning() throws Exception {
        // 190–250 nm clamped at 0.01 %T, then a rising edge to 90 %T
        FilePreview p = read(nm -> nm <= 250 ? 0.01 : Math.min(90, 0.01 + (nm - 250) * 1.5), ImportOptions.defaults());

        assertThat(p.detectionLimit()).isCloseTo(0.0001, within(1e-15));
        Curve c = p.curve();
        for (int i = 0; i < c.size(); i++) {
            assertThat(c.belowDetection(i)).as("point at %s nm", c.wavelengthNm(i)).isEqualTo(c.wavelengthNm(i) <= 250);
        }
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("instrument floor").contains("61 points")
                .contains("0.01000 %T").contains("190–250 nm"));
    }

    @Test
    void aFloorWrittenWithVaryingLastDigitsIsStillOneFloor() throws Exception {
        // exports write the floor as 0.0100000219… and 0.0100000109… %T (SOURCES.md §8)
        FilePreview p = read(nm -> nm <= 200 ? (nm % 2 == 0 ? 0.0100000219591867 : 0.0100000109795873) : 50,
                ImportOptions.defaults());

        assertThat(p.detectionLimit()).isCloseTo(0.000100000219591867, within(1e-15));
        assertThat(p.curve().belowDetection(0)).isTrue();
        assertThat(p.curve().belowDetection(10)).isTrue();
        assertThat(p.curve().belowDetection(11)).isFalse();
    }

    @Test
    void aMinimumThatOccursOnceIsNoFloor() throws Exception {
        // a smooth absorption dip reaching 0.01 %T at one wavelength only
        FilePreview p = read(nm -> 0.01 + Math.abs(nm - 220) * 0.5, ImportOptions.defaults());

        assertThat(p.detectionLimit()).isZero();
        assertThat(p.curve().belowDetectionFlags()).doesNotContain(true);
        assertThat(p.warnings()).noneMatch(w -> w.contains("instrument floor"));
    }

    @Test
    void fourPointsAtTheMinimumAreFewerThanAFloor() throws Exception {
        FilePreview p = read(nm -> nm <= 193 ? 0.01 : 40, ImportOptions.defaults());

        assertThat(p.detectionLimit()).isZero();
        assertThat(p.warnings()).noneMatch(w -> w.contains("instrument floor"));
    }

    @Test
    void aRepeatedMinimumAboveOnePercentIsAClearRegionNotAFloor() throws Exception {
        FilePreview p = read(nm -> nm <= 250 ? 91.0 : 92.0, ImportOptions.defaults());

        assertThat(p.detectionLimit()).isZero();
        assertThat(p.curve().belowDetectionFlags()).doesNotContain(true);
    }

    @Test
    void aStatedLimitAboveTheFloorIsKept() throws Exception {
        FilePreview p = read(nm -> nm <= 250 ? 0.01 : 60, ImportOptions.defaults().withDetectionLimit(0.001));

        assertThat(p.detectionLimit()).isEqualTo(0.001);
        assertThat(p.curve().detectionLimit(0)).isEqualTo(0.001);
        assertThat(p.warnings()).noneMatch(w -> w.contains("instrument floor"));
    }

    @Test
    void aStatedLimitBelowTheFloorIsRaisedToIt() throws Exception {
        FilePreview p = read(nm -> nm <= 250 ? 0.01 : 60, ImportOptions.defaults().withDetectionLimit(0.00001));

        assertThat(p.detectionLimit()).isCloseTo(0.0001, within(1e-15));
        assertThat(p.curve().belowDetection(0)).isTrue();
    }

    /** A comma file in percent, 190–400 nm at 1 nm, T(nm) from {@code percentAt}. */
    private FilePreview read(IntToDoubleFunction percentAt, ImportOptions options) throws Exception {
        StringBuilder csv = new StringBuilder("Wavelength,Transmittance\n");
        for (int nm = 190; nm <= 400; nm++) {
            csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.16g", percentAt.applyAsDouble(nm))).append('\n');
        }
        return reader.read("floor.csv", csv.toString().getBytes(StandardCharsets.UTF_8), options);
    }
}
