package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;
import tools.jackson.core.StreamWriteFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The shortest-decimal writer the answers use ({@link JsonNumbersConfiguration}) writes every double as a number
 * that parses back to exactly that double: checked by bits (the round-trip property of a correct shortest
 * representation; Schubfach, "The Schubfach way to render doubles", R. Giulietti, 2020, whose guarantee is that the
 * decimal read back rounds to the same double) on 200,000 doubles of a fixed seed — transmittances in (0, 1],
 * their logarithms, wavelengths, thicknesses and doubles of random bits — and on the edge values.
 */
class JsonNumbersTest {

    private static final JsonMapper FAST = JsonMapper.builder().enable(StreamWriteFeature.USE_FAST_DOUBLE_WRITER).build();
    private static final JsonMapper EARLIER = JsonMapper.builder().disable(StreamWriteFeature.USE_FAST_DOUBLE_WRITER).build();

    @Test
    void everyDoubleWrittenByTheFastWriterReadsBackBitForBit() {
        Random random = new Random(20261205L);
        double[] values = new double[200_000];
        for (int i = 0; i < values.length; i++) {
            values[i] = switch (i % 5) {
                case 0 -> random.nextDouble();
                case 1 -> Math.pow(10, -6 * random.nextDouble());
                case 2 -> 190 + 910 * random.nextDouble();
                case 3 -> Math.log10(random.nextDouble());
                default -> {
                    double d = Double.longBitsToDouble(random.nextLong());
                    yield Double.isFinite(d) ? d : 0.5;
                }
            };
        }
        assertRoundTrips(values);
        assertRoundTrips(new double[] {0.0, -0.0, Double.MIN_VALUE, Double.MIN_NORMAL, Double.MAX_VALUE, 1.0, 0.1,
                2.0E23, 1.0E-3, 9.999999999999999E22, 5.0E-324});
    }

    @Test
    void theEarlierWriterAndTheFastOneGiveTheSameNumbers() {
        Random random = new Random(7);
        double[] values = new double[20_000];
        for (int i = 0; i < values.length; i++) {
            values[i] = random.nextDouble() * Math.pow(10, random.nextInt(12) - 6);
        }
        JsonNode fast = FAST.readTree(FAST.writeValueAsString(values));
        JsonNode earlier = EARLIER.readTree(EARLIER.writeValueAsString(values));
        for (int i = 0; i < values.length; i++) {
            assertThat(fast.get(i).doubleValue()).isEqualTo(earlier.get(i).doubleValue());
        }
    }

    @Test
    void theServiceWritesDoublesTheFastWayUnlessSwitchedOff() {
        JsonMapper.Builder builder = JsonMapper.builder();
        new JsonNumbersConfiguration().shortestDoubles().customize(builder);
        assertThat(builder.build().isEnabled(StreamWriteFeature.USE_FAST_DOUBLE_WRITER))
                .isEqualTo(JsonNumbersConfiguration.fastDoubles());
    }

    private static void assertRoundTrips(double[] values) {
        String text = FAST.writeValueAsString(values);
        // the written text itself, not a parsed node (a node would render its double again)
        String[] written = text.substring(1, text.length() - 1).split(",");
        assertThat(written).hasSize(values.length);
        for (int i = 0; i < values.length; i++) {
            assertThat(Double.doubleToRawLongBits(Double.parseDouble(written[i])))
                    .as("%s written as %s", values[i], written[i])
                    .isEqualTo(Double.doubleToRawLongBits(values[i]));
        }
    }
}
