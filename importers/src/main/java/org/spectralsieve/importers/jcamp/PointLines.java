package org.spectralsieve.importers.jcamp;

import java.util.Arrays;

/**
 * Which file line each point came from, stored per line rather than per point (one int per data line
 * instead of one per point keeps the decoding loop lean); looked up only to word error messages.
 */
final class PointLines {

    private final int[] firstPoint;
    private final int[] lineNumber;

    /** @param firstPoint index of the first point decoded on each line, non-decreasing */
    PointLines(IntBuffer firstPoint, IntBuffer lineNumber) {
        this.firstPoint = firstPoint.toArray();
        this.lineNumber = lineNumber.toArray();
    }

    static PointLines none() {
        return new PointLines(new IntBuffer(), new IntBuffer());
    }

    /** 1-based line of point {@code i} (file order); 0 when unknown. */
    int lineOf(int i) {
        int k = Arrays.binarySearch(firstPoint, i);
        if (k < 0) {
            k = -k - 2;
        } else {
            while (k + 1 < firstPoint.length && firstPoint[k + 1] == i) {
                k++; // lines that added no point share the index; the point sits on the last of them
            }
        }
        return k >= 0 && k < lineNumber.length ? lineNumber[k] : 0;
    }
}
