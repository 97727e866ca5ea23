package org.spectralsieve.importers.jcamp;

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
