package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;

/**
 * A light path's transmittance when the light arrives at an angle or spread over angles ({@link Illumination}),
 * at fixed wavelengths and with the parts' indices fixed, prepared once and applied to the parts' curves at any
 * thickness. Rules (docs/oblique-incidence.md):
 *
 * <ul>
 *   <li>Each part is read as a slab the way {@link LightPath} reads it at normal incidence ({@link SlabReading}:
 *       Fresnel R of its index and the K that reproduces its measured T; a clear reading keeps its measured T
 *       through an effective R', R' − R being surface loss the data cannot place).</li>
 *   <li>At an angle θ in air, every part sees θ (parts are plane, parallel and separated by air gaps, so Snell's
 *       law returns the ray to θ between them). Per polarisation the part's surfaces reflect R_s(θ) or R_p(θ)
 *       ({@link ObliqueIncidence#surface}) plus the unplaced surface loss R' − R, and its internal transmittance
 *       is K^(1/cos θt), the path through it lengthened by 1/cos θt (Beer–Lambert along the ray).</li>
 *   <li>The parts are chained with incoherent multiple reflections across the gaps per polarisation (s and p do
 *       not mix between parallel plane surfaces), and the path's T at θ is the mean of the two chains
 *       (unpolarised light).</li>
 *   <li>A spread source averages T(θ) over its intensity ({@link BeamSpread}): Gauss–Legendre in u = cos θ with
 *       {@value #ANGLES} angles; {@link #integrationError} estimates the error against half as many.</li>
 *   <li>Bounds stay bounds: T at every angle rises with every part's T, so a point below detection in any part
 *       is below detection in the path, and the path's detection limit is the largest T with one part at a time
 *       at its limit (as {@link LightPath}). The absorbance uncertainty of the normal path is scaled by the
 *       longest slant factor 1/cos θt the light reaches (absorbance is proportional to path length; the largest
 *       factor, so the figure errs wide).</li>
 * </ul>
 * Normal incidence never comes here: {@link LightPath#transmittance(Illumination)} keeps today's arithmetic for it.
 * Each point's angle tables are formed when the point is first read ({@link #KEPT_TABLES_UP_TO}). Not shared between
 * threads.
 */
public final class ObliquePath {

    /**
     * Curves of up to this many points keep each point's angle tables once formed (a solve reads the same points at
     * dozens of thicknesses): about 1.2 kB per point and part under a spread source, so at most about 5 MB per part.
     * A longer curve forms them anew at each read and keeps none, so memory stays bounded whatever the curve.
     */
    static final int KEPT_TABLES_UP_TO = 4096;

    /** Angles the reported integral uses (Gauss–Legendre nodes in cos θ); one for a collimated beam. */
    public static final int ANGLES = 2 * BeamSpread.NODES;

    private final double[] nm;
    private final int parts;
    /** [point][part]: Fresnel R at normal incidence, the reflectance SlabReading starts from. */
    private final double[][] normalR;
    /** [point][part][angle]: R_s, R_p and 1/cos θt at each angle. */
    private final double[][][] rs;
    private final double[][][] rp;
    private final double[][][] slant;
    /** Weight of each angle (summing to 1). */
    private final double[] weights;
    private final double[] anglesRad;
    /** [point]: the largest 1/cos θt over the parts at the largest angle, for the uncertainty. */
    private final double[] longestSlant;
    private final double mostSlant;
    private final Illumination light;
    private final RefractiveIndex[] indexes;

    private ObliquePath(double[] nm, RefractiveIndex[] indexes, Illumination light, double[] anglesRad, double[] weights) {
        this.nm = nm.clone();
        this.parts = indexes.length;
        this.indexes = indexes;
        this.light = light;
        this.anglesRad = anglesRad;
        this.weights = weights;
        int points = nm.length;
        normalR = new double[points][];
        rs = new double[points][][];
        rp = new double[points][][];
        slant = new double[points][][];
        longestSlant = new double[points];
        // the largest slant over the path, for the bounds and the uncertainty: from the smallest index met
        // (1/cos θt = n / √(n² − sin² θ) falls as n rises), read at every point once: cheap beside the tables
        double sinMax = Math.sin(Math.min(light.maxAngleRad(), Math.nextDown(Math.PI / 2)));
        double most = 1;
        for (int i = 0; i < points; i++) {
            for (RefractiveIndex index : indexes) {
                double n = index.at(nm[i]);
                longestSlant[i] = Math.max(longestSlant[i], n / Math.sqrt(n * n - sinMax * sinMax));
            }
            most = Math.max(most, longestSlant[i]);
        }
        this.mostSlant = most;
    }

