package org.spectralsieve.spectrum;

/**
 * Evenly spaced wavelengths from {@code fromNm} in steps of {@code stepNm}, never beyond {@code toNm}.
 * The last point is exactly {@code toNm} when {@code toNm} lies on the step (within 1e-9 steps), so that
 * a grid 280..400 step 0.1 ends on 400 rather than on 399.99999999994.
 */
public record WavelengthGrid(double fromNm, double toNm, double stepNm) {

    /** Keeps a mistyped step (0.0001 nm over the whole UV-visible) from allocating gigabytes. */
    public static final int MAX_POINTS = 1_000_000;

    private static final double ON_STEP_TOLERANCE = 1e-9;

    public WavelengthGrid {
        requireFinite("fromNm", fromNm);
        requireFinite("toNm", toNm);
        requireFinite("stepNm", stepNm);
        if (!(fromNm < toNm)) {
            throw new CurveException("grid fromNm (" + fromNm + " nm) must be less than toNm (" + toNm + " nm)");
        }
        if (!(stepNm > 0)) {
            throw new CurveException("grid stepNm (" + stepNm + " nm) must be greater than 0");
        }
        double steps = (toNm - fromNm) / stepNm;
        if (!(steps + 1 <= MAX_POINTS)) {
            throw new CurveException("grid " + fromNm + ".." + toNm + " nm step " + stepNm
                    + " nm would have more than " + MAX_POINTS + " points");
        }
    }

    private static void requireFinite(String name, double value) {
        if (!Double.isFinite(value)) {
            throw new CurveException("grid " + name + " must be finite, was " + value);
        }
    }

    public int size() {
        return lastIndex() + 1;
    }

    public double at(int i) {
        int last = lastIndex();
        if (i < 0 || i > last) {
            throw new IndexOutOfBoundsException("grid index " + i + " outside 0.." + last);
        }
        if (i == last && endsOnStep()) {
            return toNm;
        }
        // min(): rounding in from + i*step must never push a point past toNm
        return Math.min(toNm, fromNm + i * stepNm);
    }

    public double[] points() {
        double[] points = new double[size()];
        for (int i = 0; i < points.length; i++) {
            points[i] = at(i);
        }
        return points;
    }

    private double steps() {
        return (toNm - fromNm) / stepNm;
    }

    private boolean endsOnStep() {
        double steps = steps();
        return Math.abs(steps - Math.rint(steps)) <= ON_STEP_TOLERANCE;
    }

    private int lastIndex() {
        double steps = steps();
        return (int) (endsOnStep() ? Math.rint(steps) : Math.floor(steps));
    }
}
