package org.spectralsieve.store;

/**
 * Each curve's class for the integer screen over a thickness range ({@link RangeLevelScreen}): a film or
 * coating (read as measured), a sheet whose thickness is unknown (always kept), or a sheet of one index
 * model whose measured thickness falls in one narrow bucket. The buckets are runs of float bit patterns
 * (the bits of a positive float order as its value), 128 per octave (under 0.8 % wide) unless the store's
 * models and thicknesses would make more than {@link #MOST} classes, in which case they are coarser.
 * Derived from the store's own arrays once per store; 2 bytes per curve.
 */
final class ThicknessClasses {

    static final int FILM = 0;
    static final int UNKNOWN_THICKNESS = 1;
    private static final int FIRST_SHEET = 2;
    /** At most this many classes: a screen's table of limits (two ints per class) stays within 128 KB. */
    static final int MOST = 1 << 14;
    private static final int FINEST_SHIFT = 16;
    /** Beyond this a bucket would span more than an octave: no classes (the exact caps read every curve). */
    private static final int COARSEST_SHIFT = 23;

    private final short[] classOfCurve;
    private final int shift;
    private final int firstBucket;
    private final int buckets;
    private final int models;

    private ThicknessClasses(short[] classOfCurve, int shift, int firstBucket, int buckets, int models) {
        this.classOfCurve = classOfCurve;
        this.shift = shift;
        this.firstBucket = firstBucket;
        this.buckets = buckets;
        this.models = models;
    }

    /** The classes of the store's curves, or null when even octave-wide buckets would make too many. */
    static ThicknessClasses of(boolean[] bulk, float[] thicknessMm, short[] indexModelOfCurve, int size, int models) {
        int lowestBits = Integer.MAX_VALUE;
        int highestBits = 0;
        for (int c = 0; c < size; c++) {
            if (bulk[c] && known(thicknessMm[c])) {
                int bits = Float.floatToRawIntBits(thicknessMm[c]);
                lowestBits = Math.min(lowestBits, bits);
                highestBits = Math.max(highestBits, bits);
            }
        }
        int shift = FINEST_SHIFT;
        int buckets = lowestBits > highestBits ? 0 : (highestBits >>> shift) - (lowestBits >>> shift) + 1;
        while ((long) models * buckets + FIRST_SHEET > MOST) {
            if (++shift > COARSEST_SHIFT) {
                return null;
            }
            buckets = (highestBits >>> shift) - (lowestBits >>> shift) + 1;
        }
        int firstBucket = buckets == 0 ? 0 : lowestBits >>> shift;
        short[] classes = new short[size];
        for (int c = 0; c < size; c++) {
            int cls;
            if (!bulk[c]) {
                cls = FILM;
            } else if (!known(thicknessMm[c])) {
                cls = UNKNOWN_THICKNESS;
            } else {
                int bucket = (Float.floatToRawIntBits(thicknessMm[c]) >>> shift) - firstBucket;
                cls = FIRST_SHEET + indexModelOfCurve[c] * buckets + bucket;
            }
            classes[c] = (short) cls;
        }
        return new ThicknessClasses(classes, shift, firstBucket, buckets, models);
    }

    /** The thicknesses the caps work out a line for: positive and finite (the others are kept). */
    private static boolean known(float mm) {
        return mm > 0 && !Float.isInfinite(mm);
    }

    short[] classOfCurve() {
        return classOfCurve;
    }

    int classes() {
        return FIRST_SHEET + models * buckets;
    }

    /** The class of sheets of index model {@code model} in thickness bucket {@code bucket}. */
    static int sheetClass(int model, int bucket, int buckets) {
        return FIRST_SHEET + model * buckets + bucket;
    }

    int buckets() {
        return buckets;
    }

    int models() {
        return models;
    }

    /** The thinnest thickness in a bucket (every curve of the bucket is at least this thick). */
    double bucketLowMm(int bucket) {
        return Float.intBitsToFloat((firstBucket + bucket) << shift);
    }

    /** Above every thickness in a bucket (+∞ for the bucket of the largest floats). */
    double bucketHighMm(int bucket) {
        long bits = (long) (firstBucket + bucket + 1) << shift;
        return bits >= Float.floatToRawIntBits(Float.POSITIVE_INFINITY) ? Double.POSITIVE_INFINITY
                : Float.intBitsToFloat((int) bits);
    }
}