    /** Point i's angle tables, formed when the point is first read (a clause reads few of a curve's points). */
    private void tables(int i) {
        if (rs[i] != null) {
            return;
        }
        int angles = anglesRad.length;
        double[] r0 = new double[parts];
        double[][] s = new double[parts][angles];
        double[][] p = new double[parts][angles];
        double[][] sl = new double[parts][angles];
        for (int j = 0; j < parts; j++) {
            double n = indexes[j].at(nm[i]);
            r0[j] = Fresnel.reflectanceInAir(n);
            for (int k = 0; k < angles; k++) {
                ObliqueIncidence.Surface surface = ObliqueIncidence.surface(n, anglesRad[k]);
                s[j][k] = surface.rs();
                p[j][k] = surface.rp();
                sl[j][k] = 1 / surface.cosRefracted();
            }
        }
        normalR[i] = r0;
        rp[i] = p;
        slant[i] = sl;
        rs[i] = s; // last: it marks the point ready
    }

    /**
     * @param nm      the wavelengths every part's curve will be given at
     * @param indexes each part's index, in the light's order
     */
    public static ObliquePath prepare(double[] nm, RefractiveIndex[] indexes, Illumination light) {
        if (light.normal()) {
            throw new IllegalArgumentException("normal incidence is LightPath's own arithmetic, not an oblique path");
        }
        if (indexes.length == 0) {
            throw new IllegalArgumentException("a light path needs at least one part");
        }
        BeamSpread spread = light.spread();
        double[][] nodes = spread.nodes(ANGLES);
        return new ObliquePath(nm, indexes.clone(), light, nodes[0], nodes[1]);
    }

    public double[] wavelengthsNm() {
        return nm.clone();
    }

    /** The largest 1/cos θt the light reaches in any part at any of the wavelengths (≥ 1). */
    public double longestSlant() {
        return mostSlant;
    }

    /** The largest 1/cos θt the light reaches in any part at point i. */
    double longestSlant(int i) {
        return longestSlant[i];
    }

    /**
     * The path's points under this light, each formed when read ({@link ObliquePoints}): the same numbers as
     * {@link #transmittance(Curve[], Curve[])} at the points read.
     */
    public PointReadings points(PointReadings[] onPoints, PointReadings[] boundedAlso) {
        return new ObliquePoints(this, onPoints, boundedAlso);
    }

    int size() {
        return nm.length;
    }

    double wavelengthNm(int i) {
        return nm[i];
    }

    /** T of the path at point i from the parts' readings there. */
    double transmittanceAt(int i, PointReadings[] onPoints) {
        tables(i);
        double[] excess = new double[parts];
        double[] lnK = new double[parts];
        for (int j = 0; j < parts; j++) {
            read(onPoints[j].transmittance(i), normalR[i][j], excess, lnK, j);
        }
        double t = Math.min(averaged(i, excess, lnK, -1, 0, 0), 1.0);
        release(i);
        return t;
    }

    /** Drops point i's tables on a curve too long to keep them ({@link #KEPT_TABLES_UP_TO}). */
    private void release(int i) {
        if (nm.length > KEPT_TABLES_UP_TO) {
            rs[i] = null;
            rp[i] = null;
            slant[i] = null;
            normalR[i] = null;
        }
    }

    /** The path's detection limit at point i: the largest T with one part at a time at its own limit. */
    double detectionLimitAt(int i, PointReadings[] onPoints) {
        tables(i);
        double[] excess = new double[parts];
        double[] lnK = new double[parts];
        double[] limitExcess = new double[parts];
        double[] limitLnK = new double[parts];
        for (int j = 0; j < parts; j++) {
            read(onPoints[j].transmittance(i), normalR[i][j], excess, lnK, j);
            read(onPoints[j].detectionLimit(i), normalR[i][j], limitExcess, limitLnK, j);
        }
        double limit = 0;
        for (int j = 0; j < parts; j++) {
            limit = Math.max(limit, averaged(i, excess, lnK, j, limitExcess[j], limitLnK[j]));
        }
        release(i);
        return Math.min(limit, Math.nextDown(1.0));
    }

    /** Whether point i is a bound: below detection in any part, or in a part's reading along the longest slant. */
    static boolean belowAt(int i, PointReadings[] onPoints, PointReadings[] boundedAlso) {
        for (int j = 0; j < onPoints.length; j++) {
            if (onPoints[j].belowDetection(i) || boundedAlso != null && boundedAlso[j] != null && boundedAlso[j].belowDetection(i)) {
                return true;
            }
        }
        return false;
    }

    /** The path's absorbance uncertainty at point i: the parts' in quadrature, times the longest slant; NaN if unknown. */
    double absorbanceUncertaintyAt(int i, PointReadings[] onPoints, boolean bound) {
        if (bound) {
            return Double.NaN;
        }
        double variance = 0;
        for (PointReadings part : onPoints) {
            double s = part.absorbanceUncertainty(i);
            variance += s * s;
        }
        return Math.sqrt(variance) * longestSlant[i];
    }

