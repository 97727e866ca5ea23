package org.spectralsieve.weighting;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.DoubleUnaryOperator;

/**
 * A response (action spectrum, weighting) W(λ): how much a unit of power at λ counts for the thing that
 * matters (skin, eye, a photoinitiator). Zero outside [{@link #minNm()}, {@link #maxNm()}], its defined
 * range; weighted figures integrate over exactly that range.
 *
 * <p>Whether that zero is the response's own definition or only where its data stops is told by
 * {@link #zeroOutsideByDefinition()}: the standard action spectra (erythema, actinic UV, blue light, V(λ))
 * are defined as 0 outside their tables, so an emitter's power there truly does not count; an imported
 * table simply ends, so power outside it is weight the figure cannot see, and
 * {@link WeightedFigures#effectiveTransmittance} estimates and reports that share instead of dropping it.
 */
public final class Response {

    /** The older 1987 variant used 139 here; the standard (ISO/CIE 17166) uses 140, continuous at 328 nm. */
    static final double ERYTHEMA_UVA_CONSTANT = 140;

    /** The shipped V(λ) table, a resource under {@code weighting/}. */
    static final String PHOTOPIC_TABLE = "cie-1931-photopic-v.txt";

    private static final Response ERYTHEMA = new Response("erythema", 250, 400, true,
            "CIE erythema reference action spectrum, ISO/CIE 17166:2019 (CIE S 007/E-1998) form with 140 in the "
                    + "UVA branch; 250-400 nm, 0 above 400 nm by convention", Response::erythema);
    private static final Response ACTINIC_UV = fromTable("actinic-uv", "actinic-uv-hazard.txt",
            "actinic UV hazard S(λ) (ICNIRP / ACGIH / IEC 62471), tabulated 180-400 nm, log-linear between rows");
    private static final Response BLUE_LIGHT = fromTable("blue-light", "blue-light-hazard.txt",
            "blue-light hazard B(λ) (IEC 62471 / CIE S 009), 380-700 nm, log-linear between rows");
    private static final Response PHOTOPIC = fromTable("photopic", PHOTOPIC_TABLE,
            "photopic luminous efficiency V(λ) = CIE 1931 2° ȳ(λ), 5 nm table 360-830 nm, 1 at 555 nm, linear "
                    + "between rows");
    /**
     * Unweighted means flat over the whole emitter: W = 1 over the tool's whole range, so an emitter's power
     * counts wherever it has it (an LED at 405 nm is not cut at 400 nm).
     */
    private static final Response FLAT = new Response("flat", Emitter.TOOL_MIN_NM, Emitter.TOOL_MAX_NM, true,
            "unweighted, W = 1 wherever the emitter has power (" + Emitter.TOOL_MIN_NM + "-" + Emitter.TOOL_MAX_NM
                    + " nm, the tool's range)", nm -> 1.0);

    private final String name;
    private final double minNm;
    private final double maxNm;
    private final boolean zeroOutsideByDefinition;
    private final String description;
    private final DoubleUnaryOperator weight;

    private Response(String name, double minNm, double maxNm, boolean zeroOutsideByDefinition, String description,
            DoubleUnaryOperator weight) {
        if (!(minNm > 0 && maxNm > minNm && Double.isFinite(maxNm))) {
            throw new IllegalArgumentException("response '" + name + "' range " + minNm + ".." + maxNm
                    + " nm must be finite with 0 < min < max");
        }
        this.name = name;
        this.minNm = minNm;
        this.maxNm = maxNm;
        this.zeroOutsideByDefinition = zeroOutsideByDefinition;
        this.description = description;
        this.weight = weight;
    }

    private static Response fromTable(String name, String file, String description) {
        WeightingTable table = WeightingTable.resource(file);
        return new Response(name, table.minWavelengthNm(), table.maxWavelengthNm(), true,
                description + "; source: " + table.source(), table::valueAt);
    }

    public static Response erythema() {
        return ERYTHEMA;
    }

    public static Response actinicUv() {
        return ACTINIC_UV;
    }

    public static Response blueLight() {
        return BLUE_LIGHT;
    }

    /** V(λ), the eye's daylight sensitivity, for lamps and filters judged by eye. */
    public static Response photopic() {
        return PHOTOPIC;
    }

    /** Unweighted over the whole emitter (W = 1 over the tool's 100-1100 nm). */
    public static Response flat() {
        return FLAT;
    }

    /** Unweighted (W = 1) over [minNm, maxNm] and 0 outside by this definition: a chosen band. */
    public static Response flat(double minNm, double maxNm) {
        return new Response("flat", minNm, maxNm, true, "unweighted, W = 1 over " + minNm + "-" + maxNm + " nm",
                nm -> 1.0);
    }

    /**
     * A measured or imported response (a photoinitiator's absorbance, a sensor's responsivity): weights at
     * the given wavelengths, straight lines between them, defined over the first to the last point.
     */
    public static Response tabulated(String name, String description, double[] nm, double[] weights) {
        Tabulated table = new Tabulated("response '" + name + "'", nm, weights);
        return new Response(name, table.minNm(), table.maxNm(), false, description, table::valueAt);
    }

    public static List<Response> catalogue() {
        return List.of(ERYTHEMA, ACTINIC_UV, BLUE_LIGHT, PHOTOPIC, FLAT);
    }

    /** Looks a catalogue response up by name, ignoring case. */
    public static Optional<Response> named(String name) {
        String key = name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
        return catalogue().stream().filter(r -> r.name.equals(key)).findFirst();
    }

    /** ISO/CIE 17166 s_er(λ): 1 up to 298 nm, then two decadic slopes meeting at 328 nm. */
    static double erythema(double nm) {
        if (nm < 250 || nm > 400) {
            return 0;
        }
        if (nm <= 298) {
            return 1;
        }
        if (nm <= 328) {
            return Math.pow(10, 0.094 * (298 - nm));
        }
        return Math.pow(10, 0.015 * (ERYTHEMA_UVA_CONSTANT - nm));
    }

    public String name() {
        return name;
    }

    public double minNm() {
        return minNm;
    }

    public double maxNm() {
        return maxNm;
    }

    public String description() {
        return description;
    }

    /** True when W = 0 outside the range is the response's definition, false when its data just ends there. */
    public boolean zeroOutsideByDefinition() {
        return zeroOutsideByDefinition;
    }

    /** W at the nearer end of the range: how an imported table is held beyond its ends to estimate what it misses. */
    public double weightAtNearestEnd(double nm) {
        return weight.applyAsDouble(Math.min(maxNm, Math.max(minNm, nm)));
    }

    /** W(λ); 0 outside the defined range. */
    public double weightAt(double nm) {
        return nm >= minNm && nm <= maxNm ? weight.applyAsDouble(nm) : 0;
    }

    @Override
    public String toString() {
        return "Response[" + name + ", " + minNm + ".." + maxNm + " nm]";
    }
}
