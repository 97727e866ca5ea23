package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The ASTM G173-03 solar reference spectra from the shared reference data (never copied in), read as a
 * relative spectrum. Layout and expected values: reference-data/SOURCES.md §6 — a title line with
 * trailing commas, header {@code wavelength,extraterrestrial,global,direct}, 2002 rows over
 * 280–4000 nm in W m⁻² nm⁻¹; trapezoid integrals ETR 1347.93, global 1000.37, direct 900.14 W m⁻²;
 * global over 280–400 nm 46.10 W m⁻².
 */
@ReadsSharedFolder
class SolarReferenceReadTest {

    private static SpectrumValues read(String column) throws ImportException {
        Path file = SharedFolder.referenceFile("astm-g173-pvlib/ASTMG173.csv");
        return new DelimitedValuesReader().read(file, SpectrumValuesOptions.defaults().valueColumn(column));
    }

    @Test
    void globalTiltColumnReadsWithTheSourcesIntegrals() throws ImportException {
        SpectrumValues global = read("global");

        assertThat(global.size()).isEqualTo(2002);
        assertThat(global.wavelengthsNm()[0]).isEqualTo(280.0);
        assertThat(global.wavelengthsNm()[global.size() - 1]).isEqualTo(4000.0);
        assertThat(global.valueColumn()).isEqualTo("global");
        assertThat(trapezoid(global, 280, 4000)).isCloseTo(1000.37, within(0.005));
        assertThat(trapezoid(global, 280, 400)).isCloseTo(46.10, within(0.005));
        // the title line is preamble, reported, not data
        assertThat(global.warnings()).anySatisfy(w -> assertThat(w).contains("preamble"));
    }

    @Test
    void theOtherColumnsAreTheirOwnSpectra() throws ImportException {
        assertThat(trapezoid(read("extraterrestrial"), 280, 4000)).isCloseTo(1347.93, within(0.005));
        assertThat(trapezoid(read("4"), 280, 4000)).isCloseTo(900.14, within(0.005));
    }

    private static double trapezoid(SpectrumValues s, double from, double to) {
        double[] x = s.wavelengthsNm();
        double[] y = s.values();
        double sum = 0;
        for (int i = 1; i < x.length; i++) {
            if (x[i - 1] >= from && x[i] <= to) {
                sum += (x[i] - x[i - 1]) * (y[i] + y[i - 1]) / 2;
            }
        }
        return sum;
    }
}
