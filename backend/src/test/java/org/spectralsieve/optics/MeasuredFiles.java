package org.spectralsieve.optics;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Measured transmittance files from ../shared/reference-data/measured-transmittance-… (never copied into
 * the repository; see its SOURCES.md §8), read plainly for the rescaling checks: the first two numbers of
 * each data line, T in percent, the instrument floor of 0.01 %T as the detection limit. A test that needs
 * them is skipped with a message when the folder is absent ({@link SharedFolder}; mark it @ReadsSharedFolder).
 */
public final class MeasuredFiles {

    /** The instrument floor: SOURCES.md §8, "the constant 0.0100000… (about 4 absorbance units)". */
    public static final double FLOOR = 1.001e-4; // 0.01 %T, with room for the file's last digits

    private MeasuredFiles() {
    }

    public static Curve curve(String name) {
        Path file = SharedFolder.measuredSheet(name);
        try {
            return parse(Files.readAllLines(file));
        } catch (IOException e) {
            throw new IllegalStateException("cannot read " + file, e);
        }
    }

    private static Curve parse(List<String> lines) {
        List<double[]> points = new ArrayList<>();
        for (String line : lines) {
            String[] fields = line.trim().split("[,;\\s]+");
            if (fields.length < 2 || !fields[0].matches("[0-9.]+") || !fields[1].matches("-?[0-9.]+")) {
                continue; // comment, header or empty line
            }
            points.add(new double[] {Double.parseDouble(fields[0]), Double.parseDouble(fields[1]) / 100});
        }
        double[] nm = points.stream().mapToDouble(p -> p[0]).toArray();
        double[] t = points.stream().mapToDouble(p -> Math.max(0, p[1])).toArray();
        return Curve.of(nm, t, FLOOR);
    }
}
