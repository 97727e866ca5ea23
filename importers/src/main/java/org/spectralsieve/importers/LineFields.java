package org.spectralsieve.importers;

import java.util.Arrays;
import java.util.List;

/**
 * The fields of one line as index ranges into the line, so that numbers are parsed in place; reused
 * from line to line by one read. Lines with quotes are tokenised by commons-csv, and then each field is
 * its own string.
 */
final class LineFields {

    private String line = "";
    private String[] quoted;
    private int count;
    private int[] from = new int[8];
    private int[] to = new int[8];

    void reset(String newLine) {
        line = newLine;
        quoted = null;
        count = 0;
    }

    void add(int start, int end) {
        if (count == from.length) {
            from = Arrays.copyOf(from, count * 2);
            to = Arrays.copyOf(to, count * 2);
        }
        while (start < end && isBlank(line.charAt(start))) {
            start++;
        }
        while (end > start && isBlank(line.charAt(end - 1))) {
            end--;
        }
        from[count] = start;
        to[count] = end;
        count++;
    }

    void setQuoted(List<String> fields) {
        quoted = fields.toArray(String[]::new);
        count = quoted.length;
    }

    static boolean isBlank(char c) {
        return c == ' ' || c == '\t';
    }

    int count() {
        return count;
    }

    /** The string holding field {@code i}; with {@link #start} and {@link #end} it locates the text. */
    String source(int i) {
        return quoted != null ? quoted[i] : line;
    }

    int start(int i) {
        return quoted != null ? 0 : from[i];
    }

    int end(int i) {
        return quoted != null ? quoted[i].length() : to[i];
    }

    boolean isEmpty(int i) {
        return start(i) == end(i);
    }

    String text(int i) {
        return quoted != null ? quoted[i] : line.substring(from[i], to[i]);
    }

    boolean isNumber(int i, char decimal) {
        return NumberText.isNumber(source(i), start(i), end(i), decimal);
    }
}
