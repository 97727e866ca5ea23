package org.spectralsieve.importers.jcamp;

import java.util.Arrays;
import java.util.Optional;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.YKind;

/**
 * The project's private label {@code ##$SIEVE ABSORBANCE SD=}: one standard deviation of the decadic
 * absorbance per point, in data-table order, {@code ?} where unknown (the JCAMP-DX mark for a missing
 * ordinate).
 *
 * <p>Why a private label: JCAMP-DX 5.01 (McDonald and Wilks 1988; Lampen et al. 1999) gives a block one data
 * table, and no YUNITS for a standard deviation; a second {@code ##XYPOINTS} in the block is not standard, and
 * a linked second block would read elsewhere as a second spectrum. Labels starting with '$' are the
 * standard's place for what it does not define, and other readers skip them — the curve stays a plain,
 * valid transmittance file. The project already carries its below-detection flags that way.
 */
final class AbsorbanceSd {

    private static final int PER_LINE = 6;

    private AbsorbanceSd() {
    }

    static void write(StringBuilder out, double[] sd) {
        out.append("##").append(Labels.ABSORBANCE_SD_AS_WRITTEN)
                .append("= $$ one standard deviation of the absorbance per XYPOINTS pair, in order; ? unknown\n");
        for (int i = 0; i < sd.length; i++) {
            out.append(Double.isNaN(sd[i]) ? "?" : Double.toString(sd[i]));
            out.append((i + 1) % PER_LINE == 0 || i == sd.length - 1 ? "\n" : " ");
        }
    }

    /** The label's values, or empty when the block has none; refused when they do not match the points. */
    static Optional<double[]> read(String source, JcampBlock block, int points) throws ImportException {
        Optional<Ldr> label = block.ldr(Labels.ABSORBANCE_SD);
        if (label.isEmpty()) {
            return Optional.empty();
        }
        Ldr l = label.get();
        String[] tokens = l.value().strip().split("[\\s,;]+");
        if (tokens.length != points || tokens[0].isEmpty()) {
            throw new ImportException(source, l.line(), Labels.field(l.name()), "holds "
                    + (tokens[0].isEmpty() ? 0 : tokens.length) + " values for " + points + " points");
        }
        double[] sd = new double[points];
        for (int i = 0; i < points; i++) {
            if (tokens[i].equals("?")) {
                sd[i] = Double.NaN;
                continue;
            }
            try {
                sd[i] = Double.parseDouble(tokens[i]);
            } catch (NumberFormatException e) {
                throw new ImportException(source, l.line(), Labels.field(l.name()), "not a number: '" + tokens[i] + "'");
            }
            if (!(Double.isFinite(sd[i]) && sd[i] >= 0)) {
                throw new ImportException(source, l.line(), Labels.field(l.name()),
                        "a standard deviation must be finite and >= 0, was '" + tokens[i] + "'");
            }
        }
        return Optional.of(sd);
    }

    /** {@code spectrum} with the label's standard deviations, reversed as its points were. */
    static ParsedSpectrum attach(String source, JcampBlock block, ParsedSpectrum spectrum, boolean reversed)
            throws ImportException {
        Optional<double[]> sd = read(source, block, spectrum.size());
        if (sd.isEmpty()) {
            return spectrum;
        }
        double[] values = sd.get();
        if (reversed) {
            double[] r = new double[values.length];
            Arrays.setAll(r, i -> values[values.length - 1 - i]);
            return spectrum.withStandardDeviations(r, YKind.ABSORBANCE, "label ##" + Labels.ABSORBANCE_SD_AS_WRITTEN);
        }
        return spectrum.withStandardDeviations(values, YKind.ABSORBANCE, "label ##" + Labels.ABSORBANCE_SD_AS_WRITTEN);
    }
}
