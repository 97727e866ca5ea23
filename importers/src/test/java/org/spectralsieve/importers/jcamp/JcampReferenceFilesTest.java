package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.math.BigDecimal;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Every JCAMP-DX file of the shared reference data decodes to the values its SOURCES.md gives
 * (sections 1–4: point counts, first and last values, extrema). Those values were computed by the
 * collector with a decoder checked against a second open-source JCAMP reader; SOURCES.md rounds them,
 * so each check allows half a unit in the last decimal written (0.1626 → ±0.00005).
 */
@ReadsSharedFolder
class JcampReferenceFilesTest {

    private final JcampReader reader = new JcampReader();

    /** Values in file order, in the file's units with YFACTOR applied; empty cells: SOURCES.md gives none. */
    @ParameterizedTest(name = "{0} block {1}")
    @CsvSource(delimiter = '|', nullValues = "", textBlock = """
            # file                                       |blk| n    | x first  | x last   | y first   | y last    | y min    | y max
            jcamp-lancashire/dupinc1.jdx                 | 0 | 440  | 250.0    | 469.5    | 1.1663    | 0.1626    | 0.0769   | 3.3747
            jcamp-lancashire/blckpac1.jdx                | 1 | 176  | 700      | 350      | -0.006136 | 0.193442  |          |
            jcamp-lancashire/blckpac1.jdx                | 5 | 176  | 700      | 350      | -0.009105 | 0.176864  |          |
            jcamp-lancashire/jtpolys.jdx                 | 0 | 1844 | 447.48   | 4002.28  | 0.981633  | 0.986610  | 0.342853 |
            jcamp-lancashire/jtpolysd.jdx                | 0 | 1844 | 447.48   | 4002.28  | 0.983376  |           |          |
            jcamp-lancashire/xyinc1.jdx                  | 0 | 3601 | 400      | 4000     | 0.4480    |           | -0.0023  | 0.7945
            jcamp-lancashire/fixinc2.jdx                 | 0 | 3601 | 400      | 4000     |           |           |          | 3.000
            jcamp-lancashire/pacdec1.jdx                 | 0 | 3301 | 4000     | 700      | 101.60    | 101.24    | 86.31    | 101.89
            jcamp-lancashire/sqzdupd1.jdx                | 0 | 18669| 5000.03  | 499.96   | 0.98287   | 1.26502   | 0        | 1.505
            jcamp-cheminfo/uv-link.jdx                   | 1 | 911  | 190      | 1100     | -0.72973  | -0.0042925|          | 1.11981
            jcamp-cheminfo/uv-link.jdx                   | 2 | 911  | 190      | 1100     |           |           | 8.4e-5   | 1.3727
            jcamp-cheminfo/uv.jdx                        | 0 | 501  | 300      | 800      | 4.112     | 70.683    |          | 71.046
            jcamp-cheminfo/uv_ACD.jdx                    | 0 | 881  | 210      | 650      | 2.925     | 0.003     |          | 3.076
            jcamp-cheminfo/jcamp-fix.dx                  | 0 | 8    |          |          | -10247    | -3100     |          |
            jcamp-cheminfo/jcamp-packed.dx               | 0 | 30   |          |          | -10247    | -1613     |          |
            jcamp-cheminfo/jcamp-squeezed.dx             | 0 | 38   |          |          | -10247    |           |          |
            jcamp-cheminfo/jcamp-difdup.dx               | 0 | 30   |          |          | -10247    | -1613     |          |
            isopropanol_ASDF.jdx                         | 0 | 9541 | 400.20   | 5000.04  | 0.03005   | 0.001875  | -0.0855  | 0.3689
            example_compound_file.jdx                    | 1 | 2074 | 11995.21 | 3999.691 | 0.032112 | 0.52175 |        |
            example_compound_file.jdx                    | 2 | 2074 | 11995.21 | 3999.691 | 0.193928 | 1.17382 |        |
            jcamp-readjdx/SBO.jdx                        | 0 | 1868 | 399.21   | 3999.84  |           |           | 0.523    | 1.0596
            """)
    void referenceFileDecodesToSourcesMdValues(String file, int block, int n, String x0, String xLast, String y0,
            String yLast, String yMin, String yMax) throws ImportException {
        // a bare file name is looked up in any folder (some folders carry the name of who published the data)
        List<JcampBlock> blocks = reader.blocks(file.contains("/") ? SharedFolder.referenceFile(file)
                : SharedFolder.referenceFileNamed(file));
        JcampBlock b = blocks.get(block);
        double[] x = b.x();
        double[] y = b.y();

        assertThat(b.hasData()).isTrue();
        assertThat(b.size()).isEqualTo(n);
        assertRounded(x0, x[0]);
        assertRounded(xLast, x[n - 1]);
        assertRounded(y0, y[0]);
        assertRounded(yLast, y[n - 1]);
        assertRounded(yMin, Arrays.stream(y).min().orElseThrow());
        assertRounded(yMax, Arrays.stream(y).max().orElseThrow());
    }

