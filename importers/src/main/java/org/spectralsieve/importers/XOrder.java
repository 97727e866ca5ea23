package org.spectralsieve.importers;

import java.util.ArrayList;
import java.util.List;

/**
 * Puts rows in increasing wavelength order, or refuses them. Files may run either way (long to short
 * wavelengths, or increasing wavenumbers, which are decreasing wavelengths): a monotonic decreasing
 * column is reversed with a note. A column that changes direction is refused, naming every line where
 * it turns. Equal neighbours are refused, or merged into their mean when the user asked for it.
 *
 * <p>Several value columns may share the wavelength column; they are reordered and merged together.
 */
final class XOrder {

    /** Turning points listed in full up to this many; more are counted. */
    private static final int LISTED = 10;

    /** Rows in increasing x; {@code bounds[k]} true where the k-th column holds an upper bound. */
    record Ordered(double[] x, double[][] values, boolean[][] bounds, int[] lines, List<String> notes) {
    }

    private XOrder() {
    }

    /**
     * @param x      wavelengths in nm, file order
     * @param field  name of the wavelength column, for messages
     * @param merge  merge runs of equal wavelengths into the mean instead of refusing them
     */
    static Ordered order(String source, String field, double[] x, double[][] values, boolean[][] bounds,
            int[] lines, boolean merge) throws ImportException {
        int n = x.length;
        int direction = 0;
        List<Integer> turns = new ArrayList<>();
        int firstDuplicate = -1;
        int duplicates = 0;
        for (int i = 1; i < n; i++) {
            int step = Double.compare(x[i], x[i - 1]);
            if (x[i] == x[i - 1]) {
                step = 0; // -0.0 and 0.0 are equal wavelengths
            }
            if (step == 0) {
                duplicates++;
                firstDuplicate = firstDuplicate < 0 ? i : firstDuplicate;
            } else if (direction == 0) {
                direction = step;
            } else if (step != direction) {
                turns.add(i);
                direction = step;
            }
        }
        if (!turns.isEmpty()) {
            throw notMonotonic(source, field, x, lines, turns);
        }
        if (duplicates > 0 && !merge) {
            int i = firstDuplicate;
            throw new ImportException(source, lines[i], field, "duplicate wavelength: line " + lines[i] + " ("
                    + x[i] + " nm) repeats line " + lines[i - 1] + " (" + x[i - 1] + " nm)"
                    + (duplicates > 1 ? "; " + duplicates + " repeated wavelengths in all" : "")
                    + "; set mergeDuplicates in the read options to average them");
        }
        List<String> notes = new ArrayList<>();
        boolean reverse = direction < 0;
        if (reverse) {
            notes.add("wavelengths run from " + x[0] + " to " + x[n - 1] + " nm; rows reversed into increasing order");
        }
        return build(x, values, bounds, lines, reverse, duplicates, notes);
    }

    private static ImportException notMonotonic(String source, String field, double[] x, int[] lines,
            List<Integer> turns) {
        StringBuilder where = new StringBuilder();
        for (int t = 0; t < Math.min(turns.size(), LISTED); t++) {
            int i = turns.get(t);
            where.append(t == 0 ? "" : ", ").append("line ").append(lines[i]).append(" (").append(x[i])
                    .append(" nm after ").append(x[i - 1]).append(" nm)");
        }
        if (turns.size() > LISTED) {
            where.append(" and ").append(turns.size() - LISTED).append(" more");
        }
        return new ImportException(source, lines[turns.get(0)], field, "wavelengths are not monotonic: the order "
                + "changes direction at " + where + "; a curve needs one wavelength per point in one direction");
    }

    private static Ordered build(double[] x, double[][] values, boolean[][] bounds, int[] lines, boolean reverse,
            int duplicates, List<String> notes) {
        int n = x.length;
        int m = n - duplicates;
        int k = values.length;
        double[] ox = new double[m];
        double[][] ov = new double[k][m];
        boolean[][] ob = new boolean[k][m];
        int[] ol = new int[m];
        int out = -1;
        int runLength = 0;
        for (int j = 0; j < n; j++) {
            int i = reverse ? n - 1 - j : j;
            boolean same = out >= 0 && x[i] == ox[out];
            if (!same) {
                finishRun(ov, ob, out, runLength);
                out++;
                ox[out] = x[i];
                ol[out] = lines[i];
                runLength = 0;
                for (int c = 0; c < k; c++) {
                    ob[c][out] = true;
                }
            }
            runLength++;
            for (int c = 0; c < k; c++) {
                ov[c][out] += values[c][i] / runOf(x, i, reverse); // divide first: a sum of huge values would overflow
                ob[c][out] &= bounds[c] != null && bounds[c][i];
            }
        }
        finishRun(ov, ob, out, runLength);
        if (duplicates > 0) {
            notes.add(duplicates + " rows with a repeated wavelength merged into the mean of their values"
                    + " (an upper bound only where every merged value was one)");
        }
        return new Ordered(ox, ov, ob, ol, notes);
    }

    private static void finishRun(double[][] ov, boolean[][] ob, int out, int runLength) {
        // the mean is already complete: each value was divided by the length of its run
    }

    /** Length of the run of equal wavelengths that row i belongs to. */
    private static int runOf(double[] x, int i, boolean reverse) {
        int a = i;
        int b = i;
        while (a > 0 && x[a - 1] == x[i]) {
            a--;
        }
        while (b < x.length - 1 && x[b + 1] == x[i]) {
            b++;
        }
        return b - a + 1;
    }
}
