package org.spectralsieve.store;

import static org.spectralsieve.store.WeightedScreen.BINS;
import static org.spectralsieve.store.WeightedScreen.binOf;

import java.util.Arrays;
import java.util.Optional;
import org.spectralsieve.requirement.Weighting;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.LuminousTransmittance;
import org.spectralsieve.weighting.WeightedFigures;

/**
 * Where a weighted figure puts its weight among {@link WeightedScreen}'s bins: each bin's share of the figure's weight
 * for a curve range, the same with a fixed layer's largest upper reading per point, and the figure's integration
 * points themselves (docs/weighted-screening.md, "Why a bound is a proof").
 */
final class BinShares {

    private BinShares() {
    }

    /**
     * {@link #binShares} with each integration point's weight times the layer's largest upper reading around it
     * ({@code Query#layerShares}); empty where {@link #binShares} is, or where a point lies outside the layer.
     */
    static double[] layerShares(Weighting weighting, double[] curveRange, Curve layer) {
        double[][] nodes = integrationNodes(weighting, curveRange);
        if (nodes == null || nodes[0].length == 0) {
            return new double[0];
        }
        double[] nm = nodes[0];
        double[] weight = nodes[1];
        double[] wavelengths = layer.wavelengthsNm();
        double[] out = new double[BINS];
        double total = 0;
        for (int i = 0; i < nm.length; i++) {
            int bin = binOf(nm[i]);
            if (bin < 0 || !layer.covers(nm[i])) {
                return new double[0];
            }
            int hit = Arrays.binarySearch(wavelengths, nm[i]);
            // the intervals holding the point: both around a stored point, else the one it lies in
            int lo = hit >= 0 ? Math.max(0, hit - 1) : -hit - 2;
            int hi = hit >= 0 ? Math.min(wavelengths.length - 1, hit + 1) : -hit - 1;
            double up = 0;
            for (int j = lo; j <= hi; j++) {
                up = Math.max(up, Math.max(layer.transmittance(j), layer.detectionLimit(j)));
            }
            out[bin] += weight[i] * up;
            total += weight[i];
        }
        if (!(total > 0)) {
            return new double[0];
        }
        for (int b = 0; b < BINS; b++) {
            out[b] /= total;
        }
        return out;
    }

    /**
     * The figure's integration points on a curve spanning the range with, per point, the layer's largest upper
     * reading around it (as {@link #layerShares}): {nm, weight, layerUp}; null where {@link #layerShares} is empty.
     */
    static double[][] layerNodes(Weighting weighting, double[] curveRange, Curve layer) {
        double[][] nodes = integrationNodes(weighting, curveRange);
        if (nodes == null || nodes[0].length == 0) {
            return null;
        }
        double[] nm = nodes[0];
        double[] wavelengths = layer.wavelengthsNm();
        double[] up = new double[nm.length];
        for (int i = 0; i < nm.length; i++) {
            if (binOf(nm[i]) < 0 || !layer.covers(nm[i])) {
                return null;
            }
            int hit = Arrays.binarySearch(wavelengths, nm[i]);
            int lo = hit >= 0 ? Math.max(0, hit - 1) : -hit - 2;
            int hi = hit >= 0 ? Math.min(wavelengths.length - 1, hit + 1) : -hit - 1;
            for (int j = lo; j <= hi; j++) {
                up[i] = Math.max(up[i], Math.max(layer.transmittance(j), layer.detectionLimit(j)));
            }
        }
        return new double[][] {nm, nodes[1], up};
    }

    /** The figure's integration points {nm, weight} on a curve spanning the range, or null where not available. */
    static double[][] integrationNodes(Weighting weighting, double[] curveRange) {
        double min = curveRange[0];
        double max = curveRange[1];
        if (weighting instanceof Weighting.Luminous) {
            return min <= LuminousTransmittance.FROM_NM && max >= LuminousTransmittance.TO_NM
                    ? LuminousTransmittance.integrationNodes() : null;
        }
        if (weighting instanceof Weighting.Spectral spectral) {
            double[] span = spectral.rangeNm();
            double from = Math.max(span[0], min);
            double to = Math.min(span[1], max);
            Curve flat = Curve.of(new double[] {min, max}, new double[] {1, 1}, 0);
            if (!(to > from) || !spectral.figure(flat).available()) {
                return null;
            }
            return WeightedFigures.integrationNodes(spectral.emitter(), spectral.effectiveResponse(), from, to);
        }
        return null;
    }

    /**
     * Each bin's share of the figure's weight for a curve spanning {min, max}; empty when the figure is not
     * available on such a curve (the exact judgement says unverified, which no bound may claim to be a miss),
     * when an integration point lies outside the bins, or when a layer would change the points.
     */
    static double[] binShares(Weighting weighting, double[] curveRange, Optional<double[]> layerRange) {
        double min = curveRange[0];
        double max = curveRange[1];
        double[][] nodes;
        if (weighting instanceof Weighting.Luminous) {
            if (!(min <= LuminousTransmittance.FROM_NM && max >= LuminousTransmittance.TO_NM)) {
                return new double[0];
            }
            nodes = LuminousTransmittance.integrationNodes();
        } else if (weighting instanceof Weighting.Spectral spectral) {
            double[] span = spectral.rangeNm();
            double from = Math.max(span[0], min);
            double to = Math.min(span[1], max);
            Curve flat = Curve.of(new double[] {min, max}, new double[] {1, 1}, 0);
            if (!(to > from) || !spectral.figure(flat).available()) {
                return new double[0];
            }
            nodes = WeightedFigures.integrationNodes(spectral.emitter(), spectral.effectiveResponse(), from, to);
        } else {
            return new double[0];
        }
        double[] nm = nodes[0];
        double[] weight = nodes[1];
        if (nm.length == 0) {
            return new double[0];
        }
        if (layerRange.isPresent() && !(layerRange.get()[0] <= nm[0] && layerRange.get()[1] >= nm[nm.length - 1])) {
            return new double[0];
        }
        double[] shares = new double[BINS];
        double total = 0;
        for (int i = 0; i < nm.length; i++) {
            int bin = binOf(nm[i]);
            if (bin < 0) {
                return new double[0];
            }
            shares[bin] += weight[i];
            total += weight[i];
        }
        if (!(total > 0)) {
            return new double[0];
        }
        for (int b = 0; b < BINS; b++) {
            shares[b] /= total;
        }
        return shares;
    }
}
