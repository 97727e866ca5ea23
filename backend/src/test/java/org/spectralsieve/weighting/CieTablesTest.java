package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.weighting.ReferenceTables.Table;

/**
 * The shipped D65 and V(λ) tables against copies of the CIE data from outside the project: Debian's
 * colord-data files (which the shipped digits were transcribed from) and the CIE 1 nm tables in
 * ../shared/reference-data (CIE data via the luxpy and PySpectrometer3 repositories; SOURCES.md §7).
 */
class CieTablesTest {

    private static final WeightingTable D65 = WeightingTable.resource(Emitter.D65_TABLE);
    private static final WeightingTable V = WeightingTable.resource(Response.PHOTOPIC_TABLE);

    /** Source: Debian colord-data 1.4.6, illuminant/CIE-D65.sp (S/100) and cmf/CIE1931-2deg-XYZ.cmf (2nd set). */
    @Test
    void shippedTablesHoldColordDigitsRowForRow() throws IOException {
        Table d65 = ReferenceTables.colord("illuminant/CIE-D65.sp");
        Table cmf = ReferenceTables.colord("cmf/CIE1931-2deg-XYZ.cmf");
        assertThat(D65.wavelengthsNm()).containsExactly(d65.nm());
        assertThat(V.wavelengthsNm()).containsExactly(cmf.nm());
        double[] s = D65.values();
        for (int i = 0; i < s.length; i++) {
            double expected = d65.column(0)[i] * 100;
            assertThat(s[i]).as("D65 at %s nm", d65.nm()[i]).isCloseTo(expected, within(Math.ulp(expected) * 4));
        }
        assertThat(V.values()).containsExactly(cmf.column(1));
        assertThat(D65.wavelengthsNm()).hasSize(107).startsWith(300.0).endsWith(830.0);
        assertThat(V.wavelengthsNm()).hasSize(95).startsWith(360.0).endsWith(830.0);
    }

    /**
     * Reference sheet §9, row "D65, 360-830, 5 nm": X = 95.0467, Z = 108.8969 (Y = 100), plain sums;
     * computed here from colord-data's 5 nm D65 and CIE 1931 files, read directly.
     */
    @Test
    void d65WhitePointFromColordFiveNanometreTables() throws IOException {
        Table d65 = ReferenceTables.colord("illuminant/CIE-D65.sp").between(360, 830);
        Table cmf = ReferenceTables.colord("cmf/CIE1931-2deg-XYZ.cmf");
        assertThat(d65.nm()).containsExactly(cmf.nm());
        double[] xyz = ReferenceTables.whitePoint(d65.column(0), cmf.column(0), cmf.column(1), cmf.column(2));
        assertThat(xyz[0]).isCloseTo(95.0467, within(5e-5));
        assertThat(xyz[2]).isCloseTo(108.8969, within(5e-5));
    }

    /** The same white point with the shipped D65 and V rows standing in for colord's S and ȳ. */
    @Test
    void d65WhitePointFromShippedTablesWithColordXAndZ() throws IOException {
        Table cmf = ReferenceTables.colord("cmf/CIE1931-2deg-XYZ.cmf");
        double[] s = new double[cmf.nm().length];
        for (int i = 0; i < s.length; i++) {
            s[i] = D65.valueAt(cmf.nm()[i]);
        }
        double[] xyz = ReferenceTables.whitePoint(s, cmf.column(0), V.values(), cmf.column(2));
        // reference sheet §9, "D65, 360-830, 5 nm"
        assertThat(xyz[0]).isCloseTo(95.0467, within(5e-5));
        assertThat(xyz[2]).isCloseTo(108.8969, within(5e-5));
    }

    /**
     * CIE 1 nm tables, 360-830 nm (cie-1nm/d65.csv, cmf1931.csv): X = 95.047, Z = 108.883 with Y = 100
     * (CIE 015 white point of D65; reference sheet §9 gives 95.0471 / 108.8829 for this sum).
     */
    @Test
    @ReadsSharedFolder
    void d65WhitePointFromCieOneNanometreTables() throws IOException {
        Table d65 = ReferenceTables.referenceCsv("cie-1nm/d65.csv").between(360, 830);
        Table cmf = ReferenceTables.referenceCsv("cie-1nm/cmf1931.csv").between(360, 830);
        assertThat(d65.nm()).containsExactly(cmf.nm());
        double[] xyz = ReferenceTables.whitePoint(d65.column(0), cmf.column(0), cmf.column(1), cmf.column(2));
        assertThat(xyz[0]).isCloseTo(95.047, within(5e-4));
        assertThat(xyz[2]).isCloseTo(108.883, within(5e-4));
        assertThat(xyz[0]).isCloseTo(95.0471, within(5e-5));
        assertThat(xyz[2]).isCloseTo(108.8829, within(5e-5));
    }

