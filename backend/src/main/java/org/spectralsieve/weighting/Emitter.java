package org.spectralsieve.weighting;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;

/**
 * A light source's relative spectral power E(λ) in W/nm (any common scale: only ratios of integrals are
 * used). Zero outside [{@link #minNm()}, {@link #maxNm()}]. {@link #stepNm()} is the integration step its
 * finest feature needs: 1 nm for smooth spectra, finer for narrow lines.
 */
public final class Emitter {

    /** Wavelength range this tool evaluates; a smooth source is cut there, not extrapolated by a curve. */
    public static final double TOOL_MIN_NM = 100;
    public static final double TOOL_MAX_NM = 1100;

    /** Second radiation constant c2 = h·c/k in nm·K (CODATA 2018; h, c and k are exact in the SI). */
    public static final double C2_NM_K = 1.438776877e7;

    /** Low-pressure mercury lines used by {@link #mercury}, nm, as issue 5 names them (air wavelengths; from memory). */
    public static final double[] MERCURY_LINES_NM = {253.7, 365.0, 404.7, 435.8};

    /** Modelled width of each mercury line: far wider than the real line, narrower than any filter edge. */
    public static final double MERCURY_LINE_FWHM_NM = 1.0;

    /** The shipped D65 table, a resource under {@code weighting/}. */
    static final String D65_TABLE = "cie-illuminant-d65.txt";

    private static final double SIGMA_PER_FWHM = 1 / (2 * Math.sqrt(2 * Math.log(2)));

    private final String name;
    private final String kind;
    private final Map<String, Double> parameters;
    private final double minNm;
    private final double maxNm;
    private final double stepNm;
    private final String description;
    private final DoubleUnaryOperator power;

    private Emitter(String name, String kind, Map<String, Double> parameters, double minNm, double maxNm,
            double stepNm, String description, DoubleUnaryOperator power) {
        this.name = name;
        this.kind = kind;
        this.parameters = Collections.unmodifiableMap(new LinkedHashMap<>(parameters));
        this.minNm = Math.max(minNm, TOOL_MIN_NM);
        this.maxNm = Math.min(maxNm, TOOL_MAX_NM);
        this.stepNm = stepNm;
        this.description = description;
        this.power = power;
    }

    /** Equal energy: E = 1 W/nm everywhere the tool evaluates. */
    public static Emitter flat() {
        return new Emitter("flat", "flat", Map.of(), TOOL_MIN_NM, TOOL_MAX_NM, 1.0,
                "equal-energy source, E = 1 W/nm", nm -> 1.0);
    }

    /**
     * A Gaussian LED, 1 at the peak. Cut at peak ± 3 FWHM, where it has fallen to 2·10⁻¹¹ of the peak.
     * The integration step is a tenth of the FWHM, at most 1 nm.
     */
    public static Emitter led(String name, double peakNm, double fwhmNm) {
        requirePositive("peakNm", peakNm);
        requirePositive("fwhmNm", fwhmNm);
        double sigma = fwhmNm * SIGMA_PER_FWHM;
        Map<String, Double> params = new LinkedHashMap<>();
        params.put("peakNm", peakNm);
        params.put("fwhmNm", fwhmNm);
        return new Emitter(name, "led", params, peakNm - 3 * fwhmNm, peakNm + 3 * fwhmNm,
                Math.min(1.0, fwhmNm / 10), "LED model: Gaussian, peak " + peakNm + " nm, FWHM " + fwhmNm + " nm",
                nm -> gaussian(nm, peakNm, sigma));
    }

