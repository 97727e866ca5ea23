package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/** A file with several spectra is never cut to one without a warning that lists them all. */
class JcampBlocksLeftOutTest {

    /** Illustrative LINK file: two absorbance curves of an invented film, 300–400 nm and 300–500 nm. */
    private static final String TWO_BLOCKS = """
            ##TITLE= illustrative film series
            ##JCAMP-DX= 5.01
            ##DATA TYPE= LINK
            ##BLOCKS= 2
            ##TITLE= film before curing
            ##JCAMP-DX= 5.01
            ##BLOCK_ID= 1
            ##XUNITS= NANOMETERS
            ##YUNITS= ABSORBANCE
            ##XYPOINTS= (XY..XY)
            300, 1.0
            350, 0.5
            400, 0.2
            ##END=
            ##TITLE= film after curing
            ##JCAMP-DX= 5.01
            ##BLOCK_ID= 2
            ##XUNITS= NANOMETERS
            ##YUNITS= ABSORBANCE
            ##XYPOINTS= (XY..XY)
            300, 1.2
            400, 0.6
            450, 0.4
            500, 0.3
            ##END=
            ##END=
            """;

    @Test
    void aTwoSpectrumFileWarnsNamingBothAndWhichWasImported() throws ImportException {
        ParsedSpectrum s = new JcampReader().read("series.jdx", new StringReader(TWO_BLOCKS));

        String w = onlyBlocksWarning(s.warnings());
        assertThat(w).contains("2 spectra", "block 1 'film before curing' (3 points, x 300.0–400.0 NANOMETERS)",
                "block 2 'film after curing' (4 points", "Imported block 1 only", "left out");
        assertThat(s.size()).isEqualTo(3);
    }

    @Test
    void choosingTheSecondBlockSaysSoInTheWarning() throws ImportException {
        ParsedSpectrum s = new JcampReader().read("series.jdx", new StringReader(TWO_BLOCKS),
                JcampOptions.defaults().withBlock(2));

        assertThat(onlyBlocksWarning(s.warnings())).contains("Imported block 2 only");
        assertThat(s.size()).isEqualTo(4);
    }

    @Test
    void aSingleSpectrumFileGetsNoBlocksWarning() throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE",
                "##XYPOINTS= (XY..XY)", "300, 1.0", "400, 0.5"));

        assertThat(s.warnings()).noneMatch(w -> w.contains("spectra:"));
    }

    @Test
    @ReadsSharedFolder
    void theFiveBlockTimeSeriesListsAllFive() throws ImportException {
        // SOURCES.md §1 blckpac1: five blocks of a time series, 176 points each, 700→350 nm
        var file = SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx");
        ParsedSpectrum s = new JcampReader().read(file);

        String w = onlyBlocksWarning(s.warnings());
        assertThat(w).contains("5 spectra", "Imported block 1 only", "the other 4 were left out");
        for (int block = 1; block <= 5; block++) {
            assertThat(w).contains("block " + block + " '");
        }
        assertThat(w.split("176 points", -1)).hasSize(6);
    }

    private static String onlyBlocksWarning(List<String> warnings) {
        List<String> found = warnings.stream().filter(w -> w.contains("spectra:")).toList();
        assertThat(found).hasSize(1);
        return found.get(0);
    }
}
