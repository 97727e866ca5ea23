package org.spectralsieve.spectra;

import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.Response;

/** A stored spectrum as the core's emitter or response: straight lines between its points, 0 outside. */
final class SpectrumConversion {

    private SpectrumConversion() {
    }

    /** Cut to the tool's 100–1100 nm by {@link Emitter} itself; the stored points stay whole. */
    static Emitter emitter(ReferenceSpectrum s) {
        return Emitter.tabulated(s.name(), description(s), s.wavelengthsNm(), s.values());
    }

    static Response response(ReferenceSpectrum s) {
        return Response.tabulated(s.name(), description(s), s.wavelengthsNm(), s.values());
    }

    /** The user's description, then where the numbers came from, as the listings show it. */
    static String description(ReferenceSpectrum s) {
        String origin = "imported from " + s.sourceFileName() + (s.valueColumn().isEmpty() ? ""
                : ", column '" + s.valueColumn() + "'");
        return s.description().isBlank() ? origin : s.description() + " (" + origin + ")";
    }
}
