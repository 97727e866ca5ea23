package org.spectralsieve.optics;

import java.util.ArrayList;
import java.util.List;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;

/**
 * One bulk part read at many thicknesses, alone or in front of fixed parts: what a thickness solver asks for
 * dozens of times per sample. Everything that does not depend on the thickness is computed once — each
 * stored point's {@link SlabReading} (of T and of the detection limit), and
 * for a stack the shared wavelengths, the fixed parts' curves there and every part's reflectance there — so
 * a thickness costs one Beer–Lambert power and one slab formula per stored point, plus the chain per shared
 * point (the fixed parts' slab elements formed once, {@link LightPath#combine(double[], Curve[], double[][],
 * OpticalElement[][][])}).
 *
 * <p>The numbers are those of the straightforward route, bit for bit: {@link #rescaled} equals
 * {@link ThicknessRescaler#rescale} (the same prepared readings, the same per-point rule), and {@link #path} equals {@code LightPath.of(Layer.fixed(rescaled(d), index),
 * fixed...).transmittance()} (same shared wavelengths, same resampling, same {@code LightPath.combine}).
 * Immutable after the stack's parts are first computed; not shared between threads.
 */
public final class ThicknessSweep {

    private final Curve measured;
    private final double measuredMm;
    private final RefractiveIndex index;
    private final List<Layer> fixed;
    private final ThicknessRescaler.Prepared prepared;
    private final boolean formWhenRead;
    private Stack stack;

    /** The fixed parts at the stack's shared wavelengths, with every part's reflectance there. */
    private record Stack(double[] nm, Curve[] onShared, double[][] reflectances, OpticalElement[][][] fixedElements) {
    }

    /**
     * @param fixed parts behind the bulk part, in order (empty: the part alone); each used as its
     *              {@link Layer#transmittanceAt} gives
     */
    public ThicknessSweep(Curve measured, double measuredMm, RefractiveIndex index, List<Layer> fixed) {
        this(measured, measuredMm, index, fixed, false);
    }

    /**
     * @param formWhenRead form each point's {@link SlabReading}s only when a thickness first reads that point
     *                     (the reflectances are still computed and checked for every point now, so a failing
     *                     index fails here as before); false forms them all now, the earlier way
     */
    public ThicknessSweep(Curve measured, double measuredMm, RefractiveIndex index, List<Layer> fixed,
                          boolean formWhenRead) {
        BeerLambert.requireThickness("measuredMm", measuredMm);
        this.measured = measured;
        this.measuredMm = measuredMm;
        this.index = index;
        this.fixed = List.copyOf(fixed);
        this.formWhenRead = formWhenRead;
        this.prepared = formWhenRead ? ThicknessRescaler.prepareWhenRead(measured, index)
                : ThicknessRescaler.prepare(measured, index);
    }

    /**
     * Stored point i's reading as the rescaling uses it (the measured T with the Fresnel reflectance of the
     * index there, {@link SlabReading#of}), so a model of the same part (the thickness solver's) forms each
     * reading once, not once more for itself.
     */
    public SlabReading reading(int i) {
        return prepared.value(i);
    }

    /** The part's curve as measured. */
    public Curve measured() {
        return measured;
    }

    /** The Fresnel reflectance in air of the part's index at stored point i. */
    public double fresnelReflectance(int i) {
        return prepared.fresnel(i);
    }

    /**
     * The bulk part alone at {@code toMm}, each point computed when it is read: the points of
     * {@link #rescaled} (wavelengths, T, flags and limits; not the uncertainty), for figures that read few of them.
     */
    public PointReadings rescaledPoints(double toMm) {
        return new RescaledPoints(prepared, measuredMm, toMm, formWhenRead);
    }

    /** The bulk part alone at {@code toMm}: equal to {@link ThicknessRescaler#rescale}. */
    public Curve rescaled(double toMm) {
        return prepared.at(measuredMm, toMm);
    }

    /**
     * The bulk part at {@code toMm} followed by the fixed parts (the part alone when there are none), on the
     * parts' shared wavelengths as {@link LightPath#transmittance()} builds them.
     *
     * @throws org.spectralsieve.spectrum.CurveException when the parts' measured ranges do not overlap
     */
    public Curve path(double toMm) {
        Curve alone = rescaled(toMm);
        if (fixed.isEmpty()) {
            return alone;
        }
        Stack s = stack();
        Curve[] onShared = s.onShared().clone();
        onShared[0] = alone.resampleAt(s.nm());
        return LightPath.combine(s.nm().clone(), onShared, s.reflectances(), s.fixedElements());
    }

    private Stack stack() {
        if (stack == null) {
            List<Layer> layers = new ArrayList<>();
            // the measured curve has the wavelengths and range of every rescaled one
            layers.add(Layer.fixed(measured, index));
            layers.addAll(fixed);
            double[] nm = LightPath.of(layers).sharedWavelengths();
            Curve[] onShared = new Curve[layers.size()];
            for (int j = 1; j < onShared.length; j++) {
                onShared[j] = layers.get(j).transmittanceAt(nm);
            }
            double[][] reflectances = LightPath.reflectances(layers, nm);
            // the fixed parts' slab elements do not depend on the thickness: formed once, not per thickness
            OpticalElement[][][] fixedElements = new OpticalElement[layers.size()][][];
            for (int j = 1; j < fixedElements.length; j++) {
                fixedElements[j] = LightPath.elements(onShared[j], reflectances[j]);
            }
            stack = new Stack(nm, onShared, reflectances, fixedElements);
        }
        return stack;
    }
}
