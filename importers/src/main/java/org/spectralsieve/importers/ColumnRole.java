package org.spectralsieve.importers;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What one header name says about its column: a wavelength axis (with its unit), a value column (with
 * its kind, and whether the name says percent or fraction), or neither. Names are compared after
 * folding case, blanks, dots and underscores, a bracketed or trailing unit, and a replicate number:
 * {@code Wavelength [nm]}, {@code wavelength_nm}, {@code w.length.2}, {@code nm} are all wavelengths in nm;
 * {@code Transmittance (%)}, {@code %T}, {@code T%} are percent; {@code Abs}, {@code A}, {@code OD} absorbance.
 * {@code StdDev}, {@code Std.Dev.}, {@code sd}, {@code sigma}, {@code uncertainty} name a standard-deviation
 * column ({@link Kind#SPREAD}), which belongs to the value column before it and is in that column's unit,
 * unless its name says otherwise: {@code absorbance_sd} or {@code sd (A)} is in absorbance, {@code sd (%)}
 * in percent transmittance ({@code yKind} then holds that unit; null = the value column's).
 *
 * @param yKind       for value columns; a bare "transmittance" gets FRACTION with {@code scaleNamed} false
 * @param scaleNamed  true when the name itself says percent or fraction (or absorbance)
 */
record ColumnRole(Kind kind, XUnit xUnit, YKind yKind, boolean scaleNamed) {

    enum Kind { X, Y, SPREAD, OTHER }

    static final ColumnRole OTHER = new ColumnRole(Kind.OTHER, null, null, false);

    /** Listed in error messages, in this order. */
    static final List<String> X_EXAMPLES = List.of("wavelength_nm", "wavelength", "nm", "lambda", "lambda_nm",
            "wavelength_um", "um", "µm", "angstrom", "å", "w.length", "wavelength [nm]", "wavenumber", "cm-1");
    static final List<String> Y_EXAMPLES = List.of("transmittance", "transmittance_percent", "%t", "t%",
            "transmittance (%)", "t", "absorbance", "abs", "a", "od", "optical_density");

    private static final Set<String> X_BASES = Set.of("wavelength", "wavelengths", "w_length", "wl", "lambda",
            "λ", "wave_length");
    private static final Set<String> WAVENUMBER_BASES = Set.of("wavenumber", "wavenumbers", "wave_number");
    private static final Set<String> T_BASES = Set.of("transmittance", "transmission", "trans", "t");
    private static final Set<String> PERCENT_BASES = Set.of("%t", "t%", "percent", "%", "transmittance%",
            "t_%", "%_t", "pct_t");
    private static final Set<String> A_BASES = Set.of("absorbance", "abs", "a", "od", "optical_density",
            "absorbance_od", "o_d");
    /** Names of a standard-deviation column (after folding: "Std.Dev." is std_dev, "StdDev" stddev). */
    static final Set<String> SPREAD_BASES = Set.of("sd", "s_d", "std", "stdev", "stddev", "std_dev", "st_dev",
            "std_deviation", "standard_deviation", "stdv", "sigma", "σ", "uncertainty");
    /** Standard deviations whose name says they are in absorbance, as the project's own CSV writes them. */
    static final Set<String> ABSORBANCE_SPREAD_BASES = Set.of("absorbance_sd", "sd_absorbance", "absorbance_sigma",
            "absorbance_uncertainty", "absorbance_std", "od_sd", "sd_od");
    private static final Map<String, XUnit> X_UNITS = Map.ofEntries(
            Map.entry("nm", XUnit.NANOMETRE), Map.entry("nanometre", XUnit.NANOMETRE),
            Map.entry("nanometres", XUnit.NANOMETRE), Map.entry("nanometer", XUnit.NANOMETRE),
            Map.entry("nanometers", XUnit.NANOMETRE),
            Map.entry("um", XUnit.MICROMETRE), Map.entry("µm", XUnit.MICROMETRE),
            Map.entry("micron", XUnit.MICROMETRE), Map.entry("microns", XUnit.MICROMETRE),
            Map.entry("micrometre", XUnit.MICROMETRE), Map.entry("micrometer", XUnit.MICROMETRE),
            Map.entry("micrometres", XUnit.MICROMETRE), Map.entry("micrometers", XUnit.MICROMETRE),
            Map.entry("å", XUnit.ANGSTROM), Map.entry("angstrom", XUnit.ANGSTROM),
            Map.entry("angstroms", XUnit.ANGSTROM), Map.entry("ångström", XUnit.ANGSTROM),
            Map.entry("cm-1", XUnit.WAVENUMBER_PER_CM), Map.entry("1/cm", XUnit.WAVENUMBER_PER_CM),
            Map.entry("/cm", XUnit.WAVENUMBER_PER_CM), Map.entry("cm^-1", XUnit.WAVENUMBER_PER_CM));
    private static final Set<String> PERCENT_UNITS = Set.of("%", "percent", "pct", "%t");
    private static final Set<String> FRACTION_UNITS = Set.of("fraction", "frac", "0-1", "0..1", "1", "ratio");

    /** "Wavelength (nm)", "Transmittance [%]", with an optional replicate number after the bracket. */
    private static final Pattern BRACKETED = Pattern.compile("(.*?)\\s*[(\\[]\\s*([^)\\]]*?)\\s*[)\\]]\\s*(?:[._ ]?\\d+)?");
    private static final Pattern REPLICATE = Pattern.compile("[._ ]\\d+$");
    private static final Pattern SEPARATORS = Pattern.compile("[\\s._]+");

    /**
     * @throws IllegalArgumentException for a wavelength column with a unit this reader cannot convert
     */
    static ColumnRole of(String raw) {
        String s = raw.strip().toLowerCase(Locale.ROOT).replace('\u03bc', '\u00b5').replace("⁻¹", "-1")
                .replace('\u2212', '-').replace("^-1", "-1").replace("-¹", "-1");
        String unit = null;
        Matcher m = BRACKETED.matcher(s);
        if (m.matches()) {
            s = m.group(1);
            unit = m.group(2).strip();
        } else {
            s = REPLICATE.matcher(s).replaceFirst("");
        }
        String base = trimUnderscores(SEPARATORS.matcher(s).replaceAll("_"));
        int cut = base.lastIndexOf('_');
        if (unit == null && cut > 0) {
            String last = base.substring(cut + 1);
            if (X_UNITS.containsKey(last) || PERCENT_UNITS.contains(last) || FRACTION_UNITS.contains(last)) {
                unit = last;
                base = base.substring(0, cut);
            }
        }
        return classify(raw, base, unit);
    }

    private static ColumnRole classify(String raw, String base, String unit) {
        if (X_BASES.contains(base) || WAVENUMBER_BASES.contains(base)) {
            XUnit u = unit == null || unit.isEmpty()
                    ? (WAVENUMBER_BASES.contains(base) ? XUnit.WAVENUMBER_PER_CM : XUnit.NANOMETRE)
                    : xUnit(raw, unit);
            return new ColumnRole(Kind.X, u, null, false);
        }
        if (unit == null && X_UNITS.containsKey(base)) {
            return new ColumnRole(Kind.X, X_UNITS.get(base), null, false);
        }
        if (ABSORBANCE_SPREAD_BASES.contains(base)) {
            return new ColumnRole(Kind.SPREAD, null, YKind.ABSORBANCE, true);
        }
        if (SPREAD_BASES.contains(base)) {
            return new ColumnRole(Kind.SPREAD, null, spreadUnit(unit), unit != null && spreadUnit(unit) != null);
        }
        if (PERCENT_BASES.contains(base)) {
            return new ColumnRole(Kind.Y, null, YKind.TRANSMITTANCE_PERCENT, true);
        }
        if (A_BASES.contains(base)) {
            return new ColumnRole(Kind.Y, null, YKind.ABSORBANCE, true);
        }
        if (T_BASES.contains(base)) {
            if (unit != null && PERCENT_UNITS.contains(unit)) {
                return new ColumnRole(Kind.Y, null, YKind.TRANSMITTANCE_PERCENT, true);
            }
            boolean fraction = unit != null && FRACTION_UNITS.contains(unit);
            return new ColumnRole(Kind.Y, null, YKind.TRANSMITTANCE_FRACTION, fraction);
        }
        return OTHER;
    }

    /** The unit a standard-deviation column's name gives; null = the value column's. */
    private static YKind spreadUnit(String unit) {
        if (unit == null) {
            return null;
        }
        String u = unit.replace(" ", "");
        if (A_BASES.contains(u) || u.equals("a")) {
            return YKind.ABSORBANCE;
        }
        if (PERCENT_UNITS.contains(u) || PERCENT_BASES.contains(u)) {
            return YKind.TRANSMITTANCE_PERCENT;
        }
        return FRACTION_UNITS.contains(u) ? YKind.TRANSMITTANCE_FRACTION : null;
    }

    private static XUnit xUnit(String raw, String unit) {
        String key = unit.replace(" ", "");
        XUnit u = key.equals("a") ? XUnit.ANGSTROM : X_UNITS.get(key); // "(A)" after a wavelength is Å
        if (u == null) {
            throw new IllegalArgumentException("unknown wavelength unit '" + unit + "' in column '" + raw
                    + "'; expected nm, µm, Å or cm-1");
        }
        return u;
    }

    private static String trimUnderscores(String s) {
        int a = 0;
        int b = s.length();
        while (a < b && s.charAt(a) == '_') {
            a++;
        }
        while (b > a && s.charAt(b - 1) == '_') {
            b--;
        }
        return s.substring(a, b);
    }

    boolean isX() {
        return kind == Kind.X;
    }

    boolean isY() {
        return kind == Kind.Y;
    }

    boolean isSpread() {
        return kind == Kind.SPREAD;
    }

    Optional<YKind> namedKind() {
        return Optional.ofNullable(yKind);
    }
}
