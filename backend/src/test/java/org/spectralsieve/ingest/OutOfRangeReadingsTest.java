package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * Readings outside [0, 1] in generated captures (an invented workshop's bench readings, illustrative): kept
 * and flagged, never refused whole and never dropped. Percent to fraction is %T / 100 by the definition of
 * percent (common practice, no source); the noise and drift limits are the project's stated choices
 * (docs/importing.md).
 */
class OutOfRangeReadingsTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    /** A good blocker: dark below 250 nm with three noise readings under zero, then an edge. */
    private static String blocker(String detectionLimitLine) {
        return detectionLimitLine + """
                wavelength_nm,transmittance_percent
                220,0.002
                230,-0.005
                235,-0.003
                240,-0.004
                250,0.01
                300,20
                350,85
                """;
    }

    private FilePreview read(String text) throws Exception {
        return reader.read("capture.csv", text.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults());
    }

    @Test
    void negativeNoiseInAGoodBlockerIsKeptAsBelowDetectionAtTheGivenLimit() throws Exception {
        FilePreview p = read(blocker("# detection_limit: 0.01%\n"));
        Curve c = p.curve();

        assertThat(c.size()).isEqualTo(7);
        for (int i = 1; i <= 3; i++) {
            assertThat(c.belowDetection(i)).isTrue();
            // upper bound at the detection limit 0.01 %T = 1e-4, larger than the 0.005 %T noise shown
            assertThat(c.transmittance(i)).isEqualTo(1e-4);
            assertThat(c.detectionLimit(i)).isEqualTo(1e-4);
        }
        assertThat(c.transmittance(5)).isEqualTo(0.2);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w)
                .contains("3 readings below 0 %T").contains("-0.005 %T").contains("between 230 and 240 nm"));
    }

    @Test
    void negativeNoiseWithoutAGivenLimitIsBoundedByTheNoiseTheFileShows() throws Exception {
        Curve c = read(blocker("")).curve();

        assertThat(c.size()).isEqualTo(7);
        for (int i = 1; i <= 3; i++) {
            assertThat(c.belowDetection(i)).isTrue();
            // the largest negative reading, 0.005 %T = 5e-5, is the noise: T at most that
            assertThat(c.transmittance(i)).isEqualTo(5e-5);
        }
        assertThat(c.belowDetection(0)).as("0.002 %T with no limit given is a reading").isFalse();
    }

    @Test
    void transmittanceSlightlyAboveOneIsKeptAsReadAndFlaggedAsReferenceDrift() throws Exception {
        FilePreview p = read("wavelength_nm,transmittance_percent\n380,60\n400,101.5\n420,102\n440,99\n");
        Curve c = p.curve();

        assertThat(c.size()).isEqualTo(4);
        assertThat(c.transmittance(1)).isEqualTo(1.015);
        assertThat(c.transmittance(2)).isEqualTo(1.02);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w)
                .contains("2 readings above 100 %T").contains("between 400 and 420 nm").contains("reference drift"));
        assertThat(p.warnings()).noneSatisfy(w -> assertThat(w).contains("unreliable"));
    }

    @Test
    void transmittanceFarAboveTheDriftLimitIsKeptAndFlaggedUnreliable() throws Exception {
        FilePreview p = read("wavelength_nm,transmittance_percent\n800,90\n900,120\n1000,170\n1100,95\n");
        Curve c = p.curve();

        assertThat(c.size()).isEqualTo(4);
        assertThat(c.transmittance(1)).isEqualTo(1.2);
        assertThat(c.transmittance(2)).as("stored at the curve's ceiling").isEqualTo(Curve.MAX_TRANSMITTANCE);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w)
                .contains("2 readings above 105 %T").contains("highest 170 %T").contains("between 900 and 1000 nm")
                .contains("unreliable"));
    }

    @Test
    void negativeReadingsBeyondTheNoiseAreRefusedNamingCountAndRange() {
        assertThatThrownBy(() -> read("wavelength_nm,transmittance_percent\n300,-5\n310,-4\n320,10\n"))
                .isInstanceOf(IngestException.class)
                .hasMessageContaining("2 readings below -1 %T")
                .hasMessageContaining("between 300 and 310 nm");
    }
}