    /** Half a unit in the last decimal written, as SOURCES.md rounds. */
    private static void assertRounded(String expected, double actual) {
        if (expected == null) {
            return;
        }
        BigDecimal e = new BigDecimal(expected);
        double half = 0.5 * Math.pow(10, -e.scale());
        assertThat(actual).as("expected %s", expected).isCloseTo(e.doubleValue(), within(half * (1 + 1e-9)));
    }

    @Test
    void dupinc1PeaksAt445NanometresAndItsWrongMinyOnlyWarns() throws ImportException {
        // SOURCES.md §1 dupinc1.jdx: max 3.3747 at 445.0 nm; header MINY=0.0604 disagrees with the data (0.0769)
        ParsedSpectrum s = reader.read(SharedFolder.referenceFile("jcamp-lancashire/dupinc1.jdx"));
        double[] x = s.wavelengthsNm();
        double[] a = s.values();
        int peak = 0;
        for (int i = 1; i < a.length; i++) {
            peak = a[i] > a[peak] ? i : peak;
        }

        assertThat(s.yKind()).isEqualTo(YKind.ABSORBANCE);
        assertThat(s.xUnit()).isEqualTo(XUnit.NANOMETRE);
        assertThat(x[0]).isEqualTo(250.0);
        assertThat(x[x.length - 1]).isCloseTo(469.5, within(1e-9));
        assertThat(x[peak]).isCloseTo(445.0, within(1e-9));
        assertThat(s.warnings()).anyMatch(w -> w.contains("##MINY") && w.contains("0.0604"));
        assertThat(s.metadata()).containsEntry("owner", "Public Domain").containsEntry("datatype",
                "UV-VISIBLE SPECTRUM");
    }

    @Test
    void fourEncodingsOfOneSnippetDecodeToTheSameOrdinates() throws ImportException {
        // SOURCES.md §2 jcamp-fix/-packed/-squeezed/-difdup: the first 8 values are identical in all four
        // (−10247, 1201, −5196, 7245, −5777, 5015, −8583, −3100); packed and difdup give the same 30;
        // squeezed continues to 38 with the same first 30 (the 30th is −1613)
        double[] fix = rawOf("jcamp-cheminfo/jcamp-fix.dx");
        double[] packed = rawOf("jcamp-cheminfo/jcamp-packed.dx");
        double[] squeezed = rawOf("jcamp-cheminfo/jcamp-squeezed.dx");
        double[] difdup = rawOf("jcamp-cheminfo/jcamp-difdup.dx");

        assertThat(fix).containsExactly(-10247, 1201, -5196, 7245, -5777, 5015, -8583, -3100);
        assertThat(Arrays.copyOf(packed, 8)).containsExactly(fix);
        assertThat(Arrays.copyOf(squeezed, 8)).containsExactly(fix);
        assertThat(difdup).containsExactly(packed);
        assertThat(Arrays.copyOf(squeezed, 30)).containsExactly(packed);
        assertThat(squeezed[29]).isEqualTo(-1613);
    }

