package org.spectralsieve.importers.jcamp;

/**
 * One labelled data record ({@code ##NAME= value}) as found.
 *
 * @param name      the label as written, trimmed (for metadata keys)
 * @param canonical the name compared by the standard's rule ({@link Labels#canonical})
 * @param value     the value without {@code $$} comments; continuation lines joined with '\n'
 * @param line      1-based line of the label
 */
record Ldr(String name, String canonical, String value, int line) {

    Ldr withMoreValue(String more) {
        return new Ldr(name, canonical, value.isEmpty() ? more : value + "\n" + more, line);
    }
}
