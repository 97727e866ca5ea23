package org.spectralsieve.importers;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.jcamp.JcampReader;

/**
 * Import throughput benchmark (run by {@code mvn -B -q -Pbench -pl importers verify}, and with
 * {@code -pl backend -am}; not part of the test suite). Prints {@code BENCH ...} lines; asserts nothing
 * about time. The only checks are correctness guards: the decoded point count (and the ends of the
 * curve) must equal what was generated, otherwise the figures would time a failed or partial read.
 *
 * <p>Inputs are generated in memory (no files), illustrative only: an invented film with a UV cutoff
 * near 380 nm, fine spacing over 200–1100 nm, plus noise so that numbers are not repetitive.
 * <ul>
 *   <li>{@code delimited}: {@code wavelength_nm,transmittance}, every number in full
 *       {@link Double#toString} precision (16–17 significant digits), a few {@code # key: value} lines;</li>
 *   <li>{@code delimited-decimal-comma}: the same numbers, semicolon-separated with a decimal comma;</li>
 *   <li>{@code jcamp-asdf}: one JCAMP-DX block, {@code ##XYDATA=(X++(Y..Y))} in DIFDUP form (SQZ first
 *       ordinate, DIF differences, DUP runs, DIF Y-check at each line start, lines of at most 80 chars),
 *       integer ordinates in units of 10⁻⁷ transmittance with detector-like noise, blocked region read
 *       as exactly 0.</li>
 * </ul>
 * Each file is read from a {@link StringReader} by the public reader, single-threaded, after warm-up
 * runs; the median over the timed runs is printed. MB = 10⁶ bytes of the text as UTF-8.
 *
 * <p>Switches: {@code -Dbench.importMb=30} (target size of each file; the readers' row/point caps may
 * make a file smaller, the BENCH line gives the real size), {@code -Dbench.runs=7},
 * {@code -Dbench.warmup=3}.
 */
class ImportBenchmark {

    /** JCAMP's BlockDecoder.MAX_POINTS (package-private there): more points are refused as a damaged file. */
    private static final int JCAMP_POINT_CAP = 4_000_000;
    private static final double FIRST_NM = 200.0;
    private static final double LAST_NM = 1100.0;
    private static final long SEED = 20261203L;

    @Test
    void importThroughputOfLargeGeneratedFiles() throws Exception {
        long target = (long) (doubleProperty("bench.importMb", 30) * 1e6);
        int runs = intProperty("bench.runs", 7);
        int warmup = intProperty("bench.warmup", 3);

        int rows = delimitedRows(target);
        String csv = delimited(rows, false);
        checkDelimited(time("delimited", csv, rows, runs, warmup, () -> readDelimited(csv)));
        String comma = delimited(rows, true);
        checkDelimited(time("delimited-decimal-comma", comma, rows, runs, warmup, () -> readDelimited(comma)));
        csvBaselines(csv, runs);

        int points = jcampPoints(target);
        String jdx = jcamp(points);
        checkJcamp(time("jcamp-asdf", jdx, points, runs, warmup, () -> readJcamp(jdx)), ordinates(points));
        jcampBaselines(jdx, runs);
    }

    /** One read of the input by the real reader. */
    private interface Read {
        ParsedSpectrum run() throws Exception;
    }

    /** Returns the last spectrum read, for the content guards (which stay outside the timed section). */
    private static ParsedSpectrum time(String format, String text, int expected, int runs, int warmup, Read read)
            throws Exception {
        double mb = text.getBytes(StandardCharsets.UTF_8).length / 1e6;
        for (int i = 0; i < warmup; i++) {
            read.run();
        }
        double[] seconds = new double[runs];
        ParsedSpectrum last = null;
        for (int i = 0; i < runs; i++) {
            long t0 = System.nanoTime();
            last = read.run();
            seconds[i] = (System.nanoTime() - t0) / 1e9;
            if (last.size() != expected) {
                throw new IllegalStateException(format + ": decoded " + last.size() + " points, generated " + expected);
            }
        }
        double median = median(seconds);
        System.out.printf("BENCH import format=%s mb_per_s=%.1f mb=%.1f points=%d median_ms=%.0f min_ms=%.0f%n",
                format, mb / median, mb, expected, median * 1e3, Arrays.stream(seconds).min().orElseThrow() * 1e3);
        return last;
    }

