package org.spectralsieve.importers.jcamp;

import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;

/**
 * XUNITS and YUNITS words. The standard's words (NANOMETERS, MICROMETERS, 1/CM; TRANSMITTANCE,
 * ABSORBANCE) plus the abbreviations and percent forms real files use ({@code A}, {@code %T},
 * {@code PERCENT TRANSMITTANCE}); a free-text value is accepted when it ends in a bracketed unit
 * ({@code wavelength [nm]}).
 */
final class JcampUnits {

    private static final Set<String> NANOMETRE = Set.of("NANOMETERS", "NANOMETER", "NANOMETRES", "NANOMETRE", "NM");
    private static final Set<String> MICROMETRE = Set.of("MICROMETERS", "MICROMETER", "MICROMETRES",
            "MICROMETRE", "MICRONS", "MICRON", "UM", "\u00B5M", "\u03BCM");
    private static final Set<String> ANGSTROM = Set.of("ANGSTROMS", "ANGSTROM", "\u00C5");
    private static final Set<String> WAVENUMBER = Set.of("1/CM", "CM-1", "CM^-1", "CM**-1", "WAVENUMBERS",
            "WAVENUMBER", "CM\u207B\u00B9");
    private static final Set<String> FRACTION = Set.of("TRANSMITTANCE", "TRANSMISSION", "T");
    private static final Set<String> PERCENT = Set.of("%T", "T%", "%TRANSMITTANCE", "TRANSMITTANCE%",
            "PERCENTTRANSMITTANCE", "TRANSMITTANCEPERCENT", "PERCENTTRANSMISSION", "TRANSMISSION%",
            "%TRANSMISSION", "TRANSMITTANCE(%)", "TRANSMITTANCE[%]", "TRANSMISSION(%)");
    private static final Set<String> ABSORBANCE = Set.of("ABSORBANCE", "A", "ABS", "ABSORBANCEUNITS", "AU",
            "OPTICALDENSITY", "OD");

    private JcampUnits() {
    }

    static Optional<XUnit> xUnit(String value) {
        String v = squeeze(value);
        Optional<XUnit> unit = xWord(v);
        return unit.isPresent() ? unit : bracketed(value).flatMap(JcampUnits::xWord);
    }

    private static Optional<XUnit> xWord(String v) {
        if (NANOMETRE.contains(v)) {
            return Optional.of(XUnit.NANOMETRE);
        }
        if (MICROMETRE.contains(v)) {
            return Optional.of(XUnit.MICROMETRE);
        }
        if (ANGSTROM.contains(v)) {
            return Optional.of(XUnit.ANGSTROM);
        }
        if (WAVENUMBER.contains(v)) {
            return Optional.of(XUnit.WAVENUMBER_PER_CM);
        }
        return Optional.empty();
    }

    static Optional<YKind> yKind(String value) {
        String v = squeeze(value);
        if (FRACTION.contains(v)) {
            return Optional.of(YKind.TRANSMITTANCE_FRACTION);
        }
        if (PERCENT.contains(v)) {
            return Optional.of(YKind.TRANSMITTANCE_PERCENT);
        }
        if (ABSORBANCE.contains(v)) {
            return Optional.of(YKind.ABSORBANCE);
        }
        return Optional.empty();
    }

    /** "wavelength [nm]" → "NM": the unit inside the last brackets of a free-text value. */
    private static Optional<String> bracketed(String value) {
        int open = Math.max(value.lastIndexOf('['), value.lastIndexOf('('));
        int close = Math.max(value.lastIndexOf(']'), value.lastIndexOf(')'));
        return open >= 0 && close > open + 1 ? Optional.of(squeeze(value.substring(open + 1, close)))
                : Optional.empty();
    }

    private static String squeeze(String value) {
        return value.replace(" ", "").replace("\t", "").replace("_", "").toUpperCase(Locale.ROOT);
    }
}
