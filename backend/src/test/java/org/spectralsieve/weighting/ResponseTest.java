package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ResponseTest {

    /**
     * Source: CIE erythema reference action spectrum, ISO/CIE 17166:2019 = CIE S 007/E-1998, formula as on
     * the IES "erythemal action spectrum" definitions page and in UVSV Anlage 2; values are the check
     * table of the project's reference sheet §1 (computed from that formula, standard 140 variant).
     */
    @ParameterizedTest
    @CsvSource({
        "250, 1",
        "298, 1",
        "300, 0.6486344",
        "310, 0.07447320",
        "320, 8.550667e-3",
        "328, 1.513561e-3",
        "340, 1.000000e-3",
        "365, 4.216965e-4",
        "400, 1.258925e-4"})
    void erythemaWeightMatchesTheIsoCie17166Table(double nm, double expected) {
        assertThat(Response.erythema().weightAt(nm)).isCloseTo(expected, within(expected * 1e-6));
    }

    /** ISO/CIE 17166 form with 140: 0.094·30 = 2.82 = 0.015·188, so both branches meet at 328 nm (§1). */
    @Test
    void erythemaIsContinuousAt328Nanometres() {
        double below = Response.erythema().weightAt(328);
        double above = Response.erythema().weightAt(328 + 1e-9);
        assertThat(above / below).isCloseTo(1.0, within(1e-8));
    }

    /** The 0 above 400 nm and the 250 nm lower end are the convention stated with the formula (§1). */
    @Test
    void erythemaIsZeroOutsideItsDefinedRange() {
        assertThat(Response.erythema().weightAt(400.5)).isZero();
        assertThat(Response.erythema().weightAt(249.5)).isZero();
    }

    /**
     * Source: ACGIH 2006 TLV table of S(λ) (ICNIRP 1999; NRPB Documents 13(3) App. B) as carried in the
     * project's reference sheet §4.
     */
    @ParameterizedTest
    @CsvSource({"254, 0.500", "270, 1.000", "300, 0.300", "313, 0.006", "365, 0.00011", "180, 0.012", "400, 0.000030"})
    void actinicHazardMatchesTheAcgihTable(double nm, double expected) {
        assertThat(Response.actinicUv().weightAt(nm)).isCloseTo(expected, within(expected * 1e-12));
    }

    /** Between rows S is log-linear: at 252 nm, the geometric mean of 0.430 (250) and 0.500 (254) (§4). */
    @Test
    void actinicHazardInterpolatesInLogBetweenRows() {
        assertThat(Response.actinicUv().weightAt(252)).isCloseTo(Math.sqrt(0.430 * 0.500), within(1e-12));
    }

    /**
     * Source: IEC 62471:2006 B(λ) as coded in luxpy (reference sheet §4): 435 nm → 1, 400 nm → 0.10, and
     * the 500-600 nm formula 10^((450−λ)/50): 520 → 0.0398, 550 → 0.01.
     */
    @ParameterizedTest
    @CsvSource({"435, 1.00", "400, 0.10", "380, 0.01", "520, 0.0398107", "550, 0.01", "650, 0.001"})
    void blueLightHazardMatchesTheIec62471Values(double nm, double expected) {
        assertThat(Response.blueLight().weightAt(nm)).isCloseTo(expected, within(expected * 1e-5));
    }

    /** Log-linear interpolation reproduces the exponential 500-600 nm branch between 5 nm rows (§4). */
    @Test
    void blueLightHazardFollowsItsExponentialBranchBetweenRows() {
        assertThat(Response.blueLight().weightAt(532)).isCloseTo(Math.pow(10, (450 - 532) / 50.0), within(1e-7));
    }

    @Test
    void catalogueResponsesAreFoundByNameIgnoringCase() {
        assertThat(Response.named("Erythema")).contains(Response.erythema());
        assertThat(Response.named("uv-b")).isEmpty();
    }
}
