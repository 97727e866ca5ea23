package org.spectralsieve.importers.jcamp;

import java.util.Arrays;

/** A growable int array (line numbers and point indices). */
final class IntBuffer {
    private int[] data = new int[64];
    private int size;

    void add(int v) {
        if (size == data.length) {
            data = Arrays.copyOf(data, data.length * 2);
        }
        data[size++] = v;
    }

    int get(int i) {
        return data[i];
    }

    int size() {
        return size;
    }

    int[] toArray() {
        return Arrays.copyOf(data, size);
    }
}
