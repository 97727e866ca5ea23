package org.spectralsieve.optics;

import java.util.Arrays;
import java.util.List;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.spectrum.WavelengthGrid;

/**
 * Several separate parts one after another in a beam (window + mask film + cover), combined into one
 * transmittance curve.
 *
 * <p>Model, per wavelength: each layer becomes a symmetric slab element — R from its index by Fresnel,
 * K from its (rescaled) measured T by inverting the slab formula ({@link SlabReading}: a reading at or
 * above the lossless ceiling keeps its own T through an effective surface reflectance, so the element
 * passes exactly what was measured), element T and R from K and R — and
 * the elements are chained with {@link OpticalElement#followedBy}: incoherent multiple reflections across
 * air gaps. Incoherent, because the parts are much thicker than the coherence length of the lamps and LEDs
 * in question, so interference averages out; air gaps, because the parts are separate pieces, not
 * cemented. Inverting and re-forming the slab reproduces the layer's own T, so a path of one bulk layer
 * equals {@link ThicknessRescaler#rescale} resampled onto the grid.
 *
 * <p>Detection: the path is below detection where any layer is, because T of the chain increases with
 * every layer's T and an upper bound therefore stays a bound. The path's detection limit at a wavelength
 * is the largest path T obtained by setting one layer at a time to its own detection limit.
 */
public final class LightPath {

    private final List<Layer> layers;

    private LightPath(List<Layer> layers) {
        this.layers = layers;
    }

    public static LightPath of(List<Layer> layers) {
        List<Layer> copy = List.copyOf(layers);
        if (copy.isEmpty()) {
            throw new IllegalArgumentException("a light path needs at least one layer");
        }
        return new LightPath(copy);
    }

    public static LightPath of(Layer... layers) {
        return of(List.of(layers));
    }

    public List<Layer> layers() {
        return layers;
    }

    /** Transmittance of the whole path on {@code grid}; every layer's curve must cover the grid. */
    public Curve transmittance(WavelengthGrid grid) {
        int count = layers.size();
        Curve[] onGrid = new Curve[count];
        for (int j = 0; j < count; j++) {
            try {
                onGrid[j] = layers.get(j).transmittanceOn(grid);
            } catch (CurveException e) {
                throw new CurveException("layer " + j + ": " + e.getMessage());
            }
        }
        double[] nm = grid.points();
        return combine(nm, onGrid, reflectances(layers, nm));
    }

    /**
     * Transmittance of the whole path at the layers' own wavelengths: every stored wavelength of every
     * layer inside the range all layers cover, plus that range's two ends. Nothing a layer's curve shows
     * is smoothed away by a coarser grid, and nothing is extrapolated.
     *
     * @throws CurveException when the layers' measured ranges share less than an interval
     */
    public Curve transmittance() {
        return transmittanceAt(sharedWavelengths());
    }

    /** Transmittance of the whole path at increasing wavelengths every layer covers. */
    public Curve transmittanceAt(double[] wavelengthsNm) {
        int count = layers.size();
        Curve[] onPoints = new Curve[count];
        for (int j = 0; j < count; j++) {
            try {
                onPoints[j] = layers.get(j).transmittanceAt(wavelengthsNm);
            } catch (CurveException e) {
                throw new CurveException("layer " + j + ": " + e.getMessage());
            }
        }
        return combine(wavelengthsNm.clone(), onPoints, reflectances(layers, wavelengthsNm));
    }

    /**
     * Transmittance of the whole path at the layers' own wavelengths ({@link #sharedWavelengths}) for light
     * arriving as {@code light} says; normal incidence is {@link #transmittance()}, number for number. At an
     * angle see {@link ObliquePath}; a bulk layer's point is a bound also where the layer rescaled along the
     * longest slant the light takes through it would be one (its hidden absorption grows with the path).
     */
    public Curve transmittance(Illumination light) {
        return light.normal() ? transmittance() : transmittance(prepare(light));
    }

    /**
     * What an oblique path at {@link #sharedWavelengths} needs that depends only on the wavelengths, the indices
     * and the light: computed once, and reused for the same parts at other thicknesses (the shared wavelengths do
     * not change with thickness), {@link #transmittance(ObliquePath)}.
     */
    public ObliquePath prepare(Illumination light) {
        int count = layers.size();
        RefractiveIndex[] indexes = new RefractiveIndex[count];
        for (int j = 0; j < count; j++) {
            indexes[j] = layers.get(j).index();
        }
        return ObliquePath.prepare(sharedWavelengths(), indexes, light);
    }

