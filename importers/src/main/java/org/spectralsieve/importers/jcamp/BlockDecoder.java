package org.spectralsieve.importers.jcamp;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.spectralsieve.importers.ImportException;

/**
 * Decodes one block's data table and checks it against its header: NPOINTS must equal the decoded
 * count, and every line's X-check must sit on the grid FIRSTX…LASTX (errors); MINY, MAXY and FIRSTY
 * only warn, because real files get them wrong while their data are fine.
 */
final class BlockDecoder {

    /** Far beyond any optical spectrum (the largest reference file has 18 669); guards memory. */
    static final int MAX_POINTS = 4_000_000;

    private final String source;
    private final TextLines text;
    private final BlockScanner.Draft draft;
    private final List<String> warnings = new ArrayList<>();

    BlockDecoder(String source, TextLines text, BlockScanner.Draft draft) {
        this.source = source;
        this.text = text;
        this.draft = draft;
    }

    JcampBlock decode() throws ImportException {
        Ldr data = draft.data;
        if (data == null) {
            return new JcampBlock(draft.index, draft.startLine, draft.endLine, draft.ldrs, null, new double[0],
                    new double[0], new double[0], PointLines.none(), new boolean[0], warnings);
        }
        if (draft.extraTable) {
            warnings.add("block at line " + draft.startLine + " has more than one data table; only "
                    + Labels.field(data.name()) + " at line " + data.line() + " was read");
        }
        double xFactor = factor(Labels.XFACTOR);
        double yFactor = factor(Labels.YFACTOR);
        Optional<Integer> nPoints = count();
        int limit = nPoints.map(n -> Math.min(n, MAX_POINTS)).orElse(MAX_POINTS);
        String limitField = nPoints.isPresent() ? Labels.field(Labels.NPOINTS) : Labels.field(data.name());
        String form = data.value().replace(" ", "").replace("\t", "").toUpperCase(java.util.Locale.ROOT);
        double[] x;
        double[] raw;
        PointLines lines;
        if (data.canonical().equals(Labels.XYDATA) && !form.equals("(XY..XY)")) {
            if (!form.equals("(X++(Y..Y))")) {
                throw new ImportException(source, data.line(), Labels.field(data.name()),
                        "unsupported variable list '" + data.value() + "' (expected (X++(Y..Y)))");
            }
            AsdfDecoder asdf = new AsdfDecoder(source, Labels.field(data.name()), limit, limitField);
            for (int k = 0; k < draft.dataLines.size(); k++) {
                int i = draft.dataLines.get(k);
                asdf.line(text.chars, text.start(i), draft.dataEnds.get(k), TextLines.number(i));
            }
            raw = asdf.ordinates.toArray();
            lines = new PointLines(asdf.newPointStart, asdf.newPointLine);
            checkCount(nPoints, raw.length, data);
            x = new XGrid(source, draft, xFactor, asdf, warnings).abscissae();
        } else {
            int width = switch (form) {
                case "(XY..XY)" -> 2;
                case "(XYW..XYW)", "(XYM..XYM)" -> 3;
                default -> throw new ImportException(source, data.line(), Labels.field(data.name()),
                        "unsupported variable list '" + data.value() + "' (expected (XY..XY))");
            };
            TupleDecoder tuples = new TupleDecoder(source, Labels.field(data.name()), width, limit);
            for (int k = 0; k < draft.dataLines.size(); k++) {
                int i = draft.dataLines.get(k);
                tuples.line(text.chars, text.start(i), draft.dataEnds.get(k), TextLines.number(i));
            }
            tuples.finish();
            raw = tuples.y.toArray();
            lines = new PointLines(tuples.newPointStart, tuples.lineNumbers);
            checkCount(nPoints, raw.length, data);
            x = tuples.x.toArray();
            for (int i = 0; i < x.length; i++) {
                x[i] = finite(x[i] * xFactor, lines, i, data, "x");
            }
            checkEnds(x, lines);
        }
        double[] y = new double[raw.length];
        for (int i = 0; i < y.length; i++) {
            y[i] = finite(raw[i] * yFactor, lines, i, data, "y");
        }
        warnAboutHeaderY(y, yFactor);
        return new JcampBlock(draft.index, draft.startLine, draft.endLine, draft.ldrs, data.canonical(), x, y,
                raw, lines, BelowDetection.parse(source, draft, raw.length), warnings);
    }