    @Test
    void polystyreneInFixAndDifdupFormsHasIdenticalRawOrdinates() throws ImportException {
        // SOURCES.md §1 jtpolys/jtpolysd: raw integers identical (1844/1844); the scaled values differ by
        // ×1.001775 because jtpolysd writes YFACTOR 2.3884185791e-09 (a typo for 2.384185791e-09)
        JcampBlock fix = reader.blocks(SharedFolder.referenceFile("jcamp-lancashire/jtpolys.jdx")).get(0);
        JcampBlock difdup = reader.blocks(SharedFolder.referenceFile("jcamp-lancashire/jtpolysd.jdx")).get(0);

        assertThat(difdup.rawY()).containsExactly(fix.rawY());
        assertThat(difdup.y()[0] / fix.y()[0]).isCloseTo(1.001775, within(1e-6));
    }

    @Test
    void indeneAbsorbanceIsMinusLogOfItsTransmittanceFlooredAtOneThousandth() throws ImportException {
        // SOURCES.md §1 xyinc1/fixinc2: A = −log10(T) to ≤ 5e-5 at all 3601 points when T is floored at 1e-3
        double[] t = reader.blocks(SharedFolder.referenceFile("jcamp-lancashire/xyinc1.jdx")).get(0).y();
        double[] a = reader.blocks(SharedFolder.referenceFile("jcamp-lancashire/fixinc2.jdx")).get(0).y();

        assertThat(a).hasSameSizeAs(t).hasSize(3601);
        double worst = 0;
        for (int i = 0; i < t.length; i++) {
            worst = Math.max(worst, Math.abs(a[i] + Math.log10(Math.max(t[i], 1e-3))));
        }
        assertThat(worst).isLessThanOrEqualTo(5e-5);
    }

    @Test
    void descendingWavenumbersAreAlreadyAscendingWavelengths() throws ImportException {
        // SOURCES.md §1 sqzdupd1: 5000.03 → 499.96 cm⁻¹, y(first)=0.98287, y(last)=1.26502; λ = 10⁷/ν̃, so
        // falling wavenumbers are rising wavelengths and the file order is kept
        ParsedSpectrum s = reader.read(SharedFolder.referenceFile("jcamp-lancashire/sqzdupd1.jdx"));
        double[] x = s.wavelengthsNm();
        double[] y = s.values();

        assertThat(s.size()).isEqualTo(18669);
        assertThat(s.xUnit()).isEqualTo(XUnit.WAVENUMBER_PER_CM);
        assertThat(x[0]).isCloseTo(1e7 / 5000.0323, within(1e-9));
        assertThat(x[x.length - 1]).isCloseTo(1e7 / 499.95502, within(1e-6));
        assertThat(y[0]).isCloseTo(0.98287, within(5e-6));
        assertThat(y[y.length - 1]).isCloseTo(1.26502, within(5e-6));
    }

    @Test
    void ascendingWavenumbersAreReversedSoWavelengthsIncrease() throws ImportException {
        // SOURCES.md §1 jtpolys: 447.48–4002.28 cm⁻¹ increasing, y(first)=0.981633, y(last)=0.986610
        ParsedSpectrum s = reader.read(SharedFolder.referenceFile("jcamp-lancashire/jtpolys.jdx"));
        double[] x = s.wavelengthsNm();

        assertThat(x[0]).isCloseTo(1e7 / 4002.28378, within(1e-6));
        assertThat(x[x.length - 1]).isCloseTo(1e7 / 447.484259, within(1e-6));
        assertThat(s.values()[0]).isCloseTo(0.986610, within(5e-7));
        assertThat(s.values()[s.size() - 1]).isCloseTo(0.981633, within(5e-7));
    }

