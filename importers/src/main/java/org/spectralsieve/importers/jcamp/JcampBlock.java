package org.spectralsieve.importers.jcamp;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * One block of a JCAMP-DX file (a {@code ##TITLE=} … {@code ##END=} pair), decoded but not yet
 * interpreted: x and y are in the file's own units with XFACTOR and YFACTOR applied, in file order;
 * {@link #rawY()} holds the ordinates exactly as written. A LINK file's outer block has no data.
 * Immutable; arrays are copied out.
 */
public final class JcampBlock {

    private final int index;
    private final int startLine;
    private final int endLine;
    private final List<Ldr> ldrs;
    private final String dataLabel;
    private final double[] x;
    private final double[] y;
    private final double[] rawY;
    private final PointLines pointLines;
    private final boolean[] upperBounds;
    private final List<String> warnings;

    JcampBlock(int index, int startLine, int endLine, List<Ldr> ldrs, String dataLabel, double[] x,
            double[] y, double[] rawY, PointLines pointLines, boolean[] upperBounds, List<String> warnings) {
        this.index = index;
        this.startLine = startLine;
        this.endLine = endLine;
        this.ldrs = List.copyOf(ldrs);
        this.dataLabel = dataLabel;
        this.x = x;
        this.y = y;
        this.rawY = rawY;
        this.pointLines = pointLines;
        this.upperBounds = upperBounds;
        this.warnings = List.copyOf(warnings);
    }

    /** 0-based position in the file, counting every block (a LINK's outer block is 0). */
    public int index() {
        return index;
    }

    /** 1-based line of the block's first label. */
    public int startLine() {
        return startLine;
    }

    /** 1-based line of its {@code ##END=}. */
    public int endLine() {
        return endLine;
    }

    public String title() {
        return label(Labels.TITLE).orElse("");
    }

    /** The value of a label, looked up by the standard's rule ({@code "DATA TYPE"} finds {@code ##DATATYPE=}). */
    public Optional<String> label(String name) {
        String wanted = Labels.canonical(name);
        for (Ldr l : ldrs) {
            if (l.canonical().equals(wanted)) {
                return Optional.of(l.value());
            }
        }
        return Optional.empty();
    }

    /** All labels of this block with their names as written (first occurrence wins), in file order. */
    public Map<String, String> labels() {
        Map<String, String> m = new LinkedHashMap<>();
        for (Ldr l : ldrs) {
            m.putIfAbsent(l.name(), l.value());
        }
        return Collections.unmodifiableMap(m);
    }

    /** True when the block holds a data table (XYDATA, XYPOINTS or PEAK TABLE). */
    public boolean hasData() {
        return dataLabel != null;
    }

    /** The data table's label ({@code ##XYDATA}, {@code ##XYPOINTS} or {@code ##PEAKTABLE}), or "" without data. */
    public String dataLabel() {
        return dataLabel == null ? "" : Labels.field(dataLabel);
    }

    public int size() {
        return x.length;
    }

    /** Abscissae in the file's XUNITS, XFACTOR applied, file order (a copy). */
    public double[] x() {
        return x.clone();
    }

    /** Ordinates in the file's YUNITS, YFACTOR applied, file order (a copy). */
    public double[] y() {
        return y.clone();
    }

    /** Ordinates exactly as written, before YFACTOR (a copy): equal across FIX, PAC, SQZ, DIFDUP. */
    public double[] rawY() {
        return rawY.clone();
    }

    /** Points flagged by {@code ##$SIEVE BELOW DETECTION=}, file order (a copy). */
    public boolean[] upperBounds() {
        return upperBounds.clone();
    }

    /** Header values that disagree with the data without making it unusable (MINY, MAXY, FIRSTY…). */
    public List<String> warnings() {
        return warnings;
    }

    List<Ldr> ldrs() {
        return ldrs;
    }

    Optional<Ldr> ldr(String canonical) {
        return ldrs.stream().filter(l -> l.canonical().equals(canonical)).findFirst();
    }

    /** 1-based file line of point {@code i}. */
    int pointLine(int i) {
        return pointLines.lineOf(i);
    }

    @Override
    public String toString() {
        return "JcampBlock[" + index + ", '" + title() + "', lines " + startLine + "–" + endLine + ", "
                + (hasData() ? dataLabel() + " " + size() + " points" : "no data") + "]";
    }
}
