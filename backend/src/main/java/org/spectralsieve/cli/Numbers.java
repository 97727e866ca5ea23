package org.spectralsieve.cli;

import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.Locale;

/** Numbers as the tables print them: locale-independent, so a table reads the same on every machine. */
final class Numbers {

    static final String NONE = "-";

    private Numbers() {
    }

    /** A thickness in mm without trailing zeros ("3", "0.05", "13.05"); NaN (not recorded) as "-". */
    static String mm(double mm) {
        if (!Double.isFinite(mm)) {
            return NONE;
        }
        return new DecimalFormat("0.###", DecimalFormatSymbols.getInstance(Locale.ROOT)).format(mm);
    }

    /** A margin in decades, signed, three decimals ("+0.412", "-1.300"); NaN (no margin) as "-". */
    static String decades(double decades) {
        return Double.isFinite(decades) ? String.format(Locale.ROOT, "%+.3f", decades) : NONE;
    }
}
