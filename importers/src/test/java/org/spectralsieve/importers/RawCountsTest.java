package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import org.junit.jupiter.api.Test;

/**
 * Raw counts worked by hand. Formulas: T = [S − D]/[R − D] scaled by exposure (REFERENCE.md §11, dark and
 * reference correction, [M, generic]); T_LOD = 3σ_dark/(R − D) (REFERENCE.md §11 after IUPAC Gold Book
 * L03540, k = 3); the sample standard deviation uses n − 1 (textbook statistics). Counts are illustrative.
 */
class RawCountsTest {

    private final RawCountsReader reader = new RawCountsReader();

    private RawCounts read(String text) throws ImportException {
        return reader.read("bench.csv", new StringReader(text));
    }

    /*
     * Darks at 100 ms: two scans 90 and 110 → D = 100, σ = √((10² + 10²)/1) = 14.1421.
     * Darks at 50 ms: 95 and 105 → D = 100, σ = 7.0711.
     * Reference at 50 ms: R − D = 10000, 20000, 5000 → rate 200, 400, 100 per ms.
     * Sample at 100 ms: S − D = 10000, 4000, 40 → rate 100, 40, 0.4 per ms.
     * T = 100/200 = 0.5, 40/400 = 0.1, 0.4/100 = 0.004.
     * T_LOD = 3σ·tR/(tS·(R − D)) = 3·14.1421·50/(100·(R − D)) = 21.2132/(R − D)
     *       = 0.00212132, 0.00106066, 0.00424264 → the third point (0.004) is "< 0.00424264".
     */
    private static final String TWO_EXPOSURES = """
            # scans: 1
            wavelength_nm,dark_100ms.1,dark_100ms.2,dark_50ms.1,dark_50ms.2,reference_50ms,sample_100ms
            365,90,110,95,105,10100,10100
            385,90,110,95,105,20100,4100
            405,90,110,95,105,5100,140
            """;

    @Test
    void darkSubtractionAndExposureRatioGiveTheHandWorkedTransmittance() throws ImportException {
        RawCountsResult r = read(TWO_EXPOSURES).transmittance(RawCountsOptions.defaults());

        double[] t = r.spectrum().values();
        assertThat(t[0]).isCloseTo(0.5, within(1e-12));
        assertThat(t[1]).isCloseTo(0.1, within(1e-12));
        assertThat(r.spectrum().yKind()).isEqualTo(YKind.TRANSMITTANCE_FRACTION);
        assertThat(r.exposureMs()).containsExactly(100, 100, 100);
    }

    @Test
    void detectionLimitIsThreeSigmaOfRepeatedDarksOverTheReferenceSignal() throws ImportException {
        RawCountsResult r = read(TWO_EXPOSURES).transmittance(RawCountsOptions.defaults());

        assertThat(r.detectionLimits()[0]).isCloseTo(0.00212132, within(1e-8));
        assertThat(r.detectionLimits()[1]).isCloseTo(0.00106066, within(1e-8));
        assertThat(r.detectionLimits()[2]).isCloseTo(0.00424264, within(1e-8));
        assertThat(r.spectrum().upperBounds()).containsExactly(false, false, true);
        assertThat(r.spectrum().values()[2]).isCloseTo(0.00424264, within(1e-8));
        assertThat(r.spectrum().metadata().get("detection_limit_method")).contains("2 repeated dark captures");
    }

    @Test
    void strayLightFloorWinsWhereItIsLarger() throws ImportException {
        RawCountsResult r = read(TWO_EXPOSURES).transmittance(RawCountsOptions.defaults().strayLightFloor(0.005));

        assertThat(r.detectionLimits()).containsExactly(0.005, 0.005, 0.005);
        assertThat(r.spectrum().upperBounds()).containsExactly(false, false, true);
    }

    /*
     * One dark capture: σ from its neighbours. Dark 100, 104, 100, 104, 100 (window covers all five):
     * mean 101.6, Σ(d − mean)² = 3·1.6² + 2·2.4² = 19.2, σ = √(19.2/4) = 2.19089.
     * R − D = 1000 everywhere, S = D → T = 0 → reported as "< 3·2.19089/1000 = 0.00657267".
     */
    @Test
    void singleDarkTakesItsNoiseFromNeighbouringPixels() throws ImportException {
        RawCountsResult r = read("""
                # exposure_ms: 20
                wavelength_nm,dark,reference,sample
                400,100,1100,100
                401,104,1104,104
                402,100,1100,100
                403,104,1104,104
                404,100,1100,100
                """).transmittance(RawCountsOptions.defaults());

        assertThat(r.detectionLimits()[2]).isCloseTo(0.00657267, within(1e-8));
        assertThat(r.spectrum().upperBounds()).containsOnly(true);
        assertThat(r.spectrum().metadata().get("detection_limit_method")).contains("±5 neighbouring pixels");
    }

