package org.spectralsieve.spectra;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.SourceFile;

/** Illustrative spectra for the tests: made-up numbers, never a real lamp. */
final class Spectra {

    private Spectra() {
    }

    /** n points at irregular spacing from 250 nm, full-precision random values in [0, 1). */
    static NewReferenceSpectrum random(SpectrumKind kind, String name, int n, long seed) {
        Random random = new Random(seed);
        double[] nm = new double[n];
        double[] v = new double[n];
        double x = 250;
        for (int i = 0; i < n; i++) {
            x += 0.01 + random.nextDouble() * 0.3;
            nm[i] = x;
            v[i] = random.nextDouble();
        }
        v[0] = 0.5; // never all zero
        return of(kind, name, nm, v);
    }

    static NewReferenceSpectrum of(SpectrumKind kind, String name, double[] nm, double[] values) {
        byte[] bytes = ("illustrative file of " + name + "\n").getBytes(StandardCharsets.UTF_8);
        try {
            SpectrumValues parsed = SpectrumValues.of(name + ".csv", nm, values, null, XUnit.NANOMETRE, "power",
                    Map.of(), List.of());
            return new NewReferenceSpectrum(kind, name, "illustrative " + name, "made up for a test", parsed,
                    new SourceFile(name + ".csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes)));
        } catch (ImportException e) {
            throw new IllegalArgumentException(e);
        }
    }
}
