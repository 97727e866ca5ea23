package org.spectralsieve.importers;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Which column holds x and which holds y, and what they mean: from the header names when there is a
 * header, else by position (x in nm first, y second, kind to be guessed from the values).
 *
 * @param yKind empty when no header named it (the reader guesses from the value range)
 */
record ColumnLayout(List<String> names, int xColumn, XUnit xUnit, int yColumn, Optional<YKind> yKind,
        List<String> ignored) {

    /** Normalised names (see {@link #normalise}), in the order error messages list them. */
    private static final Map<String, XUnit> X_NAMES = ordered(
            Map.entry("wavelength_nm", XUnit.NANOMETRE), Map.entry("wavelength", XUnit.NANOMETRE),
            Map.entry("nm", XUnit.NANOMETRE), Map.entry("lambda", XUnit.NANOMETRE),
            Map.entry("lambda_nm", XUnit.NANOMETRE),
            Map.entry("wavelength_um", XUnit.MICROMETRE), Map.entry("wavelength_µm", XUnit.MICROMETRE),
            Map.entry("um", XUnit.MICROMETRE), Map.entry("µm", XUnit.MICROMETRE),
            Map.entry("angstrom", XUnit.ANGSTROM), Map.entry("wavelength_angstrom", XUnit.ANGSTROM),
            Map.entry("wavelength_å", XUnit.ANGSTROM), Map.entry("å", XUnit.ANGSTROM));

    private static final Map<String, YKind> Y_NAMES = ordered(
            Map.entry("transmittance", YKind.TRANSMITTANCE_FRACTION),
            Map.entry("transmittance_percent", YKind.TRANSMITTANCE_PERCENT),
            Map.entry("%t", YKind.TRANSMITTANCE_PERCENT), Map.entry("t%", YKind.TRANSMITTANCE_PERCENT),
            Map.entry("percent", YKind.TRANSMITTANCE_PERCENT),
            Map.entry("absorbance", YKind.ABSORBANCE), Map.entry("od", YKind.ABSORBANCE),
            Map.entry("optical_density", YKind.ABSORBANCE));

    /** "Wavelength (nm)", "Transmittance [%]": a unit in brackets after the name. */
    private static final Pattern NAME_WITH_UNIT = Pattern.compile("(.+?)_?[(\\[]\\s*([^)\\]]+?)\\s*[)\\]]");

    ColumnLayout {
        names = List.copyOf(names);
        ignored = List.copyOf(ignored);
    }

    @SafeVarargs
    private static <V> Map<String, V> ordered(Map.Entry<String, V>... entries) {
        Map<String, V> map = new LinkedHashMap<>();
        for (Map.Entry<String, V> e : entries) {
            map.put(e.getKey(), e.getValue());
        }
        return Collections.unmodifiableMap(map);
    }

    int columnCount() {
        return names.size();
    }

    static ColumnLayout positional(int columnCount) {
        List<String> names = new ArrayList<>();
        names.add("wavelength");
        names.add("value");
        List<String> ignored = new ArrayList<>();
        for (int c = 2; c < columnCount; c++) {
            names.add("column " + (c + 1));
            ignored.add("column " + (c + 1));
        }
        return new ColumnLayout(names, 0, XUnit.NANOMETRE, 1, Optional.empty(), ignored);
    }

    /** Resolves roles from header names; the first recognised x and y columns win, the rest are ignored. */
    static ColumnLayout fromHeader(String sourceName, int line, List<String> header) throws ImportException {
        int x = -1;
        int y = -1;
        XUnit unit = null;
        YKind kind = null;
        List<String> ignored = new ArrayList<>();
        for (int c = 0; c < header.size(); c++) {
            String name = normalise(header.get(c));
            if (x < 0 && X_NAMES.containsKey(name)) {
                x = c;
                unit = X_NAMES.get(name);
            } else if (y < 0 && Y_NAMES.containsKey(name)) {
                y = c;
                kind = Y_NAMES.get(name);
            } else {
                ignored.add(header.get(c));
            }
        }
        if (x < 0) {
            throw new ImportException(sourceName, line, header.get(0),
                    "no wavelength column in header " + header + "; expected one of " + X_NAMES.keySet());
        }
        if (y < 0) {
            throw new ImportException(sourceName, line, null, "no value column in header " + header + "; expected one of " + Y_NAMES.keySet());
        }
        return new ColumnLayout(header, x, unit, y, Optional.of(kind), ignored);
    }

    /**
     * Lower case, blanks as underscores, Greek mu as micro sign, and a bracketed unit folded into the name:
     * "Wavelength (nm)" → "wavelength_nm", "Transmittance(%)" → "transmittance_percent".
     */
    static String normalise(String raw) {
        String name = raw.strip().toLowerCase(Locale.ROOT).replace('\u03bc', '\u00b5').replaceAll("\\s+", "_");
        Matcher m = NAME_WITH_UNIT.matcher(name);
        if (m.matches()) {
            String unit = m.group(2).replace("_", "");
            name = m.group(1) + "_" + (unit.equals("%") ? "percent" : unit);
        }
        return name;
    }

    String xName() {
        return names.get(xColumn);
    }

    String yName() {
        return names.get(yColumn);
    }
}
