package org.spectralsieve.seedmodel;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.spectralsieve.optics.Fresnel;
import org.spectralsieve.optics.Slab;

/**
 * Turns a sample specification into its modelled external transmittance on a 1 nm grid.
 *
 * <p>T(λ) = Slab.transmittance(Π Kᵢ(λ), R(n(λ))): the layers' internal transmittances multiply, and the
 * two outer surfaces reflect with the material's index (W. J. Smith, Modern Optical Engineering, eq. 10.5).
 * Why the inner interfaces are ignored: in the modelled constructions they join media within about 0.05
 * in n (PVB 1.48 on glass 1.52, a lacquer on glass), which reflects under 0.05 %.
 */
public final class SampleModeller {

    /** Six significant digits keep files readable; rounding down never lifts a value over its physical ceiling. */
    private static final MathContext SIX_DIGITS_DOWN = new MathContext(6, RoundingMode.DOWN);

    private SampleModeller() {
    }

    public static ModelledCurve model(IndexSpec index, SampleSpec sample) {
        int size = SampleSpec.END_NM - sample.startNm() + 1;
        double[] nm = new double[size];
        double[] t = new double[size];
        boolean[] upper = new boolean[size];
        for (int i = 0; i < size; i++) {
            nm[i] = sample.startNm() + i;
            double value = roundDown(externalTransmittance(index, sample, nm[i]));
            upper[i] = value <= sample.detectionLimit();
            t[i] = upper[i] ? sample.detectionLimit() : value;
        }
        return new ModelledCurve(nm, t, upper, sample.detectionLimit());
    }

    static double externalTransmittance(IndexSpec index, SampleSpec sample, double nm) {
        double internal = 1;
        for (Layer layer : sample.layers()) {
            internal *= layer.internalTransmittance(nm);
        }
        return Slab.transmittance(internal, Fresnel.reflectanceInAir(index.nAt(nm)));
    }

    private static double roundDown(double value) {
        if (value <= 0) {
            return 0;
        }
        return new BigDecimal(value).round(SIX_DIGITS_DOWN).doubleValue();
    }
}
