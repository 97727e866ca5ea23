package org.spectralsieve.library;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;

/**
 * Curves are stored as packed little-endian float64 arrays rather than one row per point: a 5,000-point
 * curve is one 40 kB value that round-trips bit-exact and loads in a single read. Public because the
 * imported reference spectra ({@code spectra}) are stored the same way.
 */
public final class PackedArrays {

    private PackedArrays() {
    }

    public static byte[] pack(double[] values) {
        ByteBuffer buffer = ByteBuffer.allocate(values.length * Double.BYTES).order(ByteOrder.LITTLE_ENDIAN);
        buffer.asDoubleBuffer().put(values);
        return buffer.array();
    }

    public static double[] unpackDoubles(byte[] bytes, int expectedCount, String column) {
        if (bytes.length != expectedCount * Double.BYTES) {
            throw new IllegalStateException("column " + column + " holds " + bytes.length + " bytes, expected "
                    + expectedCount * Double.BYTES + " for " + expectedCount + " points");
        }
        double[] values = new double[expectedCount];
        ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN).asDoubleBuffer().get(values);
        return values;
    }

    public static byte[] pack(boolean[] flags) {
        byte[] bytes = new byte[flags.length];
        for (int i = 0; i < flags.length; i++) {
            bytes[i] = (byte) (flags[i] ? 1 : 0);
        }
        return bytes;
    }

    public static boolean[] unpackFlags(byte[] bytes, int expectedCount, String column) {
        if (bytes.length != expectedCount) {
            throw new IllegalStateException("column " + column + " holds " + bytes.length + " flags, expected " + expectedCount);
        }
        boolean[] flags = new boolean[expectedCount];
        for (int i = 0; i < expectedCount; i++) {
            flags[i] = bytes[i] != 0;
        }
        return flags;
    }
}
