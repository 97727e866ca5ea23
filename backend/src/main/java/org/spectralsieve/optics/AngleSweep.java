package org.spectralsieve.optics;

import java.util.ArrayList;
import java.util.List;
import org.spectralsieve.spectrum.Curve;

/**
 * A light path's transmittance against the angle of incidence at one wavelength: collimated light at 0°, 1°, …,
 * 89°, unpolarised and per polarisation, with the effective transmittance under three reference sources and the
 * Brewster angle of the first part's index. What the material page draws as "T against angle"
 * (docs/oblique-incidence.md).
 *
 * <ul>
 *   <li>Unpolarised: at 0° the path's own normal-incidence arithmetic ({@link LightPath#transmittanceAt}), so the
 *       first point is today's number; at every other angle the path under a collimated beam at that angle
 *       ({@link ObliquePath}), the same numbers a requirement "at 30° incidence" is judged on.</li>
 *   <li>s and p: each part read as {@link ObliquePath} reads it ({@link SlabReading}: Fresnel R at normal incidence
 *       and the K that reproduces its reading; a clear reading's unplaced surface loss R' − R added to both
 *       polarisations), its surfaces at R_s(θ) or R_p(θ) ({@link ObliqueIncidence#surface}), its internal
 *       transmittance K^(1/cos θt), the parts chained across air gaps per polarisation as {@link ObliquePath} chains
 *       them, read at the wavelength as the path's curve is (T interpolated in absorbance between neighbours).
 *       Their mean is the unpolarised value (checked in the test).</li>
 *   <li>References: a uniform 60° beam, an LED of 120° beam angle and a Lambertian source, each with its
 *       integration error estimate ({@link ObliquePath#integrationError}).</li>
 * </ul>
 * Bounded work: {@value #ANGLES} angles and three references at the two stored wavelengths around the asked one,
 * each part cut to its stored points there, whatever the curves' length.
 */
public final class AngleSweep {

    /** Angles 0°, 1°, …, 89°: at 90° no light enters a window. */
    public static final int ANGLES = 90;

    /** The sources the page compares: a uniform 60° beam, an LED with 120° beam angle, a Lambertian source. */
    public static final List<Illumination> REFERENCES =
            List.of(Illumination.beam(60), Illumination.led(120), Illumination.lambertian());

    /** The model in one line, for the answer. */
    public static final String MODEL = "plane parallel parts in air with incoherent multiple reflections; Fresnel s"
            + " and p reflectances from the stated index, absorption along the slant path inside (K^(1/cos θt));"
            + " unpolarised light is the mean of s and p";

    private AngleSweep() {
    }

    /** The effective transmittance under one reference source at the wavelength. */
    public record Reference(Illumination light, double transmittance, double errorBound, boolean upperBound) {
    }

    /**
     * @param index       the first part's refractive index at the wavelength (the Brewster angle's)
     * @param brewsterDeg atan(n), where p light is not reflected at the first part's surfaces
     * @param upperBound  per angle: the point is only an upper bound (below the detection limit in a part, or where
     *                    the slant path's hidden absorption would make it one)
     */
    public record Result(double wavelengthNm, double index, double brewsterDeg, double[] anglesDeg,
                         double[] unpolarised, double[] s, double[] p, boolean[] upperBound,
                         List<Reference> references) {
    }

    /** The wavelengths the sweep may be asked at: where every part of the path was measured, [from, to]. */
    public static double[] rangeNm(LightPath path) {
        double from = Double.NEGATIVE_INFINITY;
        double to = Double.POSITIVE_INFINITY;
        for (Layer layer : path.layers()) {
            from = Math.max(from, layer.measured().minWavelengthNm());
            to = Math.min(to, layer.measured().maxWavelengthNm());
        }
        return new double[] {from, to};
    }

    /**
     * The sweep of {@code path} at {@code nm}.
     *
     * @throws IllegalArgumentException when nm lies outside {@link #rangeNm} (curves are never extrapolated)
     */
    public static Result at(LightPath path, double nm) {
        double[] range = rangeNm(path);
        if (!(nm >= range[0] && nm <= range[1]) || !(range[1] > range[0])) {
            throw new IllegalArgumentException("wavelength " + nm + " nm lies outside the measured range "
                    + range[0] + "-" + range[1] + " nm; curves are never extrapolated");
        }
        // the path at the two shared wavelengths around nm, then read at nm as the path's whole curve would be
        // (Curve interpolates between neighbours only): the numbers the figures and the search read there
        double[] points = bracket(path.sharedWavelengths(), nm);
        // each part cut to its stored points around the two: rescaling and resampling work point by point and
        // between neighbours, so the numbers there are the same, and the work does not grow with the curve
        path = around(path, points[0], points[1]);
        List<Layer> layers = path.layers();
        RefractiveIndex[] indexes = new RefractiveIndex[layers.size()];
        Curve[] onPoints = new Curve[layers.size()];
        for (int j = 0; j < indexes.length; j++) {
            indexes[j] = layers.get(j).index();
            onPoints[j] = layers.get(j).transmittanceAt(points);
        }

        double[] angles = new double[ANGLES];
        double[] unpolarised = new double[ANGLES];
        double[] s = new double[ANGLES];
        double[] p = new double[ANGLES];
        boolean[] bound = new boolean[ANGLES];
        for (int k = 0; k < ANGLES; k++) {
            angles[k] = k;
            Curve curve = k == 0 ? path.transmittanceAt(points)
                    : path.transmittance(ObliquePath.prepare(points, indexes, Illumination.atIncidence(k)));
            unpolarised[k] = curve.transmittanceAt(nm).getAsDouble();
            bound[k] = curve.belowDetectionAt(nm);
            double[][] split = new double[2][points.length];
            for (int i = 0; i < points.length; i++) {
                double[] both = polarised(onPoints, indexes, i, points[i], Math.toRadians(k));
                split[0][i] = both[0];
                split[1][i] = both[1];
            }
            s[k] = readAt(points, split[0], nm);
            p[k] = readAt(points, split[1], nm);
        }

        List<Reference> references = new ArrayList<>();
        for (Illumination light : REFERENCES) {
            ObliquePath prepared = ObliquePath.prepare(points, indexes, light);
            Curve curve = path.transmittance(prepared);
            double[] error = prepared.integrationError(onPoints);
            // the error at nm: at most the larger of the two neighbours' (the interpolation lies between them)
            references.add(new Reference(light, curve.transmittanceAt(nm).getAsDouble(), Math.max(error[0], error[1]),
                    curve.belowDetectionAt(nm)));
        }
        double n = indexes[0].at(nm);
        return new Result(nm, n, Math.toDegrees(ObliqueIncidence.brewsterRad(n)), angles, unpolarised, s, p, bound,
                List.copyOf(references));
    }

