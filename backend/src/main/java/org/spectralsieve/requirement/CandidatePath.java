package org.spectralsieve.requirement;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.FixedParts;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.optics.ObliquePath;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.optics.ThicknessSweep;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PerPointArithmetic;
import org.spectralsieve.spectrum.PointReadings;
import org.spectralsieve.weighting.FigurePath;

/**
 * The light path a requirement judges for one candidate: the candidate at a thickness d (rescaled when it
 * is bulk and d differs from the measured thickness), behind or on the requirement's fixed layer when
 * there is one. The stack is a {@link LightPath} on the union of both parts' own wavelengths inside the
 * range both cover, so neither curve is smoothed and nothing is extrapolated. Curves are kept per d: the
 * thickness solver asks for the same thickness from several conditions; a new d reuses the candidate's
 * per-point reflectances and K0 and the layer's side of the stack ({@link ThicknessSweep}).
 */
final class CandidatePath {

    /** The index assumed for a non-bulk candidate stored without one: what import assumes too (n = 1.5). */
    static final RefractiveIndex DEFAULT_INDEX = ConstantIndex.WHEN_UNRECORDED;
    private static final int CACHE_LIMIT = 256;
    /**
     * Thicknesses whose points are kept for a weighted solve: the recommendation's step (every condition at one
     * trial thickness) and the solve's ends; older ones are recomputed, the same numbers.
     */
    private static final int RECENT_POINTS = 32;

    private final Candidate candidate;
    private final Optional<StackLayer> layer;
    private final Map<Double, Curve> byThickness = new HashMap<>();
    private final Map<Double, PointReadings> pointsByThickness = new HashMap<>();
    /** The last thicknesses' points, the lean way ({@link PerPointArithmetic}). */
    private final RecentThicknesses<PointReadings> recentPoints = new RecentThicknesses<>(RECENT_POINTS);
    private final boolean earlierArithmetic = PerPointArithmetic.earlier();
    /** The stack as measured, its points formed when read ({@link #asMeasuredPoints}); null until asked. */
    private PointReadings stackedAsMeasured;
    private ThicknessSweep sweep;
    private RescaledModel readings;
    /** The way this candidate is judged, read once so a benchmark switching it never mixes the two in one judgement. */
    private final boolean earlier = JudgementPath.reference();

    /** How the light arrives; at an angle every curve below is the oblique path's ({@link #oblique}). */
    private final Illumination light;
    /** The oblique path's angle tables, prepared on first use (they do not depend on thickness). */
    private ObliquePath prepared;

    CandidatePath(Candidate candidate, Optional<StackLayer> layer) {
        this(candidate, layer, Illumination.NORMAL);
    }

    CandidatePath(Candidate candidate, Optional<StackLayer> layer, Illumination light) {
        this.candidate = candidate;
        this.layer = layer;
        this.light = light;
    }

    /** Whether the light arrives at an angle (then the lean routes below give way to the whole oblique curve). */
    boolean oblique() {
        return !light.normal();
    }

    /**
     * The path at thickness d (NaN: as measured) for light at an angle: the candidate (rescaled when bulk and d is
     * a number) and the fixed layer as a {@link LightPath} under {@link #light}.
     */
    private Curve oblique(double d) {
        RefractiveIndex index = candidate.index() != null ? candidate.index() : DEFAULT_INDEX;
        // a bulk part as measured is a bulk layer at its own thickness, so its slant bounds are checked too
        Layer part = !candidate.bulk() || !candidate.thicknessKnown() ? Layer.fixed(candidate.measured(), index)
                : Layer.bulk(candidate.measured(), candidate.thicknessMm(), Double.isNaN(d) ? candidate.thicknessMm() : d,
                index);
        LightPath path = layer.isPresent() ? LightPath.of(part, layer.get().asLayer()) : LightPath.of(part);
        // the angle tables depend on the wavelengths and indices only, the same for every thickness
        return path.transmittance(prepared());
    }

    /** A bulk candidate of known thickness alone at an angle: its points can be formed when read. */
    private boolean obliqueAlone() {
        return oblique() && !stacked() && candidate.bulk() && candidate.thicknessKnown();
    }

