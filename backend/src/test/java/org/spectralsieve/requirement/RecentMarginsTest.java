package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;

/**
 * {@link RecentMargins} against the margin it keeps: every value read is the one the function gives at that
 * thickness, bit for bit, and the function is asked again only for a thickness not among the last
 * {@link RecentMargins#CAPACITY} computed (a seeded random sequence of thicknesses, new and repeated, as a solve
 * asks them). The margin here is a Beer–Lambert pass margin, log10(T(d)/T*) with T(d) = 10^(−a·d) (internal
 * transmittance only, the textbook law), NaN beyond a far thickness as a condition with a bound reading gives.
 */
class RecentMarginsTest {

    @Test
    void everyMarginReadIsTheOneComputedAndOnlyForgottenThicknessesAreComputedAgain() {
        Random random = new Random(20261205L);
        for (int trial = 0; trial < 200; trial++) {
            double absorbancePerMm = 0.05 + random.nextDouble();
            double threshold = 0.1 + 0.8 * random.nextDouble();
            double farMm = 2 + 6 * random.nextDouble();
            DoubleUnaryOperator margin = d -> d > farMm ? Double.NaN
                    : Math.log10(Math.pow(10, -absorbancePerMm * d) / threshold);
            int[] computed = {0};
            RecentMargins recent = new RecentMargins(d -> {
                computed[0]++;
                return margin.applyAsDouble(d);
            });
            Deque<Double> lastComputed = new ArrayDeque<>();
            double[] asked = new double[40];
            int count = 0;
            for (int step = 0; step < 300; step++) {
                double d = count > 0 && random.nextInt(3) > 0 ? asked[random.nextInt(count)] : 1 + 9 * random.nextDouble();
                if (count < asked.length) {
                    asked[count++] = d;
                }
                int before = computed[0];
                double read = recent.at(d);
                assertThat(Double.doubleToRawLongBits(read)).as("margin at " + d)
                        .isEqualTo(Double.doubleToRawLongBits(margin.applyAsDouble(d)));
                boolean kept = lastComputed.contains(d);
                assertThat(computed[0] - before).as("computed again at " + d).isEqualTo(kept ? 0 : 1);
                if (!kept) {
                    lastComputed.addLast(d);
                    if (lastComputed.size() > RecentMargins.CAPACITY) {
                        lastComputed.removeFirst();
                    }
                }
            }
        }
    }
}