    /**
     * The path's curve from each part's curve at this path's wavelengths.
     *
     * @param boundedAlso per part, a curve whose below-detection flags also make the path's point a bound (the part
     *                    rescaled along the longest slant, where hidden absorption shows first), or null entries
     */
    public Curve transmittance(Curve[] onPoints, Curve[] boundedAlso) {
        if (onPoints.length != parts) {
            throw new IllegalArgumentException("expected " + parts + " parts, got " + onPoints.length);
        }
        int points = nm.length;
        double[] t = new double[points];
        boolean[] below = new boolean[points];
        double[] limits = new double[points];
        boolean anyUncertainty = false;
        for (Curve part : onPoints) {
            anyUncertainty |= part.hasUncertainty();
        }
        double[] sigma = anyUncertainty ? new double[points] : null;
        for (int i = 0; i < points; i++) {
            t[i] = transmittanceAt(i, onPoints);
            limits[i] = detectionLimitAt(i, onPoints);
            below[i] = belowAt(i, onPoints, boundedAlso);
            if (sigma != null) {
                sigma[i] = absorbanceUncertaintyAt(i, onPoints, below[i]);
            }
        }
        Curve path = Curve.of(nm.clone(), t, below, limits);
        return sigma == null ? path : path.withAbsorbanceUncertainty(sigma);
    }

    /** The integration error estimate at each point: |T(ANGLES) − T(ANGLES / 2)| (0 for a collimated beam). */
    public double[] integrationError(Curve[] onPoints) {
        double[] error = new double[nm.length];
        if (anglesRad.length == 1) {
            return error;
        }
        double[][] half = light.spread().nodes(ANGLES / 2);
        ObliquePath coarse = new ObliquePath(nm, indexes, light, half[0], half[1]);
        Curve fine = transmittance(onPoints, null);
        Curve fewer = coarse.transmittance(onPoints, null);
        for (int i = 0; i < error.length; i++) {
            error[i] = Math.abs(fine.transmittance(i) - fewer.transmittance(i));
        }
        return error;
    }

    /** A reading T as the slab it stands for: its surface reflectance (slot j of r) and ln K (slot j of lnK). */
    private static void read(double t, double fresnelR, double[] r, double[] lnK, int j) {
        SlabReading reading = SlabReading.of(t, fresnelR);
        r[j] = reading.reflectance() - fresnelR; // the surface loss the index does not explain (0 when resolved)
        lnK[j] = Math.log(reading.internal());
    }

    /** T at point i averaged over the angles and the two polarisations; part {@code swapped} (if ≥ 0) replaced. */
    private double averaged(int i, double[] excess, double[] lnK, int swapped, double swappedExcess, double swappedLnK) {
        double[] internal = new double[parts];
        double[] r = new double[parts];
        double sum = 0;
        for (int k = 0; k < weights.length; k++) {
            // the slant path's K of each part, shared by the two polarisations
            for (int j = 0; j < parts; j++) {
                double logK = j == swapped ? swappedLnK : lnK[j];
                internal[j] = logK == Double.NEGATIVE_INFINITY ? 0 : Math.exp(logK * slant[i][j][k]);
            }
            double ts = chain(surfaces(k, rs[i], excess, swapped, swappedExcess, r), internal);
            double tp = chain(surfaces(k, rp[i], excess, swapped, swappedExcess, r), internal);
            sum += weights[k] * (ts + tp) / 2;
        }
        return sum;
    }

    /** Each part's surface reflectance for one polarisation at angle k, into {@code out}. */
    private double[] surfaces(int k, double[][] fresnel, double[] excess, int swapped, double swappedExcess, double[] out) {
        for (int j = 0; j < parts; j++) {
            out[j] = surface(fresnel[j][k], j == swapped ? swappedExcess : excess[j]);
        }
        return out;
    }

    /**
     * A part's surface reflectance for one polarisation: Fresnel's plus the unplaced surface loss of its reading. A
     * reading above the lossless ceiling (noise, a low index guess) has a negative excess: near Brewster's angle R_p
     * plus it would fall below 0, which no surface reflects, so it is held at 0.
     */
    static double surface(double fresnel, double excess) {
        return Math.min(Math.max(fresnel + excess, 0), Math.nextDown(1.0));
    }

    /**
     * T of symmetric slabs (surface reflectance r[j], internal transmittance internal[j]) one after another across air
     * gaps, for one polarisation (Smith eq. 10.5, as {@link OpticalElement#followedBy}).
     */
    static double chain(double[] r, double[] internal) {
        double t = 1;
        double rb = 0;
        for (int j = 0; j < r.length; j++) {
            double kj = internal[j];
            double oneMinusR = 1 - r[j];
            double k2 = kj * kj;
            double denominatorSlab = 1 - r[j] * r[j] * k2;
            double te = oneMinusR * oneMinusR * kj / denominatorSlab;
            double re = r[j] + oneMinusR * oneMinusR * r[j] * k2 / denominatorSlab;
            if (j == 0) {
                t = te;
                rb = re;
            } else {
                double denominator = 1 - rb * re;
                double next = t * te / denominator;
                rb = re + te * te * rb / denominator;
                t = next;
            }
        }
        return t;
    }
}
