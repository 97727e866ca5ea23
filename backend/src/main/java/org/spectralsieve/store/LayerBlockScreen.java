package org.spectralsieve.store;

import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.requirement.Aggregate;
import org.spectralsieve.requirement.Direction;
import org.spectralsieve.requirement.TransmittanceClause;
import org.spectralsieve.spectrum.Curve;

/**
 * Proves that a curve, as measured and stacked behind a fixed layer, misses an every-point <b>block</b>
 * clause, from the store's codes and the layer's own curve (docs/weighted-screening.md, "Blocks behind a
 * fixed layer"). {@link MissScreen} proves such misses for a curve alone and, behind a layer, only for passes
 * (the stack is never brighter than the candidate); a block needs the other side: the stack is never darker
 * than the product of its parts.
 *
 * <p>Why it holds. The light path ({@code optics.LightPath}) chains each part's slab element across an air
 * gap: T = T₁T₂/(1 − ρ₁ρ₂) ≥ T₁T₂, with ρ in [0, 1). Each element passes its own reading: exactly (to
 * rounding) a resolved one, and min(T, 1) one at the lossless ceiling, so at every point of the stack (the
 * union of both parts' wavelengths) the floored absorbance Ā obeys Ā_S ≤ max(Ā₁, 0) + Ā₂ + rounding whenever
 * the layer's T there lies in [ε, 1] (for x, y in [0, 1], max(xy, ε) ≥ max(x, ε)·max(y, ε)). Since
 * max(Ā₁, 0) ≤ Ā₁ + log10 max(1, B), with B at least every T the candidate's points around g hold (its bin's
 * brightest on a regular curve, {@link WeightedScreen#brightestAround}; else 1.5, the most a stored T may be),
 * the right side is linear between two neighbouring stack points, as Ā_S is, so it holds at any wavelength g
 * between them: Ā_S(g) ≤ Ā₁(g) + Ā₂(g) + log10 max(1, B) + rounding. The store's code at a grid wavelength g is
 * Ā₁(g) to within
 * half a step ({@link MissScreen#SLACK_DECADES} covers it); Ā₂(g) is read from the layer's curve here. The
 * exact judgement reads the stack at every stack point inside the band and at the band's ends; two of those
 * readings enclose g on one straight piece of Ā_S, so one of them is at least as bright as S(g). That reading
 * is a value, not a bound: the stack is below detection only where a part is, and neither the candidate's
 * points around g (its code is not a bound) nor the layer's (checked here) are. So when the bright side
 * exceeds the threshold the clause misses there with a margin at most
 * log10(threshold) + Ā₁(g) + Ā₂(g) + the slacks.
 *
 * <p>Only for a candidate judged on its measured curve (as measured), and only where the stack can be formed:
 * the layer and the candidate's index give a Fresnel reflectance over the layer's range (else the exact
 * judgement says "could not be computed" or "no light path", an unverified row that no bound may call a
 * miss), and g lies where the layer was measured.
 */
public final class LayerBlockScreen {

        /** Room for the slab inversion and re-forming of each element and the chain's arithmetic. */
    static final double ROUNDING_DECADES = 1e-7;

    private LayerBlockScreen() {
    }

    /**
     * @param blocks     every-point block clauses
     * @param layer      the layer's curve as the stack uses it
     * @param layerIndex the layer's refractive index
     * @return margins[clause][curve]: an upper bound on the exact margin of that clause on the curve as
     *         measured behind the layer where it is negative (a proven miss); +∞ where nothing is proven (no
     *         usable grid reading, an index that fails, no reading bright enough)
     */
    public static double[][] marginBounds(SpectralStore store, List<TransmittanceClause> blocks, Curve layer,
                                          RefractiveIndex layerIndex) {
        double[][] out = new double[blocks.size()][store.size()];
        for (double[] row : out) {
            Arrays.fill(row, Double.POSITIVE_INFINITY);
        }
        double[] layerRange = {layer.minWavelengthNm(), layer.maxWavelengthNm()};
        if (!(SurfaceBounds.largestReflectance(layerIndex, layerRange) < 1)) {
            return out; // no stack can be formed: every row is unverified
        }
        byte[] usableIndex = new byte[store.indexModelCount()]; // 0 unknown, 1 usable, 2 not
        for (int c = 0; c < blocks.size(); c++) {
            TransmittanceClause clause = blocks.get(c);
            if (clause.direction() != Direction.BLOCK || clause.aggregate() != Aggregate.EVERY_POINT) {
                throw new IllegalArgumentException("bounds every-point blocks only, not '" + clause.text() + "'");
            }
            bound(store, clause, layer, layerRange, usableIndex, out[c]);
        }
        return out;
    }