    @Test
    void nearInfraredLinkFileConvertsToItsWavelengthRange() throws ImportException {
        // SOURCES.md §3 example_compound_file: 11995.21→3999.69 cm⁻¹ (≈833.7–2500.2 nm), block 1 by default
        ParsedSpectrum s = reader.read(SharedFolder.referenceFileNamed("example_compound_file.jdx"));

        assertThat(s.wavelengthsNm()[0]).isCloseTo(833.7, within(0.05));
        assertThat(s.wavelengthsNm()[s.size() - 1]).isCloseTo(2500.2, within(0.05));
        assertThat(s.values()[0]).isCloseTo(0.032112, within(5e-7));
        assertThat(s.values()[s.size() - 1]).isCloseTo(0.52175, within(5e-6));
    }

    @Test
    void linkFileReadsItsFirstSpectrumBlockUnlessAnotherIsChosen() throws ImportException {
        // SOURCES.md §2 uv-link: block 1 ABSORBANCE y(190)=−0.72973; block 2 is the VARIANCE (8.4e-5…1.3727)
        java.nio.file.Path file = SharedFolder.referenceFile("jcamp-cheminfo/uv-link.jdx");

        ParsedSpectrum first = reader.read(file);
        assertThat(first.values()[0]).isCloseTo(-0.72973, within(5e-6));
        assertThat(first.metadata()).containsEntry("jcamp block", "1");

        assertThatThrownBy(() -> reader.read(file, JcampOptions.defaults().withBlock(2)))
                .isInstanceOf(ImportException.class)
                .hasMessageContaining("##YUNITS").hasMessageContaining("VARIANCE").hasMessageContaining("line 943");
        ParsedSpectrum variance = reader.read(file, JcampOptions.defaults().withBlock(2)
                .withYKind(YKind.ABSORBANCE));
        assertThat(variance.values()[0]).isCloseTo(1.3727, within(5e-5));
        assertThatThrownBy(() -> reader.read(file, JcampOptions.defaults().withBlock(0)))
                .isInstanceOf(ImportException.class).hasMessageContaining("holds no ##XYDATA");
    }

    @Test
    void blockPackLinkKeepsEachBlocksOwnMetadataAndWarnsOfSwappedExtrema() throws ImportException {
        // SOURCES.md §1 blckpac1: five blocks, BLOCK_ID written inconsistently, header MAXY/MINY swapped
        java.nio.file.Path file = SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx");
        List<JcampBlock> blocks = reader.blocks(file);

        assertThat(blocks).hasSize(6);
        assertThat(blocks.stream().filter(JcampBlock::hasData)).hasSize(5);
        assertThat(blocks.get(3).label("block id")).contains("3");
        ParsedSpectrum t1 = reader.read(file);
        assertThat(t1.metadata()).containsEntry("block_id", "1").containsEntry("date", "96/11/04");
        assertThat(t1.warnings()).anyMatch(w -> w.contains("##MAXY=-.006136"));
        assertThat(t1.wavelengthsNm()[0]).isEqualTo(350.0);
    }

