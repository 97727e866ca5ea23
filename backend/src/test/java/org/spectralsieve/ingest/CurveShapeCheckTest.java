package org.spectralsieve.ingest;

import static java.nio.charset.StandardCharsets.UTF_8;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/** Files that are numbers but not transmittance curves are refused, saying what they look like. */
class CurveShapeCheckTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview read(String name, String text) throws ImportException {
        return reader.read(name, text.getBytes(UTF_8), ImportOptions.defaults());
    }

    /**
     * Three humps peaking at 450, 550 and 600 nm and vanishing at 380 and 780 nm: the shape of the CIE 1931
     * colour-matching functions (z̄ near 445 nm, ȳ at 555 nm, x̄ near 600 nm; CIE 015:2018 tables, from memory).
     */
    @Test
    void aTableOfThreeColourMatchingLikeColumnsIsRefusedAndPointsToTheSpectrumImport() {
        StringBuilder csv = new StringBuilder();
        for (int nm = 380; nm <= 780; nm += 5) {
            csv.append(nm).append(',').append(hump(nm, 600, 40)).append(',').append(hump(nm, 555, 45))
                    .append(',').append(hump(nm, 450, 25)).append('\n');
        }
        assertThatThrownBy(() -> read("illustrative-cmf.csv", csv.toString())).isInstanceOf(ImportException.class)
                .hasMessageContaining("colour-matching").hasMessageContaining("/api/responses")
                .hasMessageContaining("import-spectrum");
    }

    @Test
    void anIlluminantLikeSpectrumAbove100WithoutPercentIsRefused() {
        String csv = "wavelength_nm,power\n380,50\n420,88\n460,117.8\n500,109\n560,100\n";
        assertThatThrownBy(() -> read("illustrative-lamp.csv", csv)).isInstanceOf(ImportException.class)
                .hasMessageContaining("117.8").hasMessageContaining("emission")
                .hasMessageContaining("/api/emitters");
    }

    @Test
    void aRefractiveIndexTableIsRefusedAsSuch() {
        String yml = "DATA:\n  - type: tabulated nk\n    data: |\n        0.40 1.50 3.8E-07\n"
                + "        0.50 1.49 2.2E-07\n        0.60 1.49 2.0E-07\n";
        assertThatThrownBy(() -> read("illustrative-index.yml", yml)).isInstanceOf(ImportException.class)
                .hasMessageContaining("refractive-index");
    }

    @Test
    void anAxisInMicrometresReadAsNanometresIsRefusedWithTheUnitHint() {
        String csv = "wavelength,T\n0.30,0.1\n0.35,0.4\n0.40,0.8\n";
        assertThatThrownBy(() -> read("illustrative-um.csv", csv)).isInstanceOf(ImportException.class)
                .hasMessageContaining("0.300–0.400 nm").hasMessageContaining("micrometres");
    }

    @Test
    void anAxisHeadedInMicrometresIsNotRefusedByTheAxisCheck() throws ImportException {
        String csv = "wavelength_um,T\n0.30,0.1\n0.35,0.4\n0.40,0.8\n";
        try {
            read("illustrative-um-named.csv", csv);
        } catch (ImportException e) {
            assertThat(e.getMessage()).doesNotContain("entirely outside");
        }
    }

    @Test
    void percentAndFractionTransmittanceFilesStillImport() throws ImportException {
        assertThat(read("illustrative-percent.csv", ImportFiles.percentCsv()).curve().size()).isEqualTo(5);
        // headerless percent: 100 %T is T = 1 by the definition of percent (common practice, no source)
        assertThat(read("illustrative-bare-percent.csv", "350,2\n380,40\n400,90\n450,100.4\n").curve().size())
                .isEqualTo(4);
        assertThat(read("illustrative-fraction.csv", "wavelength_nm,T\n300,0.2\n400,0.6\n500,0.9\n").curve().size())
                .isEqualTo(3);
    }

    /** CIE 1931 2° colour-matching functions and CIE D65 (reference-data/cie-1nm, see its SOURCES.md). */
    @Test
    @ReadsSharedFolder
    void theCieTablesAndEveryRefractiveIndexFileAreRefused() throws Exception {
        Path cmf = SharedFolder.referenceFile("cie-1nm/cmf1931.csv");
        Path d65 = SharedFolder.referenceFile("cie-1nm/d65.csv");
        // the refractive-index tables are named after their authors: found by kind, not by name
        java.util.List<Path> indexTables = SharedFolder.referenceFilesNamed("*.yml");
        assertThatThrownBy(() -> reader.read("cmf1931.csv", Files.readAllBytes(cmf), ImportOptions.defaults()))
                .isInstanceOf(ImportException.class).hasMessageContaining("colour-matching");
        assertThatThrownBy(() -> reader.read("d65.csv", Files.readAllBytes(d65), ImportOptions.defaults()))
                .isInstanceOf(ImportException.class).hasMessageContaining("emission");
        for (Path index : indexTables) {
            assertThatThrownBy(() -> reader.read(index.getFileName().toString(), Files.readAllBytes(index),
                    ImportOptions.defaults())).as(index.getFileName().toString())
                    .isInstanceOf(ImportException.class).hasMessageContaining("refractive-index");
        }
    }

    /** A film's thickness in a comment ("50 um") says nothing about the wavelength column's unit. */
    @Test
    void aThicknessInMicrometresInACommentDoesNotMakeTheAxisMicrometres() throws ImportException {
        String text = "# illustrative film 50 um\nwavelength,transmittance_percent\n300,10\n350,50\n400,90\n";

        FilePreview p = read("illustrative-film.txt", text);

        assertThat(p.curve().minWavelengthNm()).isEqualTo(300.0);
        assertThat(p.curve().maxWavelengthNm()).isEqualTo(400.0);
    }

    /** A capture export with a pixel index before its wavelengths, whose calibration turns back at line 5. */
    @Test
    void aPixelColumnBeforeTheWavelengthsIsNeitherAxisNorValueSoATurningAxisIsReportedAsSuch() {
        String csv = "Pixel,Wavelength,Intensity\n0,354.5,0.0196\n1,354.0,0.0188\n2,353.5,0.0179\n3,360.0,0.0182\n"
                + "4,365.0,0.0177\n";

        assertThatThrownBy(() -> read("illustrative-capture.csv", csv)).isInstanceOf(ImportException.class)
                .hasMessageContaining("goes up again from 353.5 nm to 360.0 nm at line 5")
                .hasMessageNotContaining("far above any transmittance");
    }

    /** Two replicate scans side by side repeat the wavelength column: it is not a value reaching 500. */
    @Test
    void replicatePairsRepeatingTheWavelengthColumnAreNotReadAsValuesFarAbove100() throws ImportException {
        String text = "# illustrative film, two scans\nw.length.1 transmittance.1  w.length.2 transmittance.2\n"
                + "300\t10\t300\t11\n400\t50\t400\t52\n500\t90\t500\t91\n";

        FilePreview p = read("illustrative-replicates.txt", text);

        assertThat(p.curve().size()).isEqualTo(3);
        assertThat(p.curve().transmittance(1)).isEqualTo(0.5); // 50 %T, the first pair by default
    }

    private static double hump(double nm, double peak, double width) {
        double z = (nm - peak) / width;
        return Math.round(Math.exp(-z * z / 2) * 1e6) / 1e6;
    }
}
