package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class TransmittanceTest {

    // Definition OD = −log10 T: ANSI Z80.3-2001 §3.2 (REFERENCE §6); OD 1 = 10 %, 3 = 0.1 %, 6 = 0.0001 %
    // is common practice following from it.
    @ParameterizedTest(name = "OD {0} is {1} %")
    @CsvSource({"1, 10", "3, 0.1", "6, 0.0001", "2, 1"})
    void opticalDensityConvertsToPercentAndBack(double od, double percent) {
        double t = Transmittance.fromPercent(percent);
        assertThat(Transmittance.toOpticalDensity(t)).isCloseTo(od, within(1e-12));
        assertThat(Transmittance.toPercent(Transmittance.fromOpticalDensity(od))).isCloseTo(percent, within(1e-12 * 100));
    }

    // REFERENCE §6 check values [C] from OD = −log10 T (ANSI Z80.3-2001 §3.2)
    @ParameterizedTest(name = "T {0} has OD {1}")
    @CsvSource({"0.8, 0.096910", "0.5, 0.301030", "0.1, 1", "0.01, 2", "1e-3, 3", "1e-6, 6", "0.923077, 0.0348"})
    void opticalDensityOfPartialTransmittanceMatchesReferenceTable(double t, double od) {
        // the lossless n = 1.5 slab's 0.0348 is printed to 4 decimals in §6
        assertThat(Transmittance.toOpticalDensity(t)).isCloseTo(od, within(od < 0.05 ? 5e-5 : 1e-6));
        assertThat(Transmittance.fromOpticalDensity(od)).isCloseTo(t, within(t * (od < 0.05 ? 2e-4 : 3e-6)));
    }

    @Test
    void zeroTransmittanceHasInfiniteDensity() {
        // definition: −log10 0 → +∞ (ANSI Z80.3-2001 §3.2)
        assertThat(Transmittance.toOpticalDensity(0)).isInfinite().isPositive();
        assertThat(Transmittance.toOpticalDensity(-0.001)).isInfinite().isPositive();
    }
}
