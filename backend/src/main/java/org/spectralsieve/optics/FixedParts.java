package org.spectralsieve.optics;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.spectralsieve.spectrum.ArrayContent;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;
import org.spectralsieve.spectrum.PointReadings;

/**
 * Fixed parts behind many different front parts: a requirement's layer ("behind 4 mm clear float glass")
 * stacked behind every candidate of a search. What depends only on the fixed parts and the front part's
 * wavelengths — the shared wavelengths, the fixed parts' curves there, their reflectances and their slab
 * elements — is computed once per distinct front grid (the demo library's curves share a few grids) instead of
 * once per candidate, which was most of a stacked judgement's time (docs/exact-judgement-speed.md).
 *
 * <p>{@link #behind} equals {@code LightPath.of(front, fixed...).transmittance()} number for number: the same
 * shared wavelengths (a grid equal in every wavelength gives the same union), the same resampling, the same
 * reflectances and the same {@link LightPath#combine} (with the fixed parts' elements formed beforehand, as
 * {@link ThicknessSweep} does). A front grid is remembered only after the straightforward route has succeeded on
 * it, so every failure (ranges that do not overlap, an index that fails) is that route's own. Thread-safe: the
 * remembered parts are immutable and several searches may stack at once.
 */
public final class FixedParts {

    /**
     * Distinct fixed-part sets remembered (a search names one layer; a few searches at once name a few). With
     * {@link #GRIDS} this bounds the memory held: about 130 kB per grid of 911 points (the layer's curve,
     * reflectances and 2 × 911 slab elements), so at most 64 grids, about 8 MB, beside the 512 MB heap.
     */
    private static final int SETS = 4;
    /** Distinct front grids remembered per set (imported curves bring their own grids; the demo library has few). */
    private static final int GRIDS = 16;
    private static final Map<Identity, FixedParts> BY_PARTS = new ConcurrentHashMap<>();

    private final List<Layer> fixed;
    private final Map<ArrayContent, OnGrid> byGrid = new ConcurrentHashMap<>();

    private FixedParts(List<Layer> fixed) {
        this.fixed = List.copyOf(fixed);
    }

    /**
     * The remembered parts for one fixed part as a layer of its curve and index, keyed by those objects
     * themselves (immutable; identity, so an equal curve loaded anew is a new entry): a layer resolved once per
     * search serves every candidate of it, and a layer whose curve is kept in the search's curve cache serves
     * later searches too.
     */
    public static FixedParts of(Curve curve, RefractiveIndex index) {
        Identity key = new Identity(curve, index);
        FixedParts hit = BY_PARTS.get(key);
        if (hit == null) {
            if (BY_PARTS.size() >= SETS) {
                BY_PARTS.clear();
            }
            hit = BY_PARTS.computeIfAbsent(key, k -> new FixedParts(List.of(Layer.fixed(curve, index))));
        }
        return hit;
    }

    /** The path of {@code front} followed by the fixed parts: equal to {@link LightPath#transmittance()} of them. */
    public Curve behind(Layer front) {
        double[] frontNm = front.measured().wavelengthsNm();
        OnGrid on = byGrid.get(new ArrayContent(frontNm));
        if (on == null) {
            List<Layer> layers = layers(front);
            Curve path = LightPath.of(layers).transmittance();
            // it succeeded: the fixed parts on this grid can be formed and kept
            remember(new ArrayContent(frontNm), layers);
            return path;
        }
        Curve[] onShared = on.onShared().clone();
        double[][] reflectances = on.reflectances().clone();
        try {
            onShared[0] = front.transmittanceAt(on.nm());
        } catch (CurveException e) {
            throw new CurveException("layer 0: " + e.getMessage());
        }
        reflectances[0] = LightPath.reflectances(List.of(front), on.nm())[0];
        return LightPath.combine(on.nm().clone(), onShared, reflectances, on.elements());
    }

    private List<Layer> layers(Layer front) {
        List<Layer> layers = new ArrayList<>(fixed.size() + 1);
        layers.add(front);
        layers.addAll(fixed);
        return layers;
    }