    // ---- delimited text ----------------------------------------------------------------------------

    /** Rows for the target size, within the reader's row cap. */
    private static int delimitedRows(long targetBytes) {
        int sample = 20_000;
        double bytesPerRow = delimited(sample, false).length() / (double) sample;
        return (int) Math.min(DelimitedTextReader.MAX_ROWS, Math.max(2, targetBytes / bytesPerRow));
    }

    static String delimited(int rows, boolean decimalComma) {
        char sep = decimalComma ? ';' : ',';
        StringBuilder b = new StringBuilder(rows * 40 + 256);
        b.append("# material: illustrative UV-blocking film (invented)\n");
        b.append("# thickness_mm: 0.125\n");
        b.append("# instrument: scanning spectrophotometer, 1 nm slit (illustrative)\n");
        b.append("# note: generated for the import benchmark\n");
        b.append("wavelength_nm").append(sep).append("transmittance\n");
        Random r = new Random(SEED);
        double step = (LAST_NM - FIRST_NM) / (rows - 1);
        for (int i = 0; i < rows; i++) {
            // jitter well inside one step keeps x strictly increasing and makes every digit significant
            double x = i == 0 ? FIRST_NM : FIRST_NM + (i + 0.4 * (r.nextDouble() - 0.5)) * step;
            double t = Math.abs(film(x) + 0.002 * r.nextGaussian());
            String xs = Double.toString(x);
            String ts = Double.toString(t);
            if (decimalComma) {
                xs = xs.replace('.', ',');
                ts = ts.replace('.', ',');
            }
            b.append(xs).append(sep).append(ts).append('\n');
        }
        return b.toString();
    }

    private static ParsedSpectrum readDelimited(String text) throws ImportException {
        return new DelimitedTextReader().read("benchmark.csv", new StringReader(text));
    }

    private static void checkDelimited(ParsedSpectrum s) {
        double[] x = s.wavelengthsNm();
        double step = (LAST_NM - FIRST_NM) / (x.length - 1);
        // the generator jitters every point but the first by up to 0.2 of a step
        if (x[0] != FIRST_NM || !(Math.abs(x[x.length - 1] - LAST_NM) <= 0.2 * step + 1e-9)
                || s.yKind() != YKind.TRANSMITTANCE_FRACTION) {
            throw new IllegalStateException("delimited: read " + s);
        }
    }

    /**
     * Where the delimited time goes, without touching the reader: splitting the text into lines alone,
     * and that plus {@link Double#parseDouble} of both fields (what any reader must at least do).
     */
    private static void csvBaselines(String csv, int runs) throws Exception {
        double mb = csv.getBytes(StandardCharsets.UTF_8).length / 1e6;
        double[] lines = new double[runs];
        double[] parse = new double[runs];
        double sink = 0;
        for (int i = -2; i < runs; i++) {
            long t0 = System.nanoTime();
            java.io.BufferedReader in = new java.io.BufferedReader(new StringReader(csv), 1 << 16);
            int count = 0;
            String line;
            while ((line = in.readLine()) != null) {
                count += line.length();
            }
            long t1 = System.nanoTime();
            in = new java.io.BufferedReader(new StringReader(csv), 1 << 16);
            while ((line = in.readLine()) != null) {
                int comma = line.indexOf(',');
                if (comma > 0 && line.charAt(0) != '#' && line.charAt(0) != 'w') {
                    sink += Double.parseDouble(line.substring(0, comma)) + Double.parseDouble(line.substring(comma + 1));
                }
            }
            long t2 = System.nanoTime();
            if (i >= 0) {
                lines[i] = (t1 - t0) / 1e9;
                parse[i] = (t2 - t1) / 1e9;
            }
            sink += count;
        }
        System.out.printf("BENCH import-baseline format=delimited readline_mb_per_s=%.1f readline_parsedouble_mb_per_s=%.1f"
                + " (sink %.0f)%n", mb / median(lines), mb / median(parse), sink % 10);
    }

