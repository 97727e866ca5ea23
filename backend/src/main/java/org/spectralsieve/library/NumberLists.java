package org.spectralsieve.library;

import java.util.Arrays;
import java.util.List;
import java.util.stream.Collectors;

/** Short number lists (Sellmeier coefficients, index tables) as comma-separated text that reads back exactly. */
final class NumberLists {

    private NumberLists() {
    }

    static String format(List<Double> values) {
        return values.stream().map(String::valueOf).collect(Collectors.joining(","));
    }

    static List<Double> parse(String text, String column) {
        if (text == null || text.isBlank()) {
            throw new IllegalStateException("column " + column + " is empty");
        }
        try {
            return Arrays.stream(text.split(",")).map(String::trim).map(Double::valueOf).toList();
        } catch (NumberFormatException e) {
            throw new IllegalStateException("column " + column + " holds '" + text + "', not a number list", e);
        }
    }
}