    /**
     * The oblique path's points at d, formed when read ({@link ObliquePath#points}) on the sweep's rescaled points
     * (the same numbers as {@link #at}'s curve: the rescaled part at the measured wavelengths), with the part along
     * the longest slant for the bounds; kept for the recent thicknesses like the normal-incidence points.
     */
    private PointReadings obliquePointsAt(double d) {
        return recentPointsAt(d, () -> {
            ObliquePath oblique = prepared();
            double slant = oblique.longestSlant();
            PointReadings part = sweep().rescaledPoints(d);
            PointReadings along = slant > 1 ? sweep().rescaledPoints(d * slant) : null;
            return oblique.points(new PointReadings[] {part}, new PointReadings[] {along});
        });
    }

    private ObliquePath prepared() {
        if (prepared == null) {
            // the tables depend on the wavelengths and the indices alone: the measured part stands for every thickness
            RefractiveIndex index = candidate.index() != null ? candidate.index() : DEFAULT_INDEX;
            Layer part = Layer.fixed(candidate.measured(), index);
            prepared = (layer.isPresent() ? LightPath.of(part, layer.get().asLayer()) : LightPath.of(part)).prepare(light);
        }
        return prepared;
    }

    /** The longest slant factor 1/cos θt of the light in the path (1 at normal incidence). */
    private double longestSlant() {
        if (!oblique()) {
            return 1;
        }
        return prepared().longestSlant();
    }

    boolean stacked() {
        return layer.isPresent();
    }

    Candidate candidate() {
        return candidate;
    }

    /** The path as measured: the measured curve, stacked when there is a layer. */
    Curve asMeasured() {
        if (oblique()) {
            return cached(Double.NaN, () -> oblique(Double.NaN));
        }
        return stacked() ? cached(Double.NaN, () -> stack(candidate.measured())) : candidate.measured();
    }

    /**
     * The points of {@link #asMeasured} for clauses that read some of them (weighted figures, bands): behind a
     * layer, each stacked point formed when read ({@link FixedParts#pointsBehind}; the same numbers), unless the
     * curve is built already or only the built curve will do; otherwise the curve itself.
     */
    PointReadings asMeasuredPoints() {
        if (obliqueAlone()) {
            return pointsAt(candidate.thicknessMm());
        }
        if (!stacked() || oblique() || earlier || earlierArithmetic || FigurePath.byLookup()) {
            return asMeasured();
        }
        if (!byThickness.isEmpty()) {
            Curve built = byThickness.get(Double.NaN);
            if (built != null) {
                return built;
            }
        }
        if (stackedAsMeasured == null) {
            StackLayer fixed = layer.orElseThrow();
            stackedAsMeasured = FixedParts.of(fixed.curve(), fixed.index()).pointsBehind(Layer.fixed(candidate.measured(),
                    candidate.index() != null ? candidate.index() : DEFAULT_INDEX));
            if (stackedAsMeasured == null) {
                return asMeasured();
            }
        }
        return stackedAsMeasured;
    }

    /**
     * The path with a bulk candidate rescaled to thickness d (always rescaled, as the solver's model is,
     * so a recommended thickness equal to the measured one reads the same curve as its neighbours); any
     * other candidate as measured.
     */
    Curve at(double d) {
        if (!candidate.bulk()) {
            return asMeasured();
        }
        if (oblique()) {
            return cached(d, () -> oblique(d));
        }
        return cached(d, () -> sweep().path(d));
    }

    /**
     * The points of {@link #at}{@code (d)} for a figure that reads few of them: for a bulk candidate alone,
     * computed only when read ({@link ThicknessSweep#rescaledPoints}; the same numbers), unless the curve at
     * d is already built; otherwise the curve itself. Kept per d like the curves, so the conditions asking
     * for the same thickness share the points computed.
     */
    PointReadings pointsAt(double d) {
        if (obliqueAlone() && !earlier && !FigurePath.byLookup()) {
            return obliquePointsAt(d);
        }
        if (!candidate.bulk() || stacked() || oblique() || FigurePath.byLookup()) {
            return at(d);
        }
        if (!earlierArithmetic) {
            return recentPointsAt(d);
        }
        Curve built = byThickness.get(d);
        if (built != null) {
            return built;
        }
        PointReadings hit = pointsByThickness.get(d);
        if (hit == null) {
            if (pointsByThickness.size() >= CACHE_LIMIT) {
                pointsByThickness.clear();
            }
            hit = sweep().rescaledPoints(d);
            pointsByThickness.put(d, hit);
        }
        return hit;
    }

    /** {@link #pointsAt} without a boxed key: a built curve first (none while a solve searches), then the recent points. */
    private PointReadings recentPointsAt(double d) {
        return recentPointsAt(d, () -> sweep().rescaledPoints(d));
    }

