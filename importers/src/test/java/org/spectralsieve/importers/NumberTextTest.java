package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** The in-place parser must agree bit for bit with Double.parseDouble (the JDK's correctly rounded reference). */
class NumberTextTest {

    @Test
    void agreesWithTheJdkOnOneHundredThousandRandomNumbersInSeveralForms() {
        Random random = new Random(7L);
        for (int k = 0; k < 100_000; k++) {
            double v = random.nextDouble() * Math.pow(10, random.nextInt(40) - 20) * (random.nextBoolean() ? 1 : -1);
            String text = switch (k % 4) {
                case 0 -> Double.toString(v);
                case 1 -> String.format(Locale.ROOT, "%.6f", v);
                case 2 -> String.format(Locale.ROOT, "%.3e", v);
                default -> String.format(Locale.ROOT, "%.17g", v);
            };
            assertThat(NumberText.parse(text, 0, text.length(), '.')).as(text).isEqualTo(Double.parseDouble(text));
        }
    }

    @Test
    void decimalCommaReadsLikeAPoint() {
        assertThat(NumberText.parse("365,5", 0, 5, ',')).isEqualTo(365.5);
        assertThat(NumberText.parse("x0,0100000109795873x", 1, 19, ',')).isEqualTo(0.0100000109795873);
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "-", ".", "1e", "1e+", "0x10", "1d", "1f", "1,5", "1.2.3", "1 2", "abc", "NaN"})
    void refusesWhatIsNotAPlainDecimal(String text) {
        assertThatThrownBy(() -> NumberText.parse(text, 0, text.length(), '.')).isInstanceOf(NumberFormatException.class);
    }
}
