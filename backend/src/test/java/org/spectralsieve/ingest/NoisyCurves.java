package org.spectralsieve.ingest;

import java.util.Locale;
import java.util.Random;

/**
 * Generated curves for the noise-region tests: an invented long-pass sheet (illustrative, no real product)
 * read at 1 nm, into which the noise of a real capture is injected where a test wants it.
 */
public final class NoisyCurves {

    public static final int FIRST_NM = 190;
    public static final int LAST_NM = 800;

    private NoisyCurves() {
    }

    public static double[] wavelengths() {
        double[] nm = new double[LAST_NM - FIRST_NM + 1];
        for (int i = 0; i < nm.length; i++) {
            nm[i] = FIRST_NM + i;
        }
        return nm;
    }

    /** A smooth cut-on: T = 0.9 / (1 + e^−(λ−350)/8), near 0 below 300 nm, 0.9 above 400 nm. */
    public static double[] cleanTransmittance() {
        double[] nm = wavelengths();
        double[] t = new double[nm.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = 0.9 / (1 + Math.exp(-(nm[i] - 350) / 8));
        }
        return t;
    }

    /**
     * Replaces the readings from {@code fromNm} to {@code toNm} by absorbance drawn evenly from −0.7 to 1.1, as a
     * diode array reports where its lamp and detector give almost no light (the range of a real capture's deep UV:
     * SOURCES.md §2, uv-link.jdx, y(190) = −0.73, max 1.12).
     */
    public static double[] withAbsorbanceNoise(double[] t, int fromNm, int toNm, long seed) {
        Random random = new Random(seed);
        double[] noisy = t.clone();
        for (int nm = fromNm; nm <= toNm; nm++) {
            noisy[nm - FIRST_NM] = Math.pow(10, -(-0.7 + 1.8 * random.nextDouble()));
        }
        return noisy;
    }

    /** Adds Gaussian noise of {@code sigma} (a transmittance fraction) to every reading. */
    public static double[] withPhotometricNoise(double[] t, double sigma, long seed) {
        Random random = new Random(seed);
        double[] noisy = t.clone();
        for (int i = 0; i < noisy.length; i++) {
            noisy[i] += sigma * random.nextGaussian();
        }
        return noisy;
    }

    /** The curve as a delimited file of absorbance, as a diode-array program exports it. */
    public static String absorbanceCsv(double[] t) {
        double[] nm = wavelengths();
        StringBuilder csv = new StringBuilder("# illustrative long-pass sheet, invented bench capture\nwavelength_nm,absorbance\n");
        for (int i = 0; i < nm.length; i++) {
            csv.append(String.format(Locale.ROOT, "%.0f,%.6f%n", nm[i], -Math.log10(Math.max(t[i], 1e-6))));
        }
        return csv.toString();
    }

    public static int index(int nm) {
        return nm - FIRST_NM;
    }
}