    /**
     * An LED with a steeper short-wavelength side, as real LED spectra have: two half-Gaussians joined at
     * the peak (1 there), the short side with the half width at half maximum {@code fwhmShortNm / 2}, the
     * long side with {@code fwhmLongNm / 2}. Each side is half of a symmetric Gaussian of that full width,
     * so the whole curve's full width at half maximum is (fwhmShortNm + fwhmLongNm) / 2 and equal widths
     * give {@link #led}. Cut 3 of the side's widths from the peak on each side (2·10⁻¹¹ of the peak), step a
     * tenth of the narrower width, at most 1 nm.
     */
    public static Emitter ledAsymmetric(String name, double peakNm, double fwhmShortNm, double fwhmLongNm) {
        requirePositive("peakNm", peakNm);
        requirePositive("fwhmShortNm", fwhmShortNm);
        requirePositive("fwhmLongNm", fwhmLongNm);
        double sigmaShort = fwhmShortNm * SIGMA_PER_FWHM;
        double sigmaLong = fwhmLongNm * SIGMA_PER_FWHM;
        double fwhm = (fwhmShortNm + fwhmLongNm) / 2;
        Map<String, Double> params = new LinkedHashMap<>();
        params.put("peakNm", peakNm);
        params.put("fwhmShortNm", fwhmShortNm);
        params.put("fwhmLongNm", fwhmLongNm);
        params.put("fwhmNm", fwhm);
        return new Emitter(name, "led", params, peakNm - 3 * fwhmShortNm, peakNm + 3 * fwhmLongNm,
                Math.min(1.0, Math.min(fwhmShortNm, fwhmLongNm) / 10),
                "LED model: two half-Gaussians joined at the peak " + peakNm + " nm, short side as a Gaussian of "
                        + fwhmShortNm + " nm FWHM, long side of " + fwhmLongNm + " nm, overall FWHM " + fwhm + " nm",
                nm -> gaussian(nm, peakNm, nm < peakNm ? sigmaShort : sigmaLong));
    }

    /**
     * Low-pressure mercury lines at {@link #MERCURY_LINES_NM}, each a Gaussian of
     * {@link #MERCURY_LINE_FWHM_NM} FWHM with unit area times its relative strength, so the strengths are
     * the lines' relative powers. Integrated on a 0.1 nm step (10 points per FWHM).
     */
    public static Emitter mercury(String name, double s254, double s365, double s405, double s436) {
        double[] strengths = {s254, s365, s405, s436};
        Map<String, Double> params = new LinkedHashMap<>();
        for (int i = 0; i < strengths.length; i++) {
            if (!(strengths[i] >= 0 && Double.isFinite(strengths[i]))) {
                throw new IllegalArgumentException("strength of the " + MERCURY_LINES_NM[i] + " nm line is "
                        + strengths[i] + ", must be finite and >= 0");
            }
            params.put("strength" + MERCURY_LINES_NM[i] + "nm", strengths[i]);
        }
        if (s254 + s365 + s405 + s436 <= 0) {
            throw new IllegalArgumentException("at least one mercury line needs a strength above 0");
        }
        params.put("lineFwhmNm", MERCURY_LINE_FWHM_NM);
        double sigma = MERCURY_LINE_FWHM_NM * SIGMA_PER_FWHM;
        double area = 1 / (sigma * Math.sqrt(2 * Math.PI));
        return new Emitter(name, "lines", params, MERCURY_LINES_NM[0] - 5, MERCURY_LINES_NM[3] + 5, 0.1,
                "low-pressure mercury lines 253.7/365.0/404.7/435.8 nm, each Gaussian of 1 nm FWHM",
                nm -> {
                    double sum = 0;
                    for (int i = 0; i < strengths.length; i++) {
                        sum += strengths[i] * area * gaussian(nm, MERCURY_LINES_NM[i], sigma);
                    }
                    return sum;
                });
    }

    /** Planck's law, relative: 100 at 560 nm (the normalisation CIE uses for illuminant A). */
    public static Emitter blackbody(double temperatureK) {
        return blackbody("blackbody-" + temperatureK + "K", temperatureK);
    }

    /** {@link #blackbody(double)} under a name of the caller's choosing. */
    public static Emitter blackbody(String name, double temperatureK) {
        requirePositive("temperatureK", temperatureK);
        return new Emitter(name, "blackbody", Map.of("temperatureK", temperatureK),
                TOOL_MIN_NM, TOOL_MAX_NM, 1.0, "blackbody (Planck) at " + temperatureK + " K, 100 at 560 nm",
                nm -> planckRelative(nm, C2_NM_K, temperatureK));
    }