    private static void bound(SpectralStore store, TransmittanceClause clause, Curve layer, double[] layerRange,
                              byte[] usableIndex, double[] out) {
        double thresholdLog = Math.log10(clause.thresholdT());
        double slack = MissScreen.SLACK_DECADES + ROUNDING_DECADES;
        WeightedScreen bins = store.weightedScreen();
        for (int w = 0; w < store.gridSize(); w++) {
            double nm = store.gridNm(w);
            if (!(nm >= clause.band().fromNm() && nm <= clause.band().toNm())) {
                continue;
            }
            double layerAbsorbance = layerAbsorbance(layer, nm);
            if (Double.isNaN(layerAbsorbance)) {
                continue;
            }
            double base = thresholdLog + layerAbsorbance + slack;
            short[] column = store.column(w);
            for (int curve = 0; curve < out.length; curve++) {
                short code = column[curve];
                if (!OdCode.isMeasured(code) || OdCode.isBound(code)) {
                    continue;
                }
                double margin = base + OdCode.opticalDensity(code) + aboveOne(bins, curve, nm);
                // only a miss is worth the index check (a positive bound is never used)
                if (margin < 0 && margin < out[curve] && usable(store, curve, layerRange, usableIndex)) {
                    out[curve] = margin;
                }
            }
        }
    }

    /**
     * What capping the candidate's readings at 1 may add to its absorbance around {@code nm}: log10 of the
     * largest T of the points a value there is read from, when above 1; log10 1.5 where nothing tighter is known.
     */
    private static double aboveOne(WeightedScreen bins, int curve, double nm) {
        double brightest = bins.brightestAround(curve, nm);
        return brightest > 1 ? Math.log10(brightest) : 0;
    }

    /**
     * The layer's absorbance at {@code nm}, or NaN where it cannot stand in the proof: outside its range, or
     * where a point it interpolates from is below detection or has T outside [ε, 1].
     */
    static double layerAbsorbance(Curve layer, double nm) {
        if (!layer.covers(nm)) {
            return Double.NaN;
        }
        double[] wavelengths = layer.wavelengthsNm();
        int hit = Arrays.binarySearch(wavelengths, nm);
        int lo = hit >= 0 ? hit : -hit - 2;
        int hi = hit >= 0 ? hit : -hit - 1;
        for (int i : new int[] {lo, hi}) {
            double t = layer.transmittance(i);
            if (layer.belowDetection(i) || !(t >= Curve.ABSORBANCE_FLOOR_T && t <= 1)) {
                return Double.NaN;
            }
        }
        OptionalDouble t = layer.transmittanceAt(nm);
        return t.isPresent() ? -Math.log10(Math.max(t.getAsDouble(), Curve.ABSORBANCE_FLOOR_T)) : Double.NaN;
    }

    /** Whether the candidate's index gives a reflectance over the layer's range (once per index model). */
    private static boolean usable(SpectralStore store, int curve, double[] layerRange, byte[] usableIndex) {
        int model = store.indexModelOf(curve);
        if (usableIndex[model] == 0) {
            RefractiveIndex index = store.indexModel(model);
            usableIndex[model] = index == null || SurfaceBounds.largestReflectance(index, layerRange) < 1 ? (byte) 1 : 2;
        }
        return usableIndex[model] == 1;
    }
}