    /** Transmittance under the light {@code prepared} for a path of these layers' wavelengths and indices. */
    public Curve transmittance(ObliquePath prepared) {
        double[] points = prepared.wavelengthsNm();
        int count = layers.size();
        Curve[] onPoints = new Curve[count];
        for (int j = 0; j < count; j++) {
            try {
                onPoints[j] = layers.get(j).transmittanceAt(points);
            } catch (CurveException e) {
                throw new CurveException("layer " + j + ": " + e.getMessage());
            }
        }
        return prepared.transmittance(onPoints, alongLongestSlant(layers, points, prepared.longestSlant()));
    }

    /** Each bulk layer rescaled to its thickness times {@code slant} at the points (null for a fixed layer). */
    static Curve[] alongLongestSlant(List<Layer> layers, double[] points, double slant) {
        Curve[] out = new Curve[layers.size()];
        for (int j = 0; j < out.length; j++) {
            if (layers.get(j) instanceof Layer.Bulk b && slant > 1) {
                out[j] = Layer.bulk(b.measured(), b.measuredThicknessMm(), b.targetThicknessMm() * slant, b.index())
                        .transmittanceAt(points);
            }
        }
        return out;
    }

    /** The union of the layers' stored wavelengths inside the range they all cover, with its ends. */
    public double[] sharedWavelengths() {
        double from = Double.NEGATIVE_INFINITY;
        double to = Double.POSITIVE_INFINITY;
        for (Layer layer : layers) {
            from = Math.max(from, layer.measured().minWavelengthNm());
            to = Math.min(to, layer.measured().maxWavelengthNm());
        }
        if (!(to > from)) {
            throw new CurveException("the layers' measured ranges do not overlap (common part " + from + ".." + to
                    + " nm); a light path is only known where every layer was measured");
        }
        int total = 2;
        for (Layer layer : layers) {
            total += layer.measured().size();
        }
        double[] points = new double[total];
        int count = 0;
        points[count++] = from;
        points[count++] = to;
        for (Layer layer : layers) {
            for (double nm : layer.measured().wavelengthsNm()) {
                if (nm > from && nm < to) {
                    points[count++] = nm;
                }
            }
        }
        return sortedDistinct(points, count);
    }

    /** The first {@code count} values in increasing order, each once (primitive sort, no boxing). */
    private static double[] sortedDistinct(double[] values, int count) {
        Arrays.sort(values, 0, count);
        int distinct = 0;
        for (int i = 0; i < count; i++) {
            if (distinct == 0 || values[i] != values[distinct - 1]) {
                values[distinct++] = values[i];
            }
        }
        return Arrays.copyOf(values, distinct);
    }

    /** Surface reflectance in air of each layer ([layer][point]) at the given wavelengths. */
    static double[][] reflectances(List<Layer> layers, double[] nm) {
        double[][] r = new double[layers.size()][nm.length];
        for (int j = 0; j < r.length; j++) {
            RefractiveIndex index = layers.get(j).index();
            for (int i = 0; i < nm.length; i++) {
                r[j][i] = Fresnel.reflectanceInAir(index.at(nm[i]));
            }
        }
        return r;
    }

    /**
     * The path's curve from each layer's curve at the points {@code nm} and the layers' reflectances there
     * ({@link #reflectances}); shared by {@link ThicknessSweep}, so a path built from precomputed parts is
     * the same arithmetic, number for number.
     */
    static Curve combine(double[] nm, Curve[] onGrid, double[][] reflectances) {
        return combine(nm, onGrid, reflectances, new OpticalElement[onGrid.length][][]);
    }

    /**
     * {@link #combine(double[], Curve[], double[][])} with some parts' slab elements already known:
     * {@code known[j]} is null, or {@link #elements} of part j (computed once for a part that does not change
     * from call to call, as a fixed layer behind a part swept through thicknesses). Each part's element of its
     * T and of its detection limit is formed once per point and reused by the chain of T and by every chain
     * of the detection limit; the chains fold the same elements in the same order as before, so the numbers
     * are the same.
     */
    static Curve combine(double[] nm, Curve[] onGrid, double[][] reflectances, OpticalElement[][][] known) {
        if (!PerPointArithmetic.earlier()) {
            Curve lean = StackArithmetic.combine(nm, onGrid, reflectances, known);
            if (lean != null) {
                return lean;
            }
            // a number the elements' records would refuse: the earlier route below refuses it the same way
        }
        return combineByElements(nm, onGrid, reflectances, known);
    }