    // ---- JCAMP-DX ASDF -----------------------------------------------------------------------------

    /** Points for the target size, within the JCAMP reader's point cap. */
    private static int jcampPoints(long targetBytes) {
        int sample = 200_000;
        double bytesPerPoint = jcamp(sample).length() / (double) sample;
        return (int) Math.min(JCAMP_POINT_CAP - 1, Math.max(2, targetBytes / bytesPerPoint));
    }

    /** Ordinates in units of 10⁻⁷ transmittance (YFACTOR 1e-7), as integer-writing instruments store them. */
    static int[] ordinates(int n) {
        Random r = new Random(SEED + 1);
        int[] y = new int[n];
        double step = (LAST_NM - FIRST_NM) / (n - 1);
        for (int i = 0; i < n; i++) {
            double x = FIRST_NM + i * step;
            double t = film(x);
            // below detection the instrument reports exactly 0 (long DUP runs); elsewhere 0.15 %T rms noise
            y[i] = t < 1e-4 ? 0 : (int) Math.round(1e7 * t + 15_000 * r.nextGaussian());
        }
        return y;
    }

    static String jcamp(int n) {
        int[] y = ordinates(n);
        double step = (LAST_NM - FIRST_NM) / (n - 1);
        double xFactor = 1e-6; // line X values written as integer picometre-thousandths: far finer than half a step
        StringBuilder b = new StringBuilder(n * 6 + 1024);
        b.append("##TITLE= illustrative UV-blocking film (invented), import benchmark\n");
        b.append("##JCAMP-DX= 4.24\n");
        b.append("##DATA TYPE= UV/VIS SPECTRUM\n");
        b.append("##ORIGIN= generated in memory (illustrative)\n");
        b.append("##OWNER= public domain\n");
        b.append("##XUNITS= NANOMETERS\n");
        b.append("##YUNITS= TRANSMITTANCE\n");
        b.append("##XFACTOR= ").append(xFactor).append('\n');
        b.append("##YFACTOR= 0.0000001\n");
        b.append("##FIRSTX= ").append(FIRST_NM).append('\n');
        b.append("##LASTX= ").append(LAST_NM).append('\n');
        b.append("##NPOINTS= ").append(n).append('\n');
        b.append("##FIRSTY= ").append(y[0] * 1e-7).append('\n');
        b.append("##XYDATA= (X++(Y..Y))\n");
        int i = 0;
        StringBuilder line = new StringBuilder(96);
        while (true) {
            line.setLength(0);
            line.append(Math.round((FIRST_NM + i * step) / xFactor));
            sqz(line, y[i]);
            int j = i;
            while (j + 1 < n && line.length() < 70) {
                int d = y[j + 1] - y[j];
                int run = 1;
                while (j + 1 + run < n && y[j + 1 + run] - y[j + run] == d && run < 9999) {
                    run++;
                }
                dif(line, d);
                if (run > 1) {
                    dup(line, run);
                }
                j += run;
            }
            b.append(line).append('\n');
            if (j == n - 1) {
                break;
            }
            i = j; // the next line repeats this ordinate: the DIF Y-check
        }
        b.append("##END=\n");
        return b.toString();
    }

    /** SQZ: sign and first digit in one pseudo-digit, @ = 0, A–I = 1–9, a–i = −1…−9. */
    private static void sqz(StringBuilder b, int v) {
        pseudo(b, v, '@', 'A', 'a');
    }

