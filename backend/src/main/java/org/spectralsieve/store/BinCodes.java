package org.spectralsieve.store;

import static org.spectralsieve.store.WeightedScreen.OFFSET;
import static org.spectralsieve.store.WeightedScreen.STEP;

/**
 * {@link WeightedScreen}'s one-byte bin codes: the code of an upper or lower bound on T (optical density in steps of
 * {@link WeightedScreen#STEP} decades, rounded to the safe side), the transmittance a code stands for and its
 * logarithm, and the powers T(c)^k of every code for the bounds over thickness ({@link Powers}).
 */
final class BinCodes {

    private BinCodes() {
    }

    /** The transmittance each code stands for (0 for code 0: no bound). */
    static final double[] T_OF_CODE = new double[256];

    /** ln of {@link #T_OF_CODE} (−∞ for code 0), for powers of bin values. */
    static final double[] LN_T_OF_CODE = new double[256];

    /** ln of the transmittance ratio of one code step: ln T(c + 1) − ln T(c) = −STEP·ln 10. */
    static final double LN_T_PER_CODE = -STEP * Math.log(10);

    static {
        LN_T_OF_CODE[0] = Double.NEGATIVE_INFINITY;
        for (int c = 1; c < 256; c++) {
            T_OF_CODE[c] = Math.pow(10, -(c - OFFSET) * STEP);
            LN_T_OF_CODE[c] = Math.log(T_OF_CODE[c]);
        }
    }

    /**
     * T(c)^k for every code c, for one exponent k at a time, without an exp per code: the codes' transmittances
     * are a geometric sequence (each code step is {@link WeightedScreen#STEP} decades), so T(c)^k = g^(c − OFFSET) with
     * g = T(OFFSET + 1)^k, formed as g^(−OFFSET)·g^(c mod 16)·g^(16·(c div 16)) from two tables of 16 powers.
     * Each entry is a product of at most 16 roundings, and the product of three more: under 1e-14 relative
     * altogether, against {@link WeightedScreen#POWER_ROOM} = 1e-12 the callers move it by. Not thread-safe.
     */
    static final class Powers {
        private final double[] low = new double[16];
        private final double[] high = new double[16];
        private double k = Double.NaN;

        /** Prepares the tables for exponent k (nothing to do when k is the last one). */
        void of(double k) {
            if (k == this.k) {
                return;
            }
            this.k = k;
            double g = Math.exp(k * LN_T_PER_CODE);
            double shift = Math.exp(-OFFSET * k * LN_T_PER_CODE);
            low[0] = shift;
            for (int j = 1; j < 16; j++) {
                low[j] = low[j - 1] * g;
            }
            double g16 = Math.exp(16 * k * LN_T_PER_CODE);
            high[0] = 1;
            for (int i = 1; i < 16; i++) {
                high[i] = high[i - 1] * g16;
            }
        }

        /** T(code)^k, to within {@link WeightedScreen#POWER_ROOM}; code ≥ 1. */
        double at(int code) {
            return low[code & 15] * high[code >>> 4];
        }
    }

    /** Code of an upper bound on T: OD rounded down; 0 (no bound) above T = 10^(OFFSET·STEP). */
    static int codeAtMost(double t) {
        if (!(t > 0)) {
            return 255;
        }
        long c = (long) Math.floor(-Math.log10(t) / STEP - 1e-6) + OFFSET;
        return c < 1 ? 0 : (int) Math.min(255, c);
    }

    /** Code of a lower bound on T: OD rounded up; 0 (T may be 0) where the OD is beyond the code. */
    static int codeAtLeast(double t) {
        if (!(t > 0)) {
            return 0;
        }
        long c = (long) Math.ceil(-Math.log10(t) / STEP + 1e-6) + OFFSET;
        return c > 255 ? 0 : (int) Math.max(1, c);
    }

    /** The transmittance a code stands for (0 for code 0). */
    static double transmittanceOf(int code) {
        return T_OF_CODE[code];
    }
}
