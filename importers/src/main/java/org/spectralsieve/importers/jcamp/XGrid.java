package org.spectralsieve.importers.jcamp;

import java.util.List;
import java.util.Optional;
import org.spectralsieve.importers.ImportException;

/**
 * Places the ordinates of an {@code (X++(Y..Y))} table on their abscissae. The standard defines the
 * grid by FIRSTX, LASTX and NPOINTS (equal steps); the X written at each line start is only a check.
 * A line X more than half a step away from its grid point would name a different point, so that is
 * the tolerance (it also absorbs line X values rounded to whole XFACTOR units).
 */
final class XGrid {

    private final String source;
    private final BlockScanner.Draft draft;
    private final double xFactor;
    private final AsdfDecoder asdf;
    private final List<String> warnings;

    XGrid(String source, BlockScanner.Draft draft, double xFactor, AsdfDecoder asdf, List<String> warnings) {
        this.warnings = warnings;
        this.source = source;
        this.draft = draft;
        this.xFactor = xFactor;
        this.asdf = asdf;
    }

    double[] abscissae() throws ImportException {
        int n = asdf.ordinates.size();
        int lines = asdf.lineX.size();
        Optional<Ldr> first = ldr(Labels.FIRSTX);
        Optional<Ldr> last = ldr(Labels.LASTX);
        Optional<Ldr> delta = ldr(Labels.DELTAX);
        double firstX = first.isPresent() ? HeaderNumbers.number(source, first.get()) : lineX(0);
        Optional<Double> lastX = HeaderNumbers.optional(source, last);
        Optional<Double> deltaX = HeaderNumbers.optional(source, delta);
        double step;
        if (lastX.isPresent() && n > 1) {
            step = (lastX.get() - firstX) / (n - 1);
            if (deltaX.isPresent() && Math.abs(deltaX.get() - step) > 1e-3 * Math.abs(step)) {
                warnings.add("line " + delta.get().line() + ": ##DELTAX=" + delta.get().value()
                        + " but FIRSTX, LASTX and the point count give a step of " + step);
            }
        } else if (deltaX.isPresent()) {
            step = deltaX.get();
        } else if (lines >= 2 && asdf.lineFirstPoint.get(lines - 1) > 0) {
            step = (lineX(lines - 1) - lineX(0)) / asdf.lineFirstPoint.get(lines - 1);
        } else if (n == 1) {
            step = 0;
        } else {
            throw new ImportException(source, draft.data.line(), Labels.field(Labels.DELTAX),
                    "cannot place the points: no ##LASTX or ##DELTAX and only one data line");
        }
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = firstX + i * step;
        }
        if (lastX.isPresent() && n > 1) {
            x[n - 1] = lastX.get();
        }
        check(x, step, first, last);
        return x;
    }

    private void check(double[] x, double step, Optional<Ldr> first, Optional<Ldr> last) throws ImportException {
        double tolerance = step == 0 ? 1e-9 * Math.max(1.0, Math.abs(x[0])) : 0.5 * Math.abs(step);
        int lines = asdf.lineX.size();
        if (first.isPresent() && !(Math.abs(lineX(0) - x[0]) <= tolerance)) {
            throw new ImportException(source, first.get().line(), Labels.field(first.get().name()),
                    Labels.field(first.get().name()) + "=" + first.get().value() + " but the first data line (line "
                            + asdf.lineNumbers.get(0) + ") starts at X " + lineX(0));
        }
        int k = lines - 1;
        double expectedLast = x[asdf.lineFirstPoint.get(k)];
        if (!(Math.abs(lineX(k) - expectedLast) <= tolerance)) {
            String field = last.isPresent() ? Labels.field(last.get().name()) : Labels.field(draft.data.name());
            throw new ImportException(source, asdf.lineNumbers.get(k), field, "X-check: the last data line starts"
                    + " at X " + lineX(k) + " but the grid from FIRSTX"
                    + (last.isPresent() ? " to LASTX=" + last.get().value() : "") + " puts point "
                    + asdf.lineFirstPoint.get(k) + " at " + expectedLast);
        }
        for (int j = 1; j < k; j++) {
            double expected = x[asdf.lineFirstPoint.get(j)];
            if (!(Math.abs(lineX(j) - expected) <= tolerance)) {
                throw new ImportException(source, asdf.lineNumbers.get(j), Labels.field(draft.data.name()),
                        "X-check: the line starts at X " + lineX(j) + " but its first point "
                                + asdf.lineFirstPoint.get(j) + " lies at " + expected + " on the grid");
            }
        }
    }

    /** Line X values are written in XFACTOR units. */
    private double lineX(int line) {
        return asdf.lineX.get(line) * xFactor;
    }

    private Optional<Ldr> ldr(String canonical) {
        return draft.ldrs.stream().filter(l -> l.canonical().equals(canonical)).findFirst();
    }
}