    /** DIF: % = 0, J–R = 1–9, j–r = −1…−9. */
    private static void dif(StringBuilder b, int d) {
        pseudo(b, d, '%', 'J', 'j');
    }

    private static void pseudo(StringBuilder b, int v, char zero, char positive, char negative) {
        if (v == 0) {
            b.append(zero);
            return;
        }
        String digits = Integer.toString(Math.abs(v));
        b.append((char) ((v > 0 ? positive : negative) + digits.charAt(0) - '1')).append(digits, 1, digits.length());
    }

    /** DUP: the count includes the original; S–Z = 1–8, s = 9 as the first digit. */
    private static void dup(StringBuilder b, int count) {
        String digits = Integer.toString(count);
        char first = digits.charAt(0) == '9' ? 's' : (char) ('S' + digits.charAt(0) - '1');
        b.append(first).append(digits, 1, digits.length());
    }

    private static ParsedSpectrum readJcamp(String text) throws ImportException {
        return new JcampReader().read("benchmark.jdx", new StringReader(text));
    }

    /** Every decoded ordinate must equal the generated integer times YFACTOR: DIF/DUP decoding is exact. */
    private static void checkJcamp(ParsedSpectrum s, int[] generated) {
        double[] x = s.wavelengthsNm();
        double[] y = s.values();
        if (x[0] != FIRST_NM || x[x.length - 1] != LAST_NM) {
            throw new IllegalStateException("jcamp: read " + s);
        }
        for (int i = 0; i < y.length; i++) {
            if (y[i] != generated[i] * 1e-7) {
                throw new IllegalStateException("jcamp: point " + i + " decoded " + y[i] + ", generated "
                        + generated[i] + " × 1e-7");
            }
        }
    }

    /**
     * Where the JCAMP time goes, without touching the reader: copying the Reader into one char array
     * (what the reader's text layer does first), and {@code blocks()} (scan and decode, without
     * building the spectrum: units, order checks, copies into {@link ParsedSpectrum}).
     */
    private static void jcampBaselines(String jdx, int runs) throws Exception {
        double mb = jdx.getBytes(StandardCharsets.UTF_8).length / 1e6;
        double[] copy = new double[runs];
        double[] blocks = new double[runs];
        long sink = 0;
        for (int i = -2; i < runs; i++) {
            long t0 = System.nanoTime();
            StringReader in = new StringReader(jdx);
            char[] buf = new char[1 << 14];
            int length = 0;
            int n;
            while ((n = in.read(buf, length, buf.length - length)) >= 0) {
                length += n;
                if (length == buf.length) {
                    buf = Arrays.copyOf(buf, buf.length * 2);
                }
            }
            long t1 = System.nanoTime();
            sink += new JcampReader().blocks("benchmark.jdx", new StringReader(jdx)).get(0).y().length;
            long t2 = System.nanoTime();
            if (i >= 0) {
                copy[i] = (t1 - t0) / 1e9;
                blocks[i] = (t2 - t1) / 1e9;
            }
            sink += length;
        }
        System.out.printf("BENCH import-baseline format=jcamp-asdf char_copy_mb_per_s=%.1f blocks_mb_per_s=%.1f"
                + " (sink %d)%n", mb / median(copy), mb / median(blocks), sink % 10);
    }

    // ---- shared ------------------------------------------------------------------------------------

    /** An invented film: about 88 % above a cutoff near 380 nm, falling to nothing below it. */
    private static double film(double nm) {
        return 0.88 / (1 + Math.exp(-(nm - 380) / 6.0));
    }

    private static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
    }

    private static int intProperty(String name, int fallback) {
        String v = System.getProperty(name);
        return v == null || v.isBlank() ? fallback : Integer.parseInt(v.strip());
    }

    private static double doubleProperty(String name, double fallback) {
        String v = System.getProperty(name);
        return v == null || v.isBlank() ? fallback : Double.parseDouble(v.strip());
    }
}