    private double finite(double v, PointLines lines, int i, Ldr data, String what) throws ImportException {
        if (!Double.isFinite(v)) {
            throw new ImportException(source, lines.lineOf(i), Labels.field(data.name()), what + " out of range after scaling");
        }
        return v;
    }

    private void checkCount(Optional<Integer> nPoints, int decoded, Ldr data) throws ImportException {
        if (decoded == 0) {
            throw new ImportException(source, data.line(), Labels.field(data.name()), "no data after the label");
        }
        if (nPoints.isPresent() && nPoints.get() != decoded) {
            Ldr n = draft.ldrs.stream().filter(l -> l.canonical().equals(Labels.NPOINTS)).findFirst().orElseThrow();
            throw new ImportException(source, n.line(), Labels.field(n.name()), "##NPOINTS=" + nPoints.get()
                    + " but the data table at line " + data.line() + " holds " + decoded + " points");
        }
    }

    /** Tables of pairs carry their own x; FIRSTX and LASTX must still name its ends. */
    private void checkEnds(double[] x, PointLines lines) throws ImportException {
        checkEnd(Labels.FIRSTX, x[0], lines.lineOf(0));
        checkEnd(Labels.LASTX, x[x.length - 1], lines.lineOf(x.length - 1));
    }

    private void checkEnd(String label, double actual, int line) throws ImportException {
        Optional<Ldr> l = ldr(label);
        if (l.isEmpty()) {
            return;
        }
        double declared = HeaderNumbers.number(source, l.get());
        if (!(Math.abs(declared - actual) <= 1e-5 * Math.max(1.0, Math.abs(actual)))) {
            throw new ImportException(source, l.get().line(), Labels.field(l.get().name()), Labels.field(label)
                    + "=" + l.get().value() + " but the data at line " + line + " give " + actual);
        }
    }

    private void warnAboutHeaderY(double[] y, double yFactor) throws ImportException {
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (double v : y) {
            min = Math.min(min, v);
            max = Math.max(max, v);
        }
        double tolerance = 1e-3 * Math.max(Math.abs(min), Math.abs(max)) + Math.abs(yFactor);
        warnIfOff(Labels.MINY, min, tolerance, "the smallest decoded y");
        warnIfOff(Labels.MAXY, max, tolerance, "the largest decoded y");
        warnIfOff(Labels.FIRSTY, y[0], tolerance, "the first decoded y");
    }

    private void warnIfOff(String label, double actual, double tolerance, String what) throws ImportException {
        Optional<Ldr> l = ldr(label);
        if (l.isPresent()) {
            double declared = HeaderNumbers.number(source, l.get());
            double allowed = Math.max(tolerance, HeaderNumbers.halfLastDecimal(l.get().value()));
            if (!(Math.abs(declared - actual) <= allowed)) {
                warnings.add("line " + l.get().line() + ": " + Labels.field(l.get().name()) + "=" + l.get().value()
                        + " but " + what + " is " + actual + " (data kept, header ignored)");
            }
        }
    }

    private double factor(String label) throws ImportException {
        Optional<Ldr> l = ldr(label);
        if (l.isEmpty()) {
            return 1.0;
        }
        double f = HeaderNumbers.number(source, l.get());
        if (f == 0.0) {
            throw new ImportException(source, l.get().line(), Labels.field(l.get().name()), "a factor of zero");
        }
        return f;
    }

    private Optional<Integer> count() throws ImportException {
        Optional<Ldr> l = ldr(Labels.NPOINTS);
        if (l.isEmpty()) {
            return Optional.empty();
        }
        double n = HeaderNumbers.number(source, l.get());
        if (n < 0 || n != Math.rint(n) || n > Integer.MAX_VALUE) {
            throw new ImportException(source, l.get().line(), Labels.field(l.get().name()),
                    "not a point count: '" + l.get().value() + "'");
        }
        return Optional.of((int) n);
    }

    private Optional<Ldr> ldr(String canonical) {
        return draft.ldrs.stream().filter(l -> l.canonical().equals(canonical)).findFirst();
    }
}
