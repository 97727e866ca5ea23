package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The standard-deviation columns of real measured sheets (../shared/reference-data, SOURCES.md §8: T and
 * its StdDev in percent, 1 nm steps from 190 nm), read from the shared folder and never copied in; skipped
 * with a message where it is absent. The expected values are worked from the file's own text line, by
 * σ_A = σ_T/(T·ln 10) (first-order propagation, GUM JCGM 100:2008, 5.1.2).
 */
@ReadsSharedFolder
class MeasuredUncertaintyTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview preview(Path f, ImportOptions options) throws Exception {
        return reader.read(f.getFileName().toString(), Files.readAllBytes(f), options);
    }

    /** The file's own text for one wavelength: {T %, StdDev %}. */
    private static double[] line(Path f, int nm) throws Exception {
        String row = Files.readAllLines(f).stream().filter(l -> l.startsWith(nm + ",")).findFirst().orElseThrow();
        String[] cells = row.split(",");
        return new double[] {Double.parseDouble(cells[1]), Double.parseDouble(cells[2])};
    }

    @Test
    void theClearAcrylicSheetImportsWithItsStdDevAsAnAbsorbanceUncertainty() throws Exception {
        Path f = SharedFolder.measuredSheet("acrylic-clear-3mm.csv");

        FilePreview p = preview(f, ImportOptions.defaults());

        double[] at400 = line(f, 400); // T400 = 91.01 % (SOURCES.md §8)
        double expected = at400[1] / (at400[0] * Math.log(10)); // both in %T: the percent cancels
        assertThat(p.curve().absorbanceUncertainty(400 - 190)).isCloseTo(expected, within(1e-12));
        assertThat(p.curve().absorbanceUncertainty(400 - 190)).isLessThan(0.001); // a good sheet in the visible
        assertThat(p.uncertaintySource()).contains("StdDev").contains("%T");
        // 190 nm sits on the instrument floor (0.01 %T, SOURCES.md §8): a bound, so no standard deviation
        assertThat(p.curve().belowDetection(0)).isTrue();
        assertThat(p.curve().absorbanceUncertainty(0)).isNaN();
    }

    @Test
    void theGlassCoverReadsItsStdDotDevColumn() throws Exception {
        Path f = SharedFolder.measuredSheet("glass-dish-cover.csv");

        FilePreview p = preview(f, ImportOptions.defaults());

        double[] at550 = line(f, 550); // T550 = 91.25 % (SOURCES.md §8)
        assertThat(p.curve().absorbanceUncertainty(550 - 190))
                .isCloseTo(at550[1] / (at550[0] * Math.log(10)), within(1e-12));
        assertThat(p.uncertaintySource()).contains("Std.Dev.");
    }
}
