package org.spectralsieve.crash;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.spectralsieve.ingest.Checksums;

/**
 * The files the crash test imports: invented, illustrative readings of an invented workshop's stock, each
 * unique (its name and a comment line carry its number) so that its checksum names it alone. Values are
 * written with six decimals, so the curve the service must keep is exactly what {@code Double.parseDouble}
 * reads from the text: a stored curve can be compared bit for bit with no tolerance.
 */
final class CrashFiles {

    private CrashFiles() {
    }

    /** A file as sent: its bytes and checksum, and the points it states. */
    record SentFile(String name, byte[] bytes, String sha256, double[] nm, double[] values) {
    }

    /**
     * A transmittance curve as fractions, 300–900 nm every 5 nm: an absorption edge between 320 and 420 nm
     * rising from 0.2 % to 80–92 % (shapes typical of clear plastics and glasses, common practice, no source).
     */
    static SentFile curve(String name, Random random) {
        double edge = 320 + random.nextDouble() * 100;
        double width = 4 + random.nextDouble() * 12;
        double top = 0.80 + random.nextDouble() * 0.12;
        StringBuilder text = new StringBuilder("# illustrative bench reading " + name
                + ", Fernhollow Print & Cure Workshop (invented)\nwavelength_nm,T\n");
        int n = 121;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            int wavelength = 300 + 5 * i;
            double value = 0.002 + (top - 0.002) / (1 + Math.exp(-(wavelength - edge) / width));
            String cell = String.format(Locale.ROOT, "%.6f", value);
            nm[i] = wavelength;
            t[i] = Double.parseDouble(cell);
            text.append(wavelength).append(',').append(cell).append('\n');
        }
        return sent(name, text.toString(), nm, t);
    }

    /** An emitter's relative power or a response's relative weight, 280–800 nm every 4 nm, one broad peak. */
    static SentFile spectrum(String name, Random random) {
        double peak = 300 + random.nextDouble() * 400;
        double width = 10 + random.nextDouble() * 60;
        StringBuilder text = new StringBuilder("# illustrative " + name + " (invented)\nwavelength_nm,relative\n");
        int n = 131;
        double[] nm = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            int wavelength = 280 + 4 * i;
            String cell = String.format(Locale.ROOT, "%.6f",
                    0.001 + Math.exp(-0.5 * Math.pow((wavelength - peak) / width, 2)));
            nm[i] = wavelength;
            v[i] = Double.parseDouble(cell);
            text.append(wavelength).append(',').append(cell).append('\n');
        }
        return sent(name, text.toString(), nm, v);
    }

    /** A batch upload: manifest.csv (one row per file, in order) and the files. */
    static byte[] zip(String manifest, List<SentFile> files) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ZipOutputStream zip = new ZipOutputStream(bytes)) {
            zip.putNextEntry(new ZipEntry("manifest.csv"));
            zip.write(manifest.getBytes(StandardCharsets.UTF_8));
            zip.closeEntry();
            for (SentFile f : files) {
                zip.putNextEntry(new ZipEntry(f.name()));
                zip.write(f.bytes());
                zip.closeEntry();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }

    private static SentFile sent(String name, String text, double[] nm, double[] values) {
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        return new SentFile(name, bytes, Checksums.sha256(bytes), nm, values);
    }
}
