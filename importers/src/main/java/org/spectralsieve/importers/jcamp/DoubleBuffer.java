package org.spectralsieve.importers.jcamp;

import java.util.Arrays;

/** A growable primitive array: the decoders append millions of values without boxing. */
final class DoubleBuffer {
    private double[] data = new double[256];
    private int size;

    void add(double v) {
        if (size == data.length) {
            data = Arrays.copyOf(data, data.length * 2);
        }
        data[size++] = v;
    }

    double get(int i) {
        return data[i];
    }

    int size() {
        return size;
    }

    double[] toArray() {
        return Arrays.copyOf(data, size);
    }
}
