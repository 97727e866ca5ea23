package org.spectralsieve.importers.jcamp;

import java.util.Locale;

/** Label names as the standard spells them, and the comparison rule that makes spelling variants equal. */
final class Labels {

    static final String TITLE = "TITLE";
    static final String END = "END";
    static final String XYDATA = "XYDATA";
    static final String XYPOINTS = "XYPOINTS";
    static final String PEAKTABLE = "PEAKTABLE";
    static final String XFACTOR = "XFACTOR";
    static final String YFACTOR = "YFACTOR";
    static final String FIRSTX = "FIRSTX";
    static final String LASTX = "LASTX";
    static final String DELTAX = "DELTAX";
    static final String NPOINTS = "NPOINTS";
    static final String FIRSTY = "FIRSTY";
    static final String MINY = "MINY";
    static final String MAXY = "MAXY";
    static final String XUNITS = "XUNITS";
    static final String YUNITS = "YUNITS";
    static final String DATA_TYPE = "DATATYPE";
    /** The project's private label (JCAMP-DX private labels start with '$'). */
    static final String BELOW_DETECTION = "$SIEVEBELOWDETECTION";
    static final String BELOW_DETECTION_AS_WRITTEN = "$SIEVE BELOW DETECTION";
    /** The project's private label for per-point absorbance standard deviations ({@link AbsorbanceSd}). */
    static final String ABSORBANCE_SD = "$SIEVEABSORBANCESD";
    static final String ABSORBANCE_SD_AS_WRITTEN = "$SIEVE ABSORBANCE SD";

    private Labels() {
    }

    /**
     * The standard says label names are compared without spaces, dashes, slashes and underscores, and
     * regardless of case; files in the wild rely on that ({@code ##DATATYPE}, {@code ##JCAMP_DX}).
     */
    static String canonical(String name) {
        StringBuilder b = new StringBuilder(name.length());
        for (int i = 0; i < name.length(); i++) {
            char c = name.charAt(i);
            if (c != ' ' && c != '\t' && c != '-' && c != '/' && c != '_') {
                b.append(c);
            }
        }
        return b.toString().toUpperCase(Locale.ROOT);
    }

    static boolean isDataTable(String canonical) {
        return canonical.equals(XYDATA) || canonical.equals(XYPOINTS) || canonical.equals(PEAKTABLE);
    }

    /** How an error message names a label: with the double hash, as users see it in the file. */
    static String field(String canonicalOrWritten) {
        return "##" + canonicalOrWritten;
    }
}
