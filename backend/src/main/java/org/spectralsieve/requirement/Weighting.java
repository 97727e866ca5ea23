package org.spectralsieve.requirement;

import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;
import org.spectralsieve.weighting.BelowDetectionAs;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.LuminousTransmittance;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;
import org.spectralsieve.weighting.WeightedFigures;

/**
 * What a {@link WeightedClause} weights the curve by, resolved to the spectra themselves when the
 * requirement is read (names are looked up in a {@link SpectrumLookup}, never in a static catalogue).
 */
public sealed interface Weighting permits Weighting.Spectral, Weighting.Luminous {

    /** The figure on a curve; the caller passes the curve with bounded points at their upper bounds. */
    default Figure figure(Curve curve) {
        return figure(curve, BelowDetectionAs.STORED);
    }

    /**
     * The figure on the curve with its below-detection points read as {@code as} says: the same as
     * {@link #figure(Curve)} on the bounded curve ({@link org.spectralsieve.weighting.BoundedCurves}), without
     * building it.
     */
    Figure figure(PointReadings curve, BelowDetectionAs as);

    /**
     * {@link #figure(PointReadings, BelowDetectionAs)} for a margin only: the same value and bound, its note
     * possibly left empty where writing it costs more than the figure (a thickness solver reads it dozens of
     * times per sample).
     */
    default Figure figureForMargin(PointReadings curve, BelowDetectionAs as) {
        return figure(curve, as);
    }

    /** How explanations name the figure: "effective T for led-365 (unweighted over its range 329–401 nm)". */
    String describe();

    /**
     * Whether the figure is an eye or skin safety figure (erythema, actinic UV hazard, blue-light hazard,
     * luminous transmittance as in sunglass categories), which answers carry with the screening caution.
     */
    boolean safetyFigure();

    /** The wavelengths the figure integrates over, {from, to} in nm. */
    double[] rangeNm();

    /** How the clause was written, kept for rendering: "of led-365 …", "erythemal …", "uv hazard …". */
    enum Preset { EMITTER, ERYTHEMAL, UV_HAZARD }

    /** Names of responses whose figures are safety figures. */
    Set<String> SAFETY_RESPONSES = Set.of("erythema", "actinic-uv", "blue-light");

    /** The emitter's light, unweighted over the emitter's own range or weighted by a response. */
    static Spectral of(Emitter emitter, Optional<Response> response) {
        return new Spectral(Preset.EMITTER, emitter, response);
    }

    /** "luminous": τv, CIE D65 weighted by V(λ) over 380-780 nm ({@link LuminousTransmittance}). */
    static Luminous luminous() {
        return new Luminous();
    }

    /** "erythemal": an equal-energy source weighted by the CIE erythema action spectrum (ISO/CIE 17166). */
    static Spectral erythemal(SpectrumLookup spectra) {
        return preset(Preset.ERYTHEMAL, spectra, Response.erythema().name());
    }

    /** "uv hazard": an equal-energy source weighted by the actinic UV hazard S(λ) (ICNIRP / IEC 62471). */
    static Spectral uvHazard(SpectrumLookup spectra) {
        return preset(Preset.UV_HAZARD, spectra, Response.actinicUv().name());
    }

    private static Spectral preset(Preset preset, SpectrumLookup spectra, String responseName) {
        String flat = Emitter.flat().name();
        Emitter emitter = spectra.emitter(flat).orElseThrow(() -> new IllegalStateException(
                "the spectrum lookup has no '" + flat + "' emitter, which every lookup starts with"));
        Response response = spectra.response(responseName).orElseThrow(() -> new IllegalStateException(
                "the spectrum lookup has no '" + responseName + "' response, which every lookup starts with"));
        return new Spectral(preset, emitter, Optional.of(response));
    }

    /**
     * Effective transmittance ∫E·W·T dλ / ∫E·W dλ ({@link WeightedFigures#effectiveTransmittance}). Without a
     * response the weight is flat (W = 1) over the emitter's own range (an LED's peak ± 3 FWHM), so the
     * figure is the share of the emitter's power that passes. Equal when preset and the emitter's and
     * response's names are equal: names are unique within a lookup, and two lookups may hand out different
     * objects for the same spectrum.
     */
    record Spectral(Preset preset, Emitter emitter, Optional<Response> response) implements Weighting {

        public Spectral {
            Objects.requireNonNull(preset, "preset");
            Objects.requireNonNull(emitter, "emitter");
            Objects.requireNonNull(response, "response");
            if (preset != Preset.EMITTER && response.isEmpty()) {
                throw new IllegalArgumentException(preset + " needs its response");
            }
        }

        /** The response actually integrated: the named one, or flat (W = 1 wherever the emitter has power). */
        public Response effectiveResponse() {
            return response.orElseGet(Response::flat);
        }

        @Override
        public Figure figure(PointReadings curve, BelowDetectionAs as) {
            return WeightedFigures.effectiveTransmittance(curve, emitter, effectiveResponse(), as);
        }

        @Override
        public Figure figureForMargin(PointReadings curve, BelowDetectionAs as) {
            return WeightedFigures.effectiveTransmittanceUnexplained(curve, emitter, effectiveResponse(), as);
        }

        @Override
        public String describe() {
            Response r = effectiveResponse();
            String range = Wording.span(Math.max(r.minNm(), emitter.minNm()), Math.min(r.maxNm(), emitter.maxNm()));
            return switch (preset) {
                case ERYTHEMAL -> "erythemal effective T (equal-energy source × CIE erythema, " + range + ")";
                case UV_HAZARD -> "UV-hazard effective T (equal-energy source × actinic UV S(λ), " + range + ")";
                case EMITTER -> "effective T for " + emitter.name() + (response.isPresent()
                        ? " weighted by " + r.name() + " (" + range + ")"
                        : " (unweighted over its range " + range + ")");
            };
        }

        @Override
        public double[] rangeNm() {
            Response r = effectiveResponse();
            return new double[] {Math.max(r.minNm(), emitter.minNm()), Math.min(r.maxNm(), emitter.maxNm())};
        }

        @Override
        public boolean safetyFigure() {
            return preset != Preset.EMITTER || response.map(r -> SAFETY_RESPONSES.contains(r.name())).orElse(false);
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Spectral other && preset == other.preset
                    && emitter.name().equals(other.emitter.name())
                    && response.map(Response::name).equals(other.response.map(Response::name));
        }

        @Override
        public int hashCode() {
            return Objects.hash(preset, emitter.name(), response.map(Response::name));
        }

        @Override
        public String toString() {
            return "Spectral[" + preset + ", " + emitter.name() + ", " + response.map(Response::name).orElse("flat over emitter") + "]";
        }
    }

    /**
     * Luminous transmittance τv: Σ T·D65·V / Σ D65·V on the CIE 5 nm rows from 380 to 780 nm (ISO 8980-3,
     * ISO 12312-1), as {@link LuminousTransmittance#of} computes it.
     */
    record Luminous() implements Weighting {

        @Override
        public Figure figure(PointReadings curve, BelowDetectionAs as) {
            return LuminousTransmittance.of(curve, as);
        }

        @Override
        public String describe() {
            return "luminous transmittance τv (CIE D65 × V(λ), 380–780 nm)";
        }

        @Override
        public boolean safetyFigure() {
            return true;
        }

        @Override
        public double[] rangeNm() {
            return new double[] {LuminousTransmittance.FROM_NM, LuminousTransmittance.TO_NM};
        }
    }
}
