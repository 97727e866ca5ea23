package org.spectralsieve.importers;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;

/** Line-level mutations of a text file, shared by the readers' fuzz tests. */
public final class TextMutations {

    private TextMutations() {
    }

    public static String swapLines(String text, Random random) {
        List<String> lines = lines(text);
        if (lines.size() > 1) {
            int a = random.nextInt(lines.size());
            int b = random.nextInt(lines.size());
            String t = lines.get(a);
            lines.set(a, lines.get(b));
            lines.set(b, t);
        }
        return String.join("\n", lines);
    }

    public static String dropLine(String text, Random random) {
        List<String> lines = lines(text);
        lines.remove(random.nextInt(lines.size()));
        return String.join("\n", lines);
    }

    public static String duplicateLine(String text, Random random) {
        List<String> lines = lines(text);
        int a = random.nextInt(lines.size());
        lines.add(a, lines.get(a));
        return String.join("\n", lines);
    }

    private static List<String> lines(String text) {
        return new ArrayList<>(Arrays.asList(text.split("\n", -1)));
    }
}
