package org.spectralsieve.spectrum;

import java.util.Arrays;

/**
 * A {@code double[]} as a map key by its content (equal when every value is), hashed once: shared curve
 * arrays are pooled by it, and a layer's stacked parts are remembered per front grid by it.
 */
public final class ArrayContent {

    private final double[] values;
    private final int hash;

    public ArrayContent(double[] values) {
        this.values = values;
        this.hash = Arrays.hashCode(values);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ArrayContent other && hash == other.hash && Arrays.equals(values, other.values);
    }

    @Override
    public int hashCode() {
        return hash;
    }
}
