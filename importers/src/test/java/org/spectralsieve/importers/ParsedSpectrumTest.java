package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ParsedSpectrumTest {

    private static ParsedSpectrum of(double[] x, double[] y, YKind kind) {
        return ParsedSpectrum.of("t.csv", x, y, null, kind, XUnit.NANOMETRE, Map.of(), List.of());
    }

    // Absorbance (= optical density) is −log10 T: ANSI Z80.3-2001 §3.2 (REFERENCE.md §6);
    // check values T = 0.1 → A = 1, T = 0.01 → A = 2, T = 1e-3 → A = 3 from there.
    @ParameterizedTest
    @CsvSource({"ABSORBANCE, 1, 0.1", "ABSORBANCE, 2, 0.01", "ABSORBANCE, 3, 0.001",
            "TRANSMITTANCE_PERCENT, 91.0, 0.91", "TRANSMITTANCE_FRACTION, 0.25, 0.25"})
    void valuesConvertToTransmittanceFractions(YKind kind, double value, double fraction) {
        ParsedSpectrum s = of(new double[] {300, 400}, new double[] {value, value}, kind);

        assertThat(s.transmittanceFractions()[1]).isCloseTo(fraction, within(1e-15));
        assertThat(s.values()[1]).isEqualTo(value); // values stay as written
    }

    // 1 µm = 1000 nm: SI prefixes (SI Brochure, 9th ed., BIPM 2019, Table 7); 1 Å = 0.1 nm: SI Brochure,
    // 8th ed. (BIPM 2006), Table 8 (cited from memory).
    @ParameterizedTest
    @CsvSource({"MICROMETRE, 0.365, 365.0", "ANGSTROM, 3650, 365.0", "NANOMETRE, 405.5, 405.5"})
    void unitsConvertToNanometres(XUnit unit, double value, double nm) {
        assertThat(unit.toNanometres(value)).isEqualTo(nm);
    }

    @Test
    void copiesItsArraysInAndOut() {
        double[] x = {300, 400};
        ParsedSpectrum s = of(x, new double[] {0.1, 0.2}, YKind.TRANSMITTANCE_FRACTION);
        x[0] = 999;
        s.wavelengthsNm()[1] = 999;

        assertThat(s.wavelengthsNm()).containsExactly(300, 400);
    }

    @Test
    void metadataKeysAreLowerCasedTrimmedAndKeptInOrder() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put(" Thickness_MM ", "3");
        m.put("Geometry", "total");
        ParsedSpectrum s = ParsedSpectrum.of("t.csv", new double[] {1, 2}, new double[] {0, 0}, null,
                YKind.ABSORBANCE, XUnit.NANOMETRE, m, List.of());

        assertThat(s.metadata()).containsExactly(Map.entry("thickness_mm", "3"), Map.entry("geometry", "total"));
        assertThatThrownBy(() -> s.metadata().put("x", "y")).isInstanceOf(UnsupportedOperationException.class);
    }

    @Test
    void refusesUnequalLengths() {
        assertThatThrownBy(() -> of(new double[] {1, 2, 3}, new double[] {0, 0}, YKind.ABSORBANCE))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("3 wavelengths, 2 values");
    }

    @Test
    void refusesASinglePoint() {
        assertThatThrownBy(() -> of(new double[] {1}, new double[] {0}, YKind.ABSORBANCE))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("at least 2 points, got 1");
    }

    @Test
    void refusesANonFiniteValueNamingItsIndex() {
        assertThatThrownBy(() -> of(new double[] {1, 2}, new double[] {0, Double.NaN}, YKind.ABSORBANCE))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("index 1").hasMessageContaining("NaN");
    }
}