    /** {@link #combine(double[], Curve[], double[][], OpticalElement[][][])} with element records, the earlier way. */
    static Curve combineByElements(double[] nm, Curve[] onGrid, double[][] reflectances, OpticalElement[][][] known) {
        int count = onGrid.length;
        double[] t = new double[nm.length];
        boolean[] below = new boolean[nm.length];
        double[] limits = new double[nm.length];
        OpticalElement[] value = new OpticalElement[count];
        OpticalElement[] atLimit = new OpticalElement[count];
        for (int i = 0; i < nm.length; i++) {
            for (int j = 0; j < count; j++) {
                if (known[j] != null) {
                    value[j] = known[j][0][i];
                    atLimit[j] = known[j][1][i];
                } else {
                    value[j] = element(onGrid[j].transmittance(i), reflectances[j][i]);
                    atLimit[j] = element(onGrid[j].detectionLimit(i), reflectances[j][i]);
                }
                below[i] |= onGrid[j].belowDetection(i);
            }
            t[i] = chain(value, -1, null);
            limits[i] = detectionLimit(value, atLimit);
        }
        Curve path = Curve.of(nm, t, below, limits);
        return withStackUncertainty(path, onGrid);
    }

    /** Part j's slab elements at every point: {of its T, of its detection limit}, for {@link #combine}. */
    static OpticalElement[][] elements(Curve onGrid, double[] reflectances) {
        int n = onGrid.size();
        OpticalElement[][] out = new OpticalElement[2][n];
        for (int i = 0; i < n; i++) {
            out[0][i] = element(onGrid.transmittance(i), reflectances[i]);
            out[1][i] = element(onGrid.detectionLimit(i), reflectances[i]);
        }
        return out;
    }

    /**
     * The stack's absorbance uncertainty: the layers' absorbances add (the interreflections between parts
     * neglected, a relative change of order 2R², about 0.3 % for glass or plastic), and their measurement errors
     * are taken as independent — each part was measured on its own — so their variances add:
     * σ² = Σ σ_j² (GUM JCGM 100:2008, 5.1.2, uncorrelated inputs with unit sensitivity). Unknown where any
     * layer's is unknown, or where the stack is only a bound; none when no layer carries one.
     */
    static Curve withStackUncertainty(Curve path, Curve[] onGrid) {
        boolean any = false;
        for (Curve layer : onGrid) {
            any |= layer.hasUncertainty();
        }
        if (!any) {
            return path;
        }
        double[] sigma = new double[path.size()];
        for (int i = 0; i < sigma.length; i++) {
            double variance = 0;
            for (Curve layer : onGrid) {
                double s = layer.absorbanceUncertainty(i);
                variance += s * s; // NaN propagates: one unknown layer makes the sum unknown
            }
            sigma[i] = path.belowDetection(i) ? Double.NaN : Math.sqrt(variance);
        }
        return path.withAbsorbanceUncertainty(sigma);
    }

    /** The largest path T with one part at a time at its detection limit. */
    private static double detectionLimit(OpticalElement[] value, OpticalElement[] atLimit) {
        double limit = 0;
        for (int j = 0; j < value.length; j++) {
            limit = Math.max(limit, chain(value, j, atLimit[j]));
        }
        // a Curve's limit must stay under 1; only noisy T above the ceiling could get near it
        return Math.min(limit, Math.nextDown(1.0));
    }

    /** T of the parts' elements in order, part {@code swapped} (if ≥ 0) replaced by {@code instead}. */
    private static double chain(OpticalElement[] elements, int swapped, OpticalElement instead) {
        OpticalElement path = swapped == 0 ? instead : elements[0];
        for (int j = 1; j < elements.length; j++) {
            path = path.followedBy(j == swapped ? instead : elements[j]);
        }
        return path.transmittance();
    }

    private static OpticalElement element(double t, double r) {
        return SlabReading.of(t, r).element();
    }
}