    /** The two neighbouring wavelengths of {@code shared} with nm between them (nm may be either). */
    private static double[] bracket(double[] shared, double nm) {
        int hit = java.util.Arrays.binarySearch(shared, nm);
        int upper = hit >= 0 ? Math.max(1, hit) : -hit - 1;
        return new double[] {shared[upper - 1], shared[upper]};
    }

    /** The path with each part's curve cut to the stored points from the last at or below lo to the first at or above hi. */
    private static LightPath around(LightPath path, double lo, double hi) {
        List<Layer> cut = new ArrayList<>();
        for (Layer layer : path.layers()) {
            Curve part = cut(layer.measured(), lo, hi);
            cut.add(layer instanceof Layer.Bulk b
                    ? Layer.bulk(part, b.measuredThicknessMm(), b.targetThicknessMm(), b.index())
                    : Layer.fixed(part, layer.index()));
        }
        return LightPath.of(cut);
    }

    private static Curve cut(Curve curve, double lo, double hi) {
        double[] nm = curve.wavelengthsNm();
        int hitLo = java.util.Arrays.binarySearch(nm, lo);
        int from = hitLo >= 0 ? hitLo : Math.max(0, -hitLo - 2);
        int hitHi = java.util.Arrays.binarySearch(nm, hi);
        int to = hitHi >= 0 ? hitHi : Math.min(nm.length - 1, -hitHi - 1);
        if (to == from) {
            to = Math.min(nm.length - 1, from + 1);
            from = to - 1;
        }
        int n = to - from + 1;
        double[] wavelengths = new double[n];
        double[] t = new double[n];
        boolean[] below = new boolean[n];
        double[] limits = new double[n];
        double[] sigma = curve.hasUncertainty() ? new double[n] : null;
        for (int i = 0; i < n; i++) {
            wavelengths[i] = curve.wavelengthNm(from + i);
            t[i] = curve.transmittance(from + i);
            below[i] = curve.belowDetection(from + i);
            limits[i] = curve.detectionLimit(from + i);
            if (sigma != null) {
                sigma[i] = curve.absorbanceUncertainty(from + i);
            }
        }
        Curve part = Curve.of(wavelengths, t, below, limits);
        return sigma == null ? part : part.withAbsorbanceUncertainty(sigma);
    }

    /** Values at the two points read at nm as {@link Curve#transmittanceAt} reads a curve (linear in absorbance). */
    private static double readAt(double[] points, double[] values, double nm) {
        return Curve.of(points, values, 0).transmittanceAt(nm).getAsDouble();
    }

    /**
     * {T_s, T_p} of the chained parts at angle θ, point {@code at} of each part's curve: each part read as
     * {@link ObliquePath} reads it, chained by its arithmetic ({@link ObliquePath#surface}, {@link ObliquePath#chain}).
     */
    private static double[] polarised(Curve[] onPoints, RefractiveIndex[] indexes, int at, double nm, double theta) {
        int parts = onPoints.length;
        double[] s = new double[parts];
        double[] p = new double[parts];
        double[] internal = new double[parts];
        for (int j = 0; j < parts; j++) {
            double n = indexes[j].at(nm);
            double normalR = Fresnel.reflectanceInAir(n);
            SlabReading reading = SlabReading.of(onPoints[j].transmittance(at), normalR);
            double excess = reading.reflectance() - normalR; // surface loss the index does not explain (0 when resolved)
            ObliqueIncidence.Surface surface = ObliqueIncidence.surface(n, theta);
            internal[j] = reading.internal() == 0 ? 0 : Math.pow(reading.internal(), 1 / surface.cosRefracted());
            s[j] = ObliquePath.surface(surface.rs(), excess);
            p[j] = ObliquePath.surface(surface.rp(), excess);
        }
        return new double[] {Math.min(ObliquePath.chain(s, internal), 1.0), Math.min(ObliquePath.chain(p, internal), 1.0)};
    }
}
