package org.spectralsieve.weighting;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Assumptions;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Test-only readers for tables from outside the project: the CSV copies (CIE 1 nm tables, ASTM G173) in
 * {@code ../shared/reference-data} and Debian colord-data's 5 nm files under /usr/share/colord. Each skips
 * the calling test, saying why, when its files are absent.
 */
final class ReferenceTables {

    /** Where Debian's colord-data package puts its spectra (a system path, not part of this project). */
    static final Path COLORD = Path.of("/usr/share/colord");

    private ReferenceTables() {
    }

    /** Wavelengths and one or more value columns. */
    record Table(double[] nm, double[][] columns) {

        double[] column(int i) {
            return columns[i];
        }

        /** The rows with from <= nm <= to. */
        Table between(double from, double to) {
            List<Integer> keep = new ArrayList<>();
            for (int i = 0; i < nm.length; i++) {
                if (nm[i] >= from && nm[i] <= to) {
                    keep.add(i);
                }
            }
            double[] n = keep.stream().mapToDouble(i -> nm[i]).toArray();
            double[][] c = new double[columns.length][];
            for (int k = 0; k < columns.length; k++) {
                double[] col = columns[k];
                c[k] = keep.stream().mapToDouble(i -> col[i]).toArray();
            }
            return new Table(n, c);
        }
    }

    /**
     * {@code wavelength,value[,value…]} lines (a non-numeric header line is skipped) of a file in the shared
     * reference data; the calling test must be marked {@code @ReadsSharedFolder}.
     */
    static Table referenceCsv(String relative) throws IOException {
        Path file = SharedFolder.referenceFile(relative);
        List<double[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(file)) {
            String text = line.strip();
            if (text.isEmpty() || !Character.isDigit(text.charAt(0))) {
                continue;
            }
            String[] f = text.split(",");
            double[] row = new double[f.length];
            for (int i = 0; i < f.length; i++) {
                row[i] = Double.parseDouble(f[i]);
            }
            rows.add(row);
        }
        return toTable(rows);
    }

    /**
     * A colord spectrum file (.sp, .cmf): SPECTRAL_START_NM, SPECTRAL_END_NM, and one line of values per
     * data set between BEGIN_DATA and END_DATA, evenly spaced from start to end.
     */
    static Table colord(String relative) throws IOException {
        Path file = COLORD.resolve(relative);
        Assumptions.assumeTrue(Files.isRegularFile(file), "Debian colord-data not installed (no " + file
                + "); skipping the check against its CIE tables (apt-get install colord-data)");
        double start = Double.NaN;
        double end = Double.NaN;
        List<double[]> sets = new ArrayList<>();
        boolean inData = false;
        for (String line : Files.readAllLines(file)) {
            String text = line.strip();
            if (text.startsWith("SPECTRAL_START_NM")) {
                start = Double.parseDouble(text.split("\\s+")[1]);
            } else if (text.startsWith("SPECTRAL_END_NM")) {
                end = Double.parseDouble(text.split("\\s+")[1]);
            } else if (text.equals("BEGIN_DATA")) {
                inData = true;
            } else if (text.equals("END_DATA")) {
                inData = false;
            } else if (inData && !text.isEmpty()) {
                String[] f = text.split("\\s+");
                double[] values = new double[f.length];
                for (int i = 0; i < f.length; i++) {
                    values[i] = Double.parseDouble(f[i]);
                }
                sets.add(values);
            }
        }
        int n = sets.get(0).length;
        double[] nm = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = start + i * (end - start) / (n - 1);
        }
        return new Table(nm, sets.toArray(new double[0][]));
    }

    private static Table toTable(List<double[]> rows) {
        int columns = rows.get(0).length - 1;
        double[] nm = rows.stream().mapToDouble(r -> r[0]).toArray();
        double[][] c = new double[columns][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            for (int k = 0; k < columns; k++) {
                c[k][i] = rows.get(i)[k + 1];
            }
        }
        return new Table(nm, c);
    }

    /** X, Y, Z with Y = 100: plain sums of S·x̄, S·ȳ, S·z̄ over the rows (reference sheet §9's method). */
    static double[] whitePoint(double[] s, double[] x, double[] y, double[] z) {
        double sx = 0;
        double sy = 0;
        double sz = 0;
        for (int i = 0; i < s.length; i++) {
            sx += s[i] * x[i];
            sy += s[i] * y[i];
            sz += s[i] * z[i];
        }
        return new double[] {100 * sx / sy, 100, 100 * sz / sy};
    }
}
