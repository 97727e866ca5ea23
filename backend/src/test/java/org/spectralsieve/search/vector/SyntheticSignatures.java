package org.spectralsieve.search.vector;

import java.util.Random;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.store.SyntheticCurves;
import org.spectralsieve.spectrum.WavelengthGrid;

/**
 * Plausible transmittance curves as similarity signatures, deterministic for a seed: the absorption edges,
 * dye bands, Fresnel surfaces and detection floors of {@link SyntheticCurves}, three samples per material at
 * random thicknesses (0.5–10 mm), Gaussian noise of one detection limit in T at every point (noise at the
 * floor), a tenth of them measured only from 250 nm, and two thirds bulk (the rest fixed constructions).
 * Read on the similarity grid only, so a million of them can be streamed without holding curves.
 */
public final class SyntheticSignatures {

    public static final int SAMPLES_PER_MATERIAL = 3;
    private static final double[] GRID = new double[CurveSignature.DIMENSION];

    static {
        for (int i = 0; i < GRID.length; i++) {
            GRID[i] = CurveSignature.wavelengthNm(i);
        }
    }

    private static final WavelengthGrid SPEC_GRID = new WavelengthGrid(200, 201, 1); // specs only, no codes
    private final long seed;
    private int made;

    public SyntheticSignatures(long seed) {
        this.seed = seed;
    }

    /** One generated sample: its material number, whether it is bulk, and its signature. */
    public record Sample(int material, boolean bulk, double thicknessMm, CurveSignature signature,
                         SyntheticCurves.Spec spec, boolean fromUv) {

        /** The same material at another thickness (a bulk one; a fixed one stays as it is) with fresh noise. */
        public CurveSignature at(double otherMm, Random random) {
            double mm = bulk ? otherMm : thicknessMm;
            return SyntheticSignatures.signature(spec, mm, fromUv, bulk, random);
        }
    }

    /** The next sample; every {@value #SAMPLES_PER_MATERIAL} share one material. */
    public Sample next() {
        return sample(made++);
    }

    /**
     * Sample {@code index}, the same whenever asked (each material and each sample has its own seed), so a
     * benchmark can re-create any of a million without holding them.
     */
    public Sample sample(int index) {
        int materialNumber = index / SAMPLES_PER_MATERIAL;
        SyntheticCurves.Spec material = new SyntheticCurves(mix(seed, materialNumber), SPEC_GRID).next();
        boolean fromUv = new Random(mix(seed, -1 - materialNumber)).nextDouble() >= 0.1;
        Random noise = new Random(mix(seed ^ 0x5DEECE66DL, index));
        boolean bulk = materialNumber % 3 != 2;
        double thickness = 0.5 + noise.nextDouble() * 9.5;
        return new Sample(materialNumber, bulk, thickness, signature(material, thickness, fromUv, bulk, noise), material,
                fromUv);
    }

    private static long mix(long seed, long n) {
        long z = seed * 0x9E3779B97F4A7C15L + n;
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        return z ^ (z >>> 27);
    }

    /** Material {@code spec} at {@code thicknessMm}, with noise from {@code random}. */
    static CurveSignature signature(SyntheticCurves.Spec spec, double thicknessMm, boolean fromUv, boolean bulk,
            Random random) {
        SyntheticCurves.Spec at = new SyntheticCurves.Spec(spec.edgeNm(), spec.edgeWidthNm(), spec.bandNm(),
                spec.bandPeakPerMm(), spec.bandWidthNm(), spec.backgroundPerMm(), thicknessMm, spec.index(), spec.floor());
        int first = fromUv ? 0 : 10; // 200 or 250 nm
        int n = GRID.length - first;
        double[] nm = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        for (int k = 0; k < n; k++) {
            nm[k] = GRID[first + k];
            limits[k] = spec.floor();
            double value = SyntheticCurves.transmittance(at, nm[k]) + random.nextGaussian() * spec.floor();
            value = Math.min(Curve.MAX_TRANSMITTANCE, Math.max(0, value));
            below[k] = value <= spec.floor();
            t[k] = below[k] ? spec.floor() : value;
        }
        return CurveSignature.of(Curve.of(nm, t, below, limits), thicknessMm, bulk);
    }
}
