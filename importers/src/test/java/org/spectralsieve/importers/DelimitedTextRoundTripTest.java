package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringReader;
import java.io.StringWriter;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Writer → reader must restore every double bit for bit (Double.toString is the shortest exact form). */
class DelimitedTextRoundTripTest {

    private static final int POINTS = 5_000;

    /** Illustrative curve: random wavelengths and fractions, every 37th point an upper bound. */
    private static double[][] randomCurve(long seed) {
        Random random = new Random(seed);
        double[] x = new double[POINTS];
        double[] t = new double[POINTS];
        double wavelength = 190.0;
        for (int i = 0; i < POINTS; i++) {
            wavelength += 1e-9 + random.nextDouble() * 0.5;
            x[i] = wavelength;
            // spread over many decades so exponents and the E notation of Double.toString are exercised
            t[i] = random.nextDouble() * Math.pow(10, -random.nextInt(9));
        }
        return new double[][] {x, t};
    }

    @Test
    void fiveThousandRandomPointsReadBackBitIdentical() throws ImportException {
        double[][] curve = randomCurve(20240601L);
        boolean[] bounds = new boolean[POINTS];
        for (int i = 0; i < POINTS; i += 37) {
            bounds[i] = true;
        }
        Map<String, String> metadata = new LinkedHashMap<>();
        metadata.put("thickness_mm", "3.0");
        metadata.put("geometry", "regular");
        metadata.put("provenance", "modelled");
        metadata.put("note", "illustrative sheet from an invented workshop\nsecond line");

        String text = DelimitedTextWriter.write(metadata, curve[0], curve[1], bounds);
        ParsedSpectrum read = new DelimitedTextReader().read("roundtrip.csv", new StringReader(text));

        assertThat(read.size()).isEqualTo(POINTS);
        assertThat(read.wavelengthsNm()).containsExactly(curve[0]);
        assertThat(read.values()).containsExactly(curve[1]);
        assertThat(read.upperBounds()).containsExactly(bounds);
        assertThat(read.yKind()).isEqualTo(YKind.TRANSMITTANCE_FRACTION);
        assertThat(read.xUnit()).isEqualTo(XUnit.NANOMETRE);
        assertThat(read.warnings()).isEmpty();
        assertThat(read.metadata()).containsExactly(
                Map.entry("thickness_mm", "3.0"), Map.entry("geometry", "regular"),
                Map.entry("provenance", "modelled"),
                Map.entry("note", "illustrative sheet from an invented workshop second line"));
    }

    @Test
    void writerProducesTheSieveCurveLayout() {
        String text = DelimitedTextWriter.write(Map.of("thickness_mm", "3.0"),
                new double[] {190.0, 191.0}, new double[] {0.001, 0.0123}, new boolean[] {true, false});

        assertThat(text).isEqualTo("""
                # Spectral Sieve curve v1
                # thickness_mm: 3.0
                wavelength_nm,transmittance
                190.0,<0.001
                191.0,0.0123
                """);
    }

    @Test
    void streamingOverloadWritesTheSameTextAsTheStringForm() throws Exception {
        double[][] curve = randomCurve(7L);
        StringWriter out = new StringWriter();

        DelimitedTextWriter.write(Map.of(), curve[0], curve[1], null, out);

        assertThat(out.toString()).isEqualTo(DelimitedTextWriter.write(Map.of(), curve[0], curve[1], null));
    }

    @Test
    void writerRefusesNonIncreasingWavelengthsNamingTheIndex() {
        assertThatThrownBy(() -> DelimitedTextWriter.write(Map.of(), new double[] {400, 300},
                new double[] {0.5, 0.5}, null))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("index 1").hasMessageContaining("300.0 nm follows 400.0 nm");
    }

    @Test
    void writerRefusesAKeyThatWouldNotReadBackAsMetadata() {
        assertThatThrownBy(() -> DelimitedTextWriter.write(Map.of("a:b", "x"), new double[] {1, 2},
                new double[] {0.5, 0.5}, null))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("'a:b'");
    }
}