    /**
     * Illuminant A by its analytic definition (CIE 015; formula in reference sheet §9) with the CIE 1931
     * 1 nm CMFs, 360-830 nm: X = 109.850, Z = 35.585 (sheet §9: 109.8503 / 35.5849).
     */
    @Test
    @ReadsSharedFolder
    void illuminantAWhitePointFromTheAnalyticDefinition() throws IOException {
        Table cmf = ReferenceTables.referenceCsv("cie-1nm/cmf1931.csv").between(360, 830);
        double[] s = new double[cmf.nm().length];
        for (int i = 0; i < s.length; i++) {
            s[i] = Emitter.illuminantA().powerAt(cmf.nm()[i]);
        }
        double[] xyz = ReferenceTables.whitePoint(s, cmf.column(0), cmf.column(1), cmf.column(2));
        assertThat(xyz[0]).isCloseTo(109.850, within(5e-4));
        assertThat(xyz[2]).isCloseTo(35.585, within(5e-4));
    }

    /**
     * The CIE's 1 nm D65 (cie-datasets/CIE_std_illum_D65.csv, 300-830 nm, DOI 10.25039/CIE.DS.hjfjmt59)
     * is the linear interpolation of the 5 nm rows, to its 6 printed digits: so the emitter, read linearly
     * between rows, gives the CIE value at every nm.
     */
    @Test
    @ReadsSharedFolder
    void d65EmitterBetweenRowsMatchesTheCieOneNanometreTable() throws IOException {
        Table cie = ReferenceTables.referenceCsv("cie-datasets/CIE_std_illum_D65.csv");
        assertThat(cie.nm()).hasSize(531);
        Emitter d65 = Emitter.d65();
        for (int i = 0; i < cie.nm().length; i++) {
            double expected = cie.column(0)[i];
            assertThat(d65.powerAt(cie.nm()[i])).as("D65 at %s nm", cie.nm()[i])
                    .isCloseTo(expected, within(Math.max(1e-3, expected * 1e-5)));
        }
    }

    /** At the 5 nm rows the shipped ȳ equals the CIE 1 nm ȳ (cie-1nm/cmf1931.csv) exactly. */
    @Test
    @ReadsSharedFolder
    void shippedVAgreesWithTheCieOneNanometreTableAtItsRows() throws IOException {
        Table cmf = ReferenceTables.referenceCsv("cie-1nm/cmf1931.csv");
        int checked = 0;
        for (int i = 0; i < cmf.nm().length; i++) {
            if (cmf.nm()[i] % 5 == 0) {
                assertThat(Response.photopic().weightAt(cmf.nm()[i])).as("V at %s nm", cmf.nm()[i])
                        .isEqualTo(cmf.column(1)[i]);
                checked++;
            }
        }
        assertThat(checked).isEqualTo(95);
    }

    /** Reference sheet §9, spot values of D65 [V, luxpy copy of the CIE table]. */
    @ParameterizedTest
    @CsvSource({"380, 49.9755", "400, 82.7549", "460, 117.812", "500, 109.354", "555, 102.023", "560, 100.000",
        "600, 90.0062", "700, 71.6091", "780, 63.3828"})
    void d65SpotValues(double nm, double expected) {
        assertThat(Emitter.d65().powerAt(nm)).isCloseTo(expected, within(expected * 1e-6));
    }

    /** Reference sheet §9, spot values of ȳ = V(λ) (CIE 1931 2° table). */
    @ParameterizedTest
    @CsvSource({"380, 3.9e-5", "400, 3.96e-4", "450, 0.038", "500, 0.323", "555, 1.000", "600, 0.631",
        "650, 0.107", "700, 0.004102", "780, 1.499e-5"})
    void photopicSpotValues(double nm, double expected) {
        assertThat(Response.photopic().weightAt(nm)).isCloseTo(expected, within(expected * 1e-9));
    }

    /** Stated in the files: licence and attribution travel with the data (CIE datasets are CC BY-SA 4.0). */
    @Test
    void shippedCieTablesStateSourceAndAreReadLinearly() {
        for (WeightingTable t : new WeightingTable[] {D65, V}) {
            assertThat(t.source()).contains("CIE 015").contains("CC BY-SA 4.0").contains("colord-data 1.4.6");
            assertThat(t.interpolation()).isEqualTo(WeightingTable.Interpolation.LINEAR);
        }
        assertThat(D65.source()).contains("ISO/CIE 11664-2");
        assertThat(V.source()).contains("ISO/CIE 11664-1");
    }
}
