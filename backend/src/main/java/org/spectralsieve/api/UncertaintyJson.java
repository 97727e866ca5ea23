package org.spectralsieve.api;

import org.spectralsieve.spectrum.Curve;

/**
 * A curve's measurement uncertainty as the API returns it, point for point with its wavelengths: one
 * standard deviation in decadic absorbance, and the one-sigma band it gives in transmittance,
 * T·10^(−σ_A) to T·10^(+σ_A) (a band symmetric in absorbance is lopsided in T). A point whose uncertainty is
 * unknown (a bound below detection, a point the file gave none for) is null in all three arrays; a curve
 * without any uncertainty has no such object at all (null).
 *
 * @param absorbance       σ_A per point
 * @param transmittanceLow T at −1σ in absorbance terms (more absorbing), a fraction
 * @param transmittanceHigh T at +1σ (less absorbing), a fraction
 */
record UncertaintyJson(String meaning, Double[] absorbance, Double[] transmittanceLow, Double[] transmittanceHigh) {

    static final String MEANING = "one standard deviation of the absorbance (decadic), and the transmittance band it spans";

    /** Null when the curve carries no uncertainty. */
    static UncertaintyJson of(Curve c) {
        if (!c.hasUncertainty()) {
            return null;
        }
        int n = c.size();
        Double[] sigma = new Double[n];
        Double[] low = new Double[n];
        Double[] high = new Double[n];
        for (int i = 0; i < n; i++) {
            double s = c.absorbanceUncertainty(i);
            if (Double.isNaN(s) || c.belowDetection(i)) { // a bound has no standard deviation
                continue;
            }
            double t = c.transmittance(i);
            sigma[i] = s;
            low[i] = t * Math.pow(10, -s);
            high[i] = t * Math.pow(10, s);
        }
        return new UncertaintyJson(MEANING, sigma, low, high);
    }
}