    private void remember(ArrayContent grid, List<Layer> layers) {
        if (byGrid.size() >= GRIDS) {
            byGrid.clear();
        }
        double[] nm = LightPath.of(layers).sharedWavelengths();
        Curve[] onShared = new Curve[layers.size()];
        for (int j = 1; j < onShared.length; j++) {
            onShared[j] = layers.get(j).transmittanceAt(nm);
        }
        double[][] reflectances = LightPath.reflectances(layers, nm);
        OpticalElement[][][] elements = new OpticalElement[layers.size()][][];
        for (int j = 1; j < elements.length; j++) {
            elements[j] = LightPath.elements(onShared[j], reflectances[j]);
        }
        byGrid.put(grid, OnGrid.of(nm, onShared, reflectances, elements, layers.get(0).measured().wavelengthsNm()));
    }

    /**
     * The fixed parts on one front grid's shared wavelengths; index 0 (the front part) left empty. With, per shared
     * wavelength, where the front grid reads it as {@code Curve.resampleAt} does: the first front point not below it
     * ({@code frontUpper}), whether that point is the wavelength itself ({@code frontHit}), and else the fraction of
     * the way from the point before ({@code frontFraction}, the expression of {@code Curve}): the same for every
     * front part on this grid.
     */
    record OnGrid(double[] nm, Curve[] onShared, double[][] reflectances, OpticalElement[][][] elements,
                  int[] frontUpper, boolean[] frontHit, double[] frontFraction) {

        static OnGrid of(double[] nm, Curve[] onShared, double[][] reflectances, OpticalElement[][][] elements,
                         double[] frontNm) {
            int[] upper = new int[nm.length];
            boolean[] hit = new boolean[nm.length];
            double[] fraction = new double[nm.length];
            int u = 0;
            for (int i = 0; i < nm.length; i++) {
                while (frontNm[u] < nm[i]) {
                    u++;
                }
                upper[i] = u;
                hit[i] = frontNm[u] == nm[i];
                fraction[i] = hit[i] ? 0 : (nm[i] - frontNm[u - 1]) / (frontNm[u] - frontNm[u - 1]);
            }
            return new OnGrid(nm, onShared, reflectances, elements, upper, hit, fraction);
        }

        boolean anyUncertainty() {
            for (int j = 1; j < onShared.length; j++) {
                if (onShared[j].hasUncertainty()) {
                    return true;
                }
            }
            return false;
        }
    }

    /**
     * The points of {@link #behind}{@code (front)}, each formed when read ({@link StackedPoints}; the same numbers),
     * or null where only the built curve will do: a grid not yet remembered (the straightforward route must
     * succeed on it first), a front part that is not fixed or a part with an uncertainty (the stack's is summed
     * over the whole curve), a shared wavelength outside the front's range (the route's own refusal).
     */
    public PointReadings pointsBehind(Layer front) {
        if (!(front instanceof Layer.Fixed) || front.measured().hasUncertainty()) {
            return null;
        }
        double[] frontNm = front.measured().wavelengthsNm();
        OnGrid on = byGrid.get(new ArrayContent(frontNm));
        if (on == null || on.anyUncertainty()) {
            return null;
        }
        double[] nm = on.nm();
        if (!(front.measured().covers(nm[0]) && front.measured().covers(nm[nm.length - 1]))) {
            return null;
        }
        // computed for every point now, as behind does, so an index that fails fails here the same way
        double[] frontReflectances = LightPath.reflectances(List.of(front), nm)[0];
        return new StackedPoints(front.measured(), frontReflectances, on, () -> behind(front));
    }

    /** A fixed part's curve and index, by identity. */
    private record Identity(Curve curve, RefractiveIndex index) {

        @Override
        public boolean equals(Object o) {
            return o instanceof Identity other && curve == other.curve && index == other.index;
        }

        @Override
        public int hashCode() {
            return 31 * System.identityHashCode(curve) + System.identityHashCode(index);
        }
    }
}