    @Test
    void percentValuesUnderATransmittanceHeaderAreKeptButFlagged() throws ImportException {
        // SOURCES.md §1 pacdec1: TRANSMITTANCE header, values 86.31–101.89 (really percent)
        ParsedSpectrum s = reader.read(SharedFolder.referenceFile("jcamp-lancashire/pacdec1.jdx"));

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_FRACTION);
        assertThat(s.warnings()).anyMatch(w -> w.contains("looks like percent"));
    }

    @Test
    void nanometreDataLabelledWavenumbersWarnWhenTheKindIsForced() throws ImportException {
        // SOURCES.md §2, the UV-vis file with contradictory metadata: XUNITS=1/CM but x = 210–650 (really nm); YUNITS ARBITRARY UNITS
        java.nio.file.Path file = SharedFolder.referenceFile("jcamp-cheminfo/uv_ACD.jdx");

        assertThatThrownBy(() -> reader.read(file)).isInstanceOf(ImportException.class)
                .hasMessageContaining("line 20").hasMessageContaining("##YUNITS")
                .hasMessageContaining("yKind").hasMessageContaining("XUNITS=1/CM contradicts")
                .hasMessageContaining("xUnit=nm");
        ParsedSpectrum s = reader.read(file, JcampOptions.defaults().withYKind(YKind.ABSORBANCE));
        assertThat(s.warnings()).anyMatch(w -> w.contains("XUNITS=1/CM contradicts the x values: they run 210–650")
                && w.contains("xUnit=nm"));
    }

    @Test
    void nanometreDataLabelledWavenumbersImportWhenTheXUnitIsOverridden() throws ImportException {
        // SOURCES.md §2 uv_ACD.jdx: x = 210–650 really nm, 881 points; decoded y(210)=2.925, y(650)=0.003, max 3.076
        java.nio.file.Path file = SharedFolder.referenceFile("jcamp-cheminfo/uv_ACD.jdx");

        ParsedSpectrum s = reader.read(file, new JcampOptions(org.spectralsieve.importers.ReadOptions.defaults()
                .withYKind(YKind.ABSORBANCE).xUnit(XUnit.NANOMETRE), java.util.OptionalInt.empty()));

        double[] nm = s.wavelengthsNm();
        assertThat(s.size()).isEqualTo(881);
        assertThat(nm[0]).isEqualTo(210.0);
        assertThat(nm[880]).isEqualTo(650.0);
        assertRounded("2.925", s.values()[0]);
        assertRounded("0.003", s.values()[880]);
        assertThat(s.warnings()).anyMatch(w -> w.contains("XUNITS=1/CM overridden"))
                .noneMatch(w -> w.contains("contradicts"));
    }

    @Test
    void peakTableWithFreeTextUnitsAndAStrayHeaderLineReads() throws ImportException {
        // SOURCES.md §2 uv.jdx: XUNITS "wavelength [nm]", a stray non-LDR line in the header, no newline
        // after ##END; its YUNITS "Reflectance" is not a transmittance, so the kind must be chosen
        ParsedSpectrum s = reader.read(SharedFolder.referenceFile("jcamp-cheminfo/uv.jdx"),
                JcampOptions.defaults().withYKind(YKind.TRANSMITTANCE_PERCENT));

        assertThat(s.xUnit()).isEqualTo(XUnit.NANOMETRE);
        assertThat(s.size()).isEqualTo(501);
        assertThat(s.metadata().get("$header")).contains("RawData").contains("Wavelength nm.");
    }

    @Test
    void isopropanolWarnsOfItsWrongFirstYButNotOfItsRoundedExtrema() throws ImportException {
        // SOURCES.md §3 isopropanol_ASDF: header FIRSTY=0 but the first decoded y is 0.03005; its MINY=-0.09
        // and MAXY=0.37 are the decoded −0.0855 and 0.3689 rounded to two decimals, which is not an error
        ParsedSpectrum s = reader.read(SharedFolder.referenceFileNamed("isopropanol_ASDF.jdx"));

        assertThat(s.warnings()).hasSize(1).allMatch(w -> w.contains("##FIRSTY=0"));
    }

    @Test
    void trailingCtrlZAfterEndIsIgnored() throws ImportException {
        // SOURCES.md §1 xyinc1: a DOS Ctrl-Z (0x1A) after ##END=, and ##JCAMP_DX spelt with an underscore
        ParsedSpectrum s = reader.read(SharedFolder.referenceFile("jcamp-lancashire/xyinc1.jdx"));

        assertThat(s.size()).isEqualTo(3601);
        assertThat(s.metadata()).containsKey("jcamp_dx");
    }

    private double[] rawOf(String file) throws ImportException {
        return reader.blocks(SharedFolder.referenceFile(file)).get(0).rawY();
    }
}