    /**
     * CIE standard illuminant A by its analytic definition (CIE 15:2004; ISO 11664-2): Planck with
     * c2 = 1.435·10⁷ nm·K at 2848 K, 100 at 560 nm. That is the historic 2856 K blackbody, kept on the
     * old c2 so the illuminant does not move when c2 is revised. Formula as given in the project's
     * reference sheet §9, tagged there as from memory; its check against the 1-nm CIE table is a test.
     */
    public static Emitter illuminantA() {
        return new Emitter("illuminant-a", "illuminant", Map.of(), 300, 830, 1.0,
                "CIE standard illuminant A (Planck, c2 = 1.435e7 nm·K, 2848 K; 100 at 560 nm), 300-830 nm",
                nm -> planckRelative(nm, 1.435e7, 2848));
    }

    /**
     * CIE standard illuminant D65 (average daylight), the shipped 5 nm table {@code cie-illuminant-d65.txt}
     * (300-830 nm, 100 at 560 nm), read along straight lines between rows; integrated on 1 nm.
     */
    public static Emitter d65() {
        WeightingTable table = WeightingTable.resource(D65_TABLE);
        return new Emitter("d65", "illuminant", Map.of(), table.minWavelengthNm(), table.maxWavelengthNm(), 1.0,
                "CIE standard illuminant D65, 5 nm table " + table.minWavelengthNm() + "-" + table.maxWavelengthNm()
                        + " nm, 100 at 560 nm, linear between rows; source: " + table.source(),
                table::valueAt);
    }

    /** A broad UVA fluorescent tube, illustrative: a Gaussian phosphor band, 352 nm peak, 40 nm FWHM. */
    public static Emitter uvaTube() {
        Emitter band = led("uva-tube", 352, 40);
        return new Emitter("uva-tube", "model", band.parameters, band.minNm, band.maxNm, 1.0,
                "UVA fluorescent tube model (illustrative, not a measured lamp): Gaussian band, peak 352 nm, "
                        + "FWHM 40 nm", band.power);
    }

    /**
     * A measured or imported spectrum: relative power at the given wavelengths, straight lines between
     * them, 0 outside. {@code description} should say where the data came from.
     */
    public static Emitter tabulated(String name, String description, double[] nm, double[] power) {
        Tabulated table = new Tabulated("emitter '" + name + "'", nm, power);
        return new Emitter(name, "tabulated", Map.of(), table.minNm(), table.maxNm(), table.stepNm(), description,
                table::valueAt);
    }

    static double planckRelative(double nm, double c2, double temperatureK) {
        double at560 = Math.expm1(c2 / (560 * temperatureK));
        double here = Math.expm1(c2 / (nm * temperatureK));
        return 100 * Math.pow(560 / nm, 5) * at560 / here;
    }

    private static double gaussian(double nm, double centre, double sigma) {
        double z = (nm - centre) / sigma;
        return Math.exp(-0.5 * z * z);
    }

    private static void requirePositive(String name, double value) {
        if (!(value > 0 && Double.isFinite(value))) {
            throw new IllegalArgumentException(name + " is " + value + ", must be finite and > 0");
        }
    }

    public String name() {
        return name;
    }

    public String kind() {
        return kind;
    }

    public Map<String, Double> parameters() {
        return parameters;
    }

    public double minNm() {
        return minNm;
    }

    public double maxNm() {
        return maxNm;
    }

    public double stepNm() {
        return stepNm;
    }

    public String description() {
        return description;
    }

    /** E(λ) in relative W/nm; 0 outside the range. */
    public double powerAt(double nm) {
        return nm >= minNm && nm <= maxNm ? power.applyAsDouble(nm) : 0;
    }

    @Override
    public String toString() {
        return "Emitter[" + name + ", " + kind + ", " + minNm + ".." + maxNm + " nm]";
    }
}
