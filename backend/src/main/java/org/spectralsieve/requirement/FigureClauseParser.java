package org.spectralsieve.requirement;

import java.util.stream.Stream;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The clauses on figures with a fixed name:
 *
 * <pre>
 * preset   = ( "erythemal" | "uv" "hazard" | "uv-hazard" | luminous ) [ "transmittance" ] level   (a WeightedClause)
 * luminous = "luminous" | "visible" [ "light" ] | "vlt"                                  (all τv)
 * critical = "critical" "wavelength" comparison wavelength                                (λc, 290-400 nm)
 * </pre>
 *
 * {@code level} is the transmittance level of {@link SpectralClauseParser} without a verb, so the comparison
 * decides: "erythemal under 1%" keeps light out, "erythemal over 50%" lets it through.
 */
final class FigureClauseParser {

    private final TokenCursor in;
    private final SpectralClauseParser spectral;
    private final SpectrumLookup spectra;

    FigureClauseParser(TokenCursor in, SpectralClauseParser spectral, SpectrumLookup spectra) {
        this.in = in;
        this.spectral = spectral;
        this.spectra = spectra;
    }

    /** "erythemal under 1%": the first word is next. */
    WeightedClause erythemal(Token start) {
        in.next();
        return preset(start, Weighting.erythemal(spectra));
    }

    /**
     * "luminous over 40%", "visible over 70%", "visible light transmittance over 70%", "VLT over 70%": τv;
     * the first word is next. Eyewear and glazing call τv the visible (light) transmittance or VLT: the
     * D65 × V(λ) weighted figure (REFERENCE.md §5, ISO 8980-3 / ISO 12311), not a level at every visible
     * wavelength.
     */
    WeightedClause luminous(Token start) {
        Token first = in.next();
        if (first.isWord("visible")) {
            in.acceptWord("light");
        }
        return preset(start, Weighting.luminous());
    }

    /** "uv hazard under 0.1%" or "uv-hazard …": the first word is next. */
    WeightedClause uvHazard(Token start) {
        Token uv = in.next();
        if (uv.isWord("uv")) {
            in.expectWord(Expected.keywords("hazard").after("uv"), "hazard");
        }
        return preset(start, Weighting.uvHazard(spectra));
    }

    private WeightedClause preset(Token start, Weighting weighting) {
        in.acceptWord("transmittance");
        SpectralClauseParser.Level level = spectral.level(null, SpectralClauseParser.Verb.NONE, true);
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new WeightedClause(level.direction(), level.thresholdT(), level.unit(),
                weighting, text));
    }

    /** "critical wavelength over 370 nm": the first word is next. */
    CriticalWavelengthClause criticalWavelength(Token start) {
        in.next();
        in.expectWord(Expected.keywords("wavelength").after("critical"), "wavelength");
        SpectralClauseParser.Sense sense = spectral.comparison();
        if (sense == null) {
            throw in.error(Expected.keywords(Stream.concat(SpectralClauseParser.HIGHER_WORDS.stream(),
                    SpectralClauseParser.LOWER_WORDS.stream()).toArray(String[]::new)).after("wavelength"));
        }
        SpectralClauseParser.Wavelength w = spectral.wavelength(true);
        double nm = SpectralClauseParser.nanometres(w, null);
        if (!(nm >= CriticalWavelengthClause.FROM_NM && nm <= CriticalWavelengthClause.TO_NM)) {
            throw TokenCursor.outOfRange(w.number(), "a critical wavelength from 290 to 400 nm (λc always lies there)",
                    "'" + w.number().text() + " " + w.unit().text() + "'");
        }
        Comparison comparison = sense == SpectralClauseParser.Sense.HIGHER ? Comparison.AT_LEAST : Comparison.AT_MOST;
        String text = in.slice(start.start(), in.previous().end());
        return TokenCursor.build(start, () -> new CriticalWavelengthClause(comparison, nm, text));
    }
}
