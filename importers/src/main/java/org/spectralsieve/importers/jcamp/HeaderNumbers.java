package org.spectralsieve.importers.jcamp;

import java.math.BigDecimal;
import java.util.Optional;
import org.spectralsieve.importers.ImportException;

/** Numeric label values (XFACTOR, FIRSTX…): one number, locale-independent, finite. */
final class HeaderNumbers {

    private HeaderNumbers() {
    }

    static double number(String source, Ldr l) throws ImportException {
        String v = l.value().strip();
        try {
            double d = Double.parseDouble(v);
            if (Double.isFinite(d) && !v.isEmpty() && isPlain(v)) {
                return d;
            }
        } catch (NumberFormatException e) {
            // reported below with the label
        }
        throw new ImportException(source, l.line(), Labels.field(l.name()), "not a number: '" + v + "'");
    }

    static Optional<Double> optional(String source, Optional<Ldr> l) throws ImportException {
        return l.isEmpty() ? Optional.empty() : Optional.of(number(source, l.get()));
    }

    /**
     * Half a unit in the last decimal a header wrote ("0.37" → 0.005): a header rounded to fewer digits
     * than the data is not wrong. Whole numbers give 0, so "FIRSTY=0" against 0.03 still warns.
     */
    static double halfLastDecimal(String value) {
        try {
            int scale = new BigDecimal(value.strip()).scale();
            return scale > 0 ? 0.5 * Math.pow(10, -scale) : 0.0;
        } catch (NumberFormatException e) {
            return 0.0;
        }
    }

    /** Double.parseDouble also takes "NaN", "Infinity", hex and a trailing 'd'; a JCAMP number does not. */
    private static boolean isPlain(String v) {
        for (int i = 0; i < v.length(); i++) {
            char c = v.charAt(i);
            if (!((c >= '0' && c <= '9') || c == '.' || c == '+' || c == '-' || c == 'e' || c == 'E')) {
                return false;
            }
        }
        return true;
    }
}
