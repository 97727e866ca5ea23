package org.spectralsieve.optics;

import org.spectralsieve.spectrum.Curve;

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
 */
public final class ObliquePath {

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
        int angles = anglesRad.length;
        normalR = new double[points][parts];
        rs = new double[points][parts][angles];
        rp = new double[points][parts][angles];
        slant = new double[points][parts][angles];
        longestSlant = new double[points];
        double thetaMax = Math.min(light.maxAngleRad(), Math.nextDown(Math.PI / 2));
        for (int i = 0; i < points; i++) {
            for (int j = 0; j < parts; j++) {
                double n = indexes[j].at(nm[i]);
                normalR[i][j] = Fresnel.reflectanceInAir(n);
                for (int k = 0; k < angles; k++) {
                    ObliqueIncidence.Surface s = ObliqueIncidence.surface(n, anglesRad[k]);
                    rs[i][j][k] = s.rs();
                    rp[i][j][k] = s.rp();
                    slant[i][j][k] = 1 / s.cosRefracted();
                }
                longestSlant[i] = Math.max(longestSlant[i], 1 / ObliqueIncidence.surface(n, thetaMax).cosRefracted());
            }
        }
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

    public Illumination light() {
        return light;
    }

    public double[] wavelengthsNm() {
        return nm.clone();
    }

    /** The largest 1/cos θt the light reaches in any part at any of the wavelengths (≥ 1). */
    public double longestSlant() {
        double most = 1;
        for (double s : longestSlant) {
            most = Math.max(most, s);
        }
        return most;
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
        double[] reflect = new double[parts];
        double[] lnK = new double[parts];
        double[] limitReflect = new double[parts];
        double[] limitLnK = new double[parts];
        for (int i = 0; i < points; i++) {
            for (int j = 0; j < parts; j++) {
                read(onPoints[j].transmittance(i), normalR[i][j], reflect, lnK, j);
                read(onPoints[j].detectionLimit(i), normalR[i][j], limitReflect, limitLnK, j);
                below[i] |= onPoints[j].belowDetection(i)
                        || boundedAlso != null && boundedAlso[j] != null && boundedAlso[j].belowDetection(i);
            }
            t[i] = Math.min(averaged(i, reflect, lnK, -1, 0, 0), 1.0);
            double limit = 0;
            for (int j = 0; j < parts; j++) {
                limit = Math.max(limit, averaged(i, reflect, lnK, j, limitReflect[j], limitLnK[j]));
            }
            limits[i] = Math.min(limit, Math.nextDown(1.0));
        }
        Curve path = Curve.of(nm.clone(), t, below, limits);
        Curve normalUncertainty = LightPath.withStackUncertainty(path, onPoints);
        if (!normalUncertainty.hasUncertainty()) {
            return path;
        }
        double[] sigma = new double[points];
        for (int i = 0; i < points; i++) {
            sigma[i] = normalUncertainty.absorbanceUncertainty(i) * longestSlant[i];
        }
        return path.withAbsorbanceUncertainty(sigma);
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
        double sum = 0;
        for (int k = 0; k < weights.length; k++) {
            double ts = chain(i, k, rs[i], excess, lnK, swapped, swappedExcess, swappedLnK);
            double tp = chain(i, k, rp[i], excess, lnK, swapped, swappedExcess, swappedLnK);
            sum += weights[k] * (ts + tp) / 2;
        }
        return sum;
    }

    /** One polarisation at one angle: the parts' slabs chained across air gaps (Smith eq. 10.5, as OpticalElement). */
    private double chain(int i, int k, double[][] fresnel, double[] excess, double[] lnK, int swapped,
                         double swappedExcess, double swappedLnK) {
        double t = 1;
        double rb = 0;
        for (int j = 0; j < parts; j++) {
            double extra = j == swapped ? swappedExcess : excess[j];
            double logK = j == swapped ? swappedLnK : lnK[j];
            double r = Math.min(fresnel[j][k] + extra, Math.nextDown(1.0));
            double internal = logK == Double.NEGATIVE_INFINITY ? 0 : Math.exp(logK * slant[i][j][k]);
            double oneMinusR = 1 - r;
            double k2 = internal * internal;
            double denominatorSlab = 1 - r * r * k2;
            double te = oneMinusR * oneMinusR * internal / denominatorSlab;
            double re = r + oneMinusR * oneMinusR * r * k2 / denominatorSlab;
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
