package org.spectralsieve.importers.jcamp;

import org.spectralsieve.importers.ImportException;

/**
 * The project's private label {@code ##$SIEVE BELOW DETECTION=}: 0-based indices, in data-table order,
 * of the points whose value is only an upper bound ("at or below detection"). Private labels start
 * with '$' (JCAMP-DX 5.01, Lampen et al. 1999), so other readers skip it.
 */
final class BelowDetection {

    private BelowDetection() {
    }

    static boolean[] parse(String source, BlockScanner.Draft draft, int points) throws ImportException {
        boolean[] flags = new boolean[points];
        for (Ldr l : draft.ldrs) {
            if (!l.canonical().equals(Labels.BELOW_DETECTION)) {
                continue;
            }
            for (String token : l.value().split("[\\s,;]+")) {
                if (token.isEmpty()) {
                    continue;
                }
                int index;
                try {
                    index = Integer.parseInt(token);
                } catch (NumberFormatException e) {
                    throw new ImportException(source, l.line(), Labels.field(l.name()), "not a point index: '"
                            + token + "'");
                }
                if (index < 0 || index >= points) {
                    throw new ImportException(source, l.line(), Labels.field(l.name()), "point index " + index
                            + " outside 0…" + (points - 1));
                }
                flags[index] = true;
            }
        }
        return flags;
    }
}