    /*
     * Full scale 1000, saturated at ≥ 980 (98 %). Darks 10 counts at both exposures (σ = 0).
     * Reference 10 ms: R − D = 500, 900, 400, 200, 300 → rate 50, 90, 40, 20, 30.
     * Sample 100 ms: 990, 985 saturated; 410, 210 → rate 4, 2 → T = 0.1, 0.1; 999 saturated.
     * Sample 10 ms: 260, 460 → rate 25, 45 → T = 0.5, 0.5; 990 saturated.
     * So 500, 501 nm come from the 10 ms exposure, 502, 503 nm from 100 ms, and 504 nm is left out.
     */
    @Test
    void longestUnsaturatedExposureIsUsedPerPointAndFullySaturatedPointsAreExcluded() throws ImportException {
        RawCountsResult r = read("""
                wavelength_nm,dark_100ms,dark_10ms,reference_10ms,sample_100ms,sample_10ms
                500,10,10,510,990,260
                501,10,10,910,985,460
                502,10,10,410,410,50
                503,10,10,210,210,30
                504,10,10,310,999,990
                """).transmittance(RawCountsOptions.defaults().fullScale(1000));

        assertThat(r.spectrum().wavelengthsNm()).containsExactly(500, 501, 502, 503);
        assertThat(r.spectrum().values()).containsExactly(0.5, 0.5, 0.1, 0.1);
        assertThat(r.exposureIndex()).containsExactly(1, 1, 0, 0);
        assertThat(r.exposureMs()).containsExactly(10, 10, 100, 100);
        assertThat(r.spectrum().warnings()).anyMatch(w -> w.startsWith("saturated points excluded") && w.contains("1 points at 504.0 nm"));
    }

    @Test
    void flatTopAtTheMaximumCountsAsSaturatedWhenFullScaleIsUnknown() throws ImportException {
        RawCountsResult r = read("""
                # exposure_ms: 5
                wavelength_nm,dark,reference,sample
                600,0,1000,100
                601,0,1000,500
                602,0,1000,500
                603,0,1000,500
                604,0,1001,200
                """).transmittance(RawCountsOptions.defaults());

        assertThat(r.spectrum().wavelengthsNm()).containsExactly(600, 604);
        assertThat(r.spectrum().warnings()).anyMatch(w -> w.contains("3 points at 601.0, 602.0, 603.0 nm"));
    }

    @Test
    void missingDarkAtAnExposureUsesTheOnlyDarkAsItIsWithAWarning() throws ImportException {
        RawCountsResult r = read("""
                wavelength_nm,dark_10ms,reference_10ms,sample_40ms
                365,100,1100,2100
                405,100,2100,2100
                """).transmittance(RawCountsOptions.defaults());

        // (2100 − 100)/40 / ((1100 − 100)/10) = 50/100 = 0.5; (2000/40)/(2000/10) = 0.25
        assertThat(r.spectrum().values()).containsExactly(0.5, 0.25);
        assertThat(r.spectrum().warnings()).anyMatch(w -> w.startsWith("no dark at 40.0 ms: the dark at 10.0 ms is used as it is"));
    }

    @Test
    void captureFilesWithRoleMetadataMergeOnTheirSharedGrid() throws ImportException {
        RawCounts dark = read("# role: dark\n# exposure_ms: 10\nwavelength_nm,counts\n365,100\n405,100\n");
        RawCounts sample = reader.read("s.csv", new StringReader("# role: sample\n# exposure_ms: 10\nnm,counts\n365,600\n405,300\n"));

        assertThat(dark.captures()).singleElement().extracting(Capture::role).isEqualTo(CaptureRole.DARK);
        assertThat(sample.captures(CaptureRole.SAMPLE)).hasSize(1);
    }

    @Test
    void exposureIsRequiredAndAPlainExposureWithoutUnitIsNotGuessed() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> read("# exposure: 100\nwavelength_nm,dark,sample\n1,0,1\n2,0,1\n"));

        assertThat(e.problem()).contains("no exposure time for column 'dark'", "unit is not stated");
    }

    @Test
    void transmittanceNeedsAllThreeRoles() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> read("# exposure_ms: 1\nwavelength_nm,dark,sample\n1,0,1\n2,0,1\n").transmittance(RawCountsOptions.defaults()));

        assertThat(e.problem()).contains("1 dark, 0 reference, 1 sample");
    }
}
