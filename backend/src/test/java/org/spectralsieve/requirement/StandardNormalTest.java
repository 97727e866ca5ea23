package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The core's standard normal distribution function (Abramowitz &amp; Stegun 26.2.17) against a named
 * table and a general reference library.
 */
class StandardNormalTest {

    /**
     * NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.1, "Cumulative Distribution Function of the
     * Standard Normal Distribution": the table gives the area from 0 to z (five decimals), so Φ(z) = 0.5 +
     * that area. Entries quoted from the table as remembered; the library check below confirms them.
     */
    @ParameterizedTest(name = "Φ({0}) = 0.5 + {1}")
    @CsvSource({
            "1.00, 0.34134",
            "1.64, 0.44950",
            "1.65, 0.45053",
            "1.96, 0.47500",
            "2.33, 0.49010",
            "3.00, 0.49865"})
    void matchesTheNistTableOfTheNormalDistributionToItsFiveDecimals(double z, double areaFromZero) {
        assertThat(StandardNormal.cdf(z)).isCloseTo(0.5 + areaFromZero, within(0.6e-5));
        // the table is one-sided: the other side by symmetry, Φ(−z) = 0.5 − area
        assertThat(StandardNormal.cdf(-z)).isCloseTo(0.5 - areaFromZero, within(0.6e-5));
    }

    @Test
    void theUsualOneSidedQuantilesGiveTheirLevels() {
        // NIST/SEMATECH e-Handbook §1.3.6.7.1 (critical values): z = 1.645 for 95 %, 2.326 for 99 %, 1 for 84.13 %
        assertThat(StandardNormal.cdf(1.645)).isCloseTo(0.9500, within(0.5e-4));
        assertThat(StandardNormal.cdf(2.326)).isCloseTo(0.9900, within(0.5e-4));
        assertThat(StandardNormal.cdf(1.0)).isCloseTo(0.8413, within(0.5e-4));
        assertThat(StandardNormal.cdf(0.0)).isCloseTo(0.5, within(1e-9));
    }

    @Test
    void agreesWithAReferenceLibraryWithinTheStatedErrorOfTheApproximation() {
        // Apache Commons Math 3 NormalDistribution (a general reference library); A&S 26.2.17 promises |ε| < 7.5e-8
        NormalDistribution reference = new NormalDistribution(0, 1);
        for (double z = -8; z <= 8; z += 0.01) {
            assertThat(StandardNormal.cdf(z)).as("z = %s", z).isCloseTo(reference.cumulativeProbability(z), within(7.5e-8));
        }
    }

    @Test
    void farTailsAndNaNAreAnsweredWithoutArithmeticTrouble() {
        assertThat(StandardNormal.cdf(60)).isEqualTo(1);
        assertThat(StandardNormal.cdf(-60)).isEqualTo(0);
        assertThat(StandardNormal.cdf(Double.POSITIVE_INFINITY)).isEqualTo(1);
        assertThat(StandardNormal.cdf(Double.NEGATIVE_INFINITY)).isEqualTo(0);
        assertThat(StandardNormal.cdf(Double.NaN)).isNaN();
    }
}