    /** A built curve at d first, then the recent points at d, else {@code form}'s points, kept as recent. */
    private PointReadings recentPointsAt(double d, java.util.function.Supplier<PointReadings> form) {
        if (!byThickness.isEmpty()) {
            Curve built = byThickness.get(d);
            if (built != null) {
                return built;
            }
        }
        PointReadings hit = recentPoints.get(d);
        if (hit == null) {
            hit = form.get();
            recentPoints.put(d, hit);
        }
        return hit;
    }

    /**
     * The thickness beyond which the path's reading at {@code nm} (a wavelength the path as measured
     * covers) is an upper bound because the candidate's reading there extrapolates an absorption its data
     * cannot resolve: the nearer far thickness of the candidate at the path's stored neighbours of nm, as
     * the path's below-detection flags combine ({@link Curve#belowDetectionAt}); +∞ for a candidate that is
     * not rescaled.
     */
    double farMmOnPath(double nm) {
        if (!candidate.bulk()) {
            return Double.POSITIVE_INFINITY;
        }
        double[] grid = asMeasured().wavelengthsNm();
        int hit = java.util.Arrays.binarySearch(grid, nm);
        if (hit >= 0) {
            return candidateFarMm(nm);
        }
        int hi = -hit - 1;
        return Math.min(candidateFarMm(grid[hi - 1]), candidateFarMm(grid[hi]));
    }

    /** The least {@link #farMmOnPath} over the path's stored wavelengths at or beyond {@code nm} (for a cutoff). */
    double farMmOnPathFrom(double nm) {
        if (!candidate.bulk()) {
            return Double.POSITIVE_INFINITY;
        }
        double far = Double.POSITIVE_INFINITY;
        double[] grid = asMeasured().wavelengthsNm();
        for (int i = grid.length - 1; i >= 0 && grid[i] >= nm; i--) {
            far = Math.min(far, candidateFarMm(grid[i]));
        }
        return far;
    }

    /** At an angle the light's longest path through the candidate is d·slant: its far thickness comes slant times sooner. */
    private double candidateFarMm(double nm) {
        return candidate.measured().covers(nm) ? readings().farMmAt(nm) / longestSlant() : Double.POSITIVE_INFINITY;
    }

    /** Whether this candidate is judged the earlier way ({@link JudgementPath}). */
    boolean earlier() {
        return earlier;
    }

    /**
     * The bulk candidate's readings as functions of thickness, for the thickness solver: on the sweep's own
     * readings, formed when read (so each is formed once for the solver, the rescaled points and the curves),
     * or, the earlier way, every reading formed anew for the model alone.
     */
    RescaledModel readings() {
        if (readings == null) {
            readings = earlier ? new RescaledModel(candidate.measured(), candidate.thicknessMm(), candidate.index())
                    : new RescaledModel(sweep(), candidate.thicknessMm());
        }
        return readings;
    }

    /**
     * The same numbers as rescaling the measured curve ({@link ThicknessRescaler}) and stacking it
     * ({@link LightPath}) anew for every d, with what does not depend on d computed once per candidate.
     */
    private ThicknessSweep sweep() {
        if (sweep == null) {
            List<Layer> fixed = layer.map(l -> List.<Layer>of(l.asLayer())).orElse(List.of());
            sweep = new ThicknessSweep(candidate.measured(), candidate.thicknessMm(), candidate.index(), fixed, !earlier);
        }
        return sweep;
    }

    private Curve stack(Curve candidateCurve) {
        RefractiveIndex index = candidate.index() != null ? candidate.index() : DEFAULT_INDEX;
        StackLayer fixed = layer.orElseThrow();
        if (earlier) {
            return LightPath.of(Layer.fixed(candidateCurve, index), fixed.asLayer()).transmittance();
        }
        // the same path, with the layer's side formed once per search and candidate grid, not per candidate
        return FixedParts.of(fixed.curve(), fixed.index()).behind(Layer.fixed(candidateCurve, index));
    }

    private Curve cached(double d, java.util.function.Supplier<Curve> compute) {
        Curve hit = byThickness.get(d);
        if (hit != null) {
            return hit;
        }
        if (byThickness.size() >= CACHE_LIMIT) {
            byThickness.clear();
        }
        Curve curve = compute.get();
        byThickness.put(d, curve);
        return curve;
    }
}
